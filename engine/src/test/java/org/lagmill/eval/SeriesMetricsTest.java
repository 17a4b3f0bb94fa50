package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.junit.jupiter.api.Test;

class SeriesMetricsTest {
  @Test
  void shouldCountTheScaleFromTheFirstNonZeroSale() {
    // 0, 0, 3, 1, 4 with the origin after the last day: differences from the first sale only,
    // (1 - 3)² = 4 and (4 - 1)² = 9, mean 13 / 2 = 6.5; absolute: (2 + 3) / 2 = 2.5.
    double[] y = {0, 0, 3, 1, 4};
    assertEquals(6.5, SeriesMetrics.squaredScale(y, 5), 1e-12);
    assertEquals(2.5, SeriesMetrics.absoluteScale(y, 5), 1e-12);
    // The pre-launch zeros would otherwise add (0 - 0)² and (3 - 0)²: 22 / 4 = 5.5.
    assertTrue(Math.abs(SeriesMetrics.squaredScale(y, 5) - 5.5) > 0.5);
    // An origin of 4 ignores the 4: one difference, (1 - 3)² = 4.
    assertEquals(4.0, SeriesMetrics.squaredScale(y, 4), 1e-12);
  }

  @Test
  void shouldLeaveScaleUndefinedWithoutTwoDaysFromTheFirstSale() {
    assertTrue(Double.isNaN(SeriesMetrics.squaredScale(new double[] {0, 0, 0}, 3)));
    assertTrue(Double.isNaN(SeriesMetrics.squaredScale(new double[] {0, 0, 5}, 3)));
    assertEquals(0.0, SeriesMetrics.squaredScale(new double[] {0, 2, 2, 2}, 4));
  }

  @Test
  void shouldMatchHandWorkedMaseAndRmsse() {
    // MASE as defined by Hyndman & Koehler (2006), "Another look at measures of forecast accuracy", IJF 22(4):
    // the in-sample mean absolute one-step naive error scales the out-of-sample MAE. Hand-worked here:
    // training 2, 4, 3, 5 -> |2|, |1|, |2| -> scale 5/3; actual 6, 3 vs forecast 4, 4 -> MAE 1.5 -> MASE 0.9.
    double[] training = {2, 4, 3, 5};
    double[] actual = {6, 3};
    double[] forecast = {4, 4};
    double absoluteScale = SeriesMetrics.absoluteScale(training, 4);
    assertEquals(5.0 / 3, absoluteScale, 1e-12);
    assertEquals(0.9, SeriesMetrics.mase(actual, forecast, absoluteScale), 1e-12);
    // RMSSE (M5 guidelines, Makridakis, Spiliotis & Assimakopoulos): squared differences 4, 1, 4 -> scale 3;
    // squared errors 4, 1 -> mean 2.5 -> sqrt(2.5 / 3) = 0.912870929...
    double squaredScale = SeriesMetrics.squaredScale(training, 4);
    assertEquals(3.0, squaredScale, 1e-12);
    assertEquals(Math.sqrt(2.5 / 3), SeriesMetrics.rmsse(actual, forecast, squaredScale), 1e-12);
    assertEquals(0.912870929175277, SeriesMetrics.rmsse(actual, forecast, squaredScale), 1e-12);
  }

  @Test
  void shouldMatchTheTextbookPinballLoss() {
    // Pinball loss (Koenker & Bassett 1978 check function): rho_tau(u) = u (tau - 1{u < 0}), u = y - q.
    // y = 10, q = 7, tau = 0.9: u = 3 -> 0.9 * 3 = 2.7; q = 12: u = -2 -> (0.9 - 1) * -2 = 0.2.
    assertEquals(2.7, SeriesMetrics.pinball(0.9, 10, 7), 1e-12);
    assertEquals(0.2, SeriesMetrics.pinball(0.9, 10, 12), 1e-12);
    assertEquals(1.0, SeriesMetrics.pinball(0.5, 10, 8), 1e-12);
    assertEquals(0.0, SeriesMetrics.pinball(0.25, 4, 4), 1e-12);
    // SPL over h = 2 with scale 2.5: (2.7 + 0.2) / 2 / 2.5 = 0.58.
    assertEquals(0.58, SeriesMetrics.scaledPinball(0.9, new double[] {10, 10}, new double[] {7, 12}, 2.5), 1e-12);
  }

  @Test
  void shouldBeMinimisedByTheSampleQuantile() {
    // The empirical quantile minimises the mean pinball loss; commons-math3's Percentile (estimation type R_1, the
    // inverse of the empirical distribution) gives a sample quantile to check this against.
    double[] sample = {3, 0, 7, 1, 1, 12, 5, 2, 9, 4, 0, 6};
    for (double tau : new double[] {0.005, 0.025, 0.165, 0.25, 0.5, 0.75, 0.835, 0.975, 0.995}) {
      double q = new Percentile().withEstimationType(Percentile.EstimationType.R_1).evaluate(sample, tau * 100);
      double atQuantile = ourMeanPinball(tau, sample, q);
      for (double other = -1; other <= 13; other += 0.25) {
        String context = "tau " + tau + " q " + q + " other " + other;
        assertEquals(meanPinball(tau, sample, other), ourMeanPinball(tau, sample, other), 1e-12, context);
        assertTrue(ourMeanPinball(tau, sample, other) >= atQuantile - 1e-12, context);
      }
    }
  }

  private static double ourMeanPinball(double tau, double[] sample, double q) {
    double sum = 0;
    for (double y : sample) {
      sum += SeriesMetrics.pinball(tau, y, q);
    }
    return sum / sample.length;
  }

  /** Mean check-function loss written out from its definition, not with our code: tau (y - q) above q, (1 - tau)
   * (q - y) below. */
  private static double meanPinball(double tau, double[] sample, double q) {
    double sum = 0;
    for (double y : sample) {
      sum += y >= q ? tau * (y - q) : (1 - tau) * (q - y);
    }
    return sum / sample.length;
  }

  @Test
  void shouldReproduceTheTwoProductWorkedExample() {
    // Weighting example of the M5 participants' guide, recalled from memory (not checked against the document):
    // two products with sales value 10 and 12 and RMSSE 0.8 and 0.7; their aggregate has RMSSE 0.77.
    // bottom level: (10 x 0.8 + 12 x 0.7) / 22 = 16.4 / 22 = 0.745454...; top level: weight 1 x 0.77 = 0.77;
    // WRMSSE = (0.745454... + 0.77) / 2 = 0.757727... ~ 0.758.
    double[] bottomWeights = SeriesMetrics.normalise(new double[] {10, 12});
    assertArrayEquals(new double[] {10.0 / 22, 12.0 / 22}, bottomWeights, 1e-15);
    double wrmsse = SeriesMetrics.weightedMeanOverLevels(new double[][] {{1.0}, bottomWeights},
        new double[][] {{0.77}, {0.8, 0.7}});
    assertEquals((16.4 / 22 + 0.77) / 2, wrmsse, 1e-12);
    assertEquals(0.758, wrmsse, 5e-4);
  }

  @Test
  void shouldPublishTheNineQuantileLevels() {
    assertArrayEquals(new double[] {0.005, 0.025, 0.165, 0.25, 0.5, 0.75, 0.835, 0.975, 0.995},
        SeriesMetrics.publishedQuantiles());
  }
}
