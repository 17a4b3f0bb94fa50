package org.lagmill.store;

import java.nio.ByteOrder;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/** {@link DayCalendar} over a mapped {@code calendar.bin}: column descriptions on the heap, values read mapped. */
final class MappedDayCalendar extends MappedStoreFile implements DayCalendar {
  private final int dayCount;
  private final String[] names;
  private final ColumnKind[] kinds;
  private final String[] keyAttributes;
  private final String[][] categories;
  private final int[] keyCounts;
  private final long[] valuesOffsets;

  private MappedDayCalendar(Path file, MappedRegion region) {
    super(region);
    MappedFileReads reads = readsFrom(file, CalendarLayout.DAY_COUNT_OFFSET);
    dayCount = reads.getCount("calendar day count", StoreWriter.MAX_DAY_COUNT);
    int columnCount = reads.getCount("calendar column count", 1 << 16);
    names = new String[columnCount];
    kinds = new ColumnKind[columnCount];
    keyAttributes = new String[columnCount];
    categories = new String[columnCount][];
    keyCounts = new int[columnCount];
    for (int c = 0; c < columnCount; c++) {
      names[c] = reads.getString();
      int kind = reads.getCount("column kind", 1);
      kinds[c] = kind == 1 ? ColumnKind.CATEGORICAL : ColumnKind.NUMERIC;
      int keyLength = reads.getInt();
      keyAttributes[c] = keyLength == CalendarLayout.NO_KEY_ATTRIBUTE ? null : reads.getStringOfLength(keyLength);
      int categoryCount = reads.getCount("category count", Integer.MAX_VALUE);
      categories[c] = new String[categoryCount];
      for (int code = 0; code < categoryCount; code++) {
        categories[c][code] = reads.getString();
      }
      keyCounts[c] = reads.getCount("key count", Integer.MAX_VALUE);
    }
    reads.alignTo(Float.BYTES);
    valuesOffsets = new long[columnCount];
    long offset = reads.position();
    long valueCount = 0;
    for (int c = 0; c < columnCount; c++) {
      valuesOffsets[c] = offset + valueCount * Float.BYTES;
      valueCount += (long) keyCounts[c] * dayCount;
    }
    CalendarLayout.checkFileSize(file, reads.position(), valueCount, fileBytes());
  }

  static MappedDayCalendar open(Path file, long fileBytes, MemoryBudget budget) {
    return openMapped(file, fileBytes, budget, region -> new MappedDayCalendar(file, region));
  }

  @Override
  public int dayCount() {
    checkOpen();
    return dayCount;
  }

  @Override
  public int columnCount() {
    checkOpen();
    return names.length;
  }

  @Override
  public String columnName(int columnIndex) {
    checkOpen();
    return names[columnIndex];
  }

  @Override
  public ColumnKind kind(int columnIndex) {
    checkOpen();
    return kinds[columnIndex];
  }

  @Override
  public int cardinality(int columnIndex) {
    checkOpen();
    return categories[columnIndex].length;
  }

  @Override
  public String categoryValue(int columnIndex, int code) {
    checkOpen();
    return categories[columnIndex][code];
  }

  @Override
  public String keyAttribute(int columnIndex) {
    checkOpen();
    return keyAttributes[columnIndex];
  }

  @Override
  public float value(int columnIndex, int keyCode, int dayIndex) {
    checkOpen();
    int row = keyAttributes[columnIndex] == null ? 0 : keyCode;
    if (dayIndex < 0 || dayIndex >= dayCount || row < 0 || row >= keyCounts[columnIndex]) {
      return Float.NaN;
    }
    return buffer.getFloat((int) CalendarLayout.valueOffset(valuesOffsets[columnIndex], dayCount, row, dayIndex),
        ByteOrder.LITTLE_ENDIAN);
  }
}
