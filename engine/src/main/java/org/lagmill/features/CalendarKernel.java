package org.lagmill.features;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.List;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * Date features (day_of_week 0 = Monday .. 6, day_of_month 1..31, month 1..12, week_of_year as the ISO-8601 week
 * 1..53, day_of_year 1..366) and every column of the history's day calendar as {@code cal_<name>}. A per-attribute
 * calendar column reads the value for the series' own code of its key attribute.
 *
 * <p>Date features are tabulated once per pass for the pass's day range ({@code 4 × features × days} heap bytes), so
 * no date object is made per row.
 */
final class CalendarKernel implements FeatureKernel {
  private final List<FeatureSpec.CalendarFeature> dateFeatures;
  private final int dateFeatureCount;
  private final int tableFirstDayIndex;
  private final float[] dateTable;
  private final DayCalendar calendar;
  private final int[] columnIndexes;
  private final int[] keyAttributeIndexes;
  private final int[] keyCodes;

  /** @param firstDayIndex first row day of the pass; {@code endDayIndex} one past the last */
  CalendarKernel(SalesHistory history, List<FeatureSpec.CalendarFeature> dateFeatures, boolean calendarColumns,
      int firstDayIndex, int endDayIndex) {
    this.dateFeatures = List.copyOf(dateFeatures);
    this.dateFeatureCount = dateFeatures.size();
    this.tableFirstDayIndex = firstDayIndex;
    int dayCount = Math.max(0, endDayIndex - firstDayIndex);
    this.dateTable = new float[dayCount * dateFeatureCount];
    LocalDate date = history.dateOf(firstDayIndex);
    for (int d = 0; d < dayCount; d++) {
      for (int k = 0; k < dateFeatureCount; k++) {
        dateTable[d * dateFeatureCount + k] = dateValue(dateFeatures.get(k), date);
      }
      date = date.plusDays(1);
    }
    this.calendar = history.calendar();
    int columnCount = calendarColumns ? calendar.columnCount() : 0;
    this.columnIndexes = new int[columnCount];
    this.keyAttributeIndexes = new int[columnCount];
    this.keyCodes = new int[columnCount];
    SeriesAttributes attributes = history.attributes();
    for (int c = 0; c < columnCount; c++) {
      columnIndexes[c] = c;
      String key = calendar.keyAttribute(c);
      keyAttributeIndexes[c] = key == null ? -1 : attributes.attributeIndex(key);
      if (key != null && keyAttributeIndexes[c] < 0) {
        throw new IllegalArgumentException("calendar column '" + calendar.columnName(c) + "' is keyed by attribute '"
            + key + "', which the series do not have; add that attribute to the series or drop the column");
      }
    }
  }

  static float dateValue(FeatureSpec.CalendarFeature feature, LocalDate date) {
    switch (feature) {
      case DAY_OF_WEEK:
        return date.getDayOfWeek().getValue() - 1;
      case DAY_OF_MONTH:
        return date.getDayOfMonth();
      case MONTH:
        return date.getMonthValue();
      case WEEK_OF_YEAR:
        return isoWeekOfYear(date);
      case DAY_OF_YEAR:
        return date.getDayOfYear();
      default:
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
      keyCodes[c] = keyAttributeIndexes[c] < 0 ? 0 : series.attributeCodes[keyAttributeIndexes[c]];
    }
  }

  @Override
  public void compute(SeriesContext series, FeatureBatch batch, int batchRow, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int columnCount = columnIndexes.length;
    for (int i = 0; i < rowCount; i++) {
      int day = dayIndexes[dayOffset + i];
      int row = batchRow + i;
      int tableOffset = (day - tableFirstDayIndex) * dateFeatureCount;
      for (int k = 0; k < dateFeatureCount; k++) {
        batch.set(row, firstFeatureIndex + k, dateTable[tableOffset + k]);
      }
      for (int c = 0; c < columnCount; c++) {
        batch.set(row, firstFeatureIndex + dateFeatureCount + c, calendar.value(columnIndexes[c], keyCodes[c], day));
      }
    }
  }
}
