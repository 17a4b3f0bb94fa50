package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.lagmill.features.FeatureSpec.Strategy;
import org.lagmill.store.ArraySalesHistory;

class FeatureSpecValidationTest {
  private static void assertMessage(String expected, Executable executable) {
    assertEquals(expected, assertThrows(IllegalArgumentException.class, executable).getMessage());
  }

  @Test
  void shouldRejectUnknownRollingStatistic() {
    assertMessage("unknown rolling statistic 'median'; allowed: mean, std, min, max, zero_share",
        () -> FeatureSpec.builder().rollingStatNames(List.of("mean", "median")));
  }

  @Test
  void shouldRejectUnknownCalendarPriceAndSeriesFeatures() {
    assertMessage("unknown calendar feature 'quarter'; allowed: day_of_week, day_of_month, month, week_of_year,"
        + " day_of_year", () -> FeatureSpec.builder().calendarFeatureNames(List.of("quarter")));
    assertMessage("unknown price feature 'discount'; allowed: price, price_to_mean, price_to_max, price_change_7,"
        + " promo, price_to_group", () -> FeatureSpec.builder().priceFeatureNames(List.of("discount")));
    assertMessage("unknown series feature 'age'; allowed: days_since_first_sale, zero_run",
        () -> FeatureSpec.builder().seriesFeatureNames(List.of("age")));
    assertMessage("unknown strategy 'hybrid'; allowed: direct, recursive", () -> Strategy.parse("hybrid"));
  }

  @Test
  void shouldRejectLagsAndWindowsBelowOneDay() {
    assertMessage("lag 0 is out of range: it must be >= 1 (days)",
        () -> FeatureSpec.builder().strategy(Strategy.RECURSIVE).lagDays(0, 7).build());
    assertMessage("rolling window -3 is out of range: it must be >= 1 (days)",
        () -> FeatureSpec.builder().rollingWindowDays(7, -3).build());
    assertMessage("horizonDays 0 is out of range: it must be >= 1 (days)",
        () -> FeatureSpec.builder().horizonDays(0).build());
    assertMessage("lag 28 is listed twice; list each once", () -> FeatureSpec.builder().lagDays(28, 28).build());
  }

  @Test
  void shouldExplainTheLeakOfShortLagsInADirectModel() {
    assertMessage("lag 7 is shorter than the horizon of 28 days: a direct model would read units it cannot know when"
        + " forecasting day 8 onward (a leak); use lags >= 28 or set strategy: recursive",
        () -> FeatureSpec.builder().lagDays(7, 28).build());
    assertMessage("rolling shift 14 is shorter than the horizon of 28 days: a direct model would read units it cannot"
        + " know when forecasting day 15 onward (a leak); use rollingShiftDays >= 28 or set strategy: recursive",
        () -> FeatureSpec.builder().rollingShiftDays(14).build());
    assertMessage("lag 28 is shorter than the horizon of 56 days: a direct model would read units it cannot know when"
        + " forecasting day 29 onward (a leak); use lags >= 56 or set strategy: recursive",
        () -> FeatureSpec.defaults().withHorizonDays(56));
  }

  @Test
  void shouldAllowShortLagsWhenRecursive() {
    FeatureSpec spec = FeatureSpec.builder().strategy(Strategy.RECURSIVE).lagDays(1, 7).rollingShiftDays(1).build();
    assertEquals(1, spec.shortestShiftDays());
    assertEquals(7, spec.launchSkipDays());
  }

  @Test
  void shouldLetTheRollingShiftFollowTheHorizonUnlessSet() {
    FeatureSpec spec = FeatureSpec.defaults().withLagDays(35).withHorizonDays(35);
    assertEquals(35, spec.rollingShiftDays());
    assertEquals(40, spec.withRollingShiftDays(40).withHorizonDays(30).rollingShiftDays());
  }

  @Test
  void shouldRejectAnEmptyTrainingWindow() {
    assertMessage("untilDate 2024-01-01 is before fromDate 2024-02-01: the training window would be empty; swap them"
        + " or drop one",
        () -> FeatureSpec.defaults().withTrainingWindow(LocalDate.of(2024, 2, 1), LocalDate.of(2024, 1, 1)));
  }

  @Test
  void shouldRejectWindowsLongerThanTheHistoryAndMissingAttributes() {
    ArraySalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2024, 1, 1), new int[][] {new int[50]});
    assertMessage("rolling window 56 days is longer than the history of 50 days; use windows of at most 50 days",
        () -> FeaturePass.training(history, FeatureSpec.defaults()));
    FeatureSpec spec = FeatureSpec.defaults().toBuilder().rollingWindowDays(7).categoricalAttributes(List.of("brand"))
        .build();
    assertMessage("categorical attribute 'brand' does not exist; the series have: series_id",
        () -> FeaturePass.training(history, spec));
    assertMessage("training days [0, 50] are out of range: need 0 <= firstDayIndex <= lastDayIndex <= 49 (the"
        + " history's last day)",
        () -> FeaturePass.training(history, spec.toBuilder().categoricalAttributes(null)
            .build(), 0, 50));
  }
}
