package org.lagmill.features;

import java.util.Arrays;
import org.lagmill.store.SalesHistory;

/**
 * The current series as the kernels see it: its units and prices by day index in buffers sized once per pass, and the
 * readable range of days. A unit is readable when it lies on or after the series' first sale, before the end of the
 * history ({@link SalesHistory#dayCount()}) and is not {@link SalesHistory#UNKNOWN_UNITS}; anything else reads NaN.
 *
 * <p>The readable units are also laid out once per series in two padded arrays indexed by
 * {@code lookbackDays + dayIndex}, so the kernels' per-row reads need no range checks: {@link #readableUnits} holds
 * the units or −1, {@link #readableValues} the units as float or NaN, for day indexes {@code [-lookbackDays, endDay)}.
 */
final class SeriesContext {
  final int[] units;
  final float[] prices;
  final int[] attributeCodes;
  /** Days before day 0 the padded arrays cover: the farthest any kernel looks back from a row's day (at least 1). */
  final int lookbackDays;
  /** Units of day {@code d} at {@code [lookbackDays + d]} when readable, else −1. */
  final int[] readableUnits;
  /** The same as float32, NaN when not readable. */
  final float[] readableValues;
  int seriesIndex;
  int firstSaleDayIndex;
  /** First readable day: the first sale, or {@link Integer#MAX_VALUE} for a series that never sold. */
  int firstReadableDayIndex;
  /** One past the last readable day (at most the history's dayCount). */
  int readableEndDayIndex;

  /**
   * @param endDayIndex one past the last day any kernel reads or any row lies on
   * @param lookbackDays the farthest any kernel reads before a row's day
   */
  SeriesContext(int unitDayCount, int priceDayCount, int attributeCount, int endDayIndex, int lookbackDays) {
    units = new int[unitDayCount];
    prices = new float[priceDayCount];
    attributeCodes = new int[attributeCount];
    this.lookbackDays = Math.max(1, lookbackDays);
    readableUnits = new int[this.lookbackDays + Math.max(unitDayCount, endDayIndex)];
    readableValues = new float[readableUnits.length];
  }

  boolean isReadable(int dayIndex) {
    return dayIndex >= firstReadableDayIndex && dayIndex < readableEndDayIndex && units[dayIndex] >= 0;
  }

  float unitsOrNaN(int dayIndex) {
    return isReadable(dayIndex) ? units[dayIndex] : Float.NaN;
  }

  /** Bytes of the per-series heap buffers. */
  long heapBytes() {
    return 4L * (units.length + prices.length + attributeCodes.length + readableUnits.length + readableValues.length);
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
    layOutReadable();
  }

  private void layOutReadable() {
    int pad = lookbackDays;
    int first = (int) Math.min(firstReadableDayIndex, readableEndDayIndex);
    int end = readableEndDayIndex;
    int[] ru = readableUnits;
    float[] rv = readableValues;
    Arrays.fill(ru, 0, pad + first, -1);
    Arrays.fill(rv, 0, pad + first, Float.NaN);
    for (int d = first; d < end; d++) {
      int u = units[d];
      // same conversion as unitsOrNaN: the int widened to float, or the canonical NaN
      ru[pad + d] = u >= 0 ? u : -1;
      rv[pad + d] = u >= 0 ? u : Float.NaN;
    }
    Arrays.fill(ru, pad + end, ru.length, -1);
    Arrays.fill(rv, pad + end, rv.length, Float.NaN);
  }
}
