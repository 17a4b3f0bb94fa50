package org.lagmill.ingest;

import java.nio.file.Path;
import java.time.LocalDate;
import org.lagmill.io.Setting;

/**
 * Notices a date far outside the others in a file of dated rows (a typo such as 2199 for 2019): the store spans
 * every period from the first date to the last, so one such row can multiply its size. Keeps the two smallest and
 * two largest distinct dates seen, with the row count and first line of the extreme ones; constant work per row and
 * no allocation. A date stretches the file's span when the span with it is more than {@link #STRETCH_FACTOR} times
 * the span without the rows of that date (common practice, no source: a factor that no regular export reaches, since
 * a history's last years never span ten times its first ones).
 */
final class DateSpanCheck {
  static final int STRETCH_FACTOR = 10;

  private long min = Long.MAX_VALUE;
  private long secondMin = Long.MAX_VALUE;
  private long minRowCount;
  private long minLine;
  private long max = Long.MIN_VALUE;
  private long secondMax = Long.MIN_VALUE;
  private long maxRowCount;
  private long maxLine;
  private boolean held;
  private long heldFirst;
  private long heldLast;

  /** Takes one row's date (days since 1970-01-01) and its 1-based line. */
  void add(long epochDay, long line) {
    if (epochDay < min) {
      secondMin = min;
      min = epochDay;
      minRowCount = 1;
      minLine = line;
    } else if (epochDay == min) {
      minRowCount++;
    } else if (epochDay < secondMin) {
      secondMin = epochDay;
    }
    if (epochDay > max) {
      secondMax = max;
      max = epochDay;
      maxRowCount = 1;
      maxLine = line;
    } else if (epochDay == max) {
      maxRowCount++;
    } else if (epochDay > secondMax) {
      secondMax = epochDay;
    }
  }

  /**
   * Days a store already holds, before every date of the file (an append): they count as the other rows' dates, and
   * only a late date of the file can stretch the span (the store's own dates were accepted before).
   */
  void addHeldDays(long firstEpochDay, long lastEpochDay) {
    held = true;
    heldFirst = firstEpochDay;
    heldLast = lastEpochDay;
  }

  /**
   * The warning for the date that stretches the span, or null when none does.
   *
   * @param minSpanDays the span below which nothing is compared (the file's period: two adjacent dates never warn)
   */
  String warning(Path file, String dateColumn, long minSpanDays) {
    if (held) {
      return heldWarning(file, dateColumn, minSpanDays);
    }
    if (secondMin == Long.MAX_VALUE) {
      return null;
    }
    long spanDays = max - min;
    long withoutLast = Math.max(minSpanDays, secondMax - min);
    long withoutFirst = Math.max(minSpanDays, max - secondMin);
    if (spanDays > STRETCH_FACTOR * withoutLast && withoutLast <= withoutFirst) {
      return message(file, dateColumn, maxLine, max, maxRowCount, spanDays, secondMax - min);
    }
    if (spanDays > STRETCH_FACTOR * withoutFirst) {
      return message(file, dateColumn, minLine, min, minRowCount, spanDays, max - secondMin);
    }
    return null;
  }

  private String heldWarning(Path file, String dateColumn, long minSpanDays) {
    if (max == Long.MIN_VALUE) {
      return null;
    }
    long spanDays = max - heldFirst;
    long otherSpanDays = Math.max(heldLast, secondMax) - heldFirst;
    if (spanDays > STRETCH_FACTOR * Math.max(minSpanDays, otherSpanDays)) {
      return message(file, dateColumn, maxLine, max, maxRowCount, spanDays, otherSpanDays, "the store and the other"
          + " rows");
    }
    return null;
  }

  private static String message(Path file, String dateColumn, long line, long epochDay, long rowCount, long spanDays,
      long otherSpanDays) {
    return message(file, dateColumn, line, epochDay, rowCount, spanDays, otherSpanDays, "the other rows");
  }

  private static String message(Path file, String dateColumn, long line, long epochDay, long rowCount, long spanDays,
      long otherSpanDays, String others) {
    return file + ", line " + line + ": " + dateColumn + " " + LocalDate.ofEpochDay(epochDay) + " stretches the"
        + " dates to " + (spanDays + 1) + " days, more than " + STRETCH_FACTOR + " times the " + (otherSpanDays + 1)
        + " days of " + others + " (" + rowCount + (rowCount == 1 ? " row" : " rows") + " on that date); the store"
        + " holds every day in between: check it for a typo, or narrow " + Setting.DATE_WINDOW
        + " to refuse such dates";
  }
}
