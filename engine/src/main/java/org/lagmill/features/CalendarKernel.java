package org.lagmill.features;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * Date features (day_of_week 0 = Monday .. 6, day_of_month 1..31, month 1..12, week_of_year as the ISO-8601 week
 * 1..53, day_of_year 1..366) and every column of the history's day calendar as {@code cal_<name>}. A per-attribute
 * calendar column reads the value for the series' own code of its key attribute.
 *
 * <p>Date features read the first date of each period. In a store whose period is a whole number of weeks (weekly)
 * every period starts on the same weekday, so {@code day_of_week} would be one constant value: it is left out of the
 * features (and so of the schema and the model), and {@code week_of_year} carries the season.
 *
 * <p>Date features are tabulated once per pass for the pass's day range ({@code 4 × features × days} heap bytes), so
 * no date object is made per row. Calendar columns are tabulated too, one row of days per key code
 * ({@code 4 × codes × days} bytes per column, one code for a global column), so no calendar lookup is made per row;
 * a keyed column whose table would pass {@link #MAX_TABULATED_CELLS} floats in all keeps a single row instead,
 * refilled when a series has another key code than the series before it.
 */
final class CalendarKernel implements FeatureKernel {
  /** Floats of calendar tables held per pass (16 MiB) before a keyed column falls back to one refilled row. */
  static final int MAX_TABULATED_CELLS = 1 << 22;

  private final List<FeatureSpec.CalendarFeature> dateFeatures;
  private final int dateFeatureCount;
  private final int tableFirstDayIndex;
  private final float[] dateTable;
  private final DayCalendar calendar;
  private final int[] columnIndexes;
  private final int[] keyAttributeIndexes;
  private final int tableDayCount;
  /** Per column: key-code rows of {@link #tableDayCount} values each (one row when refilled per series). */
  private final float[][] columnTables;
  private final boolean[] refilledPerSeries;
  private final int[] refilledKeyCodes;
  /** Per column: offset of the current series' row in its table, minus the table's first day index. */
  private final int[] columnOffsets;

  /** @param firstDayIndex first row day of the pass; {@code endDayIndex} one past the last */
  CalendarKernel(SalesHistory history, List<FeatureSpec.CalendarFeature> dateFeatures, boolean calendarColumns,
      int firstDayIndex, int endDayIndex) {
    this.dateFeatures = withoutConstantFeatures(dateFeatures, history.periodDays());
    this.dateFeatureCount = this.dateFeatures.size();
    this.tableFirstDayIndex = firstDayIndex;
    int dayCount = Math.max(0, endDayIndex - firstDayIndex);
    this.dateTable = new float[dayCount * dateFeatureCount];
    for (int d = 0; d < dayCount; d++) {
      LocalDate date = history.dateOf(firstDayIndex + d);
      for (int k = 0; k < dateFeatureCount; k++) {
        dateTable[d * dateFeatureCount + k] = dateValue(this.dateFeatures.get(k), date);
      }
    }
    this.calendar = history.calendar();
    int columnCount = calendarColumns ? calendar.columnCount() : 0;
    this.columnIndexes = new int[columnCount];
    this.keyAttributeIndexes = new int[columnCount];
    this.tableDayCount = dayCount;
    this.columnTables = new float[columnCount][];
    this.refilledPerSeries = new boolean[columnCount];
    this.refilledKeyCodes = new int[columnCount];
    this.columnOffsets = new int[columnCount];
    SeriesAttributes attributes = history.attributes();
    long tabulatedCells = 0;
    for (int c = 0; c < columnCount; c++) {
      columnIndexes[c] = c;
      String key = calendar.keyAttribute(c);
      keyAttributeIndexes[c] = key == null ? -1 : attributes.attributeIndex(key);
      if (key != null && keyAttributeIndexes[c] < 0) {
        throw new InvalidRequestException("calendar column '" + calendar.columnName(c) + "' is keyed by attribute '"
            + key + "', which the series do not have; add that attribute to the series or drop the column");
      }
      int codeCount = key == null ? 1 : Math.max(1, attributes.cardinality(keyAttributeIndexes[c]));
      long cells = (long) codeCount * dayCount;
      if (key != null && tabulatedCells + cells > MAX_TABULATED_CELLS) {
        refilledPerSeries[c] = true;
        refilledKeyCodes[c] = -1;
        columnTables[c] = new float[dayCount];
        tabulatedCells += dayCount;
      } else {
        columnTables[c] = new float[(int) cells];
        for (int code = 0; code < codeCount; code++) {
          tabulate(c, code, columnTables[c], code * dayCount);
        }
        tabulatedCells += cells;
      }
    }
  }

  /** The requested date features less {@code day_of_week} when every period starts on the same weekday. */
  static List<FeatureSpec.CalendarFeature> withoutConstantFeatures(List<FeatureSpec.CalendarFeature> requested,
      int periodDays) {
    if (periodDays % 7 != 0) {
      return List.copyOf(requested);
    }
    return requested.stream().filter(f -> f != FeatureSpec.CalendarFeature.DAY_OF_WEEK).toList();
  }

  private void tabulate(int column, int keyCode, float[] table, int offset) {
    for (int d = 0; d < tableDayCount; d++) {
      table[offset + d] = calendar.value(columnIndexes[column], keyCode, tableFirstDayIndex + d);
    }
  }

  /** Heap bytes of the date and calendar tables. */
  long heapBytes() {
    long bytes = 4L * dateTable.length;
    for (float[] table : columnTables) {
      bytes += 4L * table.length;
    }
    return bytes;
  }

  static float dateValue(FeatureSpec.CalendarFeature feature, LocalDate date) {
    switch (feature) {
      case DAY_OF_WEEK :
        return date.getDayOfWeek().getValue() - 1;
      case DAY_OF_MONTH :
        return date.getDayOfMonth();
      case MONTH :
        return date.getMonthValue();
      case WEEK_OF_YEAR :
        return isoWeekOfYear(date);
      case DAY_OF_YEAR :
        return date.getDayOfYear();
      default :
        throw new AssertionError(feature);
    }
  }

  /**
   * ISO-8601 week number: week 1 holds the year's first Thursday, weeks start on Monday. Computed from the day of the
   * year and weekday so the tests can check it against java.time's own field.
   */
  static int isoWeekOfYear(LocalDate date) {
    int weekday = date.getDayOfWeek().getValue();
    int week = (date.getDayOfYear() - weekday + 10) / 7;
    if (week < 1) {
      return isoWeeksInYear(date.getYear() - 1);
    }
    if (week > isoWeeksInYear(date.getYear())) {
      return 1;
    }
    return week;
  }

  private static int isoWeeksInYear(int year) {
    DayOfWeek januaryFirst = LocalDate.of(year, 1, 1).getDayOfWeek();
    boolean leap = LocalDate.of(year, 1, 1).isLeapYear();
    return januaryFirst == DayOfWeek.THURSDAY || (leap && januaryFirst == DayOfWeek.WEDNESDAY) ? 53 : 52;
  }

  @Override
  public int featureCount() {
    return dateFeatureCount + columnIndexes.length;
  }

  @Override
  public void describe(List<String> names, List<Boolean> categorical) {
    for (FeatureSpec.CalendarFeature feature : dateFeatures) {
      names.add(feature.configName());
      categorical.add(false);
    }
    for (int c : columnIndexes) {
      names.add("cal_" + calendar.columnName(c));
      categorical.add(calendar.kind(c) == DayCalendar.ColumnKind.CATEGORICAL);
    }
  }

  @Override
  public void beginSeries(SeriesContext series) {
    for (int c = 0; c < columnIndexes.length; c++) {
      int keyCode = keyAttributeIndexes[c] < 0 ? 0 : series.attributeCodes[keyAttributeIndexes[c]];
      if (refilledPerSeries[c]) {
        if (refilledKeyCodes[c] != keyCode) {
          tabulate(c, keyCode, columnTables[c], 0);
          refilledKeyCodes[c] = keyCode;
        }
        columnOffsets[c] = -tableFirstDayIndex;
      } else {
        columnOffsets[c] = keyCode * tableDayCount - tableFirstDayIndex;
      }
    }
  }

  @Override
  public void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int dateCount = dateFeatureCount;
    float[] dates = dateTable;
    int out;
    for (int k = 0; k < dateCount; k++) {
      out = firstFeatureIndex + k;
      int offset = k - tableFirstDayIndex * dateCount;
      for (int i = 0; i < rowCount; i++, out += rowStride) {
        rows[out] = dates[offset + dayIndexes[dayOffset + i] * dateCount];
      }
    }
    for (int c = 0; c < columnIndexes.length; c++) {
      float[] table = columnTables[c];
      int offset = columnOffsets[c];
      out = firstFeatureIndex + dateCount + c;
      for (int i = 0; i < rowCount; i++) {
        rows[out] = table[offset + dayIndexes[dayOffset + i]];
        out += rowStride;
      }
    }
  }
}
