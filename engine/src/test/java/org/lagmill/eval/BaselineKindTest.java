package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArraySalesHistory;

class BaselineKindTest {
  private static final long SEED = TestSeeds.master(0xba5e_11e5L);
  private static final int U = -1;

  /** Known days from the first sale in [from, origin), as {day, units} pairs. */
  private static List<int[]> knownFromFirstSale(int[] units, int from, int origin) {
    List<int[]> known = new ArrayList<>();
    for (int d = from; d < origin; d++) {
      if (units[d] > 0 || (!known.isEmpty() && units[d] == 0)) {
        known.add(new int[] {d, units[d]});
      }
    }
    return known;
  }

  /** Slow references, written from the definitions in docs/metrics.md without the kernels' loops. */
  private static double[] reference(BaselineKind kind, int[] units, int from, int origin, int horizon) {
    List<int[]> known = knownFromFirstSale(units, from, origin);
    double[] out = new double[horizon];
    if (known.isEmpty()) {
      return out;
    }
    double naive = known.get(known.size() - 1)[1];
    switch (kind) {
      case NAIVE -> Arrays.fill(out, naive);
      case SEASONAL_NAIVE -> {
        for (int k = 0; k < horizon; k++) {
          int weekday = (origin + k) % 7;
          double value = naive;
          for (int[] day : known) {
            if (day[0] % 7 == weekday) {
              value = day[1];
            }
          }
          out[k] = value;
        }
      }
      case MOVING_AVERAGE -> Arrays.fill(out, known.stream().filter(d -> d[0] >= origin - 28)
          .mapToInt(d -> d[1]).average().orElse(0));
      case SES -> {
        double bestError = Double.MAX_VALUE;
        double best = 0;
        for (double alpha : new double[] {0.05, 0.1, 0.2, 0.3, 0.5}) {
          double[] level = new double[known.size()];
          level[0] = known.get(0)[1];
          double error = 0;
          for (int i = 1; i < known.size(); i++) {
            error += Math.pow(known.get(i)[1] - level[i - 1], 2);
            level[i] = alpha * known.get(i)[1] + (1 - alpha) * level[i - 1];
          }
          if (error < bestError) {
            bestError = error;
            best = level[known.size() - 1];
          }
        }
        Arrays.fill(out, best);
      }
      case CROSTON, SBA -> {
        // Intervals counted in known days: positions in the known list between successive sales.
        double size = known.get(0)[1];
        double interval = 1;
        int lastSalePosition = 0;
        for (int i = 1; i < known.size(); i++) {
          if (known.get(i)[1] > 0) {
            size = 0.9 * size + 0.1 * known.get(i)[1];
            interval = 0.9 * interval + 0.1 * (i - lastSalePosition);
            lastSalePosition = i;
          }
        }
        Arrays.fill(out, (kind == BaselineKind.SBA ? 0.95 : 1) * size / interval);
      }
    }
    return out;
  }

  @Test
  void shouldMatchSlowReferencesOnRandomSeries() {
    SplittableRandom random = new SplittableRandom(SEED);
    for (int round = 0; round < 2000; round++) {
      int length = 1 + random.nextInt(70);
      int[] units = new int[length];
      int launch = random.nextInt(length + 1);
      double saleChance = 0.1 + random.nextDouble() * 0.8;
      for (int d = 0; d < length; d++) {
        units[d] = random.nextInt(12) == 0 ? U : d < launch ? 0 : random.nextDouble() < saleChance
            ? 1 + random.nextInt(9) : 0;
      }
      int origin = random.nextInt(length + 1);
      int from = random.nextInt(origin + 1);
      int horizon = random.nextInt(30);
      for (BaselineKind kind : BaselineKind.values()) {
        if (kind == BaselineKind.ETS) {
          continue; // EtsFitterTest checks it against its own slow reference, EtsExternalCheckTest against statsmodels
        }
        double[] actual = kind.forecast(units, from, origin, horizon);
        String message = "seed " + SEED + " round " + round + " " + kind + " " + Arrays.toString(units) + " from "
            + from + " origin " + origin;
        assertArrayEquals(reference(kind, units, from, origin, horizon), actual, 1e-9, message);
        for (double v : actual) {
          assertTrue(v >= 0, message);
        }
      }
    }
  }

  @Test
  void shouldForecastHandWorkedCases() {
    int[] units = {0, 0, 3, U};
    assertArrayEquals(new double[] {3, 3}, BaselineKind.NAIVE.forecast(units, 0, 4, 2));
    // Shorter than the 28-day window, pre-launch zero skipped, unknown skipped: (2 + 4 + 6) / 3.
    assertArrayEquals(new double[] {4}, BaselineKind.MOVING_AVERAGE.forecast(new int[] {0, 2, 4, U, 6}, 0, 5, 1));
    // Weekdays of days 0..9 with origin 10: day 10 -> day 3, day 11 -> day 4 (unknown, then no earlier week, falls
    // back to the naive value 9), day 16 -> day 9, day 17 -> day 3 again.
    int[] weekly = {1, 2, 3, 4, U, 6, 7, 8, 1, 9};
    double[] seasonal = BaselineKind.SEASONAL_NAIVE.forecast(weekly, 0, 10, 8);
    assertArrayEquals(new double[] {4, 9, 6, 7, 8, 1, 9, 4}, seasonal);
    // SES on 2, 4: every alpha has squared error 4, the tie goes to alpha 0.05: 2 + 0.05 x 2 = 2.1.
    assertArrayEquals(new double[] {2.1}, BaselineKind.SES.forecast(new int[] {0, 2, 4}, 0, 3, 1), 1e-12);
    // Croston on 0, 3, 0, 0, 6: size 3 -> 3 + 0.1 x 3 = 3.3; interval 1 -> 1 + 0.1 x (3 - 1) = 1.2; 3.3 / 1.2 = 2.75;
    // SBA multiplies by 1 - 0.1 / 2 = 0.95: 2.6125 (Syntetos & Boylan 2005, IJF 21(2)).
    int[] intermittent = {0, 3, 0, 0, 6};
    assertArrayEquals(new double[] {2.75}, BaselineKind.CROSTON.forecast(intermittent, 0, 5, 1), 1e-12);
    assertArrayEquals(new double[] {2.6125}, BaselineKind.SBA.forecast(intermittent, 0, 5, 1), 1e-12);
  }

  @Test
  void shouldForecastZeroForSeriesThatNeverSold() {
    for (BaselineKind kind : BaselineKind.values()) {
      assertArrayEquals(new double[3], kind.forecast(new int[] {0, U, 0, U}, 0, 4, 3), kind.name());
      assertArrayEquals(new double[2], kind.forecast(new int[] {5, 5}, 0, 0, 2), kind.name());
    }
  }

  @Test
  void shouldForecastEverySeriesOfAHistoryUpToTheLastDay() {
    SplittableRandom random = new SplittableRandom(SEED);
    ArraySalesHistory history = RandomHistories.history(random, 50, false);
    int origin = history.dayCount();
    for (BaselineKind kind : BaselineKind.values()) {
      if (kind == BaselineKind.ETS) {
        continue; // EtsFitterTest.shouldForecastAHistoryAsSeriesBySeries
      }
      double[][] all = BaselineForecaster.forecastAll(history, origin, 7, kind);
      for (int s = 0; s < history.seriesCount(); s++) {
        int[] units = new int[origin];
        history.readUnits(s, 0, units, 0, origin);
        assertArrayEquals(reference(kind, units, 0, origin, 7), all[s], 1e-9, "seed " + SEED + " " + kind + " " + s);
      }
    }
    assertThrows(IllegalArgumentException.class,
        () -> BaselineForecaster.forecastAll(ArraySalesHistory.ofUnits(LocalDate.of(2022, 1, 3), new int[][] {{1}}), 2,
            1, BaselineKind.NAIVE));
  }

  @Test
  void shouldRejectBadRanges() {
    assertEquals("need 0 <= firstUsableDay (3) <= originDay (2) <= units.length (4)", assertThrows(
        IllegalArgumentException.class, () -> BaselineKind.NAIVE.forecast(new int[4], 3, 2, 1)).getMessage());
  }
}
