package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.run.EvaluateJob;
import org.lagmill.run.RunRecord;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill evaluate}: scores a forecast file against the actuals the store holds for its days. */
@Command(name = "evaluate", header = "Score a forecast file against the actuals held in a store.",
    mixinStandardHelpOptions = true,
    description = {"Score a forecast file (long form: attributes or series_id, date, forecast, optional q… columns)",
        "against the store's actuals: WRMSSE and the per-level table, beside the baselines from the same origin."},
    footer = {"", "Example:", "  lagmill evaluate --store stores/chain --forecast week45.csv.gz --json"})
final class EvaluateCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store holding the actuals")
  Path store;

  @Option(names = "--forecast", required = true, paramLabel = "FILE", description = "forecast CSV (.gz allowed)")
  Path forecast;

  @Mixin
  JsonOption json;

  @Mixin
  ReportOption report;

  @Option(names = "--scoring-part", paramLabel = "FILE", description = {"also write this store's additive share of",
      "the score (for a shard: merge every shard's part with lagmill merge-scores)"})
  Path scoringPart;

  @Mixin
  HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = commandSpec.commandLine().getOut();
    EvaluateJob.Outcome outcome = EvaluateJob.run(new EvaluateJob.Request(store, forecast, report.dir, scoringPart,
        hierarchyOptions::hierarchy, "lagmill evaluate --store " + store + " --forecast " + forecast));
    if (outcome.reportHtml() != null && !json.on) {
      out.println("report written to " + outcome.reportHtml());
    }
    if (json.on) {
      out.println(RunRecord.JSON.writeValueAsString(EvaluatePrinter.document(outcome)));
    } else {
      EvaluatePrinter.print(out, outcome);
    }
    return ExitCodes.OK;
  }
}
