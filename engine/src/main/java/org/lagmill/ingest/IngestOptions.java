package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Objects;
import java.util.function.Function;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.Periods;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SeriesAttributes;

/**
 * What {@link StoreIngest} reads and where it writes.
 *
 * @param salesFile the sales CSV, wide or long (optionally {@code .gz})
 * @param calendarFile optional calendar CSV, or null; read with {@link CalendarFileReader} unless a calendar source is
 *     given
 * @param pricesFile optional prices CSV, or null; read with {@link PriceFileReader} unless a prices source is given
 * @param storeDir the store directory to create or replace
 * @param columns the column names the readers look for
 * @param salesFormat wide, long, or auto (decided from the sales file's header)
 * @param calendarSource builds the calendar from the finished list of series, or null; takes precedence over
 *     {@code calendarFile} (which is then only recorded as a source)
 * @param pricesSource builds the price table (indexed by series) from the finished list of series, or null; takes
 *     precedence over {@code pricesFile}
 * @param missingRows what a day with no row means in long sales (ignored for wide sales, whose empty cells are
 *     unknown)
 * @param periodDays the period given with {@code --period} (checked against the dates), or null to detect it
 * @param closuresFile optional closures CSV (days on which series could not sell), or null
 * @param plan optional plan file (known-future drivers) with its column names, or null
 */
public record IngestOptions(Path salesFile, Path calendarFile, Path pricesFile, Path storeDir, ColumnNames columns,
    SalesFormat salesFormat, Function<SeriesAttributes, DayCalendar> calendarSource,
    Function<SeriesAttributes, PriceTable> pricesSource, MissingRows missingRows, Path closuresFile,
    PlanSource plan, Integer periodDays) {

  /** Period detected from the sales file. */
  public IngestOptions(Path salesFile, Path calendarFile, Path pricesFile, Path storeDir, ColumnNames columns,
      SalesFormat salesFormat, Function<SeriesAttributes, DayCalendar> calendarSource,
      Function<SeriesAttributes, PriceTable> pricesSource, MissingRows missingRows, Path closuresFile,
      PlanSource plan) {
    this(salesFile, calendarFile, pricesFile, storeDir, columns, salesFormat, calendarSource, pricesSource,
        missingRows, closuresFile, plan, null);
  }

  /**
   * The store's period in days ({@code --period}), checked against the sales file's dates, or null to detect it
   * from them.
   */
  public IngestOptions withPeriodDays(Integer days) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, columns, salesFormat, calendarSource,
        pricesSource, missingRows, closuresFile, plan, days == null ? null : Periods.requireValid(days));
  }

  public IngestOptions {
    Objects.requireNonNull(salesFile, "salesFile");
    Objects.requireNonNull(storeDir, "storeDir");
    Objects.requireNonNull(columns, "columns");
    Objects.requireNonNull(salesFormat, "salesFormat");
    Objects.requireNonNull(missingRows, "missingRows");
  }

  /** Sales only, default column names, format decided from the header. */
  public static IngestOptions of(Path salesFile, Path storeDir) {
    return new IngestOptions(salesFile, null, null, storeDir, ColumnNames.DEFAULTS, SalesFormat.AUTO, null, null,
        MissingRows.DEFAULT, null, null);
  }

  /** The column naming each series ({@code --series-id-column}). */
  public String seriesIdColumn() {
    return columns.seriesIdColumn();
  }

  public IngestOptions withColumns(ColumnNames names) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, names, salesFormat, calendarSource,
        pricesSource, missingRows, closuresFile, plan, periodDays);
  }

  public IngestOptions withSalesFormat(SalesFormat format) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, columns, format, calendarSource,
        pricesSource, missingRows, closuresFile, plan, periodDays);
  }

  public IngestOptions withCalendarFile(Path file) {
    return new IngestOptions(salesFile, file, pricesFile, storeDir, columns, salesFormat, calendarSource,
        pricesSource, missingRows, closuresFile, plan, periodDays);
  }

  public IngestOptions withPricesFile(Path file) {
    return new IngestOptions(salesFile, calendarFile, file, storeDir, columns, salesFormat, calendarSource,
        pricesSource, missingRows, closuresFile, plan, periodDays);
  }

  public IngestOptions withClosuresFile(Path file) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, columns, salesFormat, calendarSource,
        pricesSource, missingRows, file, plan, periodDays);
  }

  /** A plan file read once the series are known, or null for none. */
  public IngestOptions withPlan(PlanSource source) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, columns, salesFormat, calendarSource,
        pricesSource, missingRows, closuresFile, source, periodDays);
  }

  public IngestOptions withMissingRows(MissingRows policy) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, columns, salesFormat, calendarSource,
        pricesSource, policy, closuresFile, plan, periodDays);
  }

  /** A calendar already parsed, aligned to day 0 = the first sales date. */
  public IngestOptions withCalendar(DayCalendar calendar) {
    return withCalendar(attributes -> calendar);
  }

  /** A calendar built once the series are known (a keyed column needs the store's attribute codes). */
  public IngestOptions withCalendar(Function<SeriesAttributes, DayCalendar> source) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, columns, salesFormat, source,
        pricesSource, missingRows, closuresFile, plan, periodDays);
  }

  /** A price table already built, indexed by series in the sales file's row order, days from the first sales date. */
  public IngestOptions withPrices(PriceTable prices) {
    return withPrices(attributes -> prices);
  }

  /** A price table built once the series are known (the price reader maps its keys to series indexes). */
  public IngestOptions withPrices(Function<SeriesAttributes, PriceTable> source) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, columns, salesFormat, calendarSource,
        source, missingRows, closuresFile, plan, periodDays);
  }
}
