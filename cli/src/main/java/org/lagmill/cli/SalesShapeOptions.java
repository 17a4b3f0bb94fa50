package org.lagmill.cli;

import org.lagmill.ingest.MissingRows;
import org.lagmill.ingest.SalesFormat;
import picocli.CommandLine.Option;

/** How a sales file is shaped and what a missing row means: the options {@code ingest} and {@code append} share. */
final class SalesShapeOptions {
  @Option(names = "--sales-format", paramLabel = "FORMAT", defaultValue = "auto",
      description = "wide, long or auto: wide when a header is an ISO date, long when it has the date and units "
          + "columns (default: ${DEFAULT-VALUE})")
  String salesFormat;

  @Option(names = "--missing-rows", paramLabel = "POLICY", defaultValue = "zero",
      description = {"what a period with no row means in long sales, from each series' first row to the file's",
          "last date (on append, from the store's next period for series it lists): zero (till exports leave out",
          "days with no sale) or unknown (default: ${DEFAULT-VALUE}); empty cells are unknown either way"})
  String missingRows;

  SalesFormat format() {
    return SalesFormat.parse(salesFormat);
  }

  MissingRows missingRows() {
    return MissingRows.parse(missingRows);
  }
}
