package org.lagmill.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** {@code --report DIR} where a report is optional; null when absent. */
final class ReportOption {
  @Option(names = "--report", paramLabel = "DIR", description = "also write report.html and report.json here")
  Path dir;
}
