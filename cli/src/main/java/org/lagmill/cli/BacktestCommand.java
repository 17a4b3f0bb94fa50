package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.lagmill.run.BacktestJob;
import org.lagmill.run.RunRecord;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill backtest}: rolling-origin backtest of the model against baselines, with a report. */
@Command(name = "backtest", header = "Score the model against baselines over rolling forecast origins.",
    mixinStandardHelpOptions = true,
    description = {"Rolling-origin backtest: for each origin, train only on the days before it, forecast the horizon",
        "as in production and score WRMSSE per level beside naive, seasonal naive, moving average, exponential",
        "smoothing, Croston and ETS (exponential smoothing with trend and season, chosen per series) baselines on",
        "the same days."},
    footer = {"", "Example:", "  lagmill backtest --store stores/chain --origins 3 --step 28 --report runs/bt1",
        "  lagmill backtest --store stores/chain --origins 3 --report runs/bt2 \\",
        "      --continue-origins --save-last-model models/last-origin"})
final class BacktestCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Mixin
  StoreOption store;

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

  @Mixin
  ShownSeriesOption shown;

  @Mixin
  JsonOption json;

  @Mixin
  MemoryLimitOption memoryLimit;

  @Mixin
  QuietOption quiet;

  @Option(names = "--member", paramLabel = "SPEC[@ATTRIBUTE]", description = "a member of a combined model: a "
      + "feature spec YAML, optionally @ the attribute to partition by (e.g. recursive.yaml@store); repeat it: each "
      + "member and their average are scored on the same origins, the training options apply to all")
  List<String> members = List.of();

  @Option(names = "--scoring-part", paramLabel = "FILE", description = {"also write this store's additive share of",
      "every origin's scores (a shard's; lagmill merge-scores adds the shards' into one hierarchy-wide backtest",
      "score); point forecasts only, one plan"})
  Path scoringPart;

  @Option(names = "--continue-origins", description = {"every origin after the first continues from the previous",
      "origin's model (its trees, then added rounds until early stopping) instead of boosting from scratch;",
      "one plan, not --member"})
  boolean continueOrigins;

  @Option(names = "--save-last-model", paramLabel = "DIR", description = {"save the last origin's model as a model",
      "directory, as train writes one: lagmill train --continue-from DIR then adds the newest days; one plan"})
  Path lastModelDir;

  @Mixin
  TrainingOptions training;
  @Mixin
  HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    BacktestJob.Outcome outcome = BacktestJob.run(new BacktestJob.Request(store.dir, originCount, stepDays,
        memoryLimit.bytes(), reportDir, shown.seriesIds,
        (periodDays, cut) -> training.members(members, periodDays, cut),
        hierarchyOptions::hierarchy,
        "lagmill backtest --store " + store.dir + " --origins " + originCount, scoringPart, continueOrigins,
        lastModelDir),
        ConsoleProgress.forCommand(quiet.on));
    PrintWriter out = commandSpec.commandLine().getOut();
    if (json.on) {
      out.println(RunRecord.JSON.writeValueAsString(outcome.written()));
    } else if (!quiet.on) {
      if (outcome.combined() != null) {
        BacktestPrinter.printMembers(out, outcome.combined());
      }
      BacktestPrinter.print(out, outcome.backtest().result());
      BacktestPrinter.printContinued(out, outcome.backtest().result());
      if (lastModelDir != null) {
        out.println("last origin's model written to " + lastModelDir);
      }
      ScoredLevels.print(out, outcome.firstOriginScores(), outcome.manifest());
      out.println("report written to " + outcome.reportHtml());
    }
    return ExitCodes.OK;
  }

}
