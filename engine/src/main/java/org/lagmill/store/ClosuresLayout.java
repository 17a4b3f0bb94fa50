package org.lagmill.store;

import java.nio.file.Path;

/**
 * Layout of {@code closures.bin}: header, seriesCount int, rangeCount int (all series), then seriesCount+1 int range
 * starts (series s owns ranges {@code start[s] .. start[s+1]-1}), then rangeCount int first day indexes, then
 * rangeCount int last day indexes (inclusive), then the footer. Day indexes count from the store's first date and are
 * never negative; they may lie past the last sales day.
 */
final class ClosuresLayout {
  static final int SERIES_COUNT_OFFSET = StoreFileFormat.HEADER_BYTES;
  static final int RANGE_COUNT_OFFSET = SERIES_COUNT_OFFSET + 4;
  static final int RANGE_STARTS_OFFSET = RANGE_COUNT_OFFSET + 4;

  private ClosuresLayout() {}

  static long rangeStartOffset(int seriesIndex) {
    return RANGE_STARTS_OFFSET + (long) seriesIndex * Integer.BYTES;
  }

  static long firstDaysOffset(int seriesCount) {
    return rangeStartOffset(seriesCount + 1);
  }

  static long lastDaysOffset(int seriesCount, int rangeCount) {
    return firstDaysOffset(seriesCount) + (long) rangeCount * Integer.BYTES;
  }

  static long fileBytes(int seriesCount, int rangeCount) {
    return lastDaysOffset(seriesCount, rangeCount) + (long) rangeCount * Integer.BYTES + StoreFileFormat.FOOTER_BYTES;
  }

  static void checkFileSize(Path file, int seriesCount, int rangeCount, long actualBytes) {
    long expected = fileBytes(seriesCount, rangeCount);
    if (expected != actualBytes) {
      throw new CorruptStoreException(file, "wrong size for " + seriesCount + " series and " + rangeCount
          + " closed ranges: expected " + expected + " bytes, actual " + actualBytes + " bytes");
    }
  }
}
