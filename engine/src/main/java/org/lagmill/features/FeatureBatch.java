package org.lagmill.features;

import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeFloatArray;

/**
 * A reusable block of feature rows: a row-major float32 matrix in native memory ({@code capacityRows × featureCount})
 * plus per-row label, weight, series index and day index in heap arrays. The streaming pass fills it, the learner
 * pushes it, then it is reset and filled again: nothing is allocated per row.
 *
 * <p>Missing feature values are NaN. Not thread-safe; closing frees the native matrix.
 */
public final class FeatureBatch implements AutoCloseable {
  private final int capacityRows;
  private final int featureCount;
  private final NativeFloatArray values;
  private final float[] labels;
  private final float[] weights;
  private final int[] seriesIndexes;
  private final int[] dayIndexes;
  private int rowCount;
  private long firstRowIndex;

  public FeatureBatch(MemoryBudget budget, int capacityRows, int featureCount) {
    if (capacityRows < 1 || featureCount < 1) {
      throw new IllegalArgumentException("capacityRows and featureCount must be >= 1, got " + capacityRows + " and "
          + featureCount);
    }
    this.capacityRows = capacityRows;
    this.featureCount = featureCount;
    this.values = new NativeFloatArray(budget, (long) capacityRows * featureCount);
    this.labels = new float[capacityRows];
    this.weights = new float[capacityRows];
    this.seriesIndexes = new int[capacityRows];
    this.dayIndexes = new int[capacityRows];
  }

  public int capacityRows() { return capacityRows; }
  public int featureCount() { return featureCount; }
  public int rowCount() { return rowCount; }
  public boolean isFull() { return rowCount == capacityRows; }

  /** Index of row 0 of this batch within the whole stream (rows are numbered in stream order from 0). */
  public long firstRowIndex() {
    return firstRowIndex;
  }

  /** Empties the batch; the next row added is row {@code firstRowIndex} of the stream. */
  public void reset(long firstRowIndex) {
    this.rowCount = 0;
    this.firstRowIndex = firstRowIndex;
  }

  /**
   * Appends a row whose features are then set with {@link #set}; returns its row index within the batch.
   *
   * @param label the target (units sold that day), NaN when unknown (prediction rows)
   */
  public int addRow(int seriesIndex, int dayIndex, float label, float weight) {
    assert rowCount < capacityRows : "batch full";
    int row = rowCount++;
    seriesIndexes[row] = seriesIndex;
    dayIndexes[row] = dayIndex;
    labels[row] = label;
    weights[row] = weight;
    return row;
  }

  public void set(int row, int featureIndex, float value) {
    values.set(row * featureCount + featureIndex, value);
  }

  /**
   * Sets every feature of rows {@code [firstRow, firstRow + rowCount)} from a row-major heap array (row {@code r},
   * feature {@code f} at {@code src[r * featureCount() + f]}) in one bulk copy; the rows must have been added.
   */
  public void setRows(int firstRow, float[] src, int rowCount) {
    assert firstRow >= 0 && firstRow + rowCount <= this.rowCount : firstRow + "+" + rowCount;
    values.put(firstRow * featureCount, src, 0, rowCount * featureCount);
  }

  public float get(int row, int featureIndex) {
    return values.get(row * featureCount + featureIndex);
  }

  /** Native address of the row-major matrix: row r, feature f at {@code address + 4 * (r * featureCount + f)}. */
  public long valuesAddress() {
    return values.address();
  }

  /** Heap arrays of length {@link #capacityRows()}; only the first {@link #rowCount()} entries are meaningful. */
  public float[] labels() {
    return labels;
  }
  public float[] weights() { return weights; }
  public int[] seriesIndexes() { return seriesIndexes; }
  public int[] dayIndexes() { return dayIndexes; }

  public long offHeapBytes() { return values.offHeapBytes(); }

  @Override
  public void close() {
    values.close();
  }
}
