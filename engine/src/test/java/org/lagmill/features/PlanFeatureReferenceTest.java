package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.RandomPlans;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.PlanTable;
import org.lagmill.store.SalesHistory;

/**
 * The {@code plan_<column>} features of training and prediction rows against the slow raw-row reference of
 * {@link RandomPlans}: keys at every level, both forms, daily and weekly stores, a series with no plan row, rows before
 * the first sale and past the last day (prediction rows reach past it), and a spec that reads a reordered subset of
 * the columns. Each row must read the plan at its own (target) period.
 */
class PlanFeatureReferenceTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);

  @TempDir
  Path temp;

  @Test
  void shouldReadThePlanAtEachRowsOwnPeriod() throws Exception {
    int checkedRows = 0;
    for (int round = 0; round < 30; round++) {
      long seed = MASTER_SEED * 17 + round;
      try {
        checkedRows += checkOne(new SplittableRandom(seed), round);
      } catch (AssertionError | RuntimeException e) {
        throw new AssertionError("seed " + seed + " (round " + round + ", -Dlagmill.seed=" + MASTER_SEED + "): "
            + e.getMessage(), e);
      }
    }
    assertTrue(checkedRows > 1000, "rows checked: " + checkedRows);
  }

  private int checkOne(SplittableRandom random, int round) throws Exception {
    RandomPlans plans = RandomPlans.generate(random, round, 0, temp);
    PlanTable plan = plans.read().plan();
    int seriesCount = plans.series.size();
    int[][] units = new int[seriesCount][plans.dayCount];
    for (int s = 0; s < seriesCount; s++) {
      // Late launches, so plan rows fall before the first sale too; some unknown periods.
      int launch = random.nextInt(plans.dayCount / 2);
      for (int d = 0; d < plans.dayCount; d++) {
        units[s][d] = d < launch ? 0 : random.nextInt(9) == 0 ? SalesHistory.UNKNOWN_UNITS : random.nextInt(6);
      }
    }
    SalesHistory history = new ArraySalesHistory(RandomPlans.FIRST, plans.periodDays, units, plans.attributes,
        org.lagmill.store.PriceTable.EMPTY, org.lagmill.store.DayCalendar.EMPTY).withPlan(plan);
    List<String> columns = new ArrayList<>(List.of(plans.columns));
    if (round % 2 == 1) {
      java.util.Collections.reverse(columns);
      if (columns.size() > 1) {
        columns.remove(columns.size() - 1);
      }
    }
    FeatureSpec spec = FeatureSpec.builder().horizonDays(1).lagDays(1).rollingWindowDays().calendarFeatures(List.of())
        .calendarColumns(false).priceFeatures(List.of()).seriesFeatures(List.of()).categoricalAttributes(List.of())
        .skipPreLaunch(false).planColumns(round % 2 == 1 ? columns : null).build();
    int checked = 0;
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      FeaturePass training = FeaturePass.training(history, spec);
      int futureDays = plans.periodsSpan - plans.dayCount + 4;
      FeaturePass prediction = FeaturePass.prediction(history, spec, null, plans.dayCount - 2, futureDays);
      for (FeaturePass pass : List.of(training, prediction)) {
        List<String> names = pass.schema().names();
        assertEquals("lag_1", names.get(0));
        assertEquals(columns.size(), names.size() - 1, names.toString());
        for (int k = 0; k < columns.size(); k++) {
          assertEquals("plan_" + columns.get(k), names.get(k + 1));
        }
        checked += compare(pass, plans, columns, budget);
      }
      assertEquals(0, budget.heldBytes());
    }
    return checked;
  }

  private static int compare(FeaturePass pass, RandomPlans plans, List<String> columns, MemoryBudget budget) {
    int[] rows = {0};
    // A small batch, so series cross batch and strip boundaries.
    try (FeatureBatch batch = new FeatureBatch(budget, 37, pass.schema().featureCount())) {
      pass.stream(batch, full -> {
        for (int r = 0; r < full.rowCount(); r++) {
          int s = full.seriesIndexes()[r];
          int day = full.dayIndexes()[r];
          for (int k = 0; k < columns.size(); k++) {
            int column = List.of(plans.columns).indexOf(columns.get(k));
            assertEquals(plans.slowValue(s, day, column), full.get(r, k + 1), "series " + s + " period " + day
                + " column " + columns.get(k));
          }
          rows[0]++;
        }
      });
    }
    return rows[0];
  }

  @Test
  void shouldNameAPlanColumnTheStoreLacks() throws Exception {
    RandomPlans plans = RandomPlans.generate(new SplittableRandom(MASTER_SEED), 2, 1, temp);
    PlanTable plan = plans.read().plan();
    int[][] units = new int[plans.series.size()][plans.dayCount];
    ArraySalesHistory bare = new ArraySalesHistory(RandomPlans.FIRST, 1, units, plans.attributes,
        org.lagmill.store.PriceTable.EMPTY, org.lagmill.store.DayCalendar.EMPTY);
    FeatureSpec spec = FeatureSpec.builder().horizonDays(1).lagDays(1).rollingWindowDays()
        .planColumns(List.of("end_cap", "coupon")).build();
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> FeaturePass.prediction(bare.withPlan(plan), spec, null, plans.dayCount, 3));
    assertEquals("the features read plan column 'coupon', which the store's plan does not have (its columns: "
        + String.join(", ", plans.columns)
        + "); append a plan with that column (\u2039append command\u203a \u2039store\u203a DIR \u2039plan\u203a "
        + "FILE) or train again", e.getMessage());
    e = assertThrows(IllegalArgumentException.class, () -> FeaturePass.prediction(bare, spec, null, plans.dayCount,
        3));
    assertEquals("the features read plan columns end_cap, coupon but the store holds no plan; ingest or append one "
        + "with those columns (\u2039append command\u203a \u2039store\u203a DIR \u2039plan\u203a FILE)",
        e.getMessage());
  }
}
