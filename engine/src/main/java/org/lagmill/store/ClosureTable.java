package org.lagmill.store;

/**
 * Declared closures: per series, sorted day index ranges (periods of the store's step; a period is closed when every
 * day of it is, see {@code ingest/ClosuresFileReader}) on which the series could not sell (a store shut for a
 * holiday, an item not yet listed or delisted). A closed day reads as {@link SalesHistory#UNKNOWN_UNITS} for every
 * consumer; {@link SalesHistory#isClosed} tells it from an unknown day. Ranges may lie past the last sales day (a
 * closure planned in the forecast horizon).
 *
 * <p>Within a series, ranges are sorted, do not overlap and do not touch ({@code last + 1 < next first}).
 */
public interface ClosureTable {
  /** No closures. */
  ClosureTable EMPTY = new ClosureTable() {
    @Override
    public int rangeCount(int seriesIndex) { return 0; }
    @Override
    public int firstDayIndex(int seriesIndex, int rangeIndex) { throw new IndexOutOfBoundsException(); }
    @Override
    public int lastDayIndex(int seriesIndex, int rangeIndex) { throw new IndexOutOfBoundsException(); }
    @Override
    public boolean isEmpty() { return true; }
  };

  /** Number of closed ranges of a series. */
  int rangeCount(int seriesIndex);

  /** First closed day index of a range, {@code >= 0}. */
  int firstDayIndex(int seriesIndex, int rangeIndex);

  /** Last closed day index of a range, inclusive. */
  int lastDayIndex(int seriesIndex, int rangeIndex);

  /** True when no series has a closure. */
  boolean isEmpty();

  /** Whether the series is closed on a day index (binary search over its ranges). */
  default boolean isClosed(int seriesIndex, int dayIndex) {
    int low = 0;
    int high = rangeCount(seriesIndex) - 1;
    while (low <= high) {
      int mid = (low + high) >>> 1;
      if (lastDayIndex(seriesIndex, mid) < dayIndex) {
        low = mid + 1;
      } else if (firstDayIndex(seriesIndex, mid) > dayIndex) {
        high = mid - 1;
      } else {
        return true;
      }
    }
    return false;
  }

  /**
   * Overwrites the closed days of {@code count} days from {@code fromDayIndex} in {@code dst} with
   * {@link SalesHistory#UNKNOWN_UNITS}.
   */
  default void maskClosed(int seriesIndex, int fromDayIndex, int[] dst, int dstOffset, int count) {
    int end = fromDayIndex + count;
    for (int k = 0, n = rangeCount(seriesIndex); k < n; k++) {
      int first = Math.max(fromDayIndex, firstDayIndex(seriesIndex, k));
      int last = Math.min(end - 1, lastDayIndex(seriesIndex, k));
      for (int d = first; d <= last; d++) {
        dst[dstOffset + d - fromDayIndex] = SalesHistory.UNKNOWN_UNITS;
      }
    }
  }

  /** Closed item-days of every series within {@code [0, dayCount)}. */
  default long closedItemDays(int seriesCount, int dayCount) {
    long total = 0;
    for (int s = 0; s < seriesCount; s++) {
      for (int k = 0, n = rangeCount(s); k < n; k++) {
        int first = Math.max(0, firstDayIndex(s, k));
        int last = Math.min(dayCount - 1, lastDayIndex(s, k));
        total += Math.max(0, last - first + 1);
      }
    }
    return total;
  }
}
