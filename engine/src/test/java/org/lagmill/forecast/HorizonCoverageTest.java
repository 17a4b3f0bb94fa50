package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.features.FeatureSpec;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.PriceTable;
import org.lagmill.store.ArrayPlanTable;
import org.lagmill.store.PlanTable;

class HorizonCoverageTest {
  private static final FeatureSpec SPEC = FeatureSpec.builder().horizonDays(7).lagDays(7).rollingWindowDays(7).build();

  @Test
  void shouldRefuseACalendarEndingBeforeTheHorizon() {
    // 30 sales days from 2024-01-01 (last 2024-01-30); the calendar has 36 days (to 2024-02-05); 7 days need 02-06.
    ArraySalesHistory history = history(36, PriceTable.EMPTY);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> HorizonCoverage.check(history,
        SPEC, 7));
    assertEquals("the calendar ends on 2024-02-05 but the forecast needs it through 2024-02-06; append a calendar"
        + " that covers the horizon (\u2039append command\u203a \u2039store\u203a DIR \u2039calendar\u203a FILE)",
        e.getMessage());
    assertEquals(List.of(), HorizonCoverage.check(history, SPEC, 6).warnings());
    assertEquals(List.of(), HorizonCoverage.check(history, SPEC.toBuilder().calendarColumns(false).build(), 7)
        .warnings(), "a spec without calendar columns does not need the calendar");
  }

  @Test
  void shouldCountSeriesWithoutPricesAndWithStalePrices() {
    // dayCount 30: a last change before day 23 is stale; one on day 23 or later (or in the horizon) is not.
    int[][] days = {{0, 22}, {}, {0, 23}, {5, 40}, {}, {10}};
    float[][] prices = {{1f, 2f}, {}, {1f, 1.5f}, {2f, 2.5f}, {}, {3f}};
    HorizonCoverage coverage = HorizonCoverage.check(history(40, new ArrayPriceTable(days, prices)), SPEC, 7);
    assertEquals(2, coverage.seriesWithoutPriceCount());
    assertEquals(2, coverage.seriesWithStalePriceCount());
    assertEquals(List.of("2 series have no price at all: their price features are missing",
        "2 series have no price set in the last week or the horizon: their last price is carried forward over the"
            + " horizon"),
        coverage.warnings());
  }

  /**
   * Hand-worked: 30 sales days from 2024-01-01; a plan keyed by series_id for s1 and s3 only, reaching day 33
   * (2024-02-03). A 4-day horizon (through day 33) is covered; 7 days (through 02-06) are not: s1 is the first series
   * with plan rows and has none from 02-04. Carrying forward counts 2 series × 3 days.
   */
  @Test
  void shouldRequireThePlanToReachTheHorizonOrCountWhatIsCarried() {
    int[] keyBySeries = {PlanTable.NO_KEY, 0, PlanTable.NO_KEY, 1, PlanTable.NO_KEY, PlanTable.NO_KEY};
    PlanTable plan = new ArrayPlanTable(List.of("series_id"), List.of("promo"), keyBySeries,
        new int[][] {{3, 33}, {10}}, new float[][] {{1f, 0f}, {1f}}, 33);
    ArraySalesHistory history = history(60, PriceTable.EMPTY).withPlan(plan);
    assertEquals(0, HorizonCoverage.check(history, SPEC, 4).planCarriedSeriesPeriods());
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> HorizonCoverage.check(history,
        SPEC, 7));
    assertEquals("the plan ends on 2024-02-03 but the forecast needs it through 2024-02-06: series_id=s1 has no plan"
        + " from 2024-02-04 (nor has any other series with plan rows); append a plan that reaches the horizon's end"
        + " (\u2039append command\u203a \u2039store\u203a DIR \u2039plan\u203a FILE) or forecast with"
        + " \u2039plan-carry-forward\u203a to carry each key's last"
        + " values forward", e.getMessage());
    HorizonCoverage carried = HorizonCoverage.check(history, SPEC, 7, true);
    assertEquals(6, carried.planCarriedSeriesPeriods());
    assertEquals(List.of("plan values carried forward for 6 series-days: the plan ends on 2024-02-03, so 2 series "
        + "with plan rows read their last plan values over the last 3 days of the horizon"), carried.warnings());
    assertEquals(0, HorizonCoverage.check(history, SPEC.toBuilder().planColumns(List.of()).build(), 7)
        .planCarriedSeriesPeriods(), "a model that reads no plan column needs no plan");
    e = assertThrows(IllegalArgumentException.class, () -> HorizonCoverage.check(history, SPEC.toBuilder()
        .planColumns(List.of("display")).build(), 4));
    assertEquals("the features read plan column 'display', which the store's plan does not have (its columns: "
        + "promo); append a plan with that column (\u2039append command\u203a \u2039store\u203a DIR"
        + " \u2039plan\u203a FILE) or train again",
        e.getMessage());
  }

  private static ArraySalesHistory history(int calendarDays, PriceTable prices) {
    int[][] units = new int[6][30];
    String[][] ids = new String[6][];
    for (int s = 0; s < 6; s++) {
      ids[s] = new String[] {"s" + s};
      units[s][s] = 1;
    }
    DayCalendar calendar = new ArrayDayCalendar(calendarDays, List.of(new ArrayDayCalendar.Column("event",
        DayCalendar.ColumnKind.NUMERIC, null, null, new float[][] {new float[calendarDays]})));
    return new ArraySalesHistory(LocalDate.of(2024, 1, 1), units, ArraySeriesAttributes.of(new String[] {"series_id"},
        ids), prices, calendar);
  }
}
