package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;

/** Members scored on the same origins; the combination is the plain mean of their forecasts, scored the same way. */
class CombinedBacktestTest {
  private static final long SEED = Long.getLong("lagmill.seed", 20240611L);
  private static final int HORIZON_DAYS = 7;
  private static final Hierarchy HIERARCHY = Hierarchy.parse(List.of("region>store", "item"));

  @Test
  void shouldScoreEachMemberAndTheMeanOfTheirForecastsOnTheSameOrigins() {
    ArraySalesHistory history = SmallHistories.history(SEED, 24, 190, 10);
    TrainingPlan pooled = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 6, 0, HORIZON_DAYS, null)
        .withRefit(true);
    TrainingPlan perStore = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 6, 0, HORIZON_DAYS, "store");
    BacktestSettings settings = new BacktestSettings(2, 10, HORIZON_DAYS, List.of(BaselineKind.SEASONAL_NAIVE),
        HIERARCHY, new double[0]);
    Map<String, double[][]> forecasts = new HashMap<>();
    CombinedBacktestResult result;
    BacktestResult pooledAlone;
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      result = RollingOriginBacktest.runMembers(history, List.of("pooled", "per store"), List.of(pooled, perStore),
          settings, budget, ProgressListener.SILENT,
          (member, origin, point, dispersion) -> forecasts.put(member + "@" + origin, point));
      pooledAlone = RollingOriginBacktest.run(history, pooled, settings, budget, ProgressListener.SILENT, null);
    }
    Evaluator evaluator = new Evaluator(history, HIERARCHY);
    for (int k = 0; k < 2; k++) {
      int origin = settings.originDayIndex(history.dayCount(), k);
      double[][] first = forecasts.get("0@" + origin);
      double[][] second = forecasts.get("1@" + origin);
      double[][] combined = forecasts.get("2@" + origin);
      String context = "origin " + origin + ", seed " + SEED;
      boolean differ = false;
      for (int s = 0; s < first.length; s++) {
        double[] mean = new double[HORIZON_DAYS];
        for (int d = 0; d < HORIZON_DAYS; d++) {
          mean[d] = (first[s][d] + second[s][d]) / 2;
          differ |= first[s][d] != second[s][d];
        }
        assertArrayEquals(mean, combined[s], 1e-12, "series " + s + ", " + context);
      }
      assertFalse(!differ, "two identical members prove nothing, " + context);
      double[][] mean = new double[first.length][HORIZON_DAYS];
      for (int s = 0; s < first.length; s++) {
        for (int d = 0; d < HORIZON_DAYS; d++) {
          mean[s][d] = 0.5 * first[s][d] + 0.5 * second[s][d];
        }
      }
      OriginStatistics statistics = evaluator.statistics(origin);
      double expected = evaluator.evaluate(statistics, evaluator.aggregator().aggregateForecasts(
          evaluator.withoutUnknownActuals(mean, origin)), null).wrmsse();
      assertEquals(expected, result.combination().origins().get(k).model().wrmsse(), 1e-12, context);
      assertEquals(pooledAlone.origins().get(k).model().wrmsse(), result.members().get(0).origins().get(k).model()
          .wrmsse(), 0, "a member scores as its own backtest does, " + context);
      assertEquals(result.members().get(0).origins().get(k).baselines().get("SEASONAL_NAIVE").wrmsse(),
          result.combination().origins().get(k).baselines().get("SEASONAL_NAIVE").wrmsse(), 0, context);
    }
    double best = Math.min(result.combination().meanModelWrmsse(), Math.min(result.members().get(0)
        .meanModelWrmsse(), result.members().get(1).meanModelWrmsse()));
    assertEquals(best, result.chosen().meanModelWrmsse(), 0);
  }

  @Test
  void shouldRejectMembersWithoutNames() {
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 6, 0, HORIZON_DAYS, null);
    BacktestSettings settings = new BacktestSettings(1, 10, HORIZON_DAYS, List.of(), HIERARCHY, new double[0]);
    assertEquals("need one name per member and at least one member, got 1 names for 2 plans", assertThrows(
        IllegalArgumentException.class, () -> RollingOriginBacktest.runMembers(SmallHistories.history(SEED, 4, 100, 0),
            List.of("a"), List.of(plan, plan), settings, null, ProgressListener.SILENT, null))
        .getMessage());
  }
}
