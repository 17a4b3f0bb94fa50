package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Objects;
import java.util.function.Function;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SeriesAttributes;

/**
 * What {@link StoreIngest} reads and where it writes.
 *
 * @param salesFile the wide sales CSV (optionally {@code .gz})
 * @param calendarFile optional calendar CSV, or null
 * @param pricesFile optional prices CSV, or null
 * @param storeDir the store directory to create or replace
 * @param seriesIdColumn name of the column naming each series
 * @param calendarSource builds the calendar from the finished list of series, or null; see {@link #withCalendar}
 * @param pricesSource builds the price table (indexed by series) from the finished list of series, or null
 */
public record IngestOptions(Path salesFile, Path calendarFile, Path pricesFile, Path storeDir, String seriesIdColumn,
    Function<SeriesAttributes, DayCalendar> calendarSource, Function<SeriesAttributes, PriceTable> pricesSource) {

  public IngestOptions {
    Objects.requireNonNull(salesFile, "salesFile");
    Objects.requireNonNull(storeDir, "storeDir");
    Objects.requireNonNull(seriesIdColumn, "seriesIdColumn");
    if (seriesIdColumn.isEmpty()) {
      throw new IllegalArgumentException("seriesIdColumn must not be empty; the default is "
          + WideSalesReader.DEFAULT_SERIES_ID_COLUMN);
    }
  }

  /** Sales only, the default series-id column. */
  public static IngestOptions of(Path salesFile, Path storeDir) {
    return new IngestOptions(salesFile, null, null, storeDir, WideSalesReader.DEFAULT_SERIES_ID_COLUMN, null, null);
  }

  public IngestOptions withSeriesIdColumn(String column) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, column, calendarSource, pricesSource);
  }

  public IngestOptions withCalendarFile(Path file) {
    return new IngestOptions(salesFile, file, pricesFile, storeDir, seriesIdColumn, calendarSource, pricesSource);
  }

  public IngestOptions withPricesFile(Path file) {
    return new IngestOptions(salesFile, calendarFile, file, storeDir, seriesIdColumn, calendarSource, pricesSource);
  }

  /** A calendar already parsed, aligned to day 0 = the first sales date. */
  public IngestOptions withCalendar(DayCalendar calendar) {
    return withCalendar(attributes -> calendar);
  }

  /** A calendar built once the series are known (a keyed column needs the store's attribute codes). */
  public IngestOptions withCalendar(Function<SeriesAttributes, DayCalendar> source) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, seriesIdColumn, source, pricesSource);
  }

  /** A price table already built, indexed by series in the sales file's row order, days from the first sales date. */
  public IngestOptions withPrices(PriceTable prices) {
    return withPrices(attributes -> prices);
  }

  /** A price table built once the series are known (the price reader maps its keys to series indexes). */
  public IngestOptions withPrices(Function<SeriesAttributes, PriceTable> source) {
    return new IngestOptions(salesFile, calendarFile, pricesFile, storeDir, seriesIdColumn, calendarSource, source);
  }
}
