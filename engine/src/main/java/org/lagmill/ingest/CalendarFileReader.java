package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.longs.LongArrayList;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.lagmill.io.Excerpts;
import org.lagmill.io.Setting;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.Periods;
import org.lagmill.store.DayCalendar.ColumnKind;
import org.lagmill.store.SeriesAttributes;

/**
 * Reads the calendar file: one row per date, consecutive and ascending, aligned to the store's day index (day 0 = the
 * store's first date; earlier rows are dropped). For a store of longer periods (weekly) there is one row per period,
 * dated on the period's first day: rows one period apart, on the store's step from its first date. Every column other than the date becomes a calendar column: numeric
 * when every non-empty cell is a decimal number, categorical otherwise (codes in order of first appearance). A header
 * {@code NAME[ATTRIBUTE=VALUE]} holds the column NAME for the series whose ATTRIBUTE is VALUE; all such headers of one
 * NAME make one per-attribute column. Empty cells read NaN. See docs/formats.md.
 *
 * <p>The file is small (one row per day), so its rows are held on the heap while it is read.
 */
public final class CalendarFileReader {
  /** Default name of the date column ({@code --date-column}). */
  public static final String DEFAULT_DATE_COLUMN = "date";

  private static final Pattern KEYED_HEADER = Pattern.compile("(.+)\\[([^=\\]]+)=(.*)\\]");

  private CalendarFileReader() {}

  /** One output column and the file columns it gathers (one for a global column, one per key value otherwise). */
  private static final class Group {
    final String name;
    final int attributeIndex;
    final String keyAttribute;
    final List<int[]> sources = new ArrayList<>(); // {fileColumnIndex, keyCode}

    Group(String name, int attributeIndex, String keyAttribute) {
      this.name = name;
      this.attributeIndex = attributeIndex;
      this.keyAttribute = keyAttribute;
    }
  }

  /**
   * Reads a calendar file.
   *
   * @param storeFirstDate date of the store's day 0; the calendar must cover it
   * @param attributes the store's series attributes, for per-attribute columns
   * @param dateColumn name of the date column, normally {@link #DEFAULT_DATE_COLUMN}
   * @throws InputFormatException on any violation of the format, with file, line, column and an exact message
   */
  public static CalendarReadResult read(Path file, LocalDate storeFirstDate, SeriesAttributes attributes,
      String dateColumn) {
    return read(file, storeFirstDate, Periods.DAILY, attributes, dateColumn);
  }

  /**
   * Reads a calendar file of one row per period of {@code periodDays} days.
   *
   * @see #read(Path, LocalDate, SeriesAttributes, String)
   */
  public static CalendarReadResult read(Path file, LocalDate storeFirstDate, int periodDays,
      SeriesAttributes attributes, String dateColumn) {
    Periods.requireValid(periodDays);
    List<String> warnings = new ArrayList<>();
    try (CsvSource source = CsvSource.open(file)) {
      String[] header = source.readHeader();
      Cells.requireDistinct(file, header);
      int dateIndex = Cells.requireColumn(file, header, dateColumn, Setting.DATE_COLUMN.toString());
      List<Group> groups = groupColumns(file, header, dateIndex, attributes, warnings);

      long firstEpochDay = storeFirstDate.toEpochDay();
      List<String[]> rows = new ArrayList<>();
      LongArrayList rowLines = new LongArrayList();
      long previous = Cells.NOT_A_DATE;
      long firstDataLine = 0;
      long firstFileDay = Cells.NOT_A_DATE;
      for (CsvRecord record = source.next(); record != null; record = source.next()) {
        long line = source.lineNumber();
        long epochDay = Cells.requireDate(file, line, dateIndex + 1, dateColumn, record.getField(dateIndex));
        if (previous != Cells.NOT_A_DATE) {
          checkNextDate(file, line, dateIndex + 1, previous, epochDay, periodDays);
        } else {
          firstDataLine = line;
          firstFileDay = epochDay;
          if (Math.floorMod(epochDay - firstEpochDay, periodDays) != 0) {
            LocalDate onStep = storeFirstDate.plusDays(Math.floorDiv(epochDay - firstEpochDay, periodDays)
                * (long) periodDays);
            throw new InputFormatException(file, line, dateIndex + 1, "calendar date " + LocalDate.ofEpochDay(epochDay)
                + " is off the store's step of " + periodDays + " days from its first date " + storeFirstDate
                + ": expected " + onStep + " or " + onStep.plusDays(periodDays));
          }
        }
        previous = epochDay;
        if (epochDay >= firstEpochDay) {
          rows.add(record.getFields().toArray(new String[0]));
          rowLines.add(line);
        }
      }
      if (previous == Cells.NOT_A_DATE) {
        throw new InputFormatException(file, 0, 0,
            "no calendar rows: expected dates covering the first sales day " + storeFirstDate);
      }
      if (firstFileDay > firstEpochDay) {
        throw new InputFormatException(file, firstDataLine, dateIndex + 1, "calendar starts "
            + LocalDate.ofEpochDay(firstFileDay) + ": expected it to cover the first sales day " + storeFirstDate);
      }
      if (rows.isEmpty()) {
        throw new InputFormatException(file, 0, 0, "calendar ends " + LocalDate.ofEpochDay(previous)
            + ": expected it to cover the first sales day " + storeFirstDate);
      }
      List<ArrayDayCalendar.Column> columns = new ArrayList<>(groups.size());
      for (Group group : groups) {
        columns.add(buildColumn(file, header, group, rows, rowLines, attributes, warnings));
      }
      return new CalendarReadResult(new ArrayDayCalendar(rows.size(), columns), warnings);
    }
  }

  private static void checkNextDate(Path file, long line, int column, long previous, long epochDay,
      int periodDays) {
    long expected = previous + periodDays;
    if (epochDay == expected) {
      return;
    }
    String expectedText = LocalDate.ofEpochDay(expected).toString();
    String foundText = LocalDate.ofEpochDay(epochDay).toString();
    if (epochDay == previous) {
      throw new InputFormatException(file, line, column,
          "duplicate calendar date " + foundText + ": expected " + expectedText);
    }
    if (epochDay < previous) {
      throw new InputFormatException(file, line, column,
          "calendar dates not ascending: expected " + expectedText + ", found " + foundText);
    }
    throw new InputFormatException(file, line, column, "calendar gap: expected " + expectedText + ", found "
        + foundText);
  }

  private static List<Group> groupColumns(Path file, String[] header, int dateIndex, SeriesAttributes attributes,
      List<String> warnings) {
    Map<String, Group> byName = new LinkedHashMap<>();
    for (int c = 0; c < header.length; c++) {
      if (c == dateIndex) {
        continue;
      }
      Matcher keyed = KEYED_HEADER.matcher(header[c]);
      if (!keyed.matches()) {
        Group existing = byName.get(header[c]);
        if (existing != null) {
          throw new InputFormatException(file, 1, c + 1, "column '" + header[c] + "' is global here but keyed by "
              + existing.keyAttribute + " in another column: expected one or the other");
        }
        Group group = new Group(header[c], -1, null);
        group.sources.add(new int[] {c, 0});
        byName.put(header[c], group);
        continue;
      }
      String name = keyed.group(1);
      String attribute = keyed.group(2);
      String value = keyed.group(3);
      int attributeIndex = attributes.attributeIndex(attribute);
      if (attributeIndex < 0) {
        throw new InputFormatException(file, 1, c + 1, "column '" + header[c] + "' is keyed by '" + attribute
            + "', which is not a series attribute: expected one of " + SeriesKeys.attributeNames(attributes));
      }
      Group group = byName.get(name);
      if (group == null) {
        group = new Group(name, attributeIndex, attribute);
        byName.put(name, group);
      } else if (group.attributeIndex != attributeIndex) {
        String was = group.keyAttribute == null ? "global" : "keyed by " + group.keyAttribute;
        throw new InputFormatException(file, 1, c + 1, "column '" + header[c] + "' is keyed by " + attribute
            + " but '" + name + "' is " + was + " in another column: expected one key per column name");
      }
      int keyCode = attributes.codeOf(attributeIndex, value);
      if (keyCode < 0) {
        warnings.add("calendar column '" + header[c] + "': no series has " + attribute + "=" + value
            + "; column ignored");
        continue;
      }
      group.sources.add(new int[] {c, keyCode});
    }
    return new ArrayList<>(byName.values());
  }

  private static ArrayDayCalendar.Column buildColumn(Path file, String[] header, Group group, List<String[]> rows,
      LongArrayList rowLines, SeriesAttributes attributes, List<String> warnings) {
    int dayCount = rows.size();
    long numberCellCount = 0;
    long otherCellCount = 0;
    int firstOtherDay = Integer.MAX_VALUE;
    int firstOtherColumn = 0;
    for (int[] source : group.sources) {
      for (int day = 0; day < dayCount; day++) {
        String cell = rows.get(day)[source[0]];
        if (cell.isEmpty()) {
          continue;
        }
        if (Cells.isNonFiniteNumber(cell)) {
          throw new InputFormatException(file, rowLines.getLong(day), source[0] + 1, "calendar column '"
              + header[source[0]] + "' value '" + Excerpts.of(cell) + "': expected a finite number, a category or an"
              + " empty cell (empty means unknown)");
        }
        if (Cells.isDecimal(cell)) {
          if (Float.isInfinite((float) Double.parseDouble(cell))) {
            throw new InputFormatException(file, rowLines.getLong(day), source[0] + 1, "calendar column '"
                + header[source[0]] + "' value '" + Excerpts.of(cell) + "': expected a number of at most "
                + Float.MAX_VALUE + " in size");
          }
          numberCellCount++;
        } else {
          otherCellCount++;
          if (day < firstOtherDay) {
            firstOtherDay = day;
            firstOtherColumn = source[0] + 1;
          }
        }
      }
    }
    boolean numeric = otherCellCount == 0;
    // A column of numbers with a few stray texts is most likely a typo, not a category list: reading it as categories
    // changes every value the model sees, so the user hears about the first stray cell.
    if (!numeric && numberCellCount > otherCellCount) {
      warnings.add(file + ", line " + rowLines.getLong(firstOtherDay) + ", column " + firstOtherColumn
          + ": calendar column '" + group.name + "' read as categories because " + otherCellCount + " of "
          + (numberCellCount + otherCellCount) + " cells are not numbers (first: '"
          + Excerpts.of(rows.get(firstOtherDay)[firstOtherColumn - 1])
          + "'); write numbers only, or leave a cell empty for unknown");
    }
    int keyRowCount = group.attributeIndex < 0 ? 1 : attributes.cardinality(group.attributeIndex);
    float[][] values = new float[keyRowCount][dayCount];
    for (float[] keyRow : values) {
      Arrays.fill(keyRow, Float.NaN);
    }
    List<String> categories = new ArrayList<>();
    Object2IntOpenHashMap<String> codeByCategory = new Object2IntOpenHashMap<>();
    codeByCategory.defaultReturnValue(-1);
    for (int day = 0; day < dayCount; day++) {
      String[] row = rows.get(day);
      for (int[] source : group.sources) {
        String cell = row[source[0]];
        if (cell.isEmpty()) {
          continue;
        }
        float value;
        if (numeric) {
          value = (float) Double.parseDouble(cell);
        } else {
          int code = codeByCategory.getInt(cell);
          if (code < 0) {
            code = categories.size();
            categories.add(cell);
            codeByCategory.put(cell, code);
          }
          value = code;
        }
        values[source[1]][day] = value;
      }
    }
    return new ArrayDayCalendar.Column(group.name, numeric ? ColumnKind.NUMERIC : ColumnKind.CATEGORICAL,
        numeric ? List.of() : categories, group.keyAttribute, values);
  }
}
