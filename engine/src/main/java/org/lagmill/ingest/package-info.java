/**
 * Reads the user's CSV files and writes a store directory in a temporary sibling, renamed into place only when every
 * file read without error. Depends on {@code memory} and {@code store}. Bad input raises
 * {@link org.lagmill.ingest.InputFormatException} naming file, line and column.
 *
 * <p>Entry points: {@link org.lagmill.ingest.StoreIngest#ingest} (with {@link org.lagmill.ingest.IngestOptions}) builds
 * or replaces a store; {@link org.lagmill.ingest.StoreAppend#append} (with {@link org.lagmill.ingest.AppendOptions})
 * adds the next days and may replace calendar and prices. Both options hold a {@link org.lagmill.ingest.SalesInputs}
 * (the input files and how to read them). Both return an {@link org.lagmill.ingest.IngestResult}: the published
 * manifest and the readers' warnings.
 *
 * <p>Readers, one per file kind:
 * <ul>
 *   <li>{@link org.lagmill.ingest.WideSalesReader}: wide sales, streamed row by row from bytes (one row on the heap).
 *   <li>{@link org.lagmill.ingest.LongSalesReader}: long sales in two passes, units gathered in native memory
 *       (4 bytes per item-day), handed on through a {@link org.lagmill.ingest.SeriesSink}.
 *   <li>{@link org.lagmill.ingest.CalendarFileReader}: the day calendar, aligned to the store's first date.
 *   <li>{@link org.lagmill.ingest.PriceFileReader}: price change points per series, keyed by series attributes.
 * </ul>
 * {@link org.lagmill.ingest.SalesFormat} decides wide or long from the header; {@link org.lagmill.ingest.ColumnNames}
 * holds the renamable column names (each with its setting and default in {@code ColumnNames.Column});
 * {@link org.lagmill.ingest.CsvSource} is the strict UTF-8, gzip-aware CSV input the long, calendar and price readers
 * share. {@code SeriesKeys} is the one matcher of the key columns of dated per-key
 * files (prices, plan, closures) to the series they cover.
 */
package org.lagmill.ingest;
