package org.lagmill.scenario;

import java.time.LocalDate;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * What to generate: {@code seriesCount} article-outlet series of {@code dayCount} sales days from {@code startDate},
 * with calendar, prices, plan and closures reaching {@code futureDayCount} days further so a forecast can read its
 * horizon. With {@code periodDays} 7 the files hold one period per 7 days from the start date (weekly sales, a weekly
 * calendar and one price row per article-outlet-week); the underlying daily simulation is the same.
 *
 * @param seriesCount number of item-store series, 1 .. {@value #MAX_SERIES_COUNT}
 * @param dayCount number of sales days, 1 .. {@value #MAX_DAY_COUNT}
 * @param startDate the first sales day, years {@value #MIN_YEAR} .. {@value #MAX_YEAR}
 * @param seed master seed; equal specs give byte-identical files
 * @param futureDayCount days of calendar and prices past the last sales day, 0 .. {@value #MAX_FUTURE_DAY_COUNT}
 * @param gzip whether files are written gzip-compressed with a {@code .gz} suffix
 * @param periodDays days per written period: 1 (daily) or 7 (weekly; day counts must then be multiples of 7)
 */
public record ScenarioSpec(int seriesCount, int dayCount, LocalDate startDate, long seed, int futureDayCount,
    boolean gzip, int periodDays) {
  public static final int MAX_SERIES_COUNT = 50_000_000;
  public static final int MAX_DAY_COUNT = 36_600;
  public static final int MAX_FUTURE_DAY_COUNT = 3_660;
  public static final int MIN_YEAR = 1900;
  public static final int MAX_YEAR = 2200;
  public static final LocalDate DEFAULT_START_DATE = LocalDate.of(2023, 1, 2);
  public static final long DEFAULT_SEED = 42L;
  public static final int DEFAULT_FUTURE_DAY_COUNT = 28;
  public static final int DAILY = 1;
  public static final int WEEKLY = 7;

  public ScenarioSpec {
    if (seriesCount < 1 || seriesCount > MAX_SERIES_COUNT) {
      throw new InvalidRequestException("series count must be in [1, " + MAX_SERIES_COUNT + "], got " + seriesCount
          + "; hint: " + Setting.SCENARIO_SERIES + " 600 gives a small demo");
    }
    if (dayCount < 1 || dayCount > MAX_DAY_COUNT) {
      throw new InvalidRequestException("day count must be in [1, " + MAX_DAY_COUNT + "], got " + dayCount
          + "; hint: " + Setting.SCENARIO_DAYS + " 730 gives two years of history");
    }
    if (futureDayCount < 0 || futureDayCount > MAX_FUTURE_DAY_COUNT) {
      throw new InvalidRequestException("future day count must be in [0, " + MAX_FUTURE_DAY_COUNT + "], got "
          + futureDayCount + "; hint: use the forecast horizon, e.g. " + Setting.SCENARIO_FUTURE_DAYS + " 28");
    }
    if (startDate == null) {
      throw new InvalidRequestException("start date is missing; hint: e.g. " + Setting.SCENARIO_START + " "
          + DEFAULT_START_DATE);
    }
    if (periodDays != DAILY && periodDays != WEEKLY) {
      throw new InvalidRequestException("period must be 1 (day) or 7 (week) days, got " + periodDays
          + "; hint: " + Setting.SCENARIO_PERIOD + " day or " + Setting.SCENARIO_PERIOD + " week");
    }
    if (periodDays == WEEKLY && (dayCount % WEEKLY != 0 || futureDayCount % WEEKLY != 0)) {
      throw new InvalidRequestException("weekly output needs whole weeks: " + Setting.SCENARIO_DAYS + " and "
          + Setting.SCENARIO_FUTURE_DAYS + " must be "
          + "multiples of 7, got " + dayCount + " and " + futureDayCount + "; hint: " + Setting.SCENARIO_DAYS + " "
          + Math.max(WEEKLY, dayCount / WEEKLY * WEEKLY) + " " + Setting.SCENARIO_FUTURE_DAYS + " "
          + futureDayCount / WEEKLY * WEEKLY);
    }
    LocalDate lastDate = startDate.plusDays((long) dayCount + futureDayCount - 1);
    if (startDate.getYear() < MIN_YEAR || lastDate.getYear() > MAX_YEAR) {
      throw new InvalidRequestException("dates must lie in years [" + MIN_YEAR + ", " + MAX_YEAR + "], got "
          + startDate + " .. " + lastDate + "; hint: pick a start date such as " + DEFAULT_START_DATE);
    }
  }

  /** A daily spec. */
  public ScenarioSpec(int seriesCount, int dayCount, LocalDate startDate, long seed, int futureDayCount,
      boolean gzip) {
    this(seriesCount, dayCount, startDate, seed, futureDayCount, gzip, DAILY);
  }

  /** A daily spec with the default start date, seed and future days, plain (not gzipped) files. */
  public static ScenarioSpec of(int seriesCount, int dayCount) {
    return new ScenarioSpec(seriesCount, dayCount, DEFAULT_START_DATE, DEFAULT_SEED, DEFAULT_FUTURE_DAY_COUNT, false);
  }

  /** The same spec writing periods of {@code days} days (1 or 7). */
  public ScenarioSpec withPeriodDays(int days) {
    return new ScenarioSpec(seriesCount, dayCount, startDate, seed, futureDayCount, gzip, days);
  }

  /** Number of written sales periods: sales days divided by the period. */
  public int periodCount() {
    return dayCount / periodDays;
  }

  /** Days covered by the calendar and prices: sales days plus future days. */
  public int calendarDayCount() {
    return dayCount + futureDayCount;
  }

  /** Item-days simulated: series times sales days (a weekly file holds them as 7-day sums). */
  public long itemDayCount() {
    return (long) seriesCount * dayCount;
  }
}
