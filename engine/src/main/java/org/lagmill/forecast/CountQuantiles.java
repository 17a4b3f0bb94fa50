package org.lagmill.forecast;

/**
 * Quantiles of a negative binomial distribution of daily units with mean {@code mean} and dispersion {@code alpha}
 * (variance = mean + alpha · mean²; alpha = 0 is Poisson). Forecast intervals use it around each point forecast:
 * daily retail units are counts whose spread grows faster than their mean, and a count distribution puts the lower
 * quantiles of a slow mover exactly at 0, which a symmetric band cannot do.
 *
 * <p>Stateless and allocation-free; thread-safe.
 */
public final class CountQuantiles {
  /** Above this mean the normal approximation with the same variance replaces summing the pmf. */
  static final double NORMAL_APPROXIMATION_MEAN = 400.0;
  private static final double POISSON_ALPHA = 1e-9;

  private CountQuantiles() {}

  /**
   * Quantile forecasts around point forecasts, each series with its own dispersion.
   *
   * @param pointForecasts {@code [seriesIndex][dayOffset]} expected units
   * @param dispersionBySeries each series' dispersion alpha, indexed like {@code pointForecasts}
   * @param probabilities quantile levels in (0, 1)
   * @return {@code [quantileIndex][seriesIndex][dayOffset]}
   */
  public static double[][][] quantiles(double[][] pointForecasts, float[] dispersionBySeries, double[] probabilities) {
    double[][][] out = new double[probabilities.length][pointForecasts.length][];
    for (int q = 0; q < probabilities.length; q++) {
      for (int s = 0; s < pointForecasts.length; s++) {
        double[] row = new double[pointForecasts[s].length];
        for (int d = 0; d < row.length; d++) {
          row[d] = quantile(pointForecasts[s][d], dispersionBySeries[s], probabilities[q]);
        }
        out[q][s] = row;
      }
    }
    return out;
  }

  /**
   * Smallest count {@code k} with {@code P(X <= k) >= probability}.
   *
   * @param mean expected units, {@code >= 0}
   * @param alpha dispersion, {@code >= 0}
   * @param probability in (0, 1)
   */
  public static double quantile(double mean, double alpha, double probability) {
    if (!(mean > 0)) {
      return 0.0;
    }
    if (mean > NORMAL_APPROXIMATION_MEAN) {
      double sd = Math.sqrt(mean + alpha * mean * mean);
      return Math.max(0.0, Math.rint(mean + sd * standardNormalQuantile(probability)));
    }
    double pmf;
    double ratio;
    boolean poisson = alpha < POISSON_ALPHA;
    double r = poisson ? 0 : 1.0 / alpha;
    if (poisson) {
      pmf = Math.exp(-mean);
      ratio = 0;
    } else {
      double successShare = 1.0 / (1.0 + alpha * mean);
      pmf = Math.exp(r * Math.log(successShare));
      ratio = 1.0 - successShare;
    }
    double cdf = pmf;
    int k = 0;
    // The tail of a count distribution with mean <= 400 ends well before this bound for any alpha we estimate.
    int maxCount = (int) Math.ceil(mean * 50 + 1000);
    while (cdf < probability && k < maxCount) {
      pmf *= poisson ? mean / (k + 1) : (k + r) / (k + 1) * ratio;
      k++;
      cdf += pmf;
    }
    return k;
  }

  /** Inverse of the standard normal CDF (Acklam's rational approximation, relative error below 1.2e-9). */
  static double standardNormalQuantile(double p) {
    if (p <= 0 || p >= 1) {
      throw new IllegalArgumentException("probability must be in (0, 1), got " + p);
    }
    double[] a = {-3.969683028665376e+01, 2.209460984245205e+02, -2.759285104469687e+02, 1.383577518672690e+02,
        -3.066479806614716e+01, 2.506628277459239e+00};
    double[] b = {-5.447609879822406e+01, 1.615858368580409e+02, -1.556989798598866e+02, 6.680131188771972e+01,
        -1.328068155288572e+01};
    double[] c = {-7.784894002430293e-03, -3.223964580411365e-01, -2.400758277161838e+00, -2.549732539343734e+00,
        4.374664141464968e+00, 2.938163982698783e+00};
    double[] d = {7.784695709041462e-03, 3.224671290700398e-01, 2.445134137142996e+00, 3.754408661907416e+00};
    double low = 0.02425;
    if (p < low) {
      double q = Math.sqrt(-2 * Math.log(p));
      return (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5])
          / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
    }
    if (p > 1 - low) {
      return -standardNormalQuantile(1 - p);
    }
    double q = p - 0.5;
    double r = q * q;
    return (((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q
        / (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
  }
}
