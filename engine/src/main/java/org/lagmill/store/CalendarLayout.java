package org.lagmill.store;

import java.nio.file.Path;

/**
 * Layout of {@code calendar.bin}: header, dayCount int, columnCount int, then per column its description (name,
 * kind int 0 numeric / 1 categorical, key attribute name or byte length -1 for a global column, categoryCount int and
 * the category texts, keyCount int), zero padding to a multiple of 4, then each column's values as float32 in
 * (keyCode, dayIndex) order: {@code keyCount * dayCount} floats per column, then the footer. Strings are int byte
 * length + UTF-8 bytes.
 */
final class CalendarLayout {
  static final int DAY_COUNT_OFFSET = StoreFileFormat.HEADER_BYTES;
  static final int COLUMN_COUNT_OFFSET = DAY_COUNT_OFFSET + 4;
  static final int FIRST_COLUMN_OFFSET = COLUMN_COUNT_OFFSET + 4;
  static final int NO_KEY_ATTRIBUTE = -1;

  private CalendarLayout() {}

  static long valueOffset(long columnValuesOffset, int dayCount, int keyCode, int dayIndex) {
    return columnValuesOffset + ((long) keyCode * dayCount + dayIndex) * Float.BYTES;
  }

  static long fileBytes(long valuesOffset, long valueCount) {
    return valuesOffset + valueCount * Float.BYTES + StoreFileFormat.FOOTER_BYTES;
  }

  static void checkFileSize(Path file, long valuesOffset, long valueCount, long actualBytes) {
    long expected = fileBytes(valuesOffset, valueCount);
    if (expected != actualBytes) {
      throw new CorruptStoreException(file, "wrong size for " + valueCount + " calendar values: expected " + expected
          + " bytes, actual " + actualBytes + " bytes");
    }
  }
}
