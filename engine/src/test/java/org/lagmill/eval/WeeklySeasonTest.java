package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.Periods;
import org.lagmill.store.PriceTable;

/** The season length rule and seasonal naive on a weekly history, worked out by hand. */
class WeeklySeasonTest {
  /**
   * 7 days for a daily store (the weekly shopping cycle) and the periods of a 52-week year otherwise: 52 weeks, 26
   * fortnights, 13 four-week periods (a year of 52 weeks is the retail calendar's common practice, no source).
   */
  @Test
  void shouldTakeTheWeekForDailyAndTheYearForLongerPeriods() {
    assertEquals(7, Periods.seasonLength(1));
    assertEquals(52, Periods.seasonLength(7));
    assertEquals(26, Periods.seasonLength(14));
    assertEquals(13, Periods.seasonLength(28));
    assertEquals(182, Periods.seasonLength(2));
  }

  /**
   * Worked by hand: 60 weeks of units u[w] = w (week 0 .. 59), week 30 unknown. Seasonal naive from origin 60
   * forecasts week 60 + k with the week 52 weeks earlier: 8, 9, 10 for k = 0..2, 29 for k = 21; k = 22 would read
   * week 30, which is unknown, and no week lies a season before it, so the naive value (59) is used.
   */
  @Test
  void shouldRepeatTheSameWeekOfTheLastYear() {
    int[] units = new int[60];
    for (int w = 0; w < units.length; w++) {
      units[w] = w;
    }
    units[30] = -1;
    ArraySalesHistory weekly = new ArraySalesHistory(LocalDate.of(2023, 1, 2), Periods.WEEKLY, new int[][] {units},
        ArraySeriesAttributes.of(new String[] {"sku"}, new String[][] {{"tea"}}), PriceTable.EMPTY,
        DayCalendar.EMPTY);
    // Week 0 has no sale (0 units), so the series starts at its first sale, week 1.
    double[][] forecast = BaselineForecaster.forecastAll(weekly, 60, 23, BaselineKind.SEASONAL_NAIVE);
    assertEquals(8.0, forecast[0][0]);
    assertEquals(9.0, forecast[0][1]);
    assertEquals(10.0, forecast[0][2]);
    assertEquals(29.0, forecast[0][21]);
    assertEquals(59.0, forecast[0][22], "week 30 unknown and no week a season before it: the naive value");
    // The daily rule on the same units repeats the last week (season 7): week 60 reads week 53.
    double[] daily = BaselineKind.SEASONAL_NAIVE.forecast(units, 0, 60, 2);
    assertArrayEquals(new double[] {53.0, 54.0}, daily);
  }

  @Test
  void shouldWeightByTheLastHorizonPeriodsOfAWeeklyStore() {
    assertEquals(28, Evaluator.weightDayCount(Periods.DAILY, 14), "a daily store keeps the published 28 days");
    assertEquals(8, Evaluator.weightDayCount(Periods.WEEKLY, 8));
  }
}
