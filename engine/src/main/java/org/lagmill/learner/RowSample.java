package org.lagmill.learner;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.lagmill.features.FeatureBatch;

/**
 * The sampling pass: picks {@code sampleRowCount} of {@code rowCount} stream rows uniformly at random (Knuth's
 * selection sampling, so positions come out sorted and no index array is needed) and keeps, per column, the sampled
 * values LightGBM needs to place bin boundaries.
 *
 * <p>Kept values follow LightGBM's sampled-column format, as its own {@code LGBM_DatasetCreateFromMat} builds it:
 * a value is kept when {@code |v| > 1e-35} or it is NaN (zeros are implicit, NaN marks a missing value), and its
 * index is the row's position within the sample ({@code 0 .. sampleRowCount-1}), not its row index in the stream.
 */
final class RowSample {
  /** LightGBM's kZeroThreshold: values at most this far from 0 count as zero. */
  static final double ZERO_THRESHOLD = 1e-35;

  private final long rowCount;
  private final int sampleRowCount;
  private final int featureCount;
  private final SplittableRandom random;
  private final float[][] values;
  private final int[][] positions;
  private final int[] keptCounts;
  private long rowsSeen;
  private int rowsSelected;

  RowSample(long rowCount, int sampleRowCount, int featureCount, long seed) {
    assert sampleRowCount <= rowCount;
    this.rowCount = rowCount;
    this.sampleRowCount = sampleRowCount;
    this.featureCount = featureCount;
    this.random = new SplittableRandom(seed);
    this.values = new float[featureCount][];
    this.positions = new int[featureCount][];
    this.keptCounts = new int[featureCount];
    int initialCapacity = Math.min(sampleRowCount, 1024);
    for (int column = 0; column < featureCount; column++) {
      values[column] = new float[initialCapacity];
      positions[column] = new int[initialCapacity];
    }
  }

  /** Consumes one batch of the stream, in stream order. */
  void accept(FeatureBatch batch) {
    int batchRows = batch.rowCount();
    for (int row = 0; row < batchRows; row++) {
      long remainingRows = rowCount - rowsSeen;
      int stillNeeded = sampleRowCount - rowsSelected;
      rowsSeen++;
      // selection sampling: take this row with probability stillNeeded / remainingRows
      if (stillNeeded > 0 && remainingRows * random.nextDouble() < stillNeeded) {
        keep(batch, row, rowsSelected++);
      }
    }
  }

  private void keep(FeatureBatch batch, int row, int samplePosition) {
    for (int column = 0; column < featureCount; column++) {
      float value = batch.get(row, column);
      if (Math.abs(value) > ZERO_THRESHOLD || Float.isNaN(value)) {
        int count = keptCounts[column];
        if (count == values[column].length) {
          int grown = (int) Math.min((long) sampleRowCount, 2L * count);
          values[column] = Arrays.copyOf(values[column], grown);
          positions[column] = Arrays.copyOf(positions[column], grown);
        }
        values[column][count] = value;
        positions[column][count] = samplePosition;
        keptCounts[column] = count + 1;
      }
    }
  }

  /**
   * Whether LightGBM would find at least one category for {@code column} in this sample: a sampled value that is not
   * NaN and whose integer part is not negative (LightGBM counts NaN and negative codes as missing), or a sampled zero
   * (zeros are not kept, so fewer kept values than sampled rows means some were zero).
   */
  boolean hasCategory(int column) {
    int kept = keptCounts[column];
    if (kept < rowsSelected) {
      return true;
    }
    float[] columnValues = values[column];
    for (int i = 0; i < kept; i++) {
      float value = columnValues[i];
      if (!Float.isNaN(value) && (int) value >= 0) {
        return true;
      }
    }
    return false;
  }

  long rowsSeen() {
    return rowsSeen;
  }

  int rowsSelected() {
    return rowsSelected;
  }

  int keptCount(int column) {
    return keptCounts[column];
  }

  float value(int column, int index) {
    return values[column][index];
  }

  int position(int column, int index) {
    return positions[column][index];
  }

  long keptValueCount() {
    long total = 0;
    for (int count : keptCounts) {
      total += count;
    }
    return total;
  }
}
