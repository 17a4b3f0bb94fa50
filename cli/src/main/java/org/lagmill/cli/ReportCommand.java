package org.lagmill.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.report.ReportJson;
import org.lagmill.run.RunReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill report}: rebuilds a run's HTML report from its report.json. */
@Command(name = "report", header = "Rebuild a run's HTML report from its report.json.", mixinStandardHelpOptions = true,
    description = "Rebuild the HTML report of a run (backtest, forecast or demo) from its report.json.",
    footer = {"", "Example:", "  lagmill report --run demo-run/report"})
final class ReportCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--run", required = true, paramLabel = "DIR", description = "folder holding report.json")
  Path run;

  @Override
  public Integer call() throws Exception {
    Path html = RunReport.write(ReportJson.read(run.resolve(RunReport.JSON_FILE)), run);
    spec.commandLine().getOut().println("report written to " + html);
    return ExitCodes.OK;
  }
}
