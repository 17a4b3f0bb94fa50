package org.lagmill.ingest;

import java.nio.file.Path;
import java.time.LocalDate;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * The plausible dates of every date lagmill reads (sales, calendar, prices): 1900-01-01 to 2200-12-31 unless widened.
 * A typo such as 9024-01-05 in one row of a long file would otherwise stretch the store to millions of days; a date
 * outside the window stops the run with the file, line and column instead.
 *
 * <p>Process-wide, because every reader checks it: the command line widens it once, before any reading, from
 * {@code --date-window FROM..TO}. Thread-safe (one volatile pair, replaced whole).
 */
public final class DateWindow {
  /** First date accepted unless widened. */
  public static final LocalDate DEFAULT_FIRST = LocalDate.of(1900, 1, 1);
  /** Last date accepted unless widened. */
  public static final LocalDate DEFAULT_LAST = LocalDate.of(2200, 12, 31);

  private record Window(long firstEpochDay, long lastEpochDay) {}

  private static volatile Window window = new Window(DEFAULT_FIRST.toEpochDay(), DEFAULT_LAST.toEpochDay());

  private DateWindow() {}

  /**
   * Sets the window every later read checks against.
   *
   * @throws IllegalArgumentException when {@code last} is before {@code first}
   */
  public static void set(LocalDate first, LocalDate last) {
    if (last.isBefore(first)) {
      throw new InvalidRequestException("date window " + first + ".." + last + ": the last date must not be before "
          + "the first");
    }
    window = new Window(first.toEpochDay(), last.toEpochDay());
  }

  /**
   * Refuses a forecast horizon whose last period starts after the window's last date: the same bound as every date
   * read, and what keeps a mistyped horizon (2147483647) from asking for an array no machine holds.
   *
   * @param firstForecastDate the first forecast period's date (the store's next period)
   * @param periodDays the store's step in days
   * @param horizonPeriods periods to forecast, at least 1
   * @throws InvalidRequestException naming the most periods that fit
   */
  public static void requireHorizonWithin(LocalDate firstForecastDate, int periodDays, long horizonPeriods) {
    Window w = window;
    long first = firstForecastDate.toEpochDay();
    if (first + (horizonPeriods - 1) * periodDays > w.lastEpochDay) {
      long most = Math.max(0, (w.lastEpochDay - first) / periodDays + 1);
      throw new InvalidRequestException(Setting.HORIZON + " " + horizonPeriods + " reaches past "
          + LocalDate.ofEpochDay(w.lastEpochDay) + ", the last plausible date: expected at most " + most
          + " periods from " + firstForecastDate);
    }
  }

  /** Back to 1900-01-01 .. 2200-12-31. */
  public static void reset() {
    set(DEFAULT_FIRST, DEFAULT_LAST);
  }

  /** The window as text, e.g. {@code 1900-01-01..2200-12-31}. */
  public static String describe() {
    Window w = window;
    return LocalDate.ofEpochDay(w.firstEpochDay()) + ".." + LocalDate.ofEpochDay(w.lastEpochDay());
  }

  /**
   * Checks one date read from a file.
   *
   * @throws InputFormatException naming the file, line, column and the window when the date lies outside it
   */
  static void check(Path file, long line, int column, String what, long epochDay) {
    Window w = window;
    if (epochDay < w.firstEpochDay() || epochDay > w.lastEpochDay()) {
      throw new InputFormatException(file, line, column, what + " " + LocalDate.ofEpochDay(epochDay)
          + ": expected a date within " + describe() + " (a typo? a wider window can be asked for)");
    }
  }
}
