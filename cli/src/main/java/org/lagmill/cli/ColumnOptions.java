package org.lagmill.cli;

import org.lagmill.ingest.ColumnNames;
import org.lagmill.store.SeriesIdentity;
import picocli.CommandLine.Option;

/** The column-name options shared by {@code ingest} and {@code append}; defaults as in docs/formats.md. */
final class ColumnOptions {
  @Option(names = "--series-id-column", paramLabel = "NAME", defaultValue = SeriesIdentity.SERIES_ID,
      description = "column naming each series (default: ${DEFAULT-VALUE}); without it a series is named by its "
          + "attribute values joined with '/'")
  String seriesIdColumn;

  @Option(names = "--date-column", paramLabel = "NAME", defaultValue = "date",
      description = "date column of the calendar and of long sales (default: ${DEFAULT-VALUE})")
  String dateColumn;

  @Option(names = "--sales-date-column", paramLabel = "NAME",
      description = "date column of long sales only (default: --date-column)")
  String salesDateColumn;

  @Option(names = "--calendar-date-column", paramLabel = "NAME",
      description = "date column of the calendar only (default: --date-column)")
  String calendarDateColumn;

  @Option(names = "--from-column", paramLabel = "NAME", defaultValue = "from",
      description = "date column of prices (default: ${DEFAULT-VALUE})")
  String fromColumn;

  @Option(names = "--price-column", paramLabel = "NAME", defaultValue = "price",
      description = "price column of prices (default: ${DEFAULT-VALUE})")
  String priceColumn;

  ColumnNames names() {
    ColumnNames names = ColumnNames.DEFAULTS.withSeriesIdColumn(seriesIdColumn).withDateColumn(dateColumn)
        .withFromColumn(fromColumn).withPriceColumn(priceColumn);
    if (salesDateColumn != null) {
      names = names.withSalesDateColumn(salesDateColumn);
    }
    if (calendarDateColumn != null) {
      names = names.withCalendarDateColumn(calendarDateColumn);
    }
    return names;
  }
}
