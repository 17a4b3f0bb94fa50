package org.lagmill.training;

/**
 * Estimates the negative binomial dispersion of each series from held-out days (actual against forecast), shrunk
 * toward the pooled estimate so a series with few or quiet held-out days borrows strength from the rest.
 *
 * <p>Method of moments: for each day, {@code (y - mu)^2 - mu} estimates {@code alpha · mu^2}; summing over days and
 * dividing by the sum of {@code mu^2} gives alpha. The shrinkage weight is the series' own {@code sum(mu^2)} against a
 * prior mass of {@link #PRIOR_MASS}: a fast mover's own evidence dominates, a slow mover's barely counts.
 */
public final class DispersionEstimator {
  /** Prior weight, in units of sum(mu^2), of the pooled estimate (common practice, no source: tuned by backtest WSPL). */
  static final double PRIOR_MASS = 20.0;
  /** Dispersions above this are clamped: beyond it the quantiles stop changing the band meaningfully. */
  static final double MAX_ALPHA = 20.0;

  private final double[] excessVarianceSum;
  private final double[] meanSquareSum;
  private double pooledExcess;
  private double pooledMeanSquare;

  public DispersionEstimator(int seriesCount) {
    this.excessVarianceSum = new double[seriesCount];
    this.meanSquareSum = new double[seriesCount];
  }

  /** Adds one held-out day of one series; unknown actuals (negative) are skipped. */
  public void add(int seriesIndex, double forecast, double actual) {
    if (actual < 0 || Double.isNaN(actual) || Double.isNaN(forecast)) {
      return;
    }
    double mu = Math.max(forecast, 1e-3);
    double error = actual - mu;
    double excess = error * error - mu;
    excessVarianceSum[seriesIndex] += excess;
    meanSquareSum[seriesIndex] += mu * mu;
    pooledExcess += excess;
    pooledMeanSquare += mu * mu;
  }

  /** Pooled dispersion over every series added, clamped to {@code [0, MAX_ALPHA]}. */
  public double pooledAlpha() {
    return clamp(pooledMeanSquare > 0 ? pooledExcess / pooledMeanSquare : 0);
  }

  /** The pooled sums {@code {Σ excess, Σ mu²}}: additive over shards. */
  public double[] pooledSums() {
    return new double[] {pooledExcess, pooledMeanSquare};
  }

  /** The pooled dispersion of pooled sums (e.g. added over every shard), clamped to {@code [0, MAX_ALPHA]}. */
  public static double pooledAlpha(double[] pooledSums) {
    return clamp(pooledSums[1] > 0 ? pooledSums[0] / pooledSums[1] : 0);
  }

  /** Per-series dispersions shrunk toward the pooled one. */
  public float[] alphas() {
    return alphas(pooledAlpha());
  }

  /** Per-series dispersions shrunk toward {@code pooled} (in a distributed run, the pooled estimate of all shards). */
  public float[] alphas(double pooled) {
    float[] alphas = new float[excessVarianceSum.length];
    for (int s = 0; s < alphas.length; s++) {
      alphas[s] = (float) clamp((excessVarianceSum[s] + PRIOR_MASS * pooled) / (meanSquareSum[s] + PRIOR_MASS));
    }
    return alphas;
  }

  private static double clamp(double alpha) {
    return Math.max(0.0, Math.min(MAX_ALPHA, alpha));
  }
}
