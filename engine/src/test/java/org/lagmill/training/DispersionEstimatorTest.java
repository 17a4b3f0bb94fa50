package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.PascalDistribution;
import org.apache.commons.math3.random.JDKRandomGenerator;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;

class DispersionEstimatorTest {
  private static final long SEED = TestSeeds.master(77L);

  @Test
  void shouldRecoverTheDispersionOfNegativeBinomialDraws() {
    // Draws from Apache Commons Math's PascalDistribution with r = 4 (alpha = 0.25) around known means.
    JDKRandomGenerator generator = new JDKRandomGenerator();
    generator.setSeed(SEED);
    SplittableRandom random = new SplittableRandom(SEED);
    DispersionEstimator estimator = new DispersionEstimator(1);
    double alpha = 0.25;
    for (int day = 0; day < 40_000; day++) {
      double mean = 1 + random.nextDouble() * 9;
      PascalDistribution distribution = new PascalDistribution(generator, 4, 1.0 / (1.0 + alpha * mean));
      estimator.add(0, mean, distribution.sample());
    }
    assertEquals(0.25, estimator.pooledAlpha(), 0.02, "seed " + SEED);
  }

  @Test
  void shouldShrinkAQuietSeriesTowardThePooledDispersion() {
    DispersionEstimator estimator = new DispersionEstimator(2);
    for (int day = 0; day < 1000; day++) {
      estimator.add(0, 20, day % 2 == 0 ? 10 : 30);
    }
    estimator.add(1, 0.1, 0);
    float[] alphas = estimator.alphas();
    double pooled = estimator.pooledAlpha();
    // One quiet day (mu 0.1, y 0) adds excess 0.01 - 0.1 = -0.09 against a mean square of 0.01.
    double expected = (-0.09 + DispersionEstimator.PRIOR_MASS * pooled) / (0.01 + DispersionEstimator.PRIOR_MASS);
    assertEquals(expected, alphas[1], 1e-6);
    assertTrue(Math.abs(alphas[1] - pooled) < 0.05 * pooled, alphas[1] + " vs pooled " + pooled);
  }

  @Test
  void shouldSkipUnknownActuals() {
    DispersionEstimator estimator = new DispersionEstimator(1);
    estimator.add(0, 3, -1);
    assertEquals(0.0, estimator.pooledAlpha());
  }
}
