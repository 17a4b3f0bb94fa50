package org.lagmill.ingest;

import org.lagmill.store.ClosureTable;

/**
 * What {@link LongSalesReader#read} found: the file's shape and which item-days it filled.
 *
 * @param header the file's shape, as given to {@link SeriesSink#begin}
 * @param zeroFilledItemDays item-days with no row that were read as zero under {@link MissingRows#ZERO}
 * @param zeroFilledBits one bit per item-day, set where a day with no row was read as zero: bit
 *     {@code seriesIndex × dayCount + dayIndex} of the words (series in the order the sink received them); empty
 *     under {@link MissingRows#UNKNOWN}. Heap: one eighth of a byte per item-day
 */
public record LongSalesRead(LongSalesHeader header, long zeroFilledItemDays, long[] zeroFilledBits) {

  /**
   * Zero-filled item-days that the closures declare closed: a till export writes no row on a day the shop was shut,
   * and such a day is counted as closed, not as a zero sale.
   */
  public long zeroFilledClosedItemDays(ClosureTable closures) {
    if (zeroFilledBits.length == 0 || closures.isEmpty()) {
      return 0;
    }
    int dayCount = header.dayCount();
    long total = 0;
    for (int s = 0; s < header.seriesCount(); s++) {
      for (int k = 0, n = closures.rangeCount(s); k < n; k++) {
        int last = Math.min(dayCount - 1, closures.lastDayIndex(s, k));
        for (int d = closures.firstDayIndex(s, k); d <= last; d++) {
          long bit = (long) s * dayCount + d;
          total += (zeroFilledBits[(int) (bit >>> 6)] >>> (bit & 63)) & 1;
        }
      }
    }
    return total;
  }
}
