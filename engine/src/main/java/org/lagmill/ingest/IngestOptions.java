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
 * @param inputs the sales file (required) and the optional calendar, prices, closures and plan files, with the
 *     column names and the sales format; the calendar and prices files are read with {@link CalendarFileReader} and
 *     {@link PriceFileReader} unless a source is given
 * @param storeDir the store directory to create or replace
 * @param calendarSource builds the calendar from the finished list of series, or null; takes precedence over the
 *     calendar file (which is then only recorded as a source)
 * @param pricesSource builds the price table (indexed by series) from the finished list of series, or null; takes
 *     precedence over the prices file
 * @param periodDays the period given with {@code --period} (checked against the dates), or null to detect it
 */
public record IngestOptions(SalesInputs inputs, Path storeDir, Function<SeriesAttributes, DayCalendar> calendarSource,
    Function<SeriesAttributes, PriceTable> pricesSource, Integer periodDays) {
  public IngestOptions {
    Objects.requireNonNull(inputs, "inputs");
    Objects.requireNonNull(inputs.salesFile(), "salesFile");
    Objects.requireNonNull(storeDir, "storeDir");
  }

  /** These inputs, the period detected from the sales file. */
  public static IngestOptions of(SalesInputs inputs, Path storeDir) {
    return new IngestOptions(inputs, storeDir, null, null, null);
  }

  /** Sales only, default column names, format decided from the header. */
  public static IngestOptions of(Path salesFile, Path storeDir) {
    return of(SalesInputs.of(salesFile), storeDir);
  }

  /**
   * The store's period in days ({@code --period}), checked against the sales file's dates, or null to detect it
   * from them.
   */
  public IngestOptions withPeriodDays(Integer days) {
    return new IngestOptions(inputs, storeDir, calendarSource, pricesSource,
        days == null ? null : Periods.requireValid(days));
  }

  /** A calendar already parsed, aligned to day 0 = the first sales date. */
  public IngestOptions withCalendar(DayCalendar calendar) {
    return withCalendar(attributes -> calendar);
  }

  /** A calendar built once the series are known (a keyed column needs the store's attribute codes). */
  public IngestOptions withCalendar(Function<SeriesAttributes, DayCalendar> source) {
    return new IngestOptions(inputs, storeDir, source, pricesSource, periodDays);
  }

  /** A price table already built, indexed by series in the sales file's row order, days from the first sales date. */
  public IngestOptions withPrices(PriceTable prices) {
    return withPrices(attributes -> prices);
  }

  /** A price table built once the series are known (the price reader maps its keys to series indexes). */
  public IngestOptions withPrices(Function<SeriesAttributes, PriceTable> source) {
    return new IngestOptions(inputs, storeDir, calendarSource, source, periodDays);
  }
}
