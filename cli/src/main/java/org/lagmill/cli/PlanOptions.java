package org.lagmill.cli;

import java.nio.file.Path;
import org.lagmill.ingest.PlanFileReader;
import org.lagmill.ingest.PlanSource;
import picocli.CommandLine.Option;

/** The plan file options shared by {@code ingest} and {@code append}; the format is docs/formats/plan.md. */
final class PlanOptions {
  @Option(names = "--plan", paramLabel = "FILE", description = {"plan CSV of known-future drivers (promotions,",
      "displays, ...): key columns, a date or from column, numeric columns that become plan_<column> features"})
  Path file;

  @Option(names = "--plan-date-column", paramLabel = "NAME", defaultValue = PlanFileReader.DEFAULT_DATE_COLUMN,
      description = "plan column of dates whose row holds for that period only (default: ${DEFAULT-VALUE})")
  String dateColumn;

  @Option(names = "--plan-from-column", paramLabel = "NAME", defaultValue = PlanFileReader.DEFAULT_FROM_COLUMN,
      description = "plan column of dates whose row holds until the key's next row (default: ${DEFAULT-VALUE})")
  String fromColumn;

  /** The plan to read, or null when {@code --plan} was not given. */
  PlanSource source() {
    return file == null ? null : new PlanSource(file, dateColumn, fromColumn);
  }
}
