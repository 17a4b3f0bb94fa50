package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.TruncatedHistory;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;

/**
 * Nothing a backtest origin produces depends on a unit at or after that origin: scrambling every such unit leaves the
 * model's forecasts and dispersions, every baseline, and the origin's scales and weights unchanged.
 */
class BacktestLeakTest {
  private static final long SEED = TestSeeds.master(9_120_733L);
  private static final int HORIZON_DAYS = 7;
  private static final Hierarchy HIERARCHY = Hierarchy.parse(List.of("region>store", "item"));

  @Test
  void shouldProduceTheSameOriginWhateverFollowsIt() {
    ArraySalesHistory history = SmallHistories.history(SEED, 30, 190, 10);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 6, 0, HORIZON_DAYS, null)
        .withRefit(true);
    BacktestSettings settings = new BacktestSettings(2, 10, HORIZON_DAYS, List.of(BaselineKind.values()), HIERARCHY,
        new double[] {0.25, 0.5, 0.75});
    int lastOrigin = settings.originDayIndex(history.dayCount(), 1);
    assertEquals(183, lastOrigin);
    ArraySalesHistory scrambled = SmallHistories.scrambledFrom(history, lastOrigin, SEED + 1);
    Map<Integer, double[][]> originalPoints = new HashMap<>();
    Map<Integer, float[]> originalAlphas = new HashMap<>();
    Map<Integer, double[][]> scrambledPoints = new HashMap<>();
    Map<Integer, float[]> scrambledAlphas = new HashMap<>();
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      BacktestResult first = RollingOriginBacktest.run(history, plan, settings, budget, ProgressListener.SILENT,
          (origin, point, alphas) -> {
            originalPoints.put(origin, point);
            originalAlphas.put(origin, alphas);
          });
      RollingOriginBacktest.run(scrambled, plan, settings, budget, ProgressListener.SILENT,
          (origin, point, alphas) -> {
            scrambledPoints.put(origin, point);
            scrambledAlphas.put(origin, alphas);
          });
      assertEquals(List.of(173, 183), first.origins().stream().map(BacktestResult.OriginResult::originDayIndex)
          .toList());
    }
    for (int origin : new int[] {173, 183}) {
      String context = "origin " + origin + ", seed " + SEED;
      for (int s = 0; s < history.seriesCount(); s++) {
        assertArrayEquals(originalPoints.get(origin)[s], scrambledPoints.get(origin)[s],
            "series " + s + ", " + context);
      }
      assertArrayEquals(originalAlphas.get(origin), scrambledAlphas.get(origin), context);
      for (BaselineKind kind : BaselineKind.values()) {
        double[][] expected = BaselineForecaster.forecastAll(new TruncatedHistory(history, origin), origin,
            HORIZON_DAYS, kind);
        double[][] actual = BaselineForecaster.forecastAll(new TruncatedHistory(scrambled, origin), origin,
            HORIZON_DAYS, kind);
        for (int s = 0; s < expected.length; s++) {
          assertArrayEquals(expected[s], actual[s], kind + " series " + s + ", " + context);
        }
      }
      OriginStatistics expected = new Evaluator(history, HIERARCHY).statistics(origin);
      OriginStatistics actual = new Evaluator(scrambled, HIERARCHY).statistics(origin);
      for (int level = 0; level < expected.levelCount(); level++) {
        assertArrayEquals(expected.squaredScales(level), actual.squaredScales(level), "level " + level + context);
        assertArrayEquals(expected.absoluteScales(level), actual.absoluteScales(level), "level " + level + context);
        assertArrayEquals(expected.weights(level), actual.weights(level), "level " + level + context);
      }
    }
  }

  @Test
  void shouldPlaceTheLastOriginOneHorizonBeforeTheEndAndStepBack() {
    BacktestSettings settings = new BacktestSettings(3, 14, 28, List.of(), HIERARCHY, new double[0]);
    assertEquals(1000 - 28, settings.originDayIndex(1000, 2));
    assertEquals(1000 - 28 - 14, settings.originDayIndex(1000, 1));
    assertEquals(1000 - 28 - 28, settings.originDayIndex(1000, 0));
  }

  @Test
  void shouldRefuseAHistoryTooShortForTheEarliestOrigin() {
    ArraySalesHistory history = SmallHistories.history(SEED, 6, 60, 10);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 3, 0, HORIZON_DAYS, null);
    // launchSkipDays = the longest lag, 21 days; 60 - 7 - 3 * 10 = 23 is the earliest origin.
    BacktestSettings settings = new BacktestSettings(4, 10, HORIZON_DAYS, List.of(), HIERARCHY, new double[0]);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> RollingOriginBacktest.run(
          history, plan, settings, budget, ProgressListener.SILENT, null));
      assertEquals("the earliest origin (day 23, 2023-01-18) leaves too little history to train: it needs more than"
          + " 28 days before it; use fewer origins or a smaller step", e.getMessage());
    }
  }
}
