package org.lagmill.ingest;

import java.util.Arrays;
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
  /**
   * Each renamable column: the setting that renames it and its documented default, in the order of the record's
   * components.
   */
  public enum Column {
    SERIES_ID(Setting.SERIES_ID_COLUMN, SeriesIdentity.SERIES_ID),
    SALES_DATE(Setting.DATE_COLUMN, CalendarFileReader.DEFAULT_DATE_COLUMN),
    UNITS(Setting.UNITS_COLUMN, LongSalesReader.DEFAULT_UNITS_COLUMN),
    PRICES_FROM(Setting.PRICES_FROM_COLUMN, PriceFileReader.DEFAULT_FROM_COLUMN),
    PRICE(Setting.PRICES_PRICE_COLUMN, PriceFileReader.DEFAULT_PRICE_COLUMN),
    CALENDAR_DATE(Setting.CALENDAR_DATE_COLUMN, CalendarFileReader.DEFAULT_DATE_COLUMN),
    CLOSURES_FROM(Setting.CLOSURES_FROM_COLUMN, ClosuresFileReader.DEFAULT_FROM_COLUMN),
    CLOSURES_UNTIL(Setting.CLOSURES_UNTIL_COLUMN, ClosuresFileReader.DEFAULT_UNTIL_COLUMN);

    private final Setting setting;
    private final String defaultName;

    Column(Setting setting, String defaultName) {
      this.setting = setting;
      this.defaultName = defaultName;
    }
  }

  /** The documented defaults: series_id, date, units, from, price, and from, until for closures. */
  public static final ColumnNames DEFAULTS = of(Arrays.stream(Column.values()).map(c -> c.defaultName)
      .toArray(String[]::new), KeyColumns.NONE);

  public ColumnNames {
    String[] names = {seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn};
    for (Column column : Column.values()) {
      requireName(names[column.ordinal()], column.setting, column.defaultName);
    }
    Objects.requireNonNull(keyColumns, "keyColumns");
  }

  /**
   * A column name as every input file's options need it: not null, not empty.
   *
   * @throws InvalidRequestException for an empty name, naming the setting and its default
   */
  static void requireName(String name, Setting setting, String defaultName) {
    Objects.requireNonNull(name, setting.toString());
    if (name.isEmpty()) {
      throw new InvalidRequestException(setting + " must name a column, got an empty name; the default is "
          + defaultName);
    }
  }

  /** These names with {@code column} named {@code name}. */
  public ColumnNames with(Column column, String name) {
    String[] names = {seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn};
    names[column.ordinal()] = name;
    return of(names, keyColumns);
  }

  /** The date column of long sales and of the calendar at once ({@code --date-column}). */
  public ColumnNames withDateColumn(String name) {
    return with(Column.SALES_DATE, name).with(Column.CALENDAR_DATE, name);
  }

  /** Key columns of the prices, plan and closures files named otherwise than the attributes. */
  public ColumnNames withKeyColumns(KeyColumns value) {
    return new ColumnNames(seriesIdColumn, dateColumn, unitsColumn, fromColumn, priceColumn, calendarDateColumn,
        closuresFromColumn, closuresUntilColumn, value);
  }

  private static ColumnNames of(String[] names, KeyColumns keyColumns) {
    return new ColumnNames(names[0], names[1], names[2], names[3], names[4], names[5], names[6], names[7],
        keyColumns);
  }
}
