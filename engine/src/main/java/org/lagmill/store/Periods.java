package org.lagmill.store;

import java.time.LocalDate;
import org.lagmill.io.InvalidRequestException;

/**
 * The one place for what a store's period means: a store holds one value per series for every period of
 * {@code periodDays} days (1 daily, 7 weekly, or any other fixed step), and index {@code i} is the period starting
 * {@code firstDate + i × periodDays}. Java names keep their {@code day…} spelling ({@code dayIndex},
 * {@code dayCount}, {@code horizonDays}): a day index counts periods of the store's step.
 */
public final class Periods {
  /** Period of a daily store, and of a store whose manifest records none. */
  public static final int DAILY = 1;
  public static final int WEEKLY = 7;
  /** Longest period accepted: one year of days. */
  public static final int MAX_PERIOD_DAYS = 366;
  /** Days of the yearly cycle the seasonal length of a longer period is taken from: 52 weeks. */
  private static final int YEAR_OF_WEEKS_DAYS = 364;

  private Periods() {}

  /**
   * The seasonal length in periods: 7 for a daily store (the weekly shopping cycle), and for longer periods the
   * number of periods in a year of 52 weeks, rounded, at least 2 (52 weekly, 26 for 14 days, 13 for 28 days). A
   * weekly cycle cannot be seen in periods of a week or longer, so the yearly cycle is the season there; for steps of
   * 2 to 6 days a week is not a whole number of periods, so they take the yearly cycle as well. Seasonal naive,
   * the seasonal baselines' scales and any seasonal model read it from here.
   *
   * @param periodDays the store's step in days, in {@code [1, MAX_PERIOD_DAYS]}
   */
  public static int seasonLength(int periodDays) {
    requireValid(periodDays);
    if (periodDays == DAILY) {
      return 7;
    }
    return Math.max(2, (int) Math.round((double) YEAR_OF_WEEKS_DAYS / periodDays));
  }

  /** Throws {@link IllegalArgumentException} unless {@code periodDays} is in {@code [1, MAX_PERIOD_DAYS]}. */
  public static int requireValid(int periodDays) {
    if (periodDays < 1 || periodDays > MAX_PERIOD_DAYS) {
      throw new InvalidRequestException("period must be 1 to " + MAX_PERIOD_DAYS + " days, got " + periodDays);
    }
    return periodDays;
  }

  /** "day", "week" or "period" (of any other step), for messages: "28 days", "8 weeks", "10 periods". */
  public static String unit(int periodDays) {
    return periodDays == DAILY ? "day" : periodDays == WEEKLY ? "week" : "period";
  }

  /** "{@code count} days", "{@code count} weeks", "1 week", "{@code count} periods". */
  public static String count(long count, int periodDays) {
    return count + " " + unit(periodDays) + (count == 1 ? "" : "s");
  }

  /** "daily", "weekly" or "every N days". */
  public static String describe(int periodDays) {
    return periodDays == DAILY ? "daily" : periodDays == WEEKLY ? "weekly" : "every " + periodDays + " days";
  }

  /**
   * The index of the period holding {@code date}: {@code floor((date − firstDate) / periodDays)}; negative before the
   * first period. Dated rows of prices and plans map to the period containing their date.
   */
  public static long periodIndexOf(LocalDate firstDate, int periodDays, long epochDay) {
    return Math.floorDiv(epochDay - firstDate.toEpochDay(), (long) periodDays);
  }

  /**
   * The period an option names: {@code day} (1), {@code week} (7), or a number of days in
   * {@code [1, MAX_PERIOD_DAYS]}.
   *
   * @throws InvalidRequestException naming the option, the value and what is allowed
   */
  public static int parse(String option, String text) {
    if (text.equalsIgnoreCase("day")) {
      return DAILY;
    }
    if (text.equalsIgnoreCase("week")) {
      return WEEKLY;
    }
    try {
      int days = Integer.parseInt(text.trim());
      if (days >= 1 && days <= MAX_PERIOD_DAYS) {
        return days;
      }
    } catch (NumberFormatException e) {
      // the message below says what is allowed
    }
    throw new InvalidRequestException(option + " must be day, week or a number of days 1 to " + MAX_PERIOD_DAYS
        + ", got '" + text + "'");
  }
}
