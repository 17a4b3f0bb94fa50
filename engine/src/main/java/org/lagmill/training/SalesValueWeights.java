package org.lagmill.training;

import org.lagmill.store.SalesHistory;

/**
 * Per-series row weights proportional to recent sales value (units × shelf price over the last days before a cut), the
 * same quantity the weighted error metric weights series by, so the learner spends its effort where the metric does.
 */
final class SalesValueWeights {
  /** Days of sales value counted, as in the error metric's weights. */
  static final int WINDOW_DAYS = 28;
  /** Smallest weight relative to the mean, so a series with no recent sales still teaches the model something
   *  (common practice, no source). */
  static final float FLOOR_RELATIVE_TO_MEAN = 0.05f;

  private SalesValueWeights() {}

  /**
   * @param endDayIndex first day after the window (exclusive), at most the history's dayCount
   * @return one weight per series with mean 1 before flooring; all 1 when nothing sold in the window
   */
  static float[] compute(SalesHistory history, int endDayIndex) {
    double[] value = values(history, endDayIndex);
    double total = 0;
    for (double v : value) {
      total += v;
    }
    return weights(value, total / Math.max(1, value.length));
  }

  /**
   * Weights from sales values and the mean over every series (a shard passes the mean over all shards, so its weights
   * are the ones the whole store would give).
   */
  static float[] weights(double[] value, double mean) {
    float[] weights = new float[value.length];
    for (int s = 0; s < weights.length; s++) {
      weights[s] = mean > 0 ? Math.max(FLOOR_RELATIVE_TO_MEAN, (float) (value[s] / mean)) : 1f;
    }
    return weights;
  }

  /** Each series' units × price over the window before {@code endDayIndex} (units alone without prices). */
  static double[] values(SalesHistory history, int endDayIndex) {
    int firstDay = Math.max(0, endDayIndex - WINDOW_DAYS);
    int dayCount = endDayIndex - firstDay;
    int[] units = new int[Math.max(0, dayCount)];
    float[] prices = new float[units.length];
    double[] value = new double[history.seriesCount()];
    for (int s = 0; s < value.length; s++) {
      history.readUnits(s, firstDay, units, 0, dayCount);
      boolean priced = !history.prices().isEmpty();
      if (priced) {
        history.prices().readPrices(s, firstDay, prices, 0, dayCount);
      }
      for (int d = 0; d < dayCount; d++) {
        if (units[d] > 0) {
          float price = priced ? prices[d] : 1f;
          value[s] += units[d] * (Float.isNaN(price) ? 0 : price);
        }
      }
    }
    return value;
  }
}
