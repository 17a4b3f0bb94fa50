package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.run.ForecastJob;
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

  @Mixin
  StoreOption store;

  @Mixin
  ModelOption model;

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

  @Mixin
  ReportOption report;

  @Option(names = "--backtest", paramLabel = "DIR", description = "with --report: include the accuracy of this "
      + "backtest of the same store (the folder backtest --report wrote)")
  Path backtestDir;

  @Mixin
  ShownSeriesOption shown;

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

  @Mixin
  QuietOption quiet;

  @Mixin
  HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    if (wide && intervals) {
      throw new InvalidRequestException("--wide holds one point forecast per date and no quantiles; drop --wide to "
          + "get the quantile columns, or drop --intervals");
    }
    if (backtestDir != null && report.dir == null) {
      throw new InvalidRequestException("--backtest adds a backtest's accuracy to the report; give --report DIR "
          + "as well");
    }
    PrintWriter err = commandSpec.commandLine().getErr();
    ForecastJob.Outcome outcome = ForecastJob.run(
        new ForecastJob.Request(store.dir, model.dir, horizonDays, out, intervals,
            wide, report.dir, backtestDir, shown.seriesIds, chosenSeriesIds, conditions, planCarryForward,
            hierarchyOptions::hierarchy, "lagmill forecast --store " + store.dir + " --model " + model.dir),
        quiet.on ? Warnings.none() : Warnings.to(err));
    if (!quiet.on) {
      ForecastPrinter.print(commandSpec.commandLine().getOut(), outcome);
    }
    return ExitCodes.OK;
  }
}
