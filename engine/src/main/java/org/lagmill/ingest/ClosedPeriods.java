package org.lagmill.ingest;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import org.lagmill.store.ArrayClosureTable;
import org.lagmill.store.ClosureTable;

/**
 * Closed day ranges turned into closed period ranges of a store's step: a period is closed when every one of its
 * days is; periods covered on some days only stay open and are counted.
 *
 * @param closures per series, sorted closed period index ranges that neither overlap nor touch
 * @param partlyClosedItemPeriods item-periods with at least one closed and at least one open day
 */
record ClosedPeriods(ClosureTable closures, long partlyClosedItemPeriods) {

  /**
   * @param days per series, merged closed day ranges (days counted from the store's first date, {@code >= 0}): sorted,
   *     not overlapping, not touching
   * @param seriesCount number of series of {@code days}
   * @param periodDays the store's step in days
   */
  static ClosedPeriods of(ClosureTable days, int seriesCount, int periodDays) {
    if (periodDays == 1) {
      return new ClosedPeriods(days, 0);
    }
    int[][] firsts = new int[seriesCount][];
    int[][] lasts = new int[seriesCount][];
    long partial = 0;
    IntArrayList first = new IntArrayList();
    IntArrayList last = new IntArrayList();
    for (int s = 0; s < seriesCount; s++) {
      first.clear();
      last.clear();
      long lastPartialPeriod = -1;
      for (int k = 0, n = days.rangeCount(s); k < n; k++) {
        long fromDay = days.firstDayIndex(s, k);
        long untilDay = days.lastDayIndex(s, k);
        long firstTouched = fromDay / periodDays;
        long lastTouched = untilDay / periodDays;
        long firstWhole = Math.floorDiv(fromDay + periodDays - 1, periodDays);
        long lastWhole = Math.floorDiv(untilDay + 1, periodDays) - 1;
        if (firstWhole <= lastWhole) {
          first.add((int) firstWhole);
          last.add((int) lastWhole);
        }
        // Merged day ranges leave at least one open day between them, so a period touched by two ranges is never
        // whole; counting each partial period once is enough to skip the one a previous range ended in.
        if (firstTouched < firstWhole || firstWhole > lastWhole) {
          if (firstTouched != lastPartialPeriod) {
            partial++;
            lastPartialPeriod = firstTouched;
          }
        }
        if (lastTouched > lastWhole && lastTouched != lastPartialPeriod) {
          partial++;
          lastPartialPeriod = lastTouched;
        }
      }
      firsts[s] = first.toIntArray();
      lasts[s] = last.toIntArray();
    }
    return new ClosedPeriods(new ArrayClosureTable(firsts, lasts), partial);
  }
}
