package org.lagmill.store;

import java.nio.file.Path;

/**
 * Layout of {@code plan.bin}: header; seriesCount, columnCount, keyAttributeCount, keyCount, changeCount (all keys)
 * and reachDayIndex, each an int; the key attribute names then the column names (int byte length + UTF-8 bytes),
 * zero padding to a multiple of 4; seriesCount int keys ({@link PlanTable#NO_KEY} = no plan row matched the series);
 * keyCount+1 int change starts (key k owns change points {@code start[k] .. start[k+1]-1}); changeCount int change
 * period indexes; changeCount × columnCount float32 values, change point by change point; then the footer. The plan
 * is kept per key rather than per series, so a plan keyed by item and banner costs one copy per item and banner
 * however many stores share it.
 */
final class PlanLayout {
  static final int SERIES_COUNT_OFFSET = StoreFileFormat.HEADER_BYTES;
  /** Six ints: series, columns, key attributes, keys, change points, reach. */
  static final int NAMES_OFFSET = SERIES_COUNT_OFFSET + 6 * Integer.BYTES;

  private PlanLayout() {}

  static long keyStartsOffset(long keysOffset, int seriesCount) {
    return keysOffset + (long) seriesCount * Integer.BYTES;
  }

  static long changeDaysOffset(long keysOffset, int seriesCount, int keyCount) {
    return keyStartsOffset(keysOffset, seriesCount) + (long) (keyCount + 1) * Integer.BYTES;
  }

  static long valuesOffset(long keysOffset, int seriesCount, int keyCount, int changeCount) {
    return changeDaysOffset(keysOffset, seriesCount, keyCount) + (long) changeCount * Integer.BYTES;
  }

  static long fileBytes(long keysOffset, int seriesCount, int keyCount, int changeCount, int columnCount) {
    return valuesOffset(keysOffset, seriesCount, keyCount, changeCount)
        + (long) changeCount * columnCount * Float.BYTES + StoreFileFormat.FOOTER_BYTES;
  }

  static void checkFileSize(Path file, long keysOffset, int seriesCount, int keyCount, int changeCount,
      int columnCount, long actualBytes) {
    long expected = fileBytes(keysOffset, seriesCount, keyCount, changeCount, columnCount);
    if (expected != actualBytes) {
      throw new CorruptStoreException(file, "wrong size for " + seriesCount + " series, " + keyCount + " plan keys, "
          + changeCount + " change points and " + columnCount + " columns: expected " + expected + " bytes, actual "
          + actualBytes + " bytes");
    }
  }
}
