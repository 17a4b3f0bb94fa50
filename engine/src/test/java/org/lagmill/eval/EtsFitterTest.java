package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArraySalesHistory;

class EtsFitterTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);
  private static final int U = -1;

  /**
   * The state equations written out with a time-indexed season history (no ring), from the book's tables 2.2 and
   * 2.3 (Hyndman, Koehler, Ord and Snyder 2008): additive error {@code l = l' + phi b' + alpha e}, {@code b = phi b' +
   * beta e}, {@code s = s_{t−m} + gamma e}; multiplicative error and season {@code l = (l' + phi b')(1 + alpha e)},
   * {@code b = phi b' + beta (l' + phi b') e}, {@code s = s_{t−m}(1 + gamma e)}. Unknown values move the state without
   * an update. Returns the log-likelihood {@code −n/2 (log(2π SSE/n) + 1) − Σ log ŷ} (the last sum for multiplicative
   * errors only) and fills {@code forecast}.
   */
  private static double slowReference(EtsForm form, double[] y, double level0, double trend0, double[] season0,
      double alpha, double beta, double gamma, double phi, double[] forecast) {
    int m = season0.length;
    int n = y.length;
    double[] season = new double[n + m];
    for (int j = 0; j < m; j++) {
      season[j] = form.seasonal() ? season0[j] : 0;
    }
    double damping = form.hasTrend() ? (form.damped() ? phi : 1) : 0;
    double level = level0;
    double trend = form.hasTrend() ? trend0 : 0;
    double sse = 0;
    double logs = 0;
    int known = 0;
    for (int t = 0; t < n; t++) {
      double previousSeason = season[t];
      double base = level + damping * trend;
      double yhat = switch (form.season()) {
        case NONE -> base;
        case ADDITIVE -> base + previousSeason;
        case MULTIPLICATIVE -> base * previousSeason;
      };
      if (Double.isNaN(y[t])) {
        level = base;
        trend = damping * trend;
        season[t + m] = previousSeason;
        continue;
      }
      known++;
      if (form.multiplicativeError()) {
        double e = (y[t] - yhat) / yhat;
        sse += e * e;
        logs += Math.log(yhat);
        level = base * (1 + alpha * e);
        trend = damping * trend + beta * base * e;
        season[t + m] = previousSeason * (1 + gamma * e);
      } else {
        double e = y[t] - yhat;
        sse += e * e;
        level = base + alpha * e;
        trend = damping * trend + beta * e;
        season[t + m] = previousSeason + gamma * e;
      }
    }
    for (int k = 1; k <= forecast.length; k++) {
      double trendSum = 0;
      for (int i = 1; i <= k; i++) {
        trendSum += Math.pow(damping, i);
      }
      double base = level + (form.hasTrend() ? trendSum * trend : 0);
      // The season of period n + k − 1 is the latest stored one of the same position.
      double s = season[n + ((k - 1) % m)];
      forecast[k - 1] = switch (form.season()) {
        case NONE -> base;
        case ADDITIVE -> base + s;
        case MULTIPLICATIVE -> base * s;
      };
    }
    return -known / 2.0 * (Math.log(2 * Math.PI * sse / known) + 1) - logs;
  }

  @Test
  void shouldMatchTheSlowReferenceOnRandomSeriesWithUnknownValues() {
    long seed = MASTER_SEED;
    SplittableRandom random = new SplittableRandom(seed);
    int checked = 0;
    for (int round = 0; round < 300; round++) {
      int m = new int[] {4, 7, 12, 52}[random.nextInt(4)];
      int n = EtsInitialStates.minimumSeasonalValues(m) + random.nextInt(150);
      double[] y = new double[n];
      double level = 5 + random.nextDouble() * 50;
      for (int t = 0; t < n; t++) {
        // Unknown values anywhere but the first ten (those feed the start states, checked in isolation below).
        y[t] = t >= 10 && random.nextInt(20) == 0 ? Double.NaN
            : Math.max(0.5, level * (1 + 0.3 * Math.sin(2 * Math.PI * t / m)) + random.nextGaussian() * 3);
      }
      EtsFitter fitter = new EtsFitter(m);
      fitter.load(y, n);
      for (EtsForm form : EtsForm.values()) {
        double alpha = 0.01 + random.nextDouble() * 0.9;
        double beta = random.nextDouble() * alpha;
        double gamma = random.nextDouble() * (1 - alpha);
        double phi = 0.8 + random.nextDouble() * 0.18;
        double logL = fitter.logLikelihood(form, alpha, beta, gamma, phi);
        String message = "seed " + seed + " round " + round + " " + form + " m " + m;
        if (!fitter.available(form)) {
          assertTrue(Double.isNaN(logL), message);
          continue;
        }
        double[] season0 = new double[m];
        for (int j = 0; j < m; j++) {
          season0[j] = fitter.initialSeason(j);
        }
        double[] expected = new double[2 * m + 3];
        double expectedLogL = slowReference(form, y, fitter.initialLevel(), fitter.initialTrend(), season0, alpha, beta,
            gamma, phi, expected);
        if (Double.isNaN(expectedLogL)) {
          assertTrue(Double.isNaN(logL), message + ": a multiplicative one-step forecast at or below 0 is invalid");
          continue;
        }
        double[] actual = new double[expected.length];
        fitter.forecast(actual.length, actual, 0);
        assertEquals(expectedLogL, logL, 1e-9 * Math.abs(expectedLogL), message);
        assertArrayEquals(expected, actual, 1e-9 * level, message);
        checked++;
      }
    }
    assertTrue(checked > 1500, "only " + checked + " checks ran");
  }

  @Test
  void shouldChooseTheFormWithTheSmallestAicc() {
    SplittableRandom random = new SplittableRandom(MASTER_SEED + 1);
    for (int round = 0; round < 20; round++) {
      int n = 40 + random.nextInt(200);
      double[] y = new double[n];
      double trend = random.nextBoolean() ? 0 : 0.1;
      double seasonAmplitude = random.nextBoolean() ? 0 : 4;
      for (int t = 0; t < n; t++) {
        y[t] = 20 + trend * t + seasonAmplitude * Math.cos(2 * Math.PI * t / 7) + random.nextGaussian();
      }
      EtsFitter fitter = new EtsFitter(7);
      fitter.load(y, n);
      double best = Double.POSITIVE_INFINITY;
      EtsForm bestForm = null;
      for (EtsForm form : EtsForm.values()) {
        if (fitter.fit(form) && fitter.fittedAicc() < best) {
          best = fitter.fittedAicc();
          bestForm = form;
        }
      }
      EtsForm chosen = fitter.selectForm();
      String message = "seed " + (MASTER_SEED + 1) + " round " + round;
      assertEquals(bestForm, chosen, message);
      assertEquals(best, fitter.fittedAicc(), 1e-9, message);
      // A strong weekly pattern (amplitude 4 against noise 1) must be seen.
      assertEquals(seasonAmplitude > 0, chosen.seasonal(), message + " chose " + chosen.label());
    }
  }

  @Test
  void shouldComputeAiccFromTheLikelihoodAndParameterCount() {
    double[] y = new double[40];
    SplittableRandom random = new SplittableRandom(MASTER_SEED + 2);
    for (int t = 0; t < y.length; t++) {
      y[t] = 10 + random.nextGaussian();
    }
    EtsFitter fitter = new EtsFitter(7);
    fitter.load(y, y.length);
    assertTrue(fitter.fit(EtsForm.AADA));
    // k = 4 smoothing + level + trend + 6 season states + variance = 13; n = 40 (Hyndman et al. 2008, eq. 7.2).
    double logL = fitter.fittedLogLikelihood();
    assertEquals(-2 * logL + 2 * 13 + 2.0 * 13 * 14 / (40 - 13 - 1), fitter.fittedAicc(), 1e-9);
    assertEquals(3, EtsForm.ANN.criterionParameterCount(7));
    assertEquals(13, EtsForm.AADA.criterionParameterCount(7));
    assertEquals(57, EtsForm.AAA.criterionParameterCount(52));
  }

  @Test
  void shouldFollowTheBaselineRulesForShortEmptyAndLaunchingSeries() {
    EtsFitter fitter = new EtsFitter(7);
    double[] out = new double[3];
    fitter.forecastUnits(new int[] {0, 0, U, 0}, 0, 4, 3, out, 0);
    assertArrayEquals(new double[3], out, "never sold: 0");
    // Nine known values from the first sale (pre-launch zeros and unknown days do not count): their mean, 4.
    int[] shortSeries = {0, 0, 0, 2, 6, U, 4, 4, 2, 6, 4, 4, U, 4};
    fitter.forecastUnits(shortSeries, 0, shortSeries.length, 3, out, 0);
    assertArrayEquals(new double[] {4, 4, 4}, out, 1e-12);
    int[] constant = new int[40];
    Arrays.fill(constant, 3);
    constant[5] = U;
    fitter.forecastUnits(constant, 0, constant.length, 3, out, 0);
    assertArrayEquals(new double[] {3, 3, 3}, out, 1e-12, "every known value equal: that value");
    // Days before firstUsableDay are never read.
    int[] late = {99, 99, 99, 0, 2, 6, 4, 4, 2, 6, 4, 4, 4, 4};
    double[] withEarly = new double[3];
    fitter.forecastUnits(late, 3, late.length, 3, withEarly, 0);
    int[] cleared = late.clone();
    cleared[0] = cleared[1] = cleared[2] = 0;
    double[] without = new double[3];
    fitter.forecastUnits(cleared, 0, cleared.length, 3, without, 0);
    assertArrayEquals(without, withEarly, 1e-12);
  }

  @Test
  void shouldFitOnlyTheLastFiftyTwoSeasonsFromTheFirstSale() {
    SplittableRandom random = new SplittableRandom(MASTER_SEED + 3);
    int[] units = new int[600];
    for (int d = 30; d < units.length; d++) {
      units[d] = random.nextInt(25) == 0 ? U : 5 + random.nextInt(6) + (d % 7 == 5 ? 8 : 0);
    }
    double[] forecast = new double[14];
    new EtsFitter(7).forecastUnits(units, 0, units.length, 14, forecast, 0);
    int[] older = units.clone();
    for (int d = 0; d < units.length - 364; d++) {
      older[d] = 1000;
    }
    double[] forecastOlder = new double[14];
    new EtsFitter(7).forecastUnits(older, 0, older.length, 14, forecastOlder, 0);
    assertArrayEquals(forecast, forecastOlder, 0, "days before the last 364 must not matter");
    EtsFitter direct = new EtsFitter(7);
    double[] window = new double[364];
    for (int t = 0; t < window.length; t++) {
      int u = units[units.length - 364 + t];
      window[t] = u < 0 ? Double.NaN : u;
    }
    direct.load(window, window.length);
    EtsForm form = direct.selectForm();
    assertNotNull(form);
    assertTrue(form.seasonal(), "a weekly peak of 8 units must be seen, chose " + form.label());
    double[] expected = new double[14];
    direct.forecast(14, expected, 0);
    assertArrayEquals(expected, forecast, 1e-12);
  }

  @Test
  void shouldUseAMultiplicativeSeasonOnlyOnPositiveSeries() {
    double[] y = new double[60];
    for (int t = 0; t < y.length; t++) {
      y[t] = 10 + 5 * (t % 7 == 6 ? 1 : 0) + (t % 3);
    }
    EtsFitter fitter = new EtsFitter(7);
    fitter.load(y, y.length);
    assertTrue(fitter.available(EtsForm.MAM));
    y[30] = 0;
    fitter.load(y, y.length);
    assertFalse(fitter.available(EtsForm.MNM));
    assertTrue(fitter.available(EtsForm.AAA));
    assertFalse(new EtsFitter(7).available(EtsForm.ANN), "nothing loaded");
  }

  @Test
  void shouldForecastAHistoryAsSeriesBySeries() {
    SplittableRandom random = new SplittableRandom(MASTER_SEED + 4);
    ArraySalesHistory history = RandomHistories.history(random, 90, false);
    int origin = 80;
    double[][] all = BaselineForecaster.forecastAll(history, origin, 10, BaselineKind.ETS);
    int[] units = new int[origin];
    for (int s = 0; s < history.seriesCount(); s++) {
      history.readUnits(s, 0, units, 0, origin);
      double[] one = BaselineKind.ETS.forecast(units, 0, origin, 10);
      assertArrayEquals(one, all[s], 0, "seed " + (MASTER_SEED + 4) + " series " + s);
      for (double v : one) {
        assertTrue(v >= 0 && Double.isFinite(v), "seed " + (MASTER_SEED + 4) + " series " + s);
      }
    }
  }
}
