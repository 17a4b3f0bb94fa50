package org.lagmill.cli;

import java.util.LinkedHashMap;
import java.util.Map;
import org.lagmill.ingest.CalendarFileReader;
import org.lagmill.ingest.ClosuresFileReader;
import org.lagmill.ingest.ColumnNames;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.ingest.KeyColumns;
import org.lagmill.ingest.LongSalesReader;
import org.lagmill.ingest.PriceFileReader;
import org.lagmill.store.SeriesIdentity;
import picocli.CommandLine.Option;

/**
 * The column-name options of every input file, shared by {@code ingest} and {@code append}: the one place they are
 * defined; the defaults are the readers' own (docs/formats.md). Each dated file has its own date columns
 * ({@code --sales-date-column}, {@code --calendar-date-column}, {@code --prices-from-column},
 * {@code --closures-from-column} and {@code --closures-until-column}); the plan file's are with its own options. The
 * key columns of prices, plan and closures may be named otherwise than the attributes ({@code --prices-key-column
 * sku=article_code}, {@code --plan-key-column}, {@code --closures-key-column}).
 */
final class ColumnOptions {
  @Option(names = "--series-id-column", paramLabel = "NAME", defaultValue = SeriesIdentity.SERIES_ID,
      description = "column naming each series (default: ${DEFAULT-VALUE}); without it a series is named by its "
          + "attribute values joined with '/'")
  String seriesIdColumn;

  @Option(names = "--date-column", paramLabel = "NAME", defaultValue = CalendarFileReader.DEFAULT_DATE_COLUMN,
      description = "date column of the calendar and of long sales (default: ${DEFAULT-VALUE})")
  String dateColumn;

  @Option(names = "--sales-date-column", paramLabel = "NAME",
      description = "date column of long sales only (default: --date-column)")
  String salesDateColumn;

  @Option(names = "--calendar-date-column", paramLabel = "NAME",
      description = "date column of the calendar only (default: --date-column)")
  String calendarDateColumn;

  @Option(names = "--units-column", paramLabel = "NAME", defaultValue = LongSalesReader.DEFAULT_UNITS_COLUMN,
      description = "units column of long sales (default: ${DEFAULT-VALUE})")
  String unitsColumn;

  @Option(names = {"--prices-from-column", "--from-column"}, paramLabel = "NAME",
      defaultValue = PriceFileReader.DEFAULT_FROM_COLUMN,
      description = "date column of prices: the price holds from it (default: ${DEFAULT-VALUE})")
  String fromColumn;

  @Option(names = {"--prices-price-column", "--price-column"}, paramLabel = "NAME",
      defaultValue = PriceFileReader.DEFAULT_PRICE_COLUMN,
      description = "price column of prices (default: ${DEFAULT-VALUE})")
  String priceColumn;

  @Option(names = "--closures-from-column", paramLabel = "NAME",
      defaultValue = ClosuresFileReader.DEFAULT_FROM_COLUMN,
      description = "first closed date of closures (default: ${DEFAULT-VALUE})")
  String closuresFromColumn;

  @Option(names = "--closures-until-column", paramLabel = "NAME",
      defaultValue = ClosuresFileReader.DEFAULT_UNTIL_COLUMN,
      description = "last closed date of closures, included (default: ${DEFAULT-VALUE})")
  String closuresUntilColumn;

  @Option(names = "--prices-key-column", paramLabel = "ATTRIBUTE=COLUMN", description = "a key column of prices "
      + "named otherwise than the sales' attribute, e.g. sku=article_code; repeatable (default: key columns carry "
      + "the attribute names)")
  Map<String, String> pricesKeyColumns = new LinkedHashMap<>();

  @Option(names = "--plan-key-column", paramLabel = "ATTRIBUTE=COLUMN", description = "a key column of the plan "
      + "named otherwise than the sales' attribute; repeatable")
  Map<String, String> planKeyColumns = new LinkedHashMap<>();

  @Option(names = "--closures-key-column", paramLabel = "ATTRIBUTE=COLUMN", description = "a key column of closures "
      + "named otherwise than the sales' attribute, e.g. shop=store_no; repeatable")
  Map<String, String> closuresKeyColumns = new LinkedHashMap<>();

  ColumnNames names() {
    ColumnNames names = ColumnNames.DEFAULTS.with(Column.SERIES_ID, seriesIdColumn).withDateColumn(dateColumn)
        .with(Column.PRICES_FROM, fromColumn).with(Column.PRICE, priceColumn).with(Column.UNITS, unitsColumn)
        .with(Column.CLOSURES_FROM, closuresFromColumn).with(Column.CLOSURES_UNTIL, closuresUntilColumn)
        .withKeyColumns(new KeyColumns(pricesKeyColumns, planKeyColumns, closuresKeyColumns));
    if (salesDateColumn != null) {
      names = names.with(Column.SALES_DATE, salesDateColumn);
    }
    if (calendarDateColumn != null) {
      names = names.with(Column.CALENDAR_DATE, calendarDateColumn);
    }
    return names;
  }
}
