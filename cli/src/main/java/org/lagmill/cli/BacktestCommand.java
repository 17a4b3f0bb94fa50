package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.lagmill.eval.CombinedBacktestResult;
import org.lagmill.features.FeatureSpec;
import org.lagmill.io.AtomicFiles;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.run.Run;
import org.lagmill.run.RunRecord;
import org.lagmill.run.RunReport;
import org.lagmill.run.Stage;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;
import org.lagmill.training.TrainingPlan;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill backtest}: rolling-origin backtest of the model against baselines, with a report. */
@Command(name = "backtest", header = "Score the model against baselines over rolling forecast origins.", mixinStandardHelpOptions = true,
    description = {"Rolling-origin backtest: for each origin, train only on the days before it, forecast the horizon",
        "as in production and score WRMSSE per level beside naive, seasonal naive, moving average, exponential",
        "smoothing, Croston and ETS (exponential smoothing with trend and season, chosen per series) baselines on",
        "the same days."},
    footer = {"", "Example:", "  lagmill backtest --store stores/chain --origins 3 --step 28 --report runs/bt1"})
final class BacktestCommand implements Callable<Integer> {
  @Spec CommandSpec commandSpec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store directory")
  Path store;

  @Option(names = "--origins", converter = Counts.Positive.class,
      required = true, paramLabel = "K", description = "number of forecast origins")
  int originCount;

  @Option(names = "--step", converter = Counts.Positive.class,
      paramLabel = "PERIODS", description = "periods (days, or weeks of a weekly store) between "
      + "origins (default: the horizon)")
  Integer stepDays;

  @Option(names = "--report", required = true, paramLabel = "DIR", description = "folder for report.html, "
      + "report.json, backtest.json and run.json")
  Path reportDir;

  @Option(names = "--show", split = ",", paramLabel = "SERIES_ID", description = "series to chart in the report")
  List<String> shownSeries = List.of();

  @Option(names = "--json", description = "print the backtest result as JSON")
  boolean json;

  @Option(names = "--memory-limit", paramLabel = "SIZE", converter = ByteSizeConverter.class,
      description = "off-heap budget: bytes, or with k, m, g (1024-based), e.g. 512m or 2g (default: none)")
  Long memoryLimitBytes;

  @Option(names = "--quiet", description = "print nothing but errors (and the JSON with --json)")
  boolean quiet;

  @Option(names = "--member", paramLabel = "SPEC[@ATTRIBUTE]", description = "a member of a combined model: a "
      + "feature spec YAML, optionally @ the attribute to partition by (e.g. recursive.yaml@store); repeat it: each "
      + "member and their average are scored on the same origins, the training options apply to all")
  List<String> members = List.of();

  @Mixin TrainingOptions training;
  @Mixin HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    // Refused before the (long) backtest runs, not after it.
    RunReport.checkTarget(reportDir);
    Path html;
    FeatureSpec spec = training.featureSpec();
    ReportData.Builder report = RunReport.start("lagmill backtest", "lagmill backtest --store " + store
        + " --origins " + originCount, store.toString());
    BacktestRun backtest;
    CombinedBacktestResult[] combined = new CombinedBacktestResult[1];
    StoreManifest[] fill = new StoreManifest[1];
    Object written;
    try (Run run = Run.start("backtest", MemoryLimitOption.bytes(memoryLimitBytes));
        Stage opening = run.stage("open store");
        SalesStore opened = SalesStore.open(store, run.budget().child("store"))) {
      opening.close();
      report.data(ReportAssembler.dataSummary(StoreSummary.of(opened)));
      fill[0] = opened.manifest();
      TrainingPlan plan = training.plan(spec, opened.dayCount() - 1);
      run.record().configure("store", store.toString()).configure("origins", originCount)
          .configure("stepDays", stepDays == null ? Integer.valueOf(spec.horizonDays()) : stepDays)
          .configure("plan", plan.toString());
      try (Stage stage = run.stage("backtest")) {
        if (!members.isEmpty()) {
          List<String> names = new java.util.ArrayList<>();
          List<TrainingPlan> plans = new java.util.ArrayList<>();
          for (String member : members) {
            int at = member.lastIndexOf('@');
            Path file = Path.of(at < 0 ? member : member.substring(0, at));
            TrainingPlan base = training.plan(org.lagmill.features.FeatureSpecYaml.read(file), opened.dayCount() - 1);
            plans.add(new TrainingPlan(base.spec(), base.trainParameters(), base.datasetParameters(),
                base.cutDayIndex(), base.validationDays(), at < 0 ? base.partitionAttribute()
                : member.substring(at + 1), base.salesValueWeights(), base.refit()));
            names.add(member);
          }
          run.record().configure("members", names);
          backtest = BacktestRun.runMembers(opened, names, plans, originCount,
              stepDays == null ? plans.get(0).spec().horizonDays() : stepDays,
              hierarchyOptions.hierarchy(opened), stage.budget(), ConsoleProgress.forCommand(quiet), combined);
        } else {
          backtest = BacktestRun.run(opened, plan, originCount, stepDays == null ? spec.horizonDays() : stepDays,
              hierarchyOptions.hierarchy(opened), stage.budget(), ConsoleProgress.forCommand(quiet));
        }
        stage.addRows(backtest.result.origins().stream().flatMap(o -> o.partitions().stream())
            .mapToLong(p -> p.trainingRowCount()).sum());
      }
      backtest.addTo(report, opened, shownSeries);
      RunReport.addStages(report, run.record(), backtest.lastPartitions().get(0).datasetBytesPerRow());
      written = combined[0] != null ? combined[0] : backtest.result;
      AtomicFiles.write(reportDir.resolve(RunReport.BACKTEST_FILE), RunRecord.JSON.writeValueAsBytes(written));
      html = RunReport.write(report.build(), reportDir);
      run.record().result("backtest", written).result("levelsScored", ScoredLevels.describe(backtest.result.origins()
          .get(0).model())).result("fill", fill[0].fill());
      run.record().write(reportDir);
    }
    PrintWriter out = commandSpec.commandLine().getOut();
    if (json) {
      out.println(RunRecord.JSON.writeValueAsString(written));
    } else if (!quiet) {
      if (combined[0] != null) {
        BacktestRun.printMembers(out, combined[0]);
      }
      backtest.print(out);
      ScoredLevels.print(out, backtest.result.origins().get(0).model(), fill[0]);
      out.println("report written to " + html);
    }
    return ExitCodes.OK;
  }
}
