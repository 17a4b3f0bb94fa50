package org.lagmill.scenario;

import java.util.SplittableRandom;

/**
 * Poisson draws for a mean that changes every day: inversion by sequential search for small means (the common case:
 * most item-store days sell under one unit), and Hörmann's transformed rejection with squeeze (PTRS; W. Hörmann, "The
 * transformed rejection method for generating Poisson random variables", Insurance: Mathematics and Economics 12,
 * 1993) for larger ones, whose cost does not grow with the mean. Stateless; the caller owns the random stream.
 */
final class PoissonSampler {
  /** Means below this use inversion; PTRS is valid from 10 on. */
  static final double INVERSION_LIMIT = 10.0;
  private static final int LOG_FACTORIAL_TABLE_SIZE = 256;
  private static final double[] LOG_FACTORIAL = new double[LOG_FACTORIAL_TABLE_SIZE];
  private static final double HALF_LOG_TWO_PI = 0.5 * Math.log(2 * Math.PI);

  static {
    for (int k = 1; k < LOG_FACTORIAL_TABLE_SIZE; k++) {
      LOG_FACTORIAL[k] = LOG_FACTORIAL[k - 1] + Math.log(k);
    }
  }

  private PoissonSampler() {}

  /** One Poisson draw with the given mean (>= 0); means above about 2^30 are not supported. */
  static int draw(SplittableRandom random, double mean) {
    assert mean >= 0 && mean < 1e9 : mean;
    if (mean < INVERSION_LIMIT) {
      return inversion(random, mean);
    }
    return ptrs(random, mean);
  }

  static int inversion(SplittableRandom random, double mean) {
    if (mean <= 0) {
      return 0;
    }
    double u = random.nextDouble();
    double probability = Math.exp(-mean);
    double cumulative = probability;
    int k = 0;
    // The bound stops the search where the remaining tail is below double precision (u rounding near 1).
    while (u > cumulative && k < 1000) {
      k++;
      probability *= mean / k;
      cumulative += probability;
    }
    return k;
  }

  static int ptrs(SplittableRandom random, double mean) {
    double sqrtMean = Math.sqrt(mean);
    double logMean = Math.log(mean);
    double b = 0.931 + 2.53 * sqrtMean;
    double a = -0.059 + 0.02483 * b;
    double inverseAlpha = 1.1239 + 1.1328 / (b - 3.4);
    double vr = 0.9277 - 3.6224 / (b - 2);
    while (true) {
      double u = random.nextDouble() - 0.5;
      double v = random.nextDouble();
      double us = 0.5 - Math.abs(u);
      long k = (long) Math.floor((2 * a / us + b) * u + mean + 0.43);
      if (us >= 0.07 && v <= vr) {
        return (int) k;
      }
      if (k < 0 || (us < 0.013 && v > us)) {
        continue;
      }
      double lhs = Math.log(v) + Math.log(inverseAlpha) - Math.log(a / (us * us) + b);
      double rhs = -mean + k * logMean - logFactorial(k);
      if (lhs <= rhs) {
        return (int) k;
      }
    }
  }

  /** ln(k!) from a table, else Stirling's series to the 1/k^3 term (error below 1e-12 from k = 256). */
  static double logFactorial(long k) {
    if (k < LOG_FACTORIAL_TABLE_SIZE) {
      return LOG_FACTORIAL[(int) k];
    }
    double n = k;
    return n * Math.log(n) - n + HALF_LOG_TWO_PI + 0.5 * Math.log(n) + 1 / (12 * n) - 1 / (360 * n * n * n);
  }
}
