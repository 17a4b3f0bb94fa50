package org.lagmill.eval;

import java.util.Arrays;
import java.util.List;

/**
 * Daily values of every aggregate of every level over a run of days: per level one flat array laid out aggregate-major
 * ({@code aggregateIndex * dayCount + dayOffset}). Filled by {@link Aggregator}; reusable through {@link #clear()}.
 * Not thread-safe.
 */
public final class AggregateTable {
  private final int[] aggregateCounts;
  private final int dayCount;
  private final double[][] valuesByLevel;
  private long unknownCount;

  private AggregateTable(int[] aggregateCounts, int dayCount) {
    if (dayCount < 0) {
      throw new IllegalArgumentException("dayCount must be >= 0, got " + dayCount);
    }
    this.aggregateCounts = aggregateCounts;
    this.dayCount = dayCount;
    this.valuesByLevel = new double[aggregateCounts.length][];
    for (int l = 0; l < aggregateCounts.length; l++) {
      valuesByLevel[l] = new double[Math.multiplyExact(aggregateCounts[l], dayCount)];
    }
  }

  /** An all-zero table shaped for these levels; also how callers supply their own per-aggregate forecasts. */
  public static AggregateTable forLevels(List<Level> levels, int dayCount) {
    int[] counts = new int[levels.size()];
    for (int l = 0; l < counts.length; l++) {
      counts[l] = levels.get(l).aggregateCount();
    }
    return new AggregateTable(counts, dayCount);
  }

  public int levelCount() {
    return aggregateCounts.length;
  }

  /** Number of days held per aggregate. */
  public int dayCount() {
    return dayCount;
  }

  public int aggregateCount(int levelIndex) {
    return aggregateCounts[levelIndex];
  }

  public double get(int levelIndex, int aggregateIndex, int dayOffset) {
    return valuesByLevel[levelIndex][aggregateIndex * dayCount + dayOffset];
  }

  public void set(int levelIndex, int aggregateIndex, int dayOffset, double value) {
    valuesByLevel[levelIndex][aggregateIndex * dayCount + dayOffset] = value;
  }

  /** The live array of one level, {@code aggregateIndex * dayCount() + dayOffset}. */
  public double[] levelValues(int levelIndex) {
    return valuesByLevel[levelIndex];
  }

  /** Number of bottom series-days read as unknown (and added as 0) since the last {@link #clear()}. */
  public long unknownCount() {
    return unknownCount;
  }

  void addUnknown(long count) {
    unknownCount += count;
  }

  /** Zeroes every value and the unknown count. */
  public void clear() {
    for (double[] values : valuesByLevel) {
      Arrays.fill(values, 0.0);
    }
    unknownCount = 0;
  }
}
