package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.concurrent.Callable;
import org.lagmill.report.DriverChart;
import org.lagmill.run.ExplainJob;
import org.lagmill.run.RunRecord;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill explain}: splits the forecast of named series and top aggregates into its drivers. */
@Command(name = "explain", header = "Show why a forecast is what it is: its parts by driver family.",
    mixinStandardHelpOptions = true,
    description = {"Forecast as lagmill forecast does, and split each forecast period of the named series and of",
        "the largest aggregate of each level into a base level and the share of each family of inputs (recent",
        "sales, weekly pattern, season, events and holidays, price, plan, launch), in units; the parts add up to",
        "the forecast. From the model's own per-input contributions: what the model leaned on, not cause and effect."},
    footer = {"", "Example:", "  lagmill explain --store stores/chain --model models/week49 \\",
        "      --series k2/north/dry --json"})
final class ExplainCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Mixin
  StoreOption store;

  @Mixin
  ModelOption model;

  @Option(names = "--series", split = ",", paramLabel = "SERIES_ID", description = "series to explain besides the "
      + "largest aggregate of each level")
  List<String> seriesIds = List.of();

  @Option(names = "--horizon", converter = Counts.Positive.class,
      paramLabel = "PERIODS", description = "periods to forecast (default: the model's "
          + "horizon)")
  Integer horizonDays;

  @Option(names = "--plan-carry-forward", description = "when the plan ends before the horizon does, carry each "
      + "key's last plan values forward (counted in a warning) instead of stopping")
  boolean planCarryForward;

  @Mixin
  JsonOption json;

  @Mixin
  HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = commandSpec.commandLine().getOut();
    PrintWriter err = commandSpec.commandLine().getErr();
    List<DriverChart> charts = ExplainJob.run(new ExplainJob.Request(store.dir, model.dir, horizonDays, seriesIds,
        planCarryForward, hierarchyOptions::hierarchy), Warnings.to(err));
    if (json.on) {
      out.println(RunRecord.JSON.writeValueAsString(ExplainPrinter.document(charts)));
    } else {
      ExplainPrinter.print(out, charts);
    }
    return ExitCodes.OK;
  }
}
