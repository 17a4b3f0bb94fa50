package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.LocalDate;
import java.time.temporal.IsoFields;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.Periods;
import org.lagmill.store.PriceTable;

/** Date features of a weekly store read each week's first date; day_of_week, constant there, is left out. */
class WeeklyCalendarFeaturesTest {
  @Test
  void shouldReadWeekOfYearFromEachWeeksFirstDateAndLeaveOutTheConstantWeekday() {
    int weeks = 70;
    int[] units = new int[weeks];
    for (int w = 0; w < weeks; w++) {
      units[w] = 1 + w % 3;
    }
    LocalDate first = LocalDate.of(2023, 12, 25);
    ArraySalesHistory history = new ArraySalesHistory(first, Periods.WEEKLY, new int[][] {units},
        ArraySeriesAttributes.of(new String[] {"sku"}, new String[][] {{"tea"}}), PriceTable.EMPTY,
        DayCalendar.EMPTY);
    FeatureSpec spec = FeatureSpec.builder().horizonDays(4).lagDays(4).rollingWindowDays(4).rollingStatNames(
        List.of("mean")).calendarFeatureNames(List.of("day_of_week", "week_of_year", "month")).seriesFeatures(
            List.of())
        .categoricalAttributes(List.of()).skipPreLaunch(false).build();
    FeaturePass pass = FeaturePass.training(history, spec);
    List<String> names = pass.schema().names();
    assertEquals(List.of("lag_4", "roll_mean_4_shift_4", "week_of_year", "month"), names);
    StreamedRows rows = StreamedRows.of(pass, 16);
    for (StreamedRows.Row row : rows.rows) {
      // Expected from java.time's own ISO week field (an outside implementation of ISO-8601), not our formula.
      LocalDate weekStart = first.plusDays(7L * row.dayIndex());
      assertEquals(weekStart.get(IsoFields.WEEK_OF_WEEK_BASED_YEAR), row.values()[2], 0f, "week " + row.dayIndex());
      assertEquals(weekStart.getMonthValue(), row.values()[3], 0f, "week " + row.dayIndex());
    }
    assertEquals(weeks, rows.rows.size());
  }
}
