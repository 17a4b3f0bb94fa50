package org.lagmill.store;

/**
 * Day-level columns from the calendar file, aligned to the store's day index (day 0 = the first sales day) and covering
 * {@code 0 .. dayCount()-1}, which may extend past the last sales day so a forecast can read the horizon.
 *
 * <p>A column is global (one value per day) or per attribute (one value per day and per value of a series attribute,
 * e.g. a payday flag per region; see docs/formats.md for the file convention). Numeric columns hold their number;
 * categorical columns hold a code {@code 0 .. cardinality-1}. Missing cells read NaN.
 */
public interface DayCalendar {
  enum ColumnKind {
    NUMERIC,
    CATEGORICAL
  }

  /** Number of days covered from day index 0; 0 when no calendar was ingested. */
  int dayCount();

  int columnCount();

  String columnName(int columnIndex);

  ColumnKind kind(int columnIndex);

  /** Number of distinct codes of a categorical column, 0 for a numeric one. */
  int cardinality(int columnIndex);

  /** Text of a categorical code. */
  String categoryValue(int columnIndex, int code);

  /** Name of the series attribute a per-attribute column is keyed by, or null for a global column. */
  String keyAttribute(int columnIndex);

  /**
   * Value of a column on a day, NaN when missing or outside the covered days.
   *
   * @param keyCode the series' code of {@link #keyAttribute(int)}; ignored for a global column
   */
  float value(int columnIndex, int keyCode, int dayIndex);

  DayCalendar EMPTY = new DayCalendar() {
    @Override
    public int dayCount() { return 0; }
    @Override
    public int columnCount() { return 0; }
    @Override
    public String columnName(int c) { throw new IndexOutOfBoundsException(); }
    @Override
    public ColumnKind kind(int c) { throw new IndexOutOfBoundsException(); }
    @Override
    public int cardinality(int c) { throw new IndexOutOfBoundsException(); }
    @Override
    public String categoryValue(int c, int code) { throw new IndexOutOfBoundsException(); }
    @Override
    public String keyAttribute(int c) { throw new IndexOutOfBoundsException(); }
    @Override
    public float value(int c, int keyCode, int dayIndex) { return Float.NaN; }
  };
}
