package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArrayPlanTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.PlanTable;
import org.lagmill.store.SalesHistory;

/**
 * A backtest whose plan covers its horizons reads the plan as planned at each target period and no unit after its
 * origin: scrambling every unit after the last origin leaves both origins' forecasts unchanged, while changing the
 * plan inside the last origin's horizon changes that origin's forecasts (and not the earlier origin's, whose horizon
 * ends before the change).
 */
class PlanBacktestLeakTest {
  private static final long SEED = Long.getLong("lagmill.seed", 9_120_734L);
  private static final int HORIZON_DAYS = 7;
  private static final int DAY_COUNT = 190;
  private static final Hierarchy HIERARCHY = Hierarchy.parse(List.of("region>store", "item"));

  @Test
  void shouldReadThePlanAsPlannedAndNoActualAfterTheOrigin() {
    String context = "seed " + SEED;
    ArraySalesHistory base = SmallHistories.history(SEED, 30, DAY_COUNT, 10);
    int[] keyBySeries = new int[base.seriesCount()];
    int itemCount = base.attributes().cardinality(base.attributes().attributeIndex("item"));
    for (int s = 0; s < keyBySeries.length; s++) {
      keyBySeries[s] = base.attributes().code(s, base.attributes().attributeIndex("item"));
    }
    // Promotion windows per item of 3 to 9 days every 10 to 40 days, over the sales days and the calendar's 10 more.
    SplittableRandom random = new SplittableRandom(SEED);
    int[][] changeDays = new int[itemCount][];
    float[][] values = new float[itemCount][];
    for (int item = 0; item < itemCount; item++) {
      List<Integer> days = new ArrayList<>();
      for (int d = random.nextInt(20); d < DAY_COUNT + 10; d += 10 + random.nextInt(30)) {
        days.add(d);
        days.add(d + 3 + random.nextInt(7));
      }
      changeDays[item] = days.stream().mapToInt(Integer::intValue).toArray();
      values[item] = new float[days.size()];
      for (int k = 0; k < days.size(); k += 2) {
        values[item][k] = 1f;
      }
    }
    PlanTable plan = new ArrayPlanTable(List.of("item"), List.of("promo"), keyBySeries, changeDays, values,
        DAY_COUNT + 9);
    // Promotion days sell three times as much, so the model has reason to read the plan.
    int[][] units = new int[base.seriesCount()][DAY_COUNT];
    for (int s = 0; s < units.length; s++) {
      base.readUnits(s, 0, units[s], 0, DAY_COUNT);
      for (int d = 0; d < DAY_COUNT; d++) {
        if (units[s][d] > 0 && plan.valueAt(s, 0, d) > 0) {
          units[s][d] = units[s][d] * 3 + 2;
        }
      }
    }
    ArraySalesHistory history = new ArraySalesHistory(base.firstDate(), units, base.attributes(), base.prices(),
        base.calendar()).withPlan(plan);
    TrainingPlan training = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 20, 0, HORIZON_DAYS, null);
    BacktestSettings settings = new BacktestSettings(2, 10, HORIZON_DAYS, List.of(), HIERARCHY, new double[0]);
    int lastOrigin = settings.originDayIndex(history.dayCount(), 1);
    assertEquals(183, lastOrigin);
    SalesHistory scrambled = SmallHistories.scrambledFrom(history, lastOrigin, SEED + 1).withPlan(plan);
    // The same plan, except that every item is on promotion from the last origin on.
    int[][] promotedDays = new int[itemCount][];
    float[][] promotedValues = new float[itemCount][];
    for (int item = 0; item < itemCount; item++) {
      List<Integer> days = new ArrayList<>();
      List<Float> kept = new ArrayList<>();
      for (int k = 0; k < changeDays[item].length && changeDays[item][k] < lastOrigin; k++) {
        days.add(changeDays[item][k]);
        kept.add(values[item][k]);
      }
      days.add(lastOrigin);
      kept.add(1f);
      promotedDays[item] = days.stream().mapToInt(Integer::intValue).toArray();
      promotedValues[item] = new float[kept.size()];
      for (int k = 0; k < kept.size(); k++) {
        promotedValues[item][k] = kept.get(k);
      }
    }
    SalesHistory replanned = history.withPlan(new ArrayPlanTable(List.of("item"), List.of("promo"), keyBySeries,
        promotedDays, promotedValues, DAY_COUNT + 9));

    Map<Integer, double[][]> original = run(history, training, settings);
    Map<Integer, double[][]> afterScramble = run(scrambled, training, settings);
    Map<Integer, double[][]> afterReplan = run(replanned, training, settings);
    for (int origin : new int[] {173, 183}) {
      for (int s = 0; s < history.seriesCount(); s++) {
        assertArrayEquals(original.get(origin)[s], afterScramble.get(origin)[s], "origin " + origin + ", series " + s
            + ", " + context);
      }
    }
    for (int s = 0; s < history.seriesCount(); s++) {
      assertArrayEquals(original.get(173)[s], afterReplan.get(173)[s], "origin 173 ends before the change, series "
          + s + ", " + context);
    }
    boolean changed = false;
    for (int s = 0; s < history.seriesCount(); s++) {
      changed |= !Arrays.equals(original.get(183)[s], afterReplan.get(183)[s]);
    }
    assertTrue(changed, "a plan changed inside the horizon changes the forecast: " + context);
  }

  private static Map<Integer, double[][]> run(SalesHistory history, TrainingPlan training, BacktestSettings settings) {
    Map<Integer, double[][]> points = new HashMap<>();
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      RollingOriginBacktest.run(history, training, settings, budget, ProgressListener.SILENT,
          (origin, point, alphas) -> points.put(origin, point));
    }
    return points;
  }
}
