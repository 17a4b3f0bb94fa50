package org.lagmill.forecast;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.features.FeatureSpec;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.SalesHistory;

/**
 * Checks that the calendar and prices reach over the forecast horizon before forecasting. A calendar that stops short
 * is an error (its features would silently turn missing); a series whose last price was set before the horizon keeps
 * it (prices hold until changed), which is counted and reported, since next month's promotions may be missing.
 */
public record HorizonCoverage(int seriesWithoutPriceCount, int seriesWithStalePriceCount, List<String> warnings) {

  public static HorizonCoverage check(SalesHistory history, FeatureSpec spec, int horizonDays) {
    int lastDay = history.dayCount() + horizonDays - 1;
    if (spec.calendarColumns() && history.calendar().columnCount() > 0 && history.calendar().dayCount() <= lastDay) {
      throw new InvalidRequestException("the calendar ends on " + history.dateOf(history.calendar().dayCount() - 1)
          + " but the forecast needs it through " + history.dateOf(lastDay) + "; append a calendar that covers the"
          + " horizon (lagmill append --store DIR --calendar FILE)");
    }
    // The last week in periods: 7 days, 1 week, at least one period of any longer step.
    int lastWeekPeriods = Math.max(1, 7 / history.periodDays());
    int withoutPrice = 0;
    int stale = 0;
    if (!history.prices().isEmpty()) {
      for (int s = 0; s < history.seriesCount(); s++) {
        int changes = history.prices().changeCount(s);
        if (changes == 0) {
          withoutPrice++;
        } else if (history.prices().changeDayIndex(s, changes - 1) < history.dayCount() - lastWeekPeriods) {
          stale++;
        }
      }
    }
    List<String> warnings = new ArrayList<>();
    if (withoutPrice > 0) {
      warnings.add(withoutPrice + " series have no price at all: their price features are missing");
    }
    if (stale > 0) {
      warnings.add(stale + " series have no price set in the last week or the horizon: their last price is carried"
          + " forward over the horizon");
    }
    return new HorizonCoverage(withoutPrice, stale, warnings);
  }
}
