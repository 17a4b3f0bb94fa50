package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.PascalDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;

class CountQuantilesTest {
  private static final long SEED = TestSeeds.master(20261202L);
  private static final double[] PROBABILITIES = {0.005, 0.025, 0.165, 0.25, 0.5, 0.75, 0.835, 0.975, 0.995};

  @Test
  void shouldMatchPoissonQuantilesOfCommonsMathWhenAlphaIsZero() {
    // Reference: Apache Commons Math 3.6.1 PoissonDistribution.inverseCumulativeProbability.
    for (double mean : new double[] {0.05, 0.3, 1.0, 2.5, 7.0, 40.0, 150.0}) {
      PoissonDistribution reference = new PoissonDistribution(mean);
      for (double p : PROBABILITIES) {
        assertEquals(reference.inverseCumulativeProbability(p), CountQuantiles.quantile(mean, 0, p), 0.0,
            "mean " + mean + " p " + p);
      }
    }
  }

  @Test
  void shouldMatchNegativeBinomialQuantilesOfCommonsMathPascal() {
    // Reference: Apache Commons Math 3.6.1 PascalDistribution(r, p) counts failures before the r-th success, which is
    // the negative binomial with mean mu and alpha = 1/r when p = 1 / (1 + alpha * mu).
    SplittableRandom random = new SplittableRandom(SEED);
    for (int trial = 0; trial < 200; trial++) {
      int r = 1 + random.nextInt(12);
      double alpha = 1.0 / r;
      double mean = 0.05 + random.nextDouble() * 60;
      PascalDistribution reference = new PascalDistribution(r, 1.0 / (1.0 + alpha * mean));
      for (double p : PROBABILITIES) {
        assertEquals(reference.inverseCumulativeProbability(p), CountQuantiles.quantile(mean, alpha, p), 0.0,
            "seed " + SEED + " trial " + trial + " r " + r + " mean " + mean + " p " + p);
      }
    }
  }

  @Test
  void shouldUseTheNormalApproximationForLargeMeans() {
    // Standard normal 0.975 quantile 1.959964 (any statistics handbook table).
    assertEquals(1.959964, CountQuantiles.standardNormalQuantile(0.975), 1e-6);
    double mean = 1000;
    double alpha = 0.01;
    double sd = Math.sqrt(mean + alpha * mean * mean);
    assertEquals(Math.rint(mean + 1.959964 * sd), CountQuantiles.quantile(mean, alpha, 0.975), 1.0);
  }

  @Test
  void shouldReturnZeroForAZeroMean() {
    assertEquals(0.0, CountQuantiles.quantile(0, 0.5, 0.995));
  }
}
