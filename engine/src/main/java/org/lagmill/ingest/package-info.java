/**
 * Streaming parsers for the user's CSV files (wide or long sales, calendar, prices) that write a store directory in a
 * temporary folder and rename it into place. Entry point: {@code StoreIngest}. Depends on {@code memory} and
 * {@code store}. Bad input raises {@link org.lagmill.ingest.InputFormatException} naming file, line and column.
 */
package org.lagmill.ingest;
