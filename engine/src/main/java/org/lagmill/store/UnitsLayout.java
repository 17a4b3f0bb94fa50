package org.lagmill.store;

import java.nio.file.Path;

/**
 * Layout of {@code units.bin}: header, then each series' units column back to back in series order (offsets and widths
 * in {@link SeriesTableLayout}), then the footer. Values are little-endian unsigned integers of the series' width.
 */
final class UnitsLayout {
  static final long FIRST_SERIES_OFFSET = StoreFileFormat.HEADER_BYTES;

  private UnitsLayout() {}

  /** Size of a units file whose columns take {@code columnBytes} in total. */
  static long fileBytes(long columnBytes) {
    return StoreFileFormat.fileBytes(columnBytes);
  }

  static void checkFileSize(Path file, long columnBytes, long actualBytes) {
    long expected = fileBytes(columnBytes);
    if (expected != actualBytes) {
      throw new CorruptStoreException(file, "wrong size for the series table's columns: expected " + expected
          + " bytes, actual " + actualBytes + " bytes");
    }
  }
}
