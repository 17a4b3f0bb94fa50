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

class HorizonCoverageTest {
  private static final FeatureSpec SPEC = FeatureSpec.builder().horizonDays(7).lagDays(7).rollingWindowDays(7).build();

  @Test
  void shouldRefuseACalendarEndingBeforeTheHorizon() {
    // 30 sales days from 2024-01-01 (last 2024-01-30); the calendar has 36 days (to 2024-02-05); 7 days need 02-06.
    ArraySalesHistory history = history(36, PriceTable.EMPTY);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> HorizonCoverage.check(history,
        SPEC, 7));
    assertEquals("the calendar ends on 2024-02-05 but the forecast needs it through 2024-02-06; append a calendar"
        + " that covers the horizon (lagmill append --store DIR --calendar FILE)", e.getMessage());
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
            + " horizon"), coverage.warnings());
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
