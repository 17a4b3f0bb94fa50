package org.lagmill.store;

/**
 * Shelf prices per series as change points: price {@code k} of a series holds from day {@code changeDayIndex(s, k)}
 * until the next change. Change points are sorted by day; they may lie past the last sales day (announced prices for the
 * forecast horizon). A sequential reader keeps a cursor, so a feature pass reads prices with no search and no hashing.
 */
public interface PriceTable {
  boolean isEmpty();

  /** Number of price change points of one series (0 when it has no price). */
  int changeCount(int seriesIndex);

  int changeDayIndex(int seriesIndex, int changeIndex);

  float changePrice(int seriesIndex, int changeIndex);

  /**
   * Fills {@code dst[dstOffset .. dstOffset+count)} with the price of each day from {@code fromDayIndex}; days before the
   * series' first price read NaN. {@code fromDayIndex} may be negative or past the last sales day.
   */
  default void readPrices(int seriesIndex, int fromDayIndex, float[] dst, int dstOffset, int count) {
    int changeCount = changeCount(seriesIndex);
    int k = -1;
    for (int i = 0; i < count; i++) {
      int day = fromDayIndex + i;
      while (k + 1 < changeCount && changeDayIndex(seriesIndex, k + 1) <= day) {
        k++;
      }
      dst[dstOffset + i] = k < 0 ? Float.NaN : changePrice(seriesIndex, k);
    }
  }

  /** Price of one day, NaN before the series' first price. Binary search: for random access, not hot loops. */
  default float priceAt(int seriesIndex, int dayIndex) {
    int lo = 0;
    int hi = changeCount(seriesIndex) - 1;
    int found = -1;
    while (lo <= hi) {
      int mid = (lo + hi) >>> 1;
      if (changeDayIndex(seriesIndex, mid) <= dayIndex) {
        found = mid;
        lo = mid + 1;
      } else {
        hi = mid - 1;
      }
    }
    return found < 0 ? Float.NaN : changePrice(seriesIndex, found);
  }

  PriceTable EMPTY = new PriceTable() {
    @Override
    public boolean isEmpty() { return true; }
    @Override
    public int changeCount(int seriesIndex) { return 0; }
    @Override
    public int changeDayIndex(int seriesIndex, int changeIndex) { throw new IndexOutOfBoundsException(); }
    @Override
    public float changePrice(int seriesIndex, int changeIndex) { throw new IndexOutOfBoundsException(); }
  };
}
