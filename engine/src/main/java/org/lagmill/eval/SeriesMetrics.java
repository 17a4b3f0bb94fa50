package org.lagmill.eval;

import org.lagmill.forecast.ForecastTable;

/**
 * Per-series error formulas of docs/metrics.md on plain arrays (day 0 = the first day of the array). The streaming
 * {@link Evaluator} computes the same quantities over aggregates; these are the reference forms and the public
 * helpers. All methods are pure and thread-safe.
 */
public final class SeriesMetrics {
  private SeriesMetrics() {}

  /** A copy of the nine published quantile levels 0.005 … 0.995. */
  public static double[] publishedQuantiles() {
    return ForecastTable.publishedQuantiles();
  }

  /** First day index in {@code [0, originDay)} with a value above 0, or -1. */
  public static int firstNonZeroDay(double[] values, int originDay) {
    for (int d = 0; d < originDay; d++) {
      if (values[d] > 0) {
        return d;
      }
    }
    return -1;
  }

  /**
   * RMSSE denominator: mean of {@code (y[t] - y[t-1])²} over {@code t = f+1 .. originDay-1}, f the first non-zero
   * day. NaN when fewer than one difference exists (never sold, or sold first on the last training day).
   */
  public static double squaredScale(double[] values, int originDay) {
    int first = firstNonZeroDay(values, originDay);
    if (first < 0 || first + 1 >= originDay) {
      return Double.NaN;
    }
    double sum = 0;
    for (int t = first + 1; t < originDay; t++) {
      double diff = values[t] - values[t - 1];
      sum += diff * diff;
    }
    return sum / (originDay - 1 - first);
  }

  /** Scaled pinball / MASE denominator: as {@link #squaredScale} with absolute differences. */
  public static double absoluteScale(double[] values, int originDay) {
    int first = firstNonZeroDay(values, originDay);
    if (first < 0 || first + 1 >= originDay) {
      return Double.NaN;
    }
    double sum = 0;
    for (int t = first + 1; t < originDay; t++) {
      sum += Math.abs(values[t] - values[t - 1]);
    }
    return sum / (originDay - 1 - first);
  }

  /** {@code sqrt( mean_k (actual[k] - forecast[k])² / squaredScale )} over the arrays' common length. */
  public static double rmsse(double[] actual, double[] forecast, double squaredScale) {
    checkSameLength(actual, forecast);
    double sum = 0;
    for (int k = 0; k < actual.length; k++) {
      double e = actual[k] - forecast[k];
      sum += e * e;
    }
    return Math.sqrt(sum / actual.length / squaredScale);
  }

  /** Mean absolute scaled error: {@code mean_k |actual[k] - forecast[k]| / absoluteScale}. */
  public static double mase(double[] actual, double[] forecast, double absoluteScale) {
    checkSameLength(actual, forecast);
    double sum = 0;
    for (int k = 0; k < actual.length; k++) {
      sum += Math.abs(actual[k] - forecast[k]);
    }
    return sum / actual.length / absoluteScale;
  }

  /** Pinball (quantile) loss of one value: {@code tau (y - q)} when {@code y >= q}, else {@code (1 - tau)(q - y)}. */
  public static double pinball(double tau, double actual, double quantileForecast) {
    return actual >= quantileForecast ? tau * (actual - quantileForecast) : (1 - tau) * (quantileForecast - actual);
  }

  /** {@code (1/h) Σ_k pinball(tau, actual[k], q[k]) / absoluteScale}. */
  public static double scaledPinball(double tau, double[] actual, double[] quantileForecast, double absoluteScale) {
    checkSameLength(actual, quantileForecast);
    double sum = 0;
    for (int k = 0; k < actual.length; k++) {
      sum += pinball(tau, actual[k], quantileForecast[k]);
    }
    return sum / actual.length / absoluteScale;
  }

  /** Divides by the sum so the values add to 1; all zeros when the sum is 0. */
  public static double[] normalise(double[] values) {
    double sum = 0;
    for (double v : values) {
      sum += v;
    }
    double[] result = new double[values.length];
    if (sum > 0) {
      for (int i = 0; i < values.length; i++) {
        result[i] = values[i] / sum;
      }
    }
    return result;
  }

  /**
   * Mean over levels of the weighted sum of per-aggregate errors: {@code (1/L) Σ_l Σ_i w[l][i] e[l][i]}. With RMSSE as
   * {@code e} this is WRMSSE, with SPL it is WSPL. Terms with weight 0 are skipped (their error may be NaN).
   */
  public static double weightedMeanOverLevels(double[][] weightsByLevel, double[][] errorsByLevel) {
    if (weightsByLevel.length != errorsByLevel.length || weightsByLevel.length == 0) {
      throw new IllegalArgumentException("need the same non-zero number of weight and error levels, got "
          + weightsByLevel.length + " and " + errorsByLevel.length);
    }
    double total = 0;
    for (int l = 0; l < weightsByLevel.length; l++) {
      checkSameLength(weightsByLevel[l], errorsByLevel[l]);
      double levelSum = 0;
      for (int i = 0; i < weightsByLevel[l].length; i++) {
        if (weightsByLevel[l][i] != 0) {
          levelSum += weightsByLevel[l][i] * errorsByLevel[l][i];
        }
      }
      total += levelSum;
    }
    return total / weightsByLevel.length;
  }

  private static void checkSameLength(double[] a, double[] b) {
    if (a.length != b.length || a.length == 0) {
      throw new IllegalArgumentException("need two arrays of the same non-zero length, got " + a.length + " and "
          + b.length);
    }
  }
}
