package org.lagmill.store;

import java.util.List;

/**
 * Known-future drivers (planned promotions, discount depth, displays, leaflets): per plan key, change points of one or
 * more numeric columns. Value {@code k} of a key holds from period {@code changeDayIndex(key, k)} until the key's next
 * change point; before a key's first change point, and for a series matched by no plan row, every column reads 0
 * (nothing planned). A plan file with a {@code date} column is stored in the same form: a row holding for one period
 * becomes a change point at that period and one back to 0 at the next period without a row.
 *
 * <p>The plan speaks for periods up to {@link #reachDayIndex()} (the period of the latest date in its file); past it a
 * key's last values simply continue, which is what a forecast may read only when the user allows it (a forecast
 * checks the horizon against the reach first). Change points are sorted by period, at most one per period, and may
 * lie past the last sales day.
 */
public interface PlanTable {
  /** {@link #keyOf} of a series no plan row matched. */
  int NO_KEY = -1;

  /** No plan. */
  PlanTable EMPTY = new ArrayPlanTable(List.of(), List.of(), new int[0], new int[0][], new float[0][], -1);

  /** Number of value columns; 0 for a store without a plan. */
  int columnCount();

  /** Name of a value column as the plan file spelled it; its feature is {@code plan_<name>}. */
  String columnName(int columnIndex);

  /** The series attributes the plan file's rows were keyed by (empty: one key for the whole chain). */
  List<String> keyAttributeNames();

  /** The plan key of a series, or {@link #NO_KEY} when no plan row matched it. */
  int keyOf(int seriesIndex);

  /** Number of plan keys; key indexes run {@code 0 .. keyCount()-1}. */
  int keyCount();

  /** Number of change points of a key. */
  int changeCount(int keyIndex);

  /** Period index from which change point {@code changeIndex} holds, {@code >= 0}. */
  int changeDayIndex(int keyIndex, int changeIndex);

  /** Value of one column at one change point. */
  float changeValue(int keyIndex, int changeIndex, int columnIndex);

  /** Last period index the plan speaks for: the period of its file's latest date; -1 for no plan. */
  int reachDayIndex();

  /**
   * A view of {@code plan} with the same keys and change points whose series get their keys from
   * {@code keyOfSeries}: what a writer stores when it keeps the plan while the series change (an append adding
   * series, a shard taking some of them).
   */
  static PlanTable withSeriesKeys(PlanTable plan, java.util.function.IntUnaryOperator keyOfSeries) {
    return new PlanTable() {
      @Override
      public int columnCount() { return plan.columnCount(); }
      @Override
      public String columnName(int c) { return plan.columnName(c); }
      @Override
      public List<String> keyAttributeNames() { return plan.keyAttributeNames(); }
      @Override
      public int keyOf(int s) { return keyOfSeries.applyAsInt(s); }
      @Override
      public int keyCount() { return plan.keyCount(); }
      @Override
      public int changeCount(int k) { return plan.changeCount(k); }
      @Override
      public int changeDayIndex(int k, int i) { return plan.changeDayIndex(k, i); }
      @Override
      public float changeValue(int k, int i, int c) { return plan.changeValue(k, i, c); }
      @Override
      public int reachDayIndex() { return plan.reachDayIndex(); }
    };
  }

  /** True when the store holds no plan. */
  default boolean isEmpty() { return columnCount() == 0; }

  /** The value column names in column order. */
  default List<String> columnNames() {
    String[] names = new String[columnCount()];
    for (int c = 0; c < names.length; c++) {
      names[c] = columnName(c);
    }
    return List.of(names);
  }

  /** Index of a value column by name, or -1. */
  default int columnIndex(String name) {
    for (int c = 0; c < columnCount(); c++) {
      if (columnName(c).equals(name)) {
        return c;
      }
    }
    return -1;
  }

  /** Largest number of change points of any key: what a reader sizes its per-key buffers by. */
  default int maxChangeCount() {
    int max = 0;
    for (int k = 0; k < keyCount(); k++) {
      max = Math.max(max, changeCount(k));
    }
    return max;
  }

  /**
   * The value of a column for a series on a period (binary search over its key's change points: for checks and
   * tests, not for hot loops, which walk the change points with a cursor).
   */
  default float valueAt(int seriesIndex, int columnIndex, int dayIndex) {
    int key = keyOf(seriesIndex);
    if (key == NO_KEY) {
      return 0f;
    }
    int lo = 0;
    int hi = changeCount(key) - 1;
    int found = -1;
    while (lo <= hi) {
      int mid = (lo + hi) >>> 1;
      if (changeDayIndex(key, mid) <= dayIndex) {
        found = mid;
        lo = mid + 1;
      } else {
        hi = mid - 1;
      }
    }
    return found < 0 ? 0f : changeValue(key, found, columnIndex);
  }

  /** "article=A1, banner=north" of a series' plan key values; "all series" when the plan has no key column. */
  default String describeKey(SeriesAttributes attributes, int seriesIndex) {
    List<String> names = keyAttributeNames();
    if (names.isEmpty()) {
      return "all series";
    }
    StringBuilder b = new StringBuilder();
    for (String name : names) {
      int a = attributes.attributeIndex(name);
      if (b.length() > 0) {
        b.append(", ");
      }
      b.append(name).append('=').append(a < 0 ? "?" : attributes.value(a, attributes.code(seriesIndex, a)));
    }
    return b.toString();
  }
}
