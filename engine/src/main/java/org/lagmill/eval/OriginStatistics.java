package org.lagmill.eval;

import java.util.List;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;

/**
 * Scales and weights of every aggregate for one forecast origin, computed from days before the origin only (so a
 * backtest cannot leak the horizon into its own yardstick). See docs/metrics.md for the formulas.
 *
 * <ul>
 *   <li>squared scale: mean squared one-step naive difference from the aggregate's first non-zero day;</li>
 *   <li>absolute scale: the same with absolute differences (for the scaled pinball loss);</li>
 *   <li>weight: the aggregate's sales value (units × day price) over the {@code weightDayCount} days before the origin,
 *       or its unit volume when the history has no prices or no priced sale in that window; aggregates whose squared
 *       scale is NaN or 0 get weight 0 and the others are renormalised to sum to 1 within the level.</li>
 * </ul>
 * Immutable once built.
 */
public final class OriginStatistics {
  /** How the weights were measured. */
  public enum WeightBasis {
    SALES_VALUE,
    UNIT_VOLUME
  }

  private static final int BLOCK_DAYS = 64;

  private final int originDay;
  private final int weightDayCount;
  private final double[][] squaredScales;
  private final double[][] absoluteScales;
  private final double[][] weights;
  private final int[] excludedCounts;
  private final long unknownTrainingCount;
  private final WeightBasis weightBasis;

  private OriginStatistics(int originDay, int weightDayCount, double[][] squaredScales, double[][] absoluteScales,
      double[][] weights, int[] excludedCounts, long unknownTrainingCount, WeightBasis weightBasis) {
    this.originDay = originDay;
    this.weightDayCount = weightDayCount;
    this.squaredScales = squaredScales;
    this.absoluteScales = absoluteScales;
    this.weights = weights;
    this.excludedCounts = excludedCounts;
    this.unknownTrainingCount = unknownTrainingCount;
    this.weightBasis = weightBasis;
  }

  /**
   * Reads days {@code 0 .. originDay-1} of the history in blocks of days (memory: aggregates × 64 days).
   *
   * @param originDay first forecast day, {@code 1 .. history.dayCount()}
   * @param weightDayCount days before the origin whose sales set the weights (28 in the published rules)
   */
  public static OriginStatistics compute(SalesHistory history, Aggregator aggregator, int originDay,
      int weightDayCount) {
    if (originDay < 1 || originDay > history.dayCount()) {
      throw new IllegalArgumentException("originDay " + originDay + " outside 1.." + history.dayCount()
          + "; the origin needs at least one training day before it");
    }
    if (weightDayCount < 1) {
      throw new IllegalArgumentException("weightDayCount must be >= 1, got " + weightDayCount);
    }
    List<Level> levels = aggregator.levels();
    int levelCount = levels.size();
    ScaleSums[] sums = new ScaleSums[levelCount];
    for (int l = 0; l < levelCount; l++) {
      sums[l] = new ScaleSums(levels.get(l).aggregateCount());
    }
    int blockDays = Math.min(BLOCK_DAYS, originDay);
    AggregateTable block = AggregateTable.forLevels(levels, blockDays);
    long unknown = 0;
    for (int from = 0; from < originDay; from += blockDays) {
      int n = Math.min(blockDays, originDay - from);
      aggregator.aggregateActualsInto(history, from, n, block);
      unknown += block.unknownCount();
      for (int l = 0; l < levelCount; l++) {
        sums[l].add(block.levelValues(l), blockDays, n);
      }
    }
    double[] values = weightWindowSumsBefore(history, originDay, weightDayCount, true);
    double[][] pricedByLevel = values == null ? null : aggregator.aggregateValues(values);
    return fromSums(originDay, weightDayCount, sums, pricedByLevel,
        () -> aggregator.aggregateValues(weightWindowSumsBefore(history, originDay, weightDayCount, false)), unknown);
  }

  /**
   * Scales and weights from their additive parts, the one place that turns them into statistics (used by
   * {@link #compute} and by the merge of shards' scoring parts).
   *
   * @param sums per level, each aggregate's sums of squared and absolute one-step differences and their count
   * @param pricedByLevel per level and aggregate, units × price over the weight window; null when there are no prices
   * @param unitsByLevel per level and aggregate, units over the weight window; asked for only when the weights fall
   *     back to unit volume
   * @param unknownTrainingCount bottom series-days before the origin whose units were unknown
   */
  static OriginStatistics fromSums(int originDay, int weightDayCount, ScaleSums[] sums, double[][] pricedByLevel,
      java.util.function.Supplier<double[][]> unitsByLevel, long unknownTrainingCount) {
    int levelCount = sums.length;
    double[][] squaredScales = new double[levelCount][];
    double[][] absoluteScales = new double[levelCount][];
    for (int l = 0; l < levelCount; l++) {
      squaredScales[l] = sums[l].squaredScales();
      absoluteScales[l] = sums[l].absoluteScales();
    }
    WeightBasis basis = WeightBasis.SALES_VALUE;
    double[][] byLevel = pricedByLevel == null ? null : copy(pricedByLevel);
    if (byLevel == null || sum(byLevel[0]) <= 0) {
      basis = WeightBasis.UNIT_VOLUME;
      byLevel = copy(unitsByLevel.get());
    }
    double[][] weights = new double[levelCount][];
    int[] excluded = new int[levelCount];
    for (int l = 0; l < levelCount; l++) {
      double[] raw = byLevel[l];
      for (int g = 0; g < raw.length; g++) {
        double scale = squaredScales[l][g];
        if (!(scale > 0)) {
          raw[g] = 0;
          excluded[l]++;
        }
      }
      weights[l] = SeriesMetrics.normalise(raw);
    }
    return new OriginStatistics(originDay, weightDayCount, squaredScales, absoluteScales, weights, excluded,
        unknownTrainingCount, basis);
  }

  private static double[][] copy(double[][] values) {
    double[][] result = new double[values.length][];
    for (int l = 0; l < values.length; l++) {
      result[l] = values[l].clone();
    }
    return result;
  }

  /** Per-series units (× price) summed over the weight window before {@code originDay}; null when unpriced. */
  static double[] weightWindowSumsBefore(SalesHistory history, int originDay, int weightDayCount, boolean priced) {
    int windowStart = Math.max(0, originDay - weightDayCount);
    double[][] values = windowSums(history, windowStart, originDay, priced);
    return values == null ? null : values[0];
  }

  /** Per-series units (× day price when {@code priced}) summed over the window; null when priced but no prices. */
  private static double[][] windowSums(SalesHistory history, int fromDay, int toDay, boolean priced) {
    PriceTable prices = history.prices();
    if (priced && prices.isEmpty()) {
      return null;
    }
    int dayCount = toDay - fromDay;
    int[] units = new int[dayCount];
    float[] dayPrices = new float[dayCount];
    double[] result = new double[history.seriesCount()];
    for (int s = 0; s < result.length; s++) {
      history.readUnits(s, fromDay, units, 0, dayCount);
      if (priced) {
        prices.readPrices(s, fromDay, dayPrices, 0, dayCount);
      }
      double total = 0;
      for (int d = 0; d < dayCount; d++) {
        if (units[d] <= 0) {
          continue;
        }
        if (!priced) {
          total += units[d];
        } else if (!Float.isNaN(dayPrices[d])) {
          total += units[d] * (double) dayPrices[d];
        }
      }
      result[s] = total;
    }
    return new double[][] {result};
  }

  private static double sum(double[] values) {
    double total = 0;
    for (double v : values) {
      total += v;
    }
    return total;
  }

  public int originDay() {
    return originDay;
  }

  public int weightDayCount() {
    return weightDayCount;
  }

  public int levelCount() {
    return weights.length;
  }

  /** Squared scale per aggregate of a level (NaN when undefined); a copy. */
  public double[] squaredScales(int levelIndex) {
    return squaredScales[levelIndex].clone();
  }

  /** Absolute scale per aggregate of a level (NaN when undefined); a copy. */
  public double[] absoluteScales(int levelIndex) {
    return absoluteScales[levelIndex].clone();
  }

  /** Weights of a level's aggregates, summing to 1 (or all 0 when nothing sold in the window); a copy. */
  public double[] weights(int levelIndex) {
    return weights[levelIndex].clone();
  }

  double squaredScale(int levelIndex, int aggregateIndex) {
    return squaredScales[levelIndex][aggregateIndex];
  }

  double absoluteScale(int levelIndex, int aggregateIndex) {
    return absoluteScales[levelIndex][aggregateIndex];
  }

  double weight(int levelIndex, int aggregateIndex) {
    return weights[levelIndex][aggregateIndex];
  }

  /** Aggregates of a level given weight 0 because their squared scale is NaN or 0. */
  public int excludedCount(int levelIndex) {
    return excludedCounts[levelIndex];
  }

  /** Bottom series-days before the origin whose units were unknown and counted as 0. */
  public long unknownTrainingCount() {
    return unknownTrainingCount;
  }

  public WeightBasis weightBasis() {
    return weightBasis;
  }
}
