package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSpec;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.SalesHistory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;

class ForecasterStrategyTest {
  private static final long SEED = TestSeeds.master(20240611L);
  private static final int HORIZON_DAYS = 7;

  @Test
  void shouldGiveTheSameForecastsDirectAndRecursiveWithALinearPredictor() {
    ArraySalesHistory history = SmallHistories.history(SEED, 30, 160, 20);
    FeatureSpec spec = SmallHistories.spec(HORIZON_DAYS);
    int featureCount = FeaturePass.prediction(history, spec, null, history.dayCount(), 1).schema().featureCount();
    SplittableRandom random = new SplittableRandom(SEED);
    double[] coefficients = new double[featureCount];
    for (int f = 0; f < featureCount; f++) {
      coefficients[f] = random.nextDouble() * 0.2 - 0.05;
    }
    BatchPredictor linear = (batch, out) -> {
      for (int r = 0; r < batch.rowCount(); r++) {
        double sum = 0.5;
        for (int f = 0; f < featureCount; f++) {
          float value = batch.get(r, f);
          sum += Float.isNaN(value) ? 0 : coefficients[f] * value;
        }
        out[r] = sum;
      }
    };
    assertSameBothWays(history, spec, linear, "linear, seed " + SEED);
  }

  @Test
  void shouldGiveTheSameForecastsDirectAndRecursiveWithATrainedModel() {
    ArraySalesHistory history = SmallHistories.history(SEED + 1, 30, 200, 20);
    FeatureSpec spec = SmallHistories.spec(HORIZON_DAYS);
    TrainingPlan plan = SmallHistories.plan(spec, 8, history.dayCount() - 1, HORIZON_DAYS, null);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet models = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      double[][] direct = Forecaster.forecast(models, history, HORIZON_DAYS, budget);
      double[][] recursive = new double[history.seriesCount()][HORIZON_DAYS];
      ModelSet.Partition only = models.partitions().get(0);
      Forecaster.forecastRecursive(history, spec, only.model()::predict, only.seriesIndexes(), HORIZON_DAYS, budget,
          recursive);
      double spread = 0;
      for (int s = 0; s < direct.length; s++) {
        assertArrayEquals(direct[s], recursive[s], "series " + s + ", seed " + (SEED + 1));
        spread += Math.abs(direct[s][0] - direct[0][0]);
      }
      assertTrue(spread > 0, "a model forecasting every series alike proves nothing; seed " + (SEED + 1));
    }
  }

  @Test
  void shouldFeedEachRoundedForecastToTheNextDaysLag() {
    // lag_1 + 1.6 forecasts last + 1.6, then (rounded) last + 2 + 1.6, ...; an unknown last day reads NaN, which
    // forecasts 0, then 1.6, 2 + 1.6, ...
    int[][] units = {{2, 0, 5, 3}, {1, 1, 4, SalesHistory.UNKNOWN_UNITS}, {0, 0, 0, 0}};
    ArraySalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2023, 1, 2), units);
    FeatureSpec spec = lagOneOnly(5);
    assertEquals(List.of("lag_1"), FeaturePass.prediction(history, spec, null, 4, 1).schema().names());
    BatchPredictor plusOne = (batch, out) -> {
      for (int r = 0; r < batch.rowCount(); r++) {
        out[r] = batch.get(r, 0) + 1.6;
      }
    };
    double[][] out = new double[3][5];
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Forecaster.forecast(history, spec, plusOne, new int[] {0, 1, 2}, 5, budget, out);
    }
    // Each day's forecast is x + 1.6 where x is the previous day's forecast rounded (not truncated) to whole units.
    assertArrayEquals(new double[] {4.6, 6.6, 8.6, 10.6, 12.6}, out[0], 1e-6);
    assertArrayEquals(new double[] {0, 1.6, 3.6, 5.6, 7.6}, out[1], 1e-6);
    // A series that never sold has no readable day, and a forecast day never counts as its launch.
    assertArrayEquals(new double[5], out[2], 1e-6);
  }

  @Test
  void shouldNeverForecastNegativeUnits() {
    ArraySalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2023, 1, 2), new int[][] {{3, 4, 5}, {0, 1,
        0}});
    BatchPredictor negative = (batch, out) -> {
      for (int r = 0; r < batch.rowCount(); r++) {
        out[r] = r % 2 == 0 ? -7.5 : Double.NaN;
      }
    };
    double[][] recursive = new double[2][4];
    double[][] direct = new double[2][1];
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Forecaster.forecast(history, lagOneOnly(4), negative, new int[] {0, 1}, 4, budget, recursive);
      Forecaster.forecast(history, lagOneOnly(1).withStrategy(FeatureSpec.Strategy.DIRECT), negative,
          new int[] {0, 1}, 1, budget, direct);
    }
    assertArrayEquals(new double[4], recursive[0]);
    assertArrayEquals(new double[4], recursive[1]);
    assertArrayEquals(new double[] {0}, direct[0]);
    assertArrayEquals(new double[] {0}, direct[1]);
  }

  @Test
  void shouldRefuseADirectForecastLongerThanTheShortestLag() {
    ArraySalesHistory history = SmallHistories.history(SEED, 6, 60, 30);
    FeatureSpec spec = SmallHistories.spec(HORIZON_DAYS);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Forecaster.forecast(history,
          spec, (batch, out) -> {}, new int[] {0}, 14, budget, new double[6][14]));
      assertEquals("a direct forecast of 14 days needs every lag and rolling shift >= 14, the shortest is 7; use"
          + " strategy: recursive or a shorter horizon", e.getMessage());
    }
  }

  /** Compares {@link Forecaster#forecast} (direct) with {@link Forecaster#forecastRecursive} on every series. */
  private static void assertSameBothWays(SalesHistory history, FeatureSpec spec, BatchPredictor predictor,
      String context) {
    int[] all = new int[history.seriesCount()];
    for (int s = 0; s < all.length; s++) {
      all[s] = s;
    }
    double[][] direct = new double[all.length][HORIZON_DAYS];
    double[][] recursive = new double[all.length][HORIZON_DAYS];
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Forecaster.forecast(history, spec, predictor, all, HORIZON_DAYS, budget, direct);
      Forecaster.forecastRecursive(history, spec, predictor, all, HORIZON_DAYS, budget, recursive);
    }
    boolean varied = false;
    for (int s = 0; s < all.length; s++) {
      assertArrayEquals(direct[s], recursive[s], "series " + s + ", " + context);
      for (int d = 1; d < HORIZON_DAYS; d++) {
        varied |= direct[s][d] != direct[s][0];
      }
    }
    assertTrue(varied, "forecasts that never change over the horizon prove nothing; " + context);
  }

  private static FeatureSpec lagOneOnly(int horizonDays) {
    return FeatureSpec.builder().horizonDays(horizonDays).strategy(FeatureSpec.Strategy.RECURSIVE).lagDays(1)
        .rollingWindowDays().calendarFeatures(List.of()).calendarColumns(false).priceFeatures(List.of())
        .categoricalAttributes(List.of()).seriesFeatures(List.of()).build();
  }
}
