package org.lagmill.ingest;

import java.nio.file.Path;
import java.time.DateTimeException;
import java.time.LocalDate;
import java.util.Arrays;
import org.lagmill.io.Excerpts;

/** Strict parsing of single CSV cells shared by the parsers; each failure message says what was found and expected. */
final class Cells {
  /** {@link #epochDay} result of a cell that is not an ISO date. */
  static final long NOT_A_DATE = Long.MIN_VALUE;
  /** {@link #units} result of a cell that is not a non-negative integer. */
  static final long NOT_UNITS = -1;

  private Cells() {}

  /** Days since 1970-01-01 of a {@code yyyy-mm-dd} cell, or {@link #NOT_A_DATE}. */
  static long epochDay(String text) {
    if (text.length() != 10 || text.charAt(4) != '-' || text.charAt(7) != '-') {
      return NOT_A_DATE;
    }
    int year = digits(text, 0, 4);
    int month = digits(text, 5, 7);
    int day = digits(text, 8, 10);
    if (year < 0 || month < 0 || day < 0) {
      return NOT_A_DATE;
    }
    try {
      return LocalDate.of(year, month, day).toEpochDay();
    } catch (DateTimeException e) {
      return NOT_A_DATE;
    }
  }

  /** Epoch day of a date cell; an {@link InputFormatException} naming the column otherwise. */
  static long requireDate(Path file, long line, int column, String columnName, String text) {
    long epochDay = epochDay(text);
    if (epochDay == NOT_A_DATE) {
      throw new InputFormatException(file, line, column,
          columnName + " '" + Excerpts.of(text) + "': expected an ISO date like 2024-03-05");
    }
    DateWindow.check(file, line, column, columnName, epochDay);
    return epochDay;
  }

  private static int digits(String text, int from, int to) {
    int value = 0;
    for (int i = from; i < to; i++) {
      char c = text.charAt(i);
      if (c < '0' || c > '9') {
        return -1;
      }
      value = value * 10 + (c - '0');
    }
    return value;
  }

  /**
   * True when the cell is a plain decimal number: optional sign, digits with an optional point, optional exponent.
   * Stricter than {@link Double#parseDouble}, which also takes "NaN", "Infinity", "1f" and hex.
   */
  static boolean isDecimal(String text) {
    int n = text.length();
    int i = 0;
    if (i < n && (text.charAt(i) == '+' || text.charAt(i) == '-')) {
      i++;
    }
    int mantissaDigits = 0;
    while (i < n && isDigit(text.charAt(i))) {
      i++;
      mantissaDigits++;
    }
    if (i < n && text.charAt(i) == '.') {
      i++;
      while (i < n && isDigit(text.charAt(i))) {
        i++;
        mantissaDigits++;
      }
    }
    if (mantissaDigits == 0) {
      return false;
    }
    if (i < n && (text.charAt(i) == 'e' || text.charAt(i) == 'E')) {
      i++;
      if (i < n && (text.charAt(i) == '+' || text.charAt(i) == '-')) {
        i++;
      }
      int exponentDigits = 0;
      while (i < n && isDigit(text.charAt(i))) {
        i++;
        exponentDigits++;
      }
      if (exponentDigits == 0) {
        return false;
      }
    }
    return i == n;
  }

  /**
   * True when the cell spells a number that is not finite: {@code NaN}, {@code Inf} or {@code Infinity}, any letter
   * case, with an optional sign. Such a cell is never a category a user meant.
   */
  static boolean isNonFiniteNumber(String text) {
    String unsigned = text.startsWith("+") || text.startsWith("-") ? text.substring(1) : text;
    return unsigned.equalsIgnoreCase("nan") || unsigned.equalsIgnoreCase("inf")
        || unsigned.equalsIgnoreCase("infinity");
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  /**
   * A non-negative integer cell as a long (values past {@link Integer#MAX_VALUE} are returned as they are, capped at
   * {@code Integer.MAX_VALUE + 1}, so the caller can report overflow), or {@link #NOT_UNITS}.
   */
  static long units(String text) {
    int n = text.length();
    if (n == 0) {
      return NOT_UNITS;
    }
    long value = 0;
    for (int i = 0; i < n; i++) {
      char c = text.charAt(i);
      if (!isDigit(c)) {
        return NOT_UNITS;
      }
      value = Math.min(value * 10 + (c - '0'), Integer.MAX_VALUE + 1L);
    }
    return value;
  }

  /**
   * The series id of a sales row must not be empty: the {@code series_id} cell when the file has one ({@code column}
   * its 1-based column), else the attribute cells together ({@code column} 0). An empty id cannot be told apart or
   * matched by a later append, forecast or evaluation.
   */
  static void requireSeriesId(Path file, long line, int column, String columnName, String seriesId) {
    if (seriesId.isEmpty()) {
      throw new InputFormatException(file, line, column, column > 0 ? columnName + " is empty: expected a value"
          + " naming the series" : "every attribute cell is empty: expected at least one value naming the series");
    }
  }

  /**
   * A header of one cell holding a semicolon or a tab is a file separated by something else than commas (a
   * spreadsheet's export in some locales): refused in those words rather than as a header missing its columns.
   */
  static void requireCommaSeparated(Path file, String[] header) {
    if (header.length != 1) {
      return;
    }
    for (char separator : new char[] {';', '\t'}) {
      if (header[0].indexOf(separator) >= 0) {
        throw new InputFormatException(file, 1, 0, "the header is one column holding '" + (separator == '\t' ? "\\t"
            : ";") + "' between its names: expected comma-separated values (lagmill reads commas only)");
      }
    }
  }

  /** How a header cell is named in a message about the cell itself. */
  static final String HEADER_CELL = "header cell";

  /**
   * A cell holding a NUL character, a sign of a UTF-16 or binary file, is refused wherever it is read: every cell of
   * every field-based input file in {@link CsvSource}, the text cells of wide sales files in their reader.
   *
   * @param columnName the column's header name, or {@link #HEADER_CELL} for a cell of the header itself
   */
  static void requireNoNul(Path file, long line, int column, String columnName, String value) {
    if (value.indexOf('\0') >= 0) {
      throw new InputFormatException(file, line, column, columnName + " '" + Excerpts.of(value) + "' holds a NUL"
          + " character: expected text (is the file UTF-16 or binary?)");
    }
  }

  /** 0-based index of a header column, or an {@link InputFormatException} naming the option that renames it. */
  static int requireColumn(Path file, String[] header, String name, String option) {
    int index = Arrays.asList(header).indexOf(name);
    if (index < 0) {
      throw new InputFormatException(file, 1, 0, "no column '" + name + "' in header " + Excerpts.of(String.join(",",
          header))
          + ": expected one (or name it with " + option + ")");
    }
    return index;
  }

  /** An {@link InputFormatException} when a header names a column twice. */
  static void requireDistinct(Path file, String[] header) {
    for (int i = 0; i < header.length; i++) {
      for (int j = 0; j < i; j++) {
        if (header[i].equals(header[j])) {
          throw new InputFormatException(file, 1, i + 1,
              "column '" + header[i] + "' appears twice: expected distinct column names");
        }
      }
    }
  }
}
