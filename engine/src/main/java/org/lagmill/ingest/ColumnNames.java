package org.lagmill.ingest;

import java.util.Objects;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.store.SeriesIdentity;

/**
 * Names of the columns the readers look for, each renamable on the command line (see docs/formats.md, "Column-name
 * options"). Immutable.
 *
 * @param seriesIdColumn the column naming each series in wide and long sales ({@code --series-id-column}); stored as
 *     the attribute {@code series_id}
 * @param dateColumn the date column of long sales ({@code --sales-date-column}, or {@code --date-column} for both)
 * @param unitsColumn the units column of long sales ({@code --units-column})
 * @param fromColumn the date column of prices ({@code --from-column})
 * @param priceColumn the price column of prices ({@code --price-column})
 * @param calendarDateColumn the date column of the calendar ({@code --calendar-date-column}, or {@code --date-column}
 *     for both)
 * @param closuresFromColumn the first closed date of closures ({@code --closures-from-column})
 * @param closuresUntilColumn the last closed date of closures ({@code --closures-until-column})
 * @param keyColumns key columns of the prices, plan and closures files named otherwise than the attributes
 */
public record ColumnNames(String seriesIdColumn, String dateColumn, String unitsColumn, String fromColumn,
    String priceColumn, String calendarDateColumn, String closuresFromColumn, String closuresUntilColumn,
    KeyColumns keyColumns) {
  /** The documented defaults: series_id, date, units, from, price, and from, until for closures. */
  public static final ColumnNames DEFAULTS = new ColumnNames(SeriesIdentity.SERIES_ID,
      CalendarFileReader.DEFAULT_DATE_COLUMN, LongSalesReader.DEFAULT_UNITS_COLUMN,
      PriceFileReader.DEFAULT_FROM_COLUMN, PriceFileReader.DEFAULT_PRICE_COLUMN,
      CalendarFileReader.DEFAULT_DATE_COLUMN, ClosuresFileReader.DEFAULT_FROM_COLUMN,
      ClosuresFileReader.DEFAULT_UNTIL_COLUMN, KeyColumns.NONE);

  /** The six columns of sales, calendar and prices, with the closures' default columns. */
  public ColumnNames(String seriesIdColumn, String dateColumn, String unitsColumn, String fromColumn,
      String priceColumn, String calendarDateColumn) {
    this(seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        ClosuresFileReader.DEFAULT_FROM_COLUMN, ClosuresFileReader.DEFAULT_UNTIL_COLUMN, KeyColumns.NONE);
  }

  public ColumnNames {
    requireName(seriesIdColumn, Setting.SERIES_ID_COLUMN.toString(), SeriesIdentity.SERIES_ID);
    requireName(dateColumn, Setting.DATE_COLUMN.toString(), CalendarFileReader.DEFAULT_DATE_COLUMN);
    requireName(unitsColumn, Setting.UNITS_COLUMN.toString(), LongSalesReader.DEFAULT_UNITS_COLUMN);
    requireName(fromColumn, Setting.PRICES_FROM_COLUMN.toString(), PriceFileReader.DEFAULT_FROM_COLUMN);
    requireName(priceColumn, Setting.PRICES_PRICE_COLUMN.toString(), PriceFileReader.DEFAULT_PRICE_COLUMN);
    requireName(calendarDateColumn, Setting.CALENDAR_DATE_COLUMN.toString(), CalendarFileReader.DEFAULT_DATE_COLUMN);
    requireName(closuresFromColumn, Setting.CLOSURES_FROM_COLUMN.toString(), ClosuresFileReader.DEFAULT_FROM_COLUMN);
    requireName(closuresUntilColumn, Setting.CLOSURES_UNTIL_COLUMN.toString(), ClosuresFileReader.DEFAULT_UNTIL_COLUMN);
    Objects.requireNonNull(keyColumns, "keyColumns");
  }

  private static void requireName(String name, String option, String defaultName) {
    Objects.requireNonNull(name, option);
    if (name.isEmpty()) {
      throw new InvalidRequestException(option + " must name a column, got an empty name; the default is "
          + defaultName);
    }
  }

  public ColumnNames withSeriesIdColumn(String name) {
    return new ColumnNames(name, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn, keyColumns);
  }

  /** The date column of long sales and of the calendar at once ({@code --date-column}). */
  public ColumnNames withDateColumn(String name) {
    return new ColumnNames(seriesIdColumn, name, unitsColumn, fromColumn, priceColumn, name,
        closuresFromColumn, closuresUntilColumn, keyColumns);
  }

  /** The date column of long sales only. */
  public ColumnNames withSalesDateColumn(String name) {
    return new ColumnNames(seriesIdColumn, name, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn, keyColumns);
  }

  /** The date column of the calendar only. */
  public ColumnNames withCalendarDateColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, name,
        closuresFromColumn, closuresUntilColumn, keyColumns);
  }

  public ColumnNames withUnitsColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, name, fromColumn, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn, keyColumns);
  }

  public ColumnNames withFromColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, name, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn, keyColumns);
  }

  public ColumnNames withPriceColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, fromColumn, name, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn, keyColumns);
  }

  /** The date columns of closures: first and last closed date. */
  public ColumnNames withClosuresColumns(String fromName, String untilName) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        fromName, untilName, keyColumns);
  }

  /** Key columns of the prices, plan and closures files named otherwise than the attributes. */
  public ColumnNames withKeyColumns(KeyColumns value) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn, value);
  }
}
