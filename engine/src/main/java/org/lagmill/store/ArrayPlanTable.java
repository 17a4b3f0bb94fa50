package org.lagmill.store;

import java.util.List;

/** {@link PlanTable} from plain arrays: per key its change periods and, per change point, one value per column. */
public final class ArrayPlanTable implements PlanTable {
  private final List<String> keyAttributeNames;
  private final List<String> columnNames;
  private final int[] keyBySeries;
  private final int[][] changeDaysByKey;
  private final float[][] valuesByKey;
  private final int reachDayIndex;

  /**
   * @param keyBySeries the key of each series, or {@link #NO_KEY}
   * @param changeDaysByKey per key, its change periods, ascending and distinct, each {@code >= 0}
   * @param valuesByKey per key, {@code changeCount × columnCount} values, change point by change point
   * @param reachDayIndex the last period the plan speaks for
   */
  public ArrayPlanTable(List<String> keyAttributeNames, List<String> columnNames, int[] keyBySeries,
      int[][] changeDaysByKey, float[][] valuesByKey, int reachDayIndex) {
    this.keyAttributeNames = List.copyOf(keyAttributeNames);
    this.columnNames = List.copyOf(columnNames);
    this.keyBySeries = keyBySeries;
    this.changeDaysByKey = changeDaysByKey;
    this.valuesByKey = valuesByKey;
    this.reachDayIndex = reachDayIndex;
    if (changeDaysByKey.length != valuesByKey.length) {
      throw new IllegalArgumentException("change days for " + changeDaysByKey.length + " keys but values for "
          + valuesByKey.length);
    }
    for (int k = 0; k < changeDaysByKey.length; k++) {
      if (valuesByKey[k].length != changeDaysByKey[k].length * columnNames.size()) {
        throw new IllegalArgumentException("key " + k + " has " + changeDaysByKey[k].length + " change points and "
            + valuesByKey[k].length + " values, expected " + changeDaysByKey[k].length * columnNames.size());
      }
    }
  }

  @Override
  public int keyCount() {
    return changeDaysByKey.length;
  }

  @Override
  public int columnCount() { return columnNames.size(); }
  @Override
  public String columnName(int columnIndex) { return columnNames.get(columnIndex); }
  @Override
  public List<String> keyAttributeNames() { return keyAttributeNames; }
  @Override
  public int changeCount(int keyIndex) { return changeDaysByKey[keyIndex].length; }
  @Override
  public int changeDayIndex(int keyIndex, int changeIndex) { return changeDaysByKey[keyIndex][changeIndex]; }
  @Override
  public int reachDayIndex() { return reachDayIndex; }

  @Override
  public int keyOf(int seriesIndex) {
    return seriesIndex < keyBySeries.length ? keyBySeries[seriesIndex] : NO_KEY;
  }

  @Override
  public float changeValue(int keyIndex, int changeIndex, int columnIndex) {
    return valuesByKey[keyIndex][changeIndex * columnNames.size() + columnIndex];
  }
}
