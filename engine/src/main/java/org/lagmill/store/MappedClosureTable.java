package org.lagmill.store;

import java.nio.ByteOrder;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/** {@link ClosureTable} over a mapped {@code closures.bin}: range starts and two int columns. */
final class MappedClosureTable extends MappedStoreFile implements ClosureTable {
  private final int seriesCount;
  private final int totalRangeCount;
  private final int firstDaysOffset;
  private final int lastDaysOffset;

  private MappedClosureTable(Path file, MappedRegion region, int expectedSeriesCount) {
    super(region);
    MappedFileReads reads = readsFrom(file, ClosuresLayout.SERIES_COUNT_OFFSET);
    seriesCount = reads.getInt();
    checkSeriesCount(file, expectedSeriesCount, seriesCount);
    totalRangeCount = reads.getCount("closed range count", Integer.MAX_VALUE / Integer.BYTES);
    ClosuresLayout.checkFileSize(file, seriesCount, totalRangeCount, fileBytes());
    firstDaysOffset = (int) ClosuresLayout.firstDaysOffset(seriesCount);
    lastDaysOffset = (int) ClosuresLayout.lastDaysOffset(seriesCount, totalRangeCount);
  }

  static MappedClosureTable open(Path file, long fileBytes, int expectedSeriesCount, MemoryBudget budget) {
    return openMapped(file, fileBytes, budget, region -> new MappedClosureTable(file, region, expectedSeriesCount));
  }

  private int rangeStart(int seriesIndex) {
    if (seriesIndex < 0 || seriesIndex >= seriesCount) {
      throw new IndexOutOfBoundsException("seriesIndex " + seriesIndex + " outside [0, " + seriesCount + ")");
    }
    return buffer.getInt((int) ClosuresLayout.rangeStartOffset(seriesIndex), ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public boolean isEmpty() {
    checkOpen();
    return totalRangeCount == 0;
  }

  @Override
  public int rangeCount(int seriesIndex) {
    checkOpen();
    return buffer.getInt((int) ClosuresLayout.rangeStartOffset(seriesIndex + 1), ByteOrder.LITTLE_ENDIAN)
        - rangeStart(seriesIndex);
  }

  @Override
  public int firstDayIndex(int seriesIndex, int rangeIndex) {
    checkOpen();
    return buffer.getInt(firstDaysOffset + (rangeStart(seriesIndex) + rangeIndex) * Integer.BYTES,
        ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public int lastDayIndex(int seriesIndex, int rangeIndex) {
    checkOpen();
    return buffer.getInt(lastDaysOffset + (rangeStart(seriesIndex) + rangeIndex) * Integer.BYTES,
        ByteOrder.LITTLE_ENDIAN);
  }
}
