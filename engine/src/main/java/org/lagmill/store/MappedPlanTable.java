package org.lagmill.store;

import java.nio.ByteOrder;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.memory.MemoryBudget;

/** {@link PlanTable} over a mapped {@code plan.bin}; the names are decoded once onto the heap. */
final class MappedPlanTable extends MappedStoreFile implements PlanTable {
  private final int seriesCount;
  private final int keyCount;
  private final int columnCount;
  private final int reachDayIndex;
  private final List<String> keyAttributeNames;
  private final List<String> columnNames;
  private final int keysOffset;
  private final int keyStartsOffset;
  private final int changeDaysOffset;
  private final int valuesOffset;

  private MappedPlanTable(Path file, MappedRegion region, int expectedSeriesCount) {
    super(region);
    MappedFileReads reads = readsFrom(file, PlanLayout.SERIES_COUNT_OFFSET);
    seriesCount = reads.getInt();
    checkSeriesCount(file, expectedSeriesCount, seriesCount);
    columnCount = reads.getCount("plan column count", Integer.MAX_VALUE / Float.BYTES);
    int keyAttributeCount = reads.getCount("plan key attribute count", Integer.MAX_VALUE / Integer.BYTES);
    keyCount = reads.getCount("plan key count", Integer.MAX_VALUE / Integer.BYTES - 1);
    int changeCount = reads.getCount("plan change point count", Integer.MAX_VALUE / Integer.BYTES);
    reachDayIndex = reads.getInt();
    List<String> keys = new ArrayList<>();
    for (int a = 0; a < keyAttributeCount; a++) {
      keys.add(reads.getString());
    }
    List<String> columns = new ArrayList<>();
    for (int c = 0; c < columnCount; c++) {
      columns.add(reads.getString());
    }
    keyAttributeNames = List.copyOf(keys);
    columnNames = List.copyOf(columns);
    reads.alignTo(Integer.BYTES);
    long keys0 = reads.position();
    PlanLayout.checkFileSize(file, keys0, seriesCount, keyCount, changeCount, columnCount, fileBytes());
    keysOffset = (int) keys0;
    keyStartsOffset = (int) PlanLayout.keyStartsOffset(keys0, seriesCount);
    changeDaysOffset = (int) PlanLayout.changeDaysOffset(keys0, seriesCount, keyCount);
    valuesOffset = (int) PlanLayout.valuesOffset(keys0, seriesCount, keyCount, changeCount);
  }

  static MappedPlanTable open(Path file, long fileBytes, int expectedSeriesCount, MemoryBudget budget) {
    return openMapped(file, fileBytes, budget, region -> new MappedPlanTable(file, region, expectedSeriesCount));
  }

  private int keyStart(int keyIndex) {
    if (keyIndex < 0 || keyIndex >= keyCount) {
      throw new IndexOutOfBoundsException("plan key " + keyIndex + " outside [0, " + keyCount + ")");
    }
    return buffer.getInt(keyStartsOffset + keyIndex * Integer.BYTES, ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public int columnCount() { return columnCount; }
  @Override
  public String columnName(int columnIndex) { return columnNames.get(columnIndex); }
  @Override
  public List<String> keyAttributeNames() { return keyAttributeNames; }
  @Override
  public int keyCount() { return keyCount; }
  @Override
  public int reachDayIndex() { return reachDayIndex; }

  @Override
  public int keyOf(int seriesIndex) {
    checkOpen();
    if (seriesIndex < 0 || seriesIndex >= seriesCount) {
      throw new IndexOutOfBoundsException("seriesIndex " + seriesIndex + " outside [0, " + seriesCount + ")");
    }
    return buffer.getInt(keysOffset + seriesIndex * Integer.BYTES, ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public int changeCount(int keyIndex) {
    checkOpen();
    return buffer.getInt(keyStartsOffset + (keyIndex + 1) * Integer.BYTES, ByteOrder.LITTLE_ENDIAN)
        - keyStart(keyIndex);
  }

  @Override
  public int changeDayIndex(int keyIndex, int changeIndex) {
    checkOpen();
    return buffer.getInt(changeDaysOffset + (keyStart(keyIndex) + changeIndex) * Integer.BYTES,
        ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public float changeValue(int keyIndex, int changeIndex, int columnIndex) {
    checkOpen();
    long point = keyStart(keyIndex) + changeIndex;
    return buffer.getFloat((int) (valuesOffset + (point * columnCount + columnIndex) * Float.BYTES),
        ByteOrder.LITTLE_ENDIAN);
  }
}
