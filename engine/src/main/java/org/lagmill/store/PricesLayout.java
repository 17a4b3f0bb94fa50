package org.lagmill.store;

import java.nio.file.Path;

/**
 * Layout of {@code prices.bin}: header, seriesCount int, changeCount int (all series), then seriesCount+1 int change
 * starts (series s owns changes {@code start[s] .. start[s+1]-1}), then changeCount int day indexes, then changeCount
 * float prices, then the footer. Day indexes are relative to the store's first date and never negative.
 */
final class PricesLayout {
  static final int SERIES_COUNT_OFFSET = StoreFileFormat.HEADER_BYTES;
  static final int CHANGE_COUNT_OFFSET = SERIES_COUNT_OFFSET + 4;
  static final int CHANGE_STARTS_OFFSET = CHANGE_COUNT_OFFSET + 4;

  private PricesLayout() {}

  static long changeStartOffset(int seriesIndex) {
    return CHANGE_STARTS_OFFSET + (long) seriesIndex * Integer.BYTES;
  }

  static long dayIndexesOffset(int seriesCount) {
    return changeStartOffset(seriesCount + 1);
  }

  static long pricesOffset(int seriesCount, int changeCount) {
    return dayIndexesOffset(seriesCount) + (long) changeCount * Integer.BYTES;
  }

  static long fileBytes(int seriesCount, int changeCount) {
    return pricesOffset(seriesCount, changeCount) + (long) changeCount * Float.BYTES + StoreFileFormat.FOOTER_BYTES;
  }

  static void checkFileSize(Path file, int seriesCount, int changeCount, long actualBytes) {
    long expected = fileBytes(seriesCount, changeCount);
    if (expected != actualBytes) {
      throw new CorruptStoreException(file, "wrong size for " + seriesCount + " series and " + changeCount
          + " price changes: expected " + expected + " bytes, actual " + actualBytes + " bytes");
    }
  }
}
