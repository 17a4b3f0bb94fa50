package org.lagmill.store;

import java.nio.file.Path;

/**
 * Layout of {@code series.bin}: header, seriesCount int, dayCount int, then one fixed record per series, then the
 * footer. Record: units offset long (bytes from the start of units.bin), bytes per value int, first sale day index
 * int ({@link SalesHistory#NO_SALE} when none), max units int.
 */
final class SeriesTableLayout {
  static final int SERIES_COUNT_OFFSET = StoreFileFormat.HEADER_BYTES;
  static final int DAY_COUNT_OFFSET = SERIES_COUNT_OFFSET + 4;
  static final int FIRST_RECORD_OFFSET = DAY_COUNT_OFFSET + 4;
  static final int RECORD_BYTES = 20;
  static final int UNITS_OFFSET_FIELD = 0;
  static final int WIDTH_FIELD = 8;
  static final int FIRST_SALE_FIELD = 12;
  static final int MAX_UNITS_FIELD = 16;

  private SeriesTableLayout() {}

  static int recordOffset(int seriesIndex) {
    return FIRST_RECORD_OFFSET + seriesIndex * RECORD_BYTES;
  }

  static long fileBytes(int seriesCount) {
    return (long) FIRST_RECORD_OFFSET + (long) seriesCount * RECORD_BYTES + StoreFileFormat.FOOTER_BYTES;
  }

  static void checkFileSize(Path file, int seriesCount, long actualBytes) {
    long expected = fileBytes(seriesCount);
    if (expected != actualBytes) {
      throw new CorruptStoreException(file, "wrong size for " + seriesCount + " series: expected " + expected
          + " bytes, actual " + actualBytes + " bytes");
    }
  }
}
