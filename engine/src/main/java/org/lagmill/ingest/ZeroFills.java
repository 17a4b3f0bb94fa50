package org.lagmill.ingest;

import org.lagmill.store.ClosureTable;

/**
 * Which item-days a long sales read filled with zero for want of a row: one bit per item-day on the heap (an eighth
 * of a byte), so that the days a closure covers can be counted as closed instead of as zero sales.
 */
public final class ZeroFills {
  /** No fills (the unknown policy). */
  static final ZeroFills NONE = new ZeroFills(0, 0);

  private final int seriesCount;
  private final int dayCount;
  private final long[] bits;
  private long count;

  /** All clear, for {@code seriesCount × dayCount} item-days. */
  ZeroFills(int seriesCount, int dayCount) {
    long itemDays = (long) seriesCount * dayCount;
    this.seriesCount = seriesCount;
    this.dayCount = dayCount;
    this.bits = new long[(int) ((itemDays + 63) >>> 6)];
  }

  /** Marks one item-day as zero-filled (idempotent). */
  void set(int seriesIndex, int dayIndex) {
    long bit = (long) seriesIndex * dayCount + dayIndex;
    long mask = 1L << (bit & 63);
    int word = (int) (bit >>> 6);
    if ((bits[word] & mask) == 0) {
      bits[word] |= mask;
      count++;
    }
  }

  boolean isSet(int seriesIndex, int dayIndex) {
    long bit = (long) seriesIndex * dayCount + dayIndex;
    return ((bits[(int) (bit >>> 6)] >>> (bit & 63)) & 1) != 0;
  }

  /** The marks of the series {@code seriesIndexes} only, renumbered 0, 1, ... in that order (one shard's series). */
  ZeroFills restrictedTo(int[] seriesIndexes) {
    if (count == 0) {
      return NONE;
    }
    ZeroFills kept = new ZeroFills(seriesIndexes.length, dayCount);
    for (int s = 0; s < seriesIndexes.length; s++) {
      for (int d = 0; d < dayCount; d++) {
        if (isSet(seriesIndexes[s], d)) {
          kept.set(s, d);
        }
      }
    }
    return kept;
  }

  /** Item-days marked. */
  public long count() {
    return count;
  }

  /**
   * Marked item-days that the closures declare closed: a till export writes no row on a day the shop was shut, and
   * such a day counts as closed, not as a zero sale.
   *
   * @param firstDayIndex the closures' day index of this read's day 0 (an append's first new day)
   * @param closures ranges of at least this read's series, indexed alike
   */
  public long closedCount(ClosureTable closures, int firstDayIndex) {
    if (count == 0 || closures.isEmpty()) {
      return 0;
    }
    long total = 0;
    for (int s = 0; s < seriesCount; s++) {
      for (int k = 0, n = closures.rangeCount(s); k < n; k++) {
        int first = Math.max(0, closures.firstDayIndex(s, k) - firstDayIndex);
        int last = Math.min(dayCount - 1, closures.lastDayIndex(s, k) - firstDayIndex);
        for (int d = first; d <= last; d++) {
          total += isSet(s, d) ? 1 : 0;
        }
      }
    }
    return total;
  }
}
