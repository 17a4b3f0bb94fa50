package org.lagmill.eval;

import java.util.List;
import org.lagmill.forecast.CountQuantiles;

/**
 * Quantile forecasts of every aggregate of a hierarchy from bottom-level count distributions. Each aggregate's mean is
 * the sum of its series' means and its variance the sum of their variances ({@code mu + alpha·mu²} each, treating
 * series as independent given the forecast); the aggregate then gets the negative binomial with that mean and
 * variance. Summing bottom quantiles instead would make aggregate bands far too wide, since extremes of many series
 * do not coincide.
 */
public final class IntervalAggregation {
  private IntervalAggregation() {}

  /**
   * @param means {@code [seriesIndex][dayOffset]} bottom point forecasts
   * @param alphas negative binomial dispersion per series
   * @param quantileLevels probabilities, e.g. the nine published ones
   */
  public static QuantileForecasts quantiles(Aggregator aggregator, double[][] means, float[] alphas,
      double[] quantileLevels) {
    Distribution distribution = distribution(aggregator, means, alphas);
    int horizon = distribution.means().dayCount();
    List<Level> levels = aggregator.levels();
    AggregateTable[] tables = new AggregateTable[quantileLevels.length];
    for (int q = 0; q < quantileLevels.length; q++) {
      tables[q] = AggregateTable.forLevels(levels, horizon);
    }
    for (int level = 0; level < levels.size(); level++) {
      for (int aggregate = 0; aggregate < distribution.means().aggregateCount(level); aggregate++) {
        for (int d = 0; d < horizon; d++) {
          for (int q = 0; q < quantileLevels.length; q++) {
            tables[q].set(level, aggregate, d, distribution.quantile(level, aggregate, d, quantileLevels[q]));
          }
        }
      }
    }
    return QuantileForecasts.ofAggregates(quantileLevels, tables);
  }

  /** Summed means and variances of every aggregate, from the series' means and dispersions. */
  public static Distribution distribution(Aggregator aggregator, double[][] means, float[] alphas) {
    int horizon = means.length == 0 ? 0 : means[0].length;
    double[][] variances = new double[means.length][horizon];
    for (int s = 0; s < means.length; s++) {
      for (int d = 0; d < horizon; d++) {
        double mu = means[s][d];
        variances[s][d] = mu + alphas[s] * mu * mu;
      }
    }
    return new Distribution(aggregator.aggregateForecasts(means), aggregator.aggregateForecasts(variances));
  }

  /**
   * Each aggregate's forecast distribution: the negative binomial with its summed mean and variance.
   *
   * @param means {@code [level][aggregate][day]} summed means
   * @param variances the same layout, summed variances
   */
  public record Distribution(AggregateTable means, AggregateTable variances) {
    /** Quantile of one aggregate on one horizon day. */
    public double quantile(int level, int aggregate, int dayOffset, double probability) {
      double mu = means.get(level, aggregate, dayOffset);
      double variance = variances.get(level, aggregate, dayOffset);
      double alpha = mu > 0 ? Math.max(0, (variance - mu) / (mu * mu)) : 0;
      return CountQuantiles.quantile(mu, alpha, probability);
    }
  }
}
