package org.lagmill.store;

import java.util.List;

/** {@link DayCalendar} from plain arrays; for tests. */
public final class ArrayDayCalendar implements DayCalendar {
  /** One column: values[keyCode][dayIndex] (a global column has one key row). */
  public record Column(String name, ColumnKind kind, List<String> categories, String keyAttribute, float[][] values) {}

  private final int dayCount;
  private final List<Column> columns;

  public ArrayDayCalendar(int dayCount, List<Column> columns) {
    this.dayCount = dayCount;
    this.columns = List.copyOf(columns);
  }

  @Override
  public int dayCount() { return dayCount; }
  @Override
  public int columnCount() { return columns.size(); }
  @Override
  public String columnName(int c) { return columns.get(c).name(); }
  @Override
  public ColumnKind kind(int c) { return columns.get(c).kind(); }

  @Override
  public int cardinality(int c) {
    return columns.get(c).kind() == ColumnKind.CATEGORICAL ? columns.get(c).categories().size() : 0;
  }

  @Override
  public String categoryValue(int c, int code) { return columns.get(c).categories().get(code); }
  @Override
  public String keyAttribute(int c) { return columns.get(c).keyAttribute(); }

  @Override
  public float value(int c, int keyCode, int dayIndex) {
    Column column = columns.get(c);
    if (dayIndex < 0 || dayIndex >= dayCount) {
      return Float.NaN;
    }
    float[][] v = column.values();
    int row = column.keyAttribute() == null ? 0 : keyCode;
    return row < 0 || row >= v.length ? Float.NaN : v[row][dayIndex];
  }
}
