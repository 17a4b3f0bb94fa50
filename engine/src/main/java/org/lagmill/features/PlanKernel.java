package org.lagmill.features;

import java.util.List;
import org.lagmill.store.PlanTable;

/**
 * Plan features {@code plan_<column>}: the value the history's plan holds for the series at the row's own period,
 * the target period. A plan is known before the period it applies to, so a row reads the plan as planned for that
 * period even when it lies after a forecast origin; it reads no unit at all. A series no plan row matched reads 0, as
 * does every period before its key's first change point.
 *
 * <p>The columns are the spec's {@link FeatureSpec#planColumns()} (every column of the plan when unset), looked up by
 * name, so a model trained on some columns reads exactly those from a later plan with more or reordered columns. The
 * current key's change points are copied once into buffers sized for the largest key, and each chunk of rows walks
 * them with a cursor: no search, no allocation per row or per series. Series that share a key one after another (the
 * stores of one item, for a plan keyed by item) reuse the copy.
 */
final class PlanKernel implements FeatureKernel {
  private static final int NOT_LOADED = Integer.MIN_VALUE;

  private final PlanTable plan;
  private final int[] planColumnIndexes;
  private final List<String> columnNames;
  private final int[] changeDays;
  private final float[] changeValues;
  private int loadedKey = NOT_LOADED;
  private int changeCount;
  /** Last change point at or before the previous row's period, -1 before the first. */
  private int cursor;

  /**
   * @param requestedColumns the spec's plan columns, or null for every column of {@code plan}
   * @throws IllegalArgumentException when a requested column is not in the plan
   */
  PlanKernel(PlanTable plan, List<String> requestedColumns) {
    this.plan = plan;
    this.columnNames = requestedColumns == null ? plan.columnNames() : List.copyOf(requestedColumns);
    this.planColumnIndexes = PlanColumns.indexesIn(plan, columnNames);
    int maxChanges = planColumnIndexes.length == 0 ? 0 : plan.maxChangeCount();
    this.changeDays = new int[maxChanges];
    this.changeValues = new float[maxChanges * planColumnIndexes.length];
  }

  /** Heap bytes of the change point buffers. */
  long heapBytes() {
    return 4L * (changeDays.length + changeValues.length);
  }

  @Override
  public int featureCount() {
    return planColumnIndexes.length;
  }

  @Override
  public void describe(List<String> names, List<Boolean> categorical) {
    for (String column : columnNames) {
      names.add("plan_" + column);
      categorical.add(false);
    }
  }

  @Override
  public void beginSeries(SeriesContext series) {
    int key = plan.keyOf(series.seriesIndex);
    if (key != loadedKey) {
      load(key);
    }
    cursor = -1;
  }

  private void load(int key) {
    loadedKey = key;
    if (key == PlanTable.NO_KEY) {
      changeCount = 0;
      return;
    }
    changeCount = plan.changeCount(key);
    int featureCount = planColumnIndexes.length;
    for (int i = 0; i < changeCount; i++) {
      changeDays[i] = plan.changeDayIndex(key, i);
      for (int k = 0; k < featureCount; k++) {
        changeValues[i * featureCount + k] = plan.changeValue(key, i, planColumnIndexes[k]);
      }
    }
  }

  @Override
  public void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int featureCount = planColumnIndexes.length;
    int[] days = changeDays;
    float[] values = changeValues;
    int count = changeCount;
    int at = cursor;
    int out = firstFeatureIndex;
    for (int i = 0; i < rowCount; i++, out += rowStride) {
      int day = dayIndexes[dayOffset + i];
      // Rows come in ascending period order within a series, so the cursor only moves forward.
      while (at + 1 < count && days[at + 1] <= day) {
        at++;
      }
      if (at < 0) {
        for (int k = 0; k < featureCount; k++) {
          rows[out + k] = 0f;
        }
      } else {
        int from = at * featureCount;
        for (int k = 0; k < featureCount; k++) {
          rows[out + k] = values[from + k];
        }
      }
    }
    cursor = at;
  }
}
