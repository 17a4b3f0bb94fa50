package org.lagmill.ingest;

import java.util.Objects;
import org.lagmill.io.InvalidRequestException;
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
 */
public record ColumnNames(String seriesIdColumn, String dateColumn, String unitsColumn, String fromColumn,
    String priceColumn, String calendarDateColumn) {
  /** The documented defaults: series_id, date, units, from, price. */
  public static final ColumnNames DEFAULTS = new ColumnNames(SeriesIdentity.SERIES_ID,
      CalendarFileReader.DEFAULT_DATE_COLUMN, LongSalesReader.DEFAULT_UNITS_COLUMN,
      PriceFileReader.DEFAULT_FROM_COLUMN, PriceFileReader.DEFAULT_PRICE_COLUMN,
      CalendarFileReader.DEFAULT_DATE_COLUMN);

  public ColumnNames {
    requireName(seriesIdColumn, "--series-id-column", SeriesIdentity.SERIES_ID);
    requireName(dateColumn, "--date-column", CalendarFileReader.DEFAULT_DATE_COLUMN);
    requireName(unitsColumn, "--units-column", LongSalesReader.DEFAULT_UNITS_COLUMN);
    requireName(fromColumn, "--from-column", PriceFileReader.DEFAULT_FROM_COLUMN);
    requireName(priceColumn, "--price-column", PriceFileReader.DEFAULT_PRICE_COLUMN);
    requireName(calendarDateColumn, "--calendar-date-column", CalendarFileReader.DEFAULT_DATE_COLUMN);
  }

  private static void requireName(String name, String option, String defaultName) {
    Objects.requireNonNull(name, option);
    if (name.isEmpty()) {
      throw new InvalidRequestException(option + " must name a column, got an empty name; the default is "
          + defaultName);
    }
  }

  public ColumnNames withSeriesIdColumn(String name) {
    return new ColumnNames(name, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn);
  }

  /** The date column of long sales and of the calendar at once ({@code --date-column}). */
  public ColumnNames withDateColumn(String name) {
    return new ColumnNames(seriesIdColumn, name, unitsColumn, fromColumn, priceColumn, name);
  }

  /** The date column of long sales only. */
  public ColumnNames withSalesDateColumn(String name) {
    return new ColumnNames(seriesIdColumn, name, unitsColumn, fromColumn, priceColumn, calendarDateColumn);
  }

  /** The date column of the calendar only. */
  public ColumnNames withCalendarDateColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, name);
  }

  public ColumnNames withUnitsColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, name, fromColumn, priceColumn, calendarDateColumn);
  }

  public ColumnNames withFromColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, name, priceColumn, calendarDateColumn);
  }

  public ColumnNames withPriceColumn(String name) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, fromColumn, name, calendarDateColumn);
  }
}
