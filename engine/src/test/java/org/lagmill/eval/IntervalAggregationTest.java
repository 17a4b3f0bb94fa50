package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.special.Beta;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.forecast.ForecastTable;
import org.lagmill.store.ArraySalesHistory;

class IntervalAggregationTest {
  private static final long SEED = TestSeeds.master(61_403L);
  private static final double[] LEVELS = ForecastTable.publishedQuantiles();

  @Test
  void shouldMatchASlowReferenceOnEveryAggregate() {
    SplittableRandom random = new SplittableRandom(SEED);
    ArraySalesHistory history = RandomHistories.history(random, 40, false);
    List<Level> levels = Hierarchy.parse(List.of("region>store", "category>department>item")).bind(history);
    Aggregator aggregator = new Aggregator(levels);
    int horizon = 5;
    double[][] means = new double[history.seriesCount()][horizon];
    float[] alphas = new float[history.seriesCount()];
    for (int s = 0; s < means.length; s++) {
      alphas[s] = s % 7 == 0 ? 0f : (float) (random.nextDouble() * 1.5);
      for (int d = 0; d < horizon; d++) {
        means[s][d] = random.nextInt(10) == 0 ? 0 : random.nextDouble() * (s % 3 == 0 ? 0.5 : 12);
      }
    }
    QuantileForecasts quantiles = IntervalAggregation.quantiles(aggregator, means, alphas, LEVELS);
    boolean sawBottom = false;
    for (int l = 0; l < levels.size(); l++) {
      Level level = levels.get(l);
      for (int a = 0; a < level.aggregateCount(); a++) {
        for (int d = 0; d < horizon; d++) {
          double mu = 0;
          double variance = 0;
          for (int s = 0; s < means.length; s++) {
            if (level.aggregateIndexOf(s) == a) {
              mu += means[s][d];
              variance += means[s][d] + alphas[s] * means[s][d] * means[s][d];
            }
          }
          double alpha = mu > 0 ? Math.max(0, (variance - mu) / (mu * mu)) : 0;
          double previous = -1;
          for (int q = 0; q < LEVELS.length; q++) {
            double actual = quantiles.table(q).get(l, a, d);
            String context = level.name() + " " + a + " day " + d + " q" + LEVELS[q] + ", seed " + SEED;
            assertEquals(referenceQuantile(mu, alpha, LEVELS[q]), actual, context);
            assertTrue(actual >= previous, "not non-decreasing in q: " + context);
            previous = actual;
          }
        }
      }
      if (level.isBottom()) {
        sawBottom = true;
        for (int s = 0; s < means.length; s++) {
          for (int d = 0; d < horizon; d++) {
            for (int q = 0; q < LEVELS.length; q++) {
              assertEquals(referenceQuantile(means[s][d], alphas[s], LEVELS[q]),
                  quantiles.table(q).get(l, level.aggregateIndexOf(s), d), "series " + s + ", seed " + SEED);
            }
          }
        }
      }
    }
    assertTrue(sawBottom);
  }

  @Test
  void shouldGiveThePoissonQuantilesOfTheSumWithoutDispersion() {
    // Independent Poisson series sum to a Poisson of the summed mean; quantiles from Apache Commons Math 3's
    // PoissonDistribution.inverseCumulativeProbability (smallest k with P(X <= k) >= p).
    SplittableRandom random = new SplittableRandom(SEED + 1);
    ArraySalesHistory history = RandomHistories.history(random, 30, false);
    List<Level> levels = Hierarchy.parse(List.of()).bind(history);
    double[][] means = new double[history.seriesCount()][1];
    double total = 0;
    for (int s = 0; s < means.length; s++) {
      means[s][0] = random.nextDouble() * 2;
      total += means[s][0];
    }
    QuantileForecasts quantiles = IntervalAggregation.quantiles(new Aggregator(levels), means,
        new float[means.length], LEVELS);
    PoissonDistribution poisson = new PoissonDistribution(total);
    for (int q = 0; q < LEVELS.length; q++) {
      assertEquals(poisson.inverseCumulativeProbability(LEVELS[q]), quantiles.table(q).get(0, 0, 0),
          "total mean " + total + ", q" + LEVELS[q] + ", seed " + (SEED + 1));
    }
  }

  /**
   * The quantile the docs promise (docs/architecture.md, intervals: a negative binomial of mean mu and variance mu + alpha mu², the
   * smallest count k with P(X <= k) >= p), computed with Apache Commons Math 3, not with our code: the negative
   * binomial CDF is the regularized incomplete beta function, P(X <= k) = I_x(r, k + 1) with r = 1 / alpha and
   * x = r / (r + mu) (a standard identity, e.g. Johnson, Kemp & Kotz, "Univariate Discrete Distributions", ch. 5;
   * quoted from memory), evaluated by {@link Beta#regularizedBeta}; alpha = 0 is the Poisson, by
   * {@link PoissonDistribution#inverseCumulativeProbability}. Above a mean of 400 the documented normal
   * approximation with the same variance applies ({@link NormalDistribution}), rounded to the nearest count.
   */
  private static double referenceQuantile(double mu, double alpha, double p) {
    if (!(mu > 0)) {
      return 0;
    }
    if (mu > 400) {
      double sd = Math.sqrt(mu + alpha * mu * mu);
      return Math.max(0, Math.rint(mu + sd * new NormalDistribution().inverseCumulativeProbability(p)));
    }
    if (alpha < 1e-9) {
      return new PoissonDistribution(mu).inverseCumulativeProbability(p);
    }
    double r = 1 / alpha;
    double x = r / (r + mu);
    int k = 0;
    while (Beta.regularizedBeta(x, r, k + 1) < p) {
      k++;
    }
    return k;
  }
}
