package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.special.Gamma;
import org.apache.commons.math3.stat.inference.ChiSquareTest;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;

class PoissonSamplerTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);

  @Test
  void shouldMatchPoissonMomentsOnBothSides() {
    for (double mean : new double[] {0.05, 0.4, 3.0, 9.99, 10.0, 25.0, 150.0, 2000.0}) {
      SplittableRandom random = new SplittableRandom(MASTER_SEED + Double.hashCode(mean));
      int drawCount = 200_000;
      double sum = 0;
      double sumSquares = 0;
      for (int i = 0; i < drawCount; i++) {
        int k = PoissonSampler.draw(random, mean);
        assertTrue(k >= 0);
        sum += k;
        sumSquares += (double) k * k;
      }
      double sampleMean = sum / drawCount;
      double sampleVariance = sumSquares / drawCount - sampleMean * sampleMean;
      // Reference moments from commons-math3's PoissonDistribution (mean = variance = lambda).
      PoissonDistribution reference = new PoissonDistribution(mean);
      double standardError = Math.sqrt(reference.getNumericalVariance() / drawCount);
      String context = "seed " + MASTER_SEED + ", mean " + mean;
      assertEquals(reference.getNumericalMean(), sampleMean, 5 * standardError, context);
      // The variance of the sample variance of a Poisson is about (lambda + 2 lambda^2) / n.
      double varianceError = Math.sqrt((mean + 2 * mean * mean) / drawCount);
      assertEquals(reference.getNumericalVariance(), sampleVariance, 5 * varianceError, context);
    }
  }

  @Test
  void shouldFitThePoissonProbabilitiesByChiSquare() {
    for (double mean : new double[] {0.7, 4.5, 12.0, 60.0}) {
      PoissonDistribution reference = new PoissonDistribution(mean);
      int low = (int) Math.max(0, Math.floor(mean - 4 * Math.sqrt(mean)));
      int high = (int) Math.ceil(mean + 4 * Math.sqrt(mean)) + 2;
      // Bins low..high, the two ends absorbing the tails.
      int binCount = high - low + 1;
      double[] expected = new double[binCount];
      for (int b = 0; b < binCount; b++) {
        int k = low + b;
        expected[b] = b == 0 ? reference.cumulativeProbability(k)
            : b == binCount - 1 ? 1 - reference.cumulativeProbability(k - 1) : reference.probability(k);
      }
      long[] observed = new long[binCount];
      SplittableRandom random = new SplittableRandom(MASTER_SEED ^ Double.doubleToLongBits(mean));
      for (int i = 0; i < 100_000; i++) {
        int k = PoissonSampler.draw(random, mean);
        observed[Math.min(binCount - 1, Math.max(0, k - low))]++;
      }
      // commons-math3 ChiSquareTest: p-value of Pearson's goodness of fit; a correct sampler fails 1 in 1000 seeds.
      double pValue = new ChiSquareTest().chiSquareTest(expected, observed);
      assertTrue(pValue > 0.001, "seed " + MASTER_SEED + ", mean " + mean + ", p " + pValue);
    }
  }

  @Test
  void shouldComputeLogFactorialLikeTheLogGammaFunction() {
    for (long k : new long[] {0, 1, 2, 10, 255, 256, 257, 1000, 123_456}) {
      // ln k! = lnGamma(k + 1), commons-math3's Gamma.logGamma as reference.
      double reference = Gamma.logGamma(k + 1.0);
      assertEquals(reference, PoissonSampler.logFactorial(k), 1e-9 * Math.max(1, reference), "k " + k);
    }
  }

  @Test
  void shouldReturnZeroForZeroMean() {
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    for (int i = 0; i < 100; i++) {
      assertEquals(0, PoissonSampler.draw(random, 0.0));
    }
  }
}
