package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;
import it.unimi.dsi.fastutil.longs.LongArrayList;
import it.unimi.dsi.fastutil.longs.LongOpenHashSet;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.lagmill.io.Excerpts;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeIntArray;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesIdentity;

/**
 * Reads long-format sales: one row per series and day, in any order, with a date column, a units column and attribute
 * columns naming the series (by its {@code series_id} cell when that column is present, otherwise by all attribute
 * values together). A day with no row for a series, from the series' first row to the file's last date, is read as
 * the {@link MissingRows} policy says (zero by default: till exports omit zero-sales days); days before a series'
 * first row and rows with an empty units cell are unknown.
 *
 * <p>The file's period is the most common gap between its consecutive distinct dates (the smaller on a tie): 1 for
 * daily rows, 7 for weekly rows even when some weeks are missing altogether. Every date must then lie a whole number
 * of periods after the earliest one; a date off that step (a Tuesday among Mondays) is an error naming its line.
 *
 * <p>Two passes over the file: the first finds the series and the date range and validates every cell; the second
 * fills a series × day units matrix in native memory reserved from a {@link MemoryBudget} (4 bytes per cell), which
 * is then handed to a {@link SeriesSink} one series at a time and freed.
 */
public final class LongSalesReader {
  public static final String DEFAULT_DATE_COLUMN = "date";
  public static final String DEFAULT_UNITS_COLUMN = "units";

  /**
   * The units matrix starts at {@link SalesHistory#UNKNOWN_UNITS}, meaning "no row seen"; a row with an empty units
   * cell stores this value instead, so a second row for the same series and date is still caught as a duplicate. When
   * the matrix is handed on, "no row" becomes what the missing-rows policy says and this value becomes unknown.
   */
  private static final int PRESENT_UNKNOWN = -2;
  private static final char KEY_SEPARATOR = '\u0000';

  private LongSalesReader() {}

  /**
   * As {@link #read(Path, String, String, String, MissingRows, MemoryBudget, SeriesSink)} with the series id column
   * {@link SeriesIdentity#SERIES_ID}.
   */
  public static LongSalesRead read(Path file, String dateColumn, String unitsColumn, MissingRows missingRows,
      MemoryBudget budget, SeriesSink sink) {
    return read(file, dateColumn, unitsColumn, SeriesIdentity.SERIES_ID, missingRows, budget, sink);
  }

  /**
   * Reads a long-format sales file and hands each series to {@code sink}.
   *
   * @param missingRows what a day with no row means, from each series' first row to the file's last date
   * @param budget pays for the {@code seriesCount × dayCount × 4} bytes of the units matrix while it is filled
   * @return the file's shape (also given to {@link SeriesSink#begin} before the first series) and the fill count
   * @throws InputFormatException on any violation of the format, with file, line, column and an exact message
   */
  public static LongSalesRead read(Path file, String dateColumn, String unitsColumn, String seriesIdColumn,
      MissingRows missingRows, MemoryBudget budget, SeriesSink sink) {
    return read(file, dateColumn, unitsColumn, seriesIdColumn, missingRows, null, budget, sink);
  }

  /**
   * Where the days of a file read onto a store go: a fixed first date and step, as for an append, instead of the
   * file's own earliest date and most common gap.
   *
   * @param firstDate the date of day index 0 (the store's next period), an earlier date in the file being an error;
   *     null for the file's earliest date (a period given with {@code --period} at ingest)
   * @param periodDays the step in days
   * @param heldFirstDate the first date of the days a store already holds before {@code firstDate} (an append), which
   *     count as other rows' dates when a date far from them is looked for; null when nothing is held
   */
  public record Frame(LocalDate firstDate, int periodDays, LocalDate heldFirstDate) {
    /** The file's own first date, a given step. */
    public static Frame ofPeriod(int periodDays) {
      return new Frame(null, Periods.requireValid(periodDays), null);
    }
  }

  /**
   * As {@link #read(Path, String, String, String, MissingRows, MemoryBudget, SeriesSink)}, with day index 0 and the
   * step fixed by {@code frame} (null: the file's earliest date and most common gap).
   */
  public static LongSalesRead read(Path file, String dateColumn, String unitsColumn, String seriesIdColumn,
      MissingRows missingRows, Frame frame, MemoryBudget budget, SeriesSink sink) {
    Layout layout;
    List<String[]> valuesBySeries = new ArrayList<>();
    Object2IntOpenHashMap<String> seriesIndexByKey = new Object2IntOpenHashMap<>();
    seriesIndexByKey.defaultReturnValue(-1);
    long minEpochDay = Long.MAX_VALUE;
    long maxEpochDay = Long.MIN_VALUE;
    int[] firstDayIndexBySeries;
    LongOpenHashSet distinctEpochDays = new LongOpenHashSet();
    LongArrayList firstEpochDayBySeries = new LongArrayList();
    DateSpanCheck span = new DateSpanCheck();
    try (CsvSource source = CsvSource.open(file)) {
      layout = Layout.of(file, source.readHeader(), dateColumn, unitsColumn, seriesIdColumn);
      LongArrayList firstLineBySeries = new LongArrayList();
      for (CsvRecord record = source.next(); record != null; record = source.next()) {
        long line = source.lineNumber();
        long epochDay = Cells.requireDate(file, line, layout.dateIndex + 1, dateColumn,
            record.getField(layout.dateIndex));
        checkUnits(file, line, layout, unitsColumn, record.getField(layout.unitsIndex));
        distinctEpochDays.add(epochDay);
        span.add(epochDay, line);
        minEpochDay = Math.min(minEpochDay, epochDay);
        maxEpochDay = Math.max(maxEpochDay, epochDay);
        String key = layout.seriesKey(record);
        int seriesIndex = seriesIndexByKey.getInt(key);
        if (seriesIndex < 0) {
          layout.checkNamesSeries(file, line, record);
          seriesIndexByKey.put(key, valuesBySeries.size());
          valuesBySeries.add(layout.attributeValues(record));
          firstLineBySeries.add(line);
          firstEpochDayBySeries.add(epochDay);
        } else {
          if (epochDay < firstEpochDayBySeries.getLong(seriesIndex)) {
            firstEpochDayBySeries.set(seriesIndex, epochDay);
          }
          if (layout.seriesIdIndex >= 0) {
            layout.checkSameAttributes(file, line, record, valuesBySeries.get(seriesIndex),
                firstLineBySeries.getLong(seriesIndex));
          }
        }
      }
      if (valuesBySeries.isEmpty()) {
        throw new InputFormatException(file, 0, 0, "no sales rows: expected at least one row after the header");
      }
    }
    DetectedPeriod detected = frame == null ? periodDaysOf(distinctEpochDays) : null;
    int periodDays = frame == null ? detected.periodDays() : frame.periodDays();
    String stepSource = frame == null ? "the most common gap between its dates" : frame.firstDate() == null
        ? "given with " + Setting.PERIOD : "the store's step";
    if (frame != null && frame.firstDate() != null) {
      long frameFirst = frame.firstDate().toEpochDay();
      if (minEpochDay < frameFirst) {
        LocalDate earliest = LocalDate.ofEpochDay(minEpochDay);
        throw new InputFormatException(file, findLineOf(file, layout, minEpochDay), layout.dateIndex + 1,
            dateColumn + " '" + earliest + "' is before " + frame.firstDate() + ": expected dates from "
                + frame.firstDate() + " on (the period after the store's last)");
      }
      minEpochDay = frameFirst;
      if (frame.heldFirstDate() != null) {
        span.addHeldDays(frame.heldFirstDate().toEpochDay(), frameFirst - frame.periodDays());
      }
    }
    firstDayIndexBySeries = new int[valuesBySeries.size()];
    for (int s = 0; s < firstDayIndexBySeries.length; s++) {
      // Bounded by the period count, which is checked to fit an int below; a date off the step fails in fill.
      firstDayIndexBySeries[s] = (int) Math.min(Integer.MAX_VALUE,
          (firstEpochDayBySeries.getLong(s) - minEpochDay) / periodDays);
    }
    long dayCountLong = (maxEpochDay - minEpochDay) / periodDays + 1;
    if (dayCountLong > Integer.MAX_VALUE) {
      throw new InputFormatException(file, 0, 0, "dates span " + dayCountLong + " days: expected at most "
          + Integer.MAX_VALUE);
    }
    int dayCount = (int) dayCountLong;
    int seriesCount = valuesBySeries.size();
    LongSalesHeader header = new LongSalesHeader(layout.attributeNames(), LocalDate.ofEpochDay(minEpochDay),
        periodDays, dayCount, seriesCount);
    try (NativeIntArray matrix = new NativeIntArray(budget, (long) seriesCount * dayCount)) {
      matrix.fill(0, (int) matrix.length(), SalesHistory.UNKNOWN_UNITS);
      fill(file, layout, dateColumn, seriesIndexByKey, minEpochDay, periodDays, stepSource, dayCount, matrix);
      sink.begin(header);
      int[] units = new int[dayCount];
      int missingValue = missingRows == MissingRows.ZERO ? 0 : SalesHistory.UNKNOWN_UNITS;
      ZeroFills zeroFills = missingValue == 0 ? new ZeroFills(seriesCount, dayCount) : ZeroFills.NONE;
      for (int s = 0; s < seriesCount; s++) {
        matrix.read(s * dayCount, units, 0, dayCount);
        // Before the series' first row nothing was recorded: unknown whatever the policy.
        for (int d = firstDayIndexBySeries[s]; d < dayCount; d++) {
          if (units[d] == SalesHistory.UNKNOWN_UNITS) {
            units[d] = missingValue;
            if (missingValue == 0) {
              zeroFills.set(s, d);
            }
          }
        }
        for (int d = 0; d < dayCount; d++) {
          if (units[d] == PRESENT_UNKNOWN) {
            units[d] = SalesHistory.UNKNOWN_UNITS;
          }
        }
        sink.accept(valuesBySeries.get(s), units, firstDayIndexBySeries[s]);
      }
      String spanWarning = span.warning(file, dateColumn, periodDays);
      String periodNote = detected == null ? "period " + Periods.describe(periodDays) + ": " + stepSource
          : "period " + Periods.describe(periodDays) + ": detected from the sales dates, the most common gap between "
              + "consecutive dates (" + detected.gapCount() + " of " + detected.allGapCount() + " gaps)";
      return new LongSalesRead(header, zeroFills, periodNote, detected != null && detected.allGapCount() > 0
          && periodDays != Periods.DAILY && periodDays != Periods.WEEKLY,
          spanWarning == null ? List.of() : List.of(spanWarning));
    }
  }

  /**
   * A period read from the dates: the most common gap, how many consecutive date pairs have it, and how many pairs
   * there are (0 for a single date).
   */
  record DetectedPeriod(int periodDays, int gapCount, int allGapCount) {}

  /** The most common gap between consecutive distinct dates, the smaller on a tie; 1 for a single date. */
  static DetectedPeriod periodDaysOf(LongOpenHashSet distinctEpochDays) {
    long[] days = distinctEpochDays.toLongArray();
    Arrays.sort(days);
    Long2IntOpenHashMap countByGap = new Long2IntOpenHashMap();
    long bestGap = 1;
    int bestCount = 0;
    for (int i = 1; i < days.length; i++) {
      long gap = days[i] - days[i - 1];
      int count = countByGap.addTo(gap, 1) + 1;
      if (count > bestCount || (count == bestCount && gap < bestGap)) {
        bestGap = gap;
        bestCount = count;
      }
    }
    return new DetectedPeriod((int) Math.min(bestGap, Periods.MAX_PERIOD_DAYS), bestCount,
        Math.max(0, days.length - 1));
  }

  private static void fill(Path file, Layout layout, String dateColumn,
      Object2IntOpenHashMap<String> seriesIndexByKey, long minEpochDay, int periodDays, String stepSource,
      int dayCount, NativeIntArray matrix) {
    try (CsvSource source = CsvSource.open(file)) {
      source.readHeader();
      for (CsvRecord record = source.next(); record != null; record = source.next()) {
        int seriesIndex = seriesIndexByKey.getInt(layout.seriesKey(record));
        String dateText = record.getField(layout.dateIndex);
        long daysAfterFirst = Cells.epochDay(dateText) - minEpochDay;
        if (daysAfterFirst % periodDays != 0) {
          LocalDate first = LocalDate.ofEpochDay(minEpochDay);
          LocalDate before = first.plusDays(daysAfterFirst / periodDays * periodDays);
          throw new InputFormatException(file, source.lineNumber(), layout.dateIndex + 1, dateColumn + " '"
              + Excerpts.of(dateText)
              + "' is off the file's step of " + periodDays + " days (" + stepSource + ", from " + first
              + "): expected " + before + " or " + before.plusDays(periodDays));
        }
        int dayIndex = (int) (daysAfterFirst / periodDays);
        String unitsText = record.getField(layout.unitsIndex);
        int cell = seriesIndex * dayCount + dayIndex;
        if (matrix.get(cell) != SalesHistory.UNKNOWN_UNITS) {
          long firstLine = findFirstLine(file, layout, record, source.lineNumber());
          throw new InputFormatException(file, source.lineNumber(), 0, "duplicate row for series "
              + layout.describe(record) + " on " + dateText + ": lines " + firstLine + " and " + source.lineNumber()
              + ", expected one row per series and date");
        }
        matrix.set(cell, unitsText.isEmpty() ? PRESENT_UNKNOWN : (int) Cells.units(unitsText));
      }
    }
  }

  /** Error path only: the first line dated {@code epochDay}. */
  private static long findLineOf(Path file, Layout layout, long epochDay) {
    try (CsvSource source = CsvSource.open(file)) {
      source.readHeader();
      for (CsvRecord record = source.next(); record != null; record = source.next()) {
        if (Cells.epochDay(record.getField(layout.dateIndex)) == epochDay) {
          return source.lineNumber();
        }
      }
    }
    throw new IllegalStateException("no line dated " + LocalDate.ofEpochDay(epochDay) + " in " + file);
  }

  /** Error path only: the earlier line holding the same series and date as {@code duplicate}. */
  private static long findFirstLine(Path file, Layout layout, CsvRecord duplicate, long duplicateLine) {
    String key = layout.seriesKey(duplicate);
    long epochDay = Cells.epochDay(duplicate.getField(layout.dateIndex));
    try (CsvSource source = CsvSource.open(file)) {
      source.readHeader();
      for (CsvRecord record = source.next(); record != null
          && source.lineNumber() < duplicateLine; record = source.next()) {
        if (Cells.epochDay(record.getField(layout.dateIndex)) == epochDay && layout.seriesKey(record).equals(key)) {
          return source.lineNumber();
        }
      }
    }
    throw new IllegalStateException("no earlier row of a duplicate on line " + duplicateLine + " of " + file);
  }

  private static void checkUnits(Path file, long line, Layout layout, String unitsColumn, String text) {
    if (text.isEmpty()) {
      return;
    }
    long units = Cells.units(text);
    if (units == Cells.NOT_UNITS) {
      throw new InputFormatException(file, line, layout.unitsIndex + 1,
          unitsColumn + " '" + Excerpts.of(text) + "': expected a non-negative integer or an empty cell");
    }
    // The store keeps the all-ones value of each width for unknown days, so the largest storable count is one less.
    if (units > Integer.MAX_VALUE - 1) {
      throw new InputFormatException(file, line, layout.unitsIndex + 1,
          unitsColumn + " '" + Excerpts.of(text) + "': expected an integer at most " + (Integer.MAX_VALUE - 1));
    }
  }

  /** Which header column holds what. */
  private static final class Layout {
    final String[] header;
    final int dateIndex;
    final int unitsIndex;
    final int seriesIdIndex;
    final int[] attributeColumns;

    private Layout(String[] header, int dateIndex, int unitsIndex, int seriesIdIndex, int[] attributeColumns) {
      this.header = header;
      this.dateIndex = dateIndex;
      this.unitsIndex = unitsIndex;
      this.seriesIdIndex = seriesIdIndex;
      this.attributeColumns = attributeColumns;
    }

    static Layout of(Path file, String[] header, String dateColumn, String unitsColumn, String seriesIdColumn) {
      Cells.requireDistinct(file, header);
      int dateIndex = Cells.requireColumn(file, header, dateColumn, Setting.DATE_COLUMN.toString());
      int unitsIndex = Cells.requireColumn(file, header, unitsColumn, Setting.UNITS_COLUMN.toString());
      int[] attributeColumns = new int[header.length - 2];
      int k = 0;
      for (int c = 0; c < header.length; c++) {
        if (c != dateIndex && c != unitsIndex) {
          attributeColumns[k++] = c;
        }
      }
      if (attributeColumns.length == 0) {
        throw new InputFormatException(file, 1, 0, "no attribute columns: expected at least one column naming the"
            + " series besides '" + dateColumn + "' and '" + unitsColumn + "'");
      }
      int seriesIdIndex = Arrays.asList(header).indexOf(seriesIdColumn);
      return new Layout(header, dateIndex, unitsIndex, seriesIdIndex, attributeColumns);
    }

    List<String> attributeNames() {
      List<String> names = new ArrayList<>();
      for (int c : attributeColumns) {
        names.add(header[c]);
      }
      return names;
    }

    String seriesKey(CsvRecord record) {
      if (seriesIdIndex >= 0) {
        return record.getField(seriesIdIndex);
      }
      if (attributeColumns.length == 1) {
        return record.getField(attributeColumns[0]);
      }
      StringBuilder b = new StringBuilder();
      for (int k = 0; k < attributeColumns.length; k++) {
        if (k > 0) {
          b.append(KEY_SEPARATOR);
        }
        b.append(record.getField(attributeColumns[k]));
      }
      return b.toString();
    }

    /** A new series' id is not empty (NUL characters are refused by {@link CsvSource}). */
    void checkNamesSeries(Path file, long line, CsvRecord record) {
      boolean allEmpty = true;
      for (int c : attributeColumns) {
        allEmpty &= record.getField(c).isEmpty();
      }
      if (seriesIdIndex >= 0) {
        Cells.requireSeriesId(file, line, seriesIdIndex + 1, header[seriesIdIndex], record.getField(seriesIdIndex));
      } else {
        Cells.requireSeriesId(file, line, 0, null, allEmpty ? "" : "named");
      }
    }

    String[] attributeValues(CsvRecord record) {
      String[] values = new String[attributeColumns.length];
      for (int k = 0; k < values.length; k++) {
        values[k] = record.getField(attributeColumns[k]);
      }
      return values;
    }

    /** The series' name as the store will show it: the series id, or the attribute values joined by '/'. */
    String describe(CsvRecord record) {
      return SeriesIdentity.seriesId(seriesIdIndex >= 0 ? record.getField(seriesIdIndex) : null,
          attributeValues(record));
    }

    void checkSameAttributes(Path file, long line, CsvRecord record, String[] firstValues, long firstLine) {
      for (int k = 0; k < attributeColumns.length; k++) {
        String value = record.getField(attributeColumns[k]);
        if (!value.equals(firstValues[k])) {
          String name = header[attributeColumns[k]];
          throw new InputFormatException(file, line, attributeColumns[k] + 1, "series "
              + Excerpts.of(record.getField(seriesIdIndex)) + " has " + name + "=" + Excerpts.of(value)
              + ": expected " + name + "="
              + firstValues[k] + " as on line " + firstLine);
        }
      }
    }
  }
}
