package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Locale;

/**
 * The most columns an input CSV file may have, the same for every reader (sales wide or long, header detection,
 * calendar, prices, plan, closures, forecast files): 1,048,576. Wide sales files are the widest (one column per
 * period: ten years of hourly buckets are 87,660 columns, a 100,000-day series 100,001), and the bound keeps a
 * damaged file (a missing line end, a wrong separator) from growing one record without end.
 *
 * <p>Why the parser's own limit is twice ours: fastcsv 3.x refuses records beyond a field count it reads once, from the
 * system property {@code fastcsv.max.field.count} (default 16,384), when its {@code Limits} class loads, and it grows
 * its field array by doubling from 32; at twice our bound every record of up to our bound plus one reaches our own
 * check, which names the limit in our words.
 */
final class ColumnLimit {
  /** Columns an input file may have: 2^20. */
  static final int MAX_COLUMN_COUNT = 1 << 20;
  private static final String PARSER_PROPERTY = "fastcsv.max.field.count";
  /** How fastcsv words its own refusal, so it can be told from other parse errors. */
  private static final String PARSER_REFUSAL_PREFIX = "Maximum number of fields exceeded";

  private ColumnLimit() {}

  /** Sets fastcsv's field limit; must run before fastcsv first grows a record (its limit is read only once). */
  static void raiseParserLimit() {
    System.setProperty(PARSER_PROPERTY, Integer.toString(2 * MAX_COLUMN_COUNT));
  }

  /** Whether a parse failure, or one of its causes, is fastcsv refusing a record for its field count. */
  static boolean isParserRefusal(Throwable failure) {
    for (Throwable t = failure; t != null; t = t.getCause()) {
      if (String.valueOf(t.getMessage()).startsWith(PARSER_REFUSAL_PREFIX)) {
        return true;
      }
    }
    return false;
  }

  /** Whether {@code columnCount} columns are more than an input file may have. */
  static boolean exceeds(long columnCount) {
    return columnCount > MAX_COLUMN_COUNT;
  }

  /** The refusal of a line with more columns than {@link #MAX_COLUMN_COUNT}. */
  static InputFormatException refusal(Path file, long lineNumber) {
    return new InputFormatException(file, lineNumber, 0, String.format(Locale.ROOT,
        "more than %,d columns: expected at most %,d columns in a line", MAX_COLUMN_COUNT, MAX_COLUMN_COUNT));
  }
}
