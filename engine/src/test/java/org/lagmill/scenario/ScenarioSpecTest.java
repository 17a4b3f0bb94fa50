package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import org.junit.jupiter.api.Test;

class ScenarioSpecTest {
  private static final LocalDate START = LocalDate.of(2023, 1, 2);

  @Test
  void shouldRejectSeriesCountOutsideRange() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new ScenarioSpec(0, 10, START, 1, 28, false));
    assertEquals("series count must be in [1, 50000000], got 0; hint: ‹series› 600 gives a small demo",
        e.getMessage());
  }

  @Test
  void shouldRejectDayCountOutsideRange() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new ScenarioSpec(5, 0, START, 1, 28, false));
    assertEquals("day count must be in [1, 36600], got 0; hint: ‹days› 730 gives two years of history",
        e.getMessage());
  }

  @Test
  void shouldRejectNegativeFutureDays() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new ScenarioSpec(5, 10, START, 1, -1, false));
    assertEquals("future day count must be in [0, 3660], got -1; hint: use the forecast horizon, e.g. ‹future-days› 28",
        e.getMessage());
  }

  @Test
  void shouldRejectDatesPastTheSupportedYears() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new ScenarioSpec(5, 10, LocalDate.of(2200, 12, 30), 1, 0, false));
    assertEquals("dates must lie in years [1900, 2200], got 2200-12-30 .. 2201-01-08; hint: pick a start date such as "
        + "2023-01-02", e.getMessage());
  }

  @Test
  void shouldRejectWeeklyOutputOfPartWeeks() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new ScenarioSpec(5, 730, START, 1, 28, false, 7));
    assertEquals("weekly output needs whole weeks: ‹days› and ‹future-days› must be multiples of 7, got 730 and 28; "
        + "hint: ‹days› 728 ‹future-days› 28", e.getMessage());
    IllegalArgumentException period = assertThrows(IllegalArgumentException.class,
        () -> new ScenarioSpec(5, 730, START, 1, 28, false, 30));
    assertEquals("period must be 1 (day) or 7 (week) days, got 30; hint: ‹period› day or ‹period› week",
        period.getMessage());
    assertEquals(104, new ScenarioSpec(5, 728, START, 1, 28, false, 7).periodCount());
  }

  @Test
  void shouldCountItemDaysAndCalendarDays() {
    ScenarioSpec spec = new ScenarioSpec(50_000_000, 36_600, LocalDate.of(1900, 1, 1), 1, 3_660, true);
    assertEquals(1_830_000_000_000L, spec.itemDayCount());
    assertEquals(40_260, spec.calendarDayCount());
  }
}
