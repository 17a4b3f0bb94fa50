package org.lagmill.store;

import java.nio.ByteOrder;
import java.nio.file.Path;
import org.agrona.concurrent.UnsafeBuffer;
import org.lagmill.memory.MemoryBudget;

/** {@link DayCalendar} over a mapped {@code calendar.bin}: column descriptions on the heap, values read mapped. */
final class MappedDayCalendar implements DayCalendar, AutoCloseable {
  private final MappedRegion region;
  private final UnsafeBuffer buffer;
  private final int dayCount;
  private final String[] names;
  private final ColumnKind[] kinds;
  private final String[] keyAttributes;
  private final String[][] categories;
  private final int[] keyCounts;
  private final long[] valuesOffsets;
  private volatile boolean closed;

  private MappedDayCalendar(Path file, MappedRegion region) {
    this.region = region;
    this.buffer = region.buffer();
    MappedFileReads reads = new MappedFileReads(file, buffer, CalendarLayout.DAY_COUNT_OFFSET,
        region.byteCount() - StoreFileFormat.FOOTER_BYTES);
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
    CalendarLayout.checkFileSize(file, reads.position(), valueCount, region.byteCount());
  }

  static MappedDayCalendar open(Path file, long fileBytes, MemoryBudget budget) {
    MappedRegion region = MappedRegion.map(file, 0, fileBytes, budget);
    try {
      return new MappedDayCalendar(file, region);
    } catch (RuntimeException e) {
      region.close();
      throw e;
    }
  }

  long offHeapBytes() {
    return closed ? 0 : region.byteCount();
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

  private void checkOpen() {
    if (closed) {
      throw new IllegalStateException("the store is closed");
    }
  }

  @Override
  public void close() {
    closed = true;
    region.close();
  }
}
