package org.lagmill.cli;

import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.run.DemoJob;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code lagmill demo}: the whole job on the built-in invented scenario: generate, ingest, backtest against the
 * baselines (the last four weeks withheld as a final check), train on the full history, forecast four weeks with
 * intervals, write the report.
 */
@Command(name = "demo",
    header = "Run the whole job on built-in demo data, from invented history to forecast and report.",
    mixinStandardHelpOptions = true,
    description = {"Run the whole job on built-in demo data: generate an invented chain's history, ingest it, backtest",
        "against baselines, train on the full history, forecast 28 days with intervals and write the report."},
    footer = {"", "Example:", "  lagmill demo --out demo-run --size small"})
final class DemoCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Option(names = "--out", paramLabel = "DIR", defaultValue = "demo-run", description = "output folder (default: "
      + "${DEFAULT-VALUE})")
  Path outDir;

  @Option(names = "--size", paramLabel = "SIZE", defaultValue = "medium", description = "small (300 series x 2 "
      + "years), medium (3,000 x 3 years) or large (10,000 x 4 years) (default: ${DEFAULT-VALUE})")
  String size;

  @Option(names = "--seed", paramLabel = "N", defaultValue = "42", description = "scenario seed (default: "
      + "${DEFAULT-VALUE})")
  long seed;

  @Mixin
  QuietOption quiet;

  @Override
  public Integer call() throws Exception {
    DemoJob.Outcome outcome = DemoJob.run(new DemoJob.Request(outDir, parseSize(size), seed, "lagmill demo --size "
        + size), ConsoleProgress.forCommand(quiet.on), Warnings.to(commandSpec.commandLine().getErr()));
    DemoPrinter.print(commandSpec.commandLine().getOut(), outcome);
    return ExitCodes.OK;
  }

  private static DemoJob.Size parseSize(String text) {
    try {
      return DemoJob.Size.valueOf(text.toUpperCase(Locale.ROOT));
    } catch (IllegalArgumentException e) {
      throw new InvalidRequestException("--size must be small, medium or large, got '" + text + "'");
    }
  }
}
