package org.lagmill.store;

import java.nio.ByteOrder;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/** {@link PriceTable} over a mapped {@code prices.bin}: offsets and two columns, read with no hashing. */
final class MappedPriceTable extends MappedStoreFile implements PriceTable {
  private final int seriesCount;
  private final int totalChangeCount;
  private final int dayIndexesOffset;
  private final int pricesOffset;

  private MappedPriceTable(Path file, MappedRegion region, int expectedSeriesCount) {
    super(region);
    MappedFileReads reads = readsFrom(file, PricesLayout.SERIES_COUNT_OFFSET);
    seriesCount = reads.getInt();
    checkSeriesCount(file, expectedSeriesCount, seriesCount);
    totalChangeCount = reads.getCount("price change count", Integer.MAX_VALUE / Integer.BYTES);
    PricesLayout.checkFileSize(file, seriesCount, totalChangeCount, fileBytes());
    dayIndexesOffset = (int) PricesLayout.dayIndexesOffset(seriesCount);
    pricesOffset = (int) PricesLayout.pricesOffset(seriesCount, totalChangeCount);
  }

  static MappedPriceTable open(Path file, long fileBytes, int expectedSeriesCount, MemoryBudget budget) {
    return openMapped(file, fileBytes, budget, region -> new MappedPriceTable(file, region, expectedSeriesCount));
  }

  private int changeStart(int seriesIndex) {
    if (seriesIndex < 0 || seriesIndex >= seriesCount) {
      throw new IndexOutOfBoundsException("seriesIndex " + seriesIndex + " outside [0, " + seriesCount + ")");
    }
    return buffer.getInt((int) PricesLayout.changeStartOffset(seriesIndex), ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public boolean isEmpty() {
    checkOpen();
    return totalChangeCount == 0;
  }

  @Override
  public int changeCount(int seriesIndex) {
    checkOpen();
    return changeEnd(seriesIndex) - changeStart(seriesIndex);
  }

  private int changeEnd(int seriesIndex) {
    return buffer.getInt((int) PricesLayout.changeStartOffset(seriesIndex + 1), ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public int changeDayIndex(int seriesIndex, int changeIndex) {
    checkOpen();
    return buffer.getInt(dayIndexesOffset + (changeStart(seriesIndex) + changeIndex) * Integer.BYTES,
        ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public float changePrice(int seriesIndex, int changeIndex) {
    checkOpen();
    return buffer.getFloat(pricesOffset + (changeStart(seriesIndex) + changeIndex) * Float.BYTES,
        ByteOrder.LITTLE_ENDIAN);
  }

  /** One cursor over the series' change points: no search, no per-day lookups through the interface. */
  @Override
  public void readPrices(int seriesIndex, int fromDayIndex, float[] dst, int dstOffset, int count) {
    checkOpen();
    int start = changeStart(seriesIndex);
    int end = changeEnd(seriesIndex);
    int k = start - 1;
    float price = Float.NaN;
    for (int i = 0; i < count; i++) {
      int day = fromDayIndex + i;
      while (k + 1 < end && buffer.getInt(dayIndexesOffset + (k + 1) * Integer.BYTES, ByteOrder.LITTLE_ENDIAN) <= day) {
        k++;
        price = buffer.getFloat(pricesOffset + k * Float.BYTES, ByteOrder.LITTLE_ENDIAN);
      }
      dst[dstOffset + i] = price;
    }
  }
}
