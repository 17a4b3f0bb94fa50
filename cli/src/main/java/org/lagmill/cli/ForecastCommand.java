package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.lagmill.forecast.CountQuantiles;
import org.lagmill.forecast.ForecastFileWriter;
import org.lagmill.forecast.ForecastTable;
import org.lagmill.forecast.Forecaster;
import org.lagmill.forecast.HorizonCoverage;
import org.lagmill.eval.Level;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.report.DriverChartBuilder;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.report.ReportJson;
import org.lagmill.report.SeriesChartBuilder;
import org.lagmill.store.Periods;
import org.lagmill.run.Run;
import org.lagmill.run.RunReport;
import org.lagmill.run.Stage;
import org.lagmill.store.SalesStore;
import org.lagmill.store.SeriesSelection;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelManifest;
import org.lagmill.training.ModelSet;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill forecast}: forecasts every series for the days after the store's last day. */
@Command(name = "forecast", header = "Forecast every series for the days after the store's last day.",
    mixinStandardHelpOptions = true,
    description = {"Forecast each series' daily units for the horizon after the store's last day, with optional",
        "quantile intervals. Forecasts are estimates for a planner to review, never automatic orders."},
    footer = {"", "Example:", "  lagmill forecast --store stores/chain --model models/week49 \\",
        "      --out week49.csv.gz --intervals --report runs/week49"})
final class ForecastCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store directory")
  Path store;

  @Option(names = "--model", required = true, paramLabel = "DIR", description = "model directory from train")
  Path model;

  @Option(names = "--horizon", converter = Counts.Positive.class,
      paramLabel = "DAYS", description = "days to forecast (default: the model's horizon)")
  Integer horizonDays;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "forecast CSV (.gz compresses)")
  Path out;

  @Option(names = "--intervals",
      description = "add nine quantile columns at the published levels, from q0.005 to q0.995")
  boolean intervals;

  @Option(names = "--wide", description = "one row per series, one column per date (point forecasts only)")
  boolean wide;

  @Option(names = "--report", paramLabel = "DIR", description = "also write report.html and report.json here")
  Path reportDir;

  @Option(names = "--backtest", paramLabel = "DIR", description = "with --report: include the accuracy of this "
      + "backtest of the same store (the folder backtest --report wrote)")
  Path backtestDir;

  @Option(names = "--show", split = ",", paramLabel = "SERIES_ID", description = "series to chart in the report")
  List<String> shownSeries = List.of();

  @Option(names = "--series", split = ",", paramLabel = "SERIES_ID",
      description = "forecast only these series (ids as lagmill series lists them)")
  List<String> chosenSeriesIds = List.of();

  @Option(names = "--where", paramLabel = "ATTRIBUTE=VALUE", description = {"forecast only the series with this "
      + "attribute value, repeatable: values of one attribute are alternatives, different attributes must all hold;",
      "adds to --series (e.g. --where store=north-3 --where department=bakery)"})
  List<String> conditions = List.of();

  @Option(names = "--plan-carry-forward", description = {"when the plan ends before the horizon does, carry each",
      "key's last plan values forward (counted in a warning, run.json and the report) instead of stopping"})
  boolean planCarryForward;

  @Option(names = "--quiet", description = "print nothing but errors")
  boolean quiet;

  @Mixin
  HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    if (wide && intervals) {
      throw new InvalidRequestException("--wide holds one point forecast per date and no quantiles; drop --wide to "
          + "get the quantile columns, or drop --intervals");
    }
    if (backtestDir != null && reportDir == null) {
      throw new InvalidRequestException("--backtest adds a backtest's accuracy to the report; give --report DIR "
          + "as well");
    }
    PrintWriter outText = commandSpec.commandLine().getOut();
    try (Run run = Run.unlimited("forecast");
        Stage opening = run.stage("open");
        SalesStore opened = SalesStore.open(store, run.budget().child("store"));
        ModelSet models = ModelDirectory.open(model, opened)) {
      ModelManifest manifest = ModelDirectory.readManifest(model);
      int horizon = horizonDays == null ? models.spec().horizonDays() : horizonDays;
      HorizonCoverage coverage = HorizonCoverage.check(opened, models.spec(), horizon, planCarryForward);
      run.record().result("planCarriedSeriesPeriods", coverage.planCarriedSeriesPeriods());
      if (!quiet) {
        coverage.warnings().forEach(w -> System.err.println("warning: " + FlagNames.render(w)));
        StoreManifest.Shard shard = opened.manifest().shard();
        // A model trained over every shard records the fingerprint of the store they were split from.
        boolean sameStore = manifest.storeFingerprint().equals(opened.fingerprint())
            || shard != null && manifest.storeFingerprint().equals(shard.sourceFingerprint());
        if (!sameStore) {
          System.err.println("warning: the model was trained on another version of the store (fingerprint "
              + manifest.storeFingerprint() + ", this store " + opened.fingerprint() + "); retrain after a refresh");
        }
      }
      int[] chosen = SeriesSelection.select(opened, chosenSeriesIds, conditions);
      if (chosen != null && reportDir != null) {
        throw new InvalidRequestException("--report charts the aggregates of every level, which need every series;"
            + " drop --series/--where to get a report, or drop --report to forecast a subset");
      }
      if (chosen != null && chosen.length == 0) {
        throw new InvalidRequestException("no series meets every --where condition " + conditions
            + "; list the store's series with lagmill series --store " + store);
      }
      opening.close();
      double[][] point;
      ForecastTable table;
      int forecastSeriesCount;
      try (Stage stage = run.stage("forecast")) {
        point = Forecaster.forecast(models, opened, horizon, stage.budget(), chosen);
        forecastSeriesCount = chosen == null ? point.length : chosen.length;
        double[] levels = intervals ? ForecastTable.publishedQuantiles() : new double[0];
        table = new ForecastTable(opened.dayCount(), point, levels,
            intervals ? CountQuantiles.quantiles(point, models.dispersionBySeries(), levels) : new double[0][][]);
        stage.addRows((long) forecastSeriesCount * horizon);
      }
      long closedSeriesDays = table.zeroClosedDays(opened);
      if (closedSeriesDays > 0 && !quiet) {
        PrintWriter err = commandSpec.commandLine().getErr();
        err.println("warning: forecast 0 for " + closedSeriesDays + " series-days declared closed (marked in the "
            + "forecast file's closed column)");
        err.flush();
      }
      run.record().result("closedSeriesDays", closedSeriesDays).result("fill", opened.manifest().fill());
      try (Stage stage = run.stage("write")) {
        if (wide) {
          ForecastFileWriter.writeWide(table, opened, out);
        } else {
          ForecastFileWriter.writeLong(table, opened, out);
        }
      }
      run.record().configure("store", store.toString()).configure("model", model.toString())
          .configure("horizonDays", horizon).configure("intervals", intervals)
          .configure("planCarryForward", planCarryForward)
          .configure("series", chosenSeriesIds).configure("where", conditions)
          .result("seriesCount", forecastSeriesCount).result("forecastFile", out.toString())
          .result("firstDate", opened.dateOf(opened.dayCount()).toString())
          .result("lastDate", opened.dateOf(opened.dayCount() + horizon - 1).toString());
      if (reportDir != null) {
        ReportData.Builder report = RunReport.start("lagmill forecast", "lagmill forecast --store " + store
            + " --model " + model, store.toString());
        if (coverage.planCarriedSeriesPeriods() > 0) {
          report.caution(ReportData.DEFAULT_CAUTION + " The promotion plan ended before the horizon: its last values "
              + "were carried forward for " + coverage.planCarriedSeriesPeriods() + " series-periods.");
        }
        report.data(ReportAssembler.dataSummary(StoreSummary.of(opened)))
            .training(ReportAssembler.training(manifest.partitions()));
        if (backtestDir != null) {
          ReportData backtest = ReportJson.read(backtestDir.resolve(RunReport.JSON_FILE));
          if (backtest.accuracy() == null) {
            throw new InvalidRequestException("--backtest " + backtestDir + ": its report.json holds no accuracy; "
                + "give the folder lagmill backtest --report wrote");
          }
          report.accuracy(backtest.accuracy()).horizon(backtest.horizon());
          BacktestMatch.warnings(backtest, opened, models.spec().horizonDays()).forEach(w -> {
            if (!quiet) {
              System.err.println("warning: " + FlagNames.render(w));
            }
          });
          run.record().configure("backtest", backtestDir.toString());
        }
        List<Level> scoredLevels = hierarchyOptions.hierarchy(opened).bind(opened);
        SeriesChartBuilder.build(opened, scoredLevels, opened.dayCount(), point, models.dispersionBySeries(),
            SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, shownSeries).forEach(report::series);
        try (Stage stage = run.stage("explain")) {
          DriverChartBuilder.build(opened, scoredLevels, models, horizon, shownSeries,
              SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, stage.budget()).forEach(report::driver);
        }
        RunReport.addStages(report, run.record(), null);
        Path html = RunReport.write(report.build(), reportDir);
        run.record().write(reportDir);
        if (!quiet) {
          outText.println("report written to " + html);
        }
      }
      if (reportDir == null) {
        // Without a report folder the record goes beside the forecast file, so every run leaves one.
        Path parent = out.toAbsolutePath().getParent();
        run.record().write(parent, out.getFileName() + ".run.json");
      }
      if (!quiet) {
        outText.printf("forecast %,d series x %s (%s .. %s) written to %s%n", forecastSeriesCount,
            Periods.count(horizon, opened.periodDays()),
            opened.dateOf(opened.dayCount()), opened.dateOf(opened.dayCount() + horizon - 1), out);
        outText.println("These are estimates for a planner to review, not orders.");
      }
    }
    return ExitCodes.OK;
  }
}
