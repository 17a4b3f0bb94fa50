package org.lagmill.store;

/** {@link ClosureTable} from plain arrays of ranges per series (each sorted, not overlapping, not touching). */
public final class ArrayClosureTable implements ClosureTable {
  private final int[][] firstDays;
  private final int[][] lastDays;

  /** @param firstDays first day index of each range per series; @param lastDays its last day index, inclusive */
  public ArrayClosureTable(int[][] firstDays, int[][] lastDays) {
    this.firstDays = firstDays;
    this.lastDays = lastDays;
  }

  @Override
  public int rangeCount(int seriesIndex) { return firstDays[seriesIndex].length; }
  @Override
  public int firstDayIndex(int seriesIndex, int rangeIndex) { return firstDays[seriesIndex][rangeIndex]; }
  @Override
  public int lastDayIndex(int seriesIndex, int rangeIndex) { return lastDays[seriesIndex][rangeIndex]; }

  @Override
  public boolean isEmpty() {
    for (int[] ranges : firstDays) {
      if (ranges.length > 0) {
        return false;
      }
    }
    return true;
  }
}
