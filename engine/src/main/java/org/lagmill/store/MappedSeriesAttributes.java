package org.lagmill.store;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.nio.ByteOrder;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.lagmill.memory.MemoryBudget;

/**
 * {@link SeriesAttributes} over a mapped {@code attributes.bin}: dictionaries are decoded to the heap once at open
 * (they are small: distinct values only), per-series codes are read from the mapping.
 */
final class MappedSeriesAttributes extends MappedStoreFile implements SeriesAttributes {
  private final int seriesCount;
  private final String[] names;
  private final String[][] values;
  private final Object2IntOpenHashMap<String>[] codeByValue;
  private final long codesOffset;
  private final int seriesIdAttribute;
  private final long heapBytes;
  private Object2IntOpenHashMap<String> seriesIndexById;

  @SuppressWarnings("unchecked")
  private MappedSeriesAttributes(Path file, MappedRegion region, int expectedSeriesCount, int maxValueCount) {
    super(region);
    MappedFileReads reads = readsFrom(file, AttributesLayout.SERIES_COUNT_OFFSET);
    seriesCount = reads.getInt();
    checkSeriesCount(file, expectedSeriesCount, seriesCount);
    int attributeCount = reads.getCount("attribute count", 1 << 16);
    names = new String[attributeCount];
    values = new String[attributeCount][];
    codeByValue = new Object2IntOpenHashMap[attributeCount];
    long heap = 0;
    for (int a = 0; a < attributeCount; a++) {
      names[a] = reads.getString();
      int valueCount = reads.getCount("dictionary size", Math.max(seriesCount, maxValueCount));
      values[a] = new String[valueCount];
      codeByValue[a] = new Object2IntOpenHashMap<>(valueCount);
      codeByValue[a].defaultReturnValue(-1);
      for (int code = 0; code < valueCount; code++) {
        values[a][code] = reads.getString();
        codeByValue[a].put(values[a][code], code);
        heap += 56 + 2L * values[a][code].length() + 24;
      }
    }
    seriesIdAttribute = SeriesIdentity.idIndex(List.of(names));
    reads.alignTo(Integer.BYTES);
    codesOffset = reads.position();
    AttributesLayout.checkFileSize(file, codesOffset, seriesCount, attributeCount, fileBytes());
    heapBytes = heap;
  }

  /**
   * @param maxValueCount the most values one dictionary may hold: the series count, or for a shard (which keeps its
   *     whole store's dictionaries) the whole store's series count
   */
  static MappedSeriesAttributes open(Path file, long fileBytes, int expectedSeriesCount, int maxValueCount,
      MemoryBudget budget) {
    return openMapped(file, fileBytes, budget,
        region -> new MappedSeriesAttributes(file, region, expectedSeriesCount, maxValueCount));
  }

  synchronized long heapBytes() {
    return heapBytes + (seriesIndexById == null ? 0 : 80L * seriesCount);
  }

  @Override
  public int attributeCount() {
    checkOpen();
    return names.length;
  }

  @Override
  public String attributeName(int attributeIndex) {
    checkOpen();
    return names[attributeIndex];
  }

  @Override
  public int attributeIndex(String attributeName) {
    checkOpen();
    return Arrays.asList(names).indexOf(attributeName);
  }

  @Override
  public int cardinality(int attributeIndex) {
    checkOpen();
    return values[attributeIndex].length;
  }

  @Override
  public int code(int seriesIndex, int attributeIndex) {
    checkOpen();
    if (seriesIndex < 0 || seriesIndex >= seriesCount) {
      throw new IndexOutOfBoundsException("seriesIndex " + seriesIndex + " outside [0, " + seriesCount + ")");
    }
    return buffer.getInt((int) AttributesLayout.codeOffset(codesOffset, seriesCount, seriesIndex, attributeIndex),
        ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public String value(int attributeIndex, int code) {
    checkOpen();
    return values[attributeIndex][code];
  }

  @Override
  public int codeOf(int attributeIndex, String value) {
    checkOpen();
    return codeByValue[attributeIndex].getInt(value);
  }

  @Override
  public String seriesId(int seriesIndex) {
    return SeriesIdentity.seriesId(this, seriesIndex, seriesIdAttribute);
  }

  /** Builds the id index on first use: most readers go by series index and never pay for it. */
  @Override
  public synchronized int seriesIndexOf(String seriesId) {
    checkOpen();
    if (seriesIndexById == null) {
      Object2IntOpenHashMap<String> index = new Object2IntOpenHashMap<>(seriesCount);
      index.defaultReturnValue(-1);
      for (int s = 0; s < seriesCount; s++) {
        index.put(seriesId(s), s);
      }
      seriesIndexById = index;
    }
    return seriesIndexById.getInt(seriesId);
  }
}
