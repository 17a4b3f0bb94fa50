package org.lagmill.forecast;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.PlanColumns;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.store.Periods;
import org.lagmill.store.PlanTable;
import org.lagmill.store.SalesHistory;

/**
 * Checks that the calendar, prices and plan reach over the forecast horizon before forecasting. A calendar that stops
 * short is an error (its features would silently turn missing); a series whose last price was set before the horizon
 * keeps it (prices hold until changed), which is counted and reported, since next month's promotions may be missing.
 *
 * <p>Plan coverage: the plan speaks for the periods up to its reach (the period of its file's latest date,
 * {@link PlanTable#reachDayIndex()}). When the model reads plan columns and a series with plan rows would read a
 * horizon period past the reach, the forecast stops, naming that series' key and the first uncovered date, unless
 * {@code planCarryForward} is set: each key's last values then hold over the rest of the horizon, and the
 * carried series-periods are counted. Series no plan row matched read 0 (nothing planned) and need no coverage.
 *
 * @param planCarriedSeriesPeriods series with plan rows × horizon periods past the plan's reach, read with their last
 *     plan values carried forward (0 unless carrying forward was allowed)
 */
public record HorizonCoverage(int seriesWithoutPriceCount, int seriesWithStalePriceCount,
    long planCarriedSeriesPeriods, List<String> warnings) {

  /** As {@link #check(SalesHistory, FeatureSpec, int, boolean)}, refusing a plan that stops short. */
  public static HorizonCoverage check(SalesHistory history, FeatureSpec spec, int horizonDays) {
    return check(history, spec, horizonDays, false);
  }

  /**
   * @param planCarryForward allow the horizon to pass the plan's reach, carrying each key's last values forward
   * @throws IllegalArgumentException when the calendar stops short, the store lacks a plan column the spec reads, or
   *     the plan stops short and carrying forward was not allowed
   */
  public static HorizonCoverage check(SalesHistory history, FeatureSpec spec, int horizonDays,
      boolean planCarryForward) {
    int lastDay = history.dayCount() + horizonDays - 1;
    if (spec.calendarColumns() && history.calendar().columnCount() > 0 && history.calendar().dayCount() <= lastDay) {
      throw new InvalidRequestException("the calendar ends on " + history.dateOf(history.calendar().dayCount() - 1)
          + " but the forecast needs it through " + history.dateOf(lastDay) + "; append a calendar that covers the"
          + " horizon (" + Setting.Command.APPEND + " " + Setting.STORE + " DIR " + Setting.CALENDAR + " FILE)");
    }
    List<String> warnings = new ArrayList<>();
    long carried = checkPlan(history, spec, lastDay, planCarryForward, warnings);
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
    if (withoutPrice > 0) {
      warnings.add(withoutPrice + " series have no price at all: their price features are missing");
    }
    if (stale > 0) {
      warnings.add(stale + " series have no price set in the last week or the horizon: their last price is carried"
          + " forward over the horizon");
    }
    return new HorizonCoverage(withoutPrice, stale, carried, warnings);
  }

  private static long checkPlan(SalesHistory history, FeatureSpec spec, int lastDay, boolean carryForward,
      List<String> warnings) {
    PlanTable plan = history.plan();
    List<String> columns = PlanColumns.of(spec, plan);
    if (columns.isEmpty()) {
      return 0;
    }
    PlanColumns.indexesIn(plan, columns);
    int reach = plan.reachDayIndex();
    if (reach >= lastDay) {
      return 0;
    }
    int firstPlanned = -1;
    long seriesWithPlan = 0;
    for (int s = 0; s < history.seriesCount(); s++) {
      if (plan.keyOf(s) != PlanTable.NO_KEY) {
        seriesWithPlan++;
        if (firstPlanned < 0) {
          firstPlanned = s;
        }
      }
    }
    if (firstPlanned < 0) {
      return 0;
    }
    int firstUncovered = Math.max(reach + 1, history.dayCount());
    int uncoveredPeriods = lastDay - firstUncovered + 1;
    String ends = reachText(history, reach);
    if (!carryForward) {
      throw new InvalidRequestException(ends + " but the forecast needs it through " + history.dateOf(lastDay) + ": "
          + plan.describeKey(history.attributes(), firstPlanned) + " has no plan from "
          + history.dateOf(firstUncovered) + " (nor has any other series with plan rows); append a plan that reaches"
          + " the horizon's end (" + Setting.Command.APPEND + " " + Setting.STORE + " DIR " + Setting.PLAN
          + " FILE) or forecast with " + Setting.PLAN_CARRY_FORWARD + " to"
          + " carry each key's last values forward");
    }
    long carried = seriesWithPlan * uncoveredPeriods;
    warnings.add("plan values carried forward for " + carried + " series-" + Periods.unit(history.periodDays())
        + "s: " + ends + ", so " + seriesWithPlan + " series with plan rows read their last plan values over the last "
        + Periods.count(uncoveredPeriods, history.periodDays()) + " of the horizon");
    return carried;
  }

  /** "the plan ends on 2025-03-05" (daily) or "the plan ends with the week of 2025-03-03". */
  private static String reachText(SalesHistory history, int reach) {
    if (history.periodDays() == Periods.DAILY) {
      return "the plan ends on " + history.dateOf(reach);
    }
    return "the plan ends with the " + Periods.unit(history.periodDays()) + " of " + history.dateOf(reach);
  }
}
