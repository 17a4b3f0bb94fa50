package org.lagmill.features;

import org.lagmill.store.SalesHistory;

/**
 * The current series as the kernels see it: its units and prices by day index in buffers sized once per pass, and the
 * readable range of days. A unit is readable when it lies on or after the series' first sale, before the end of the
 * history ({@link SalesHistory#dayCount()}) and is not {@link SalesHistory#UNKNOWN_UNITS}; anything else reads NaN.
 */
final class SeriesContext {
  final int[] units;
  final float[] prices;
  final int[] attributeCodes;
  int seriesIndex;
  int firstSaleDayIndex;
  /** First readable day: the first sale, or {@link Integer#MAX_VALUE} for a series that never sold. */
  int firstReadableDayIndex;
  /** One past the last readable day (at most the history's dayCount). */
  int readableEndDayIndex;

  SeriesContext(int unitDayCount, int priceDayCount, int attributeCount) {
    units = new int[unitDayCount];
    prices = new float[priceDayCount];
    attributeCodes = new int[attributeCount];
  }

  boolean isReadable(int dayIndex) {
    return dayIndex >= firstReadableDayIndex && dayIndex < readableEndDayIndex && units[dayIndex] >= 0;
  }

  float unitsOrNaN(int dayIndex) {
    return isReadable(dayIndex) ? units[dayIndex] : Float.NaN;
  }

  /**
   * Loads one series: units of days {@code [0, unitEndDayIndex)} and prices of days {@code [0, priceEndDayIndex)}.
   */
  void load(SalesHistory history, int seriesIndex, int unitEndDayIndex, int priceEndDayIndex, boolean withPrices) {
    this.seriesIndex = seriesIndex;
    history.readUnits(seriesIndex, 0, units, 0, unitEndDayIndex);
    firstSaleDayIndex = history.firstSaleDayIndex(seriesIndex);
    firstReadableDayIndex = firstSaleDayIndex == SalesHistory.NO_SALE ? Integer.MAX_VALUE : firstSaleDayIndex;
    readableEndDayIndex = unitEndDayIndex;
    if (withPrices) {
      history.prices().readPrices(seriesIndex, 0, prices, 0, priceEndDayIndex);
    }
    for (int a = 0; a < attributeCodes.length; a++) {
      attributeCodes[a] = history.attributes().code(seriesIndex, a);
    }
  }
}
