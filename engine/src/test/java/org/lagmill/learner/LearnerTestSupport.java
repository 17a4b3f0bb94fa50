package org.lagmill.learner;

import org.lagmill.features.FeatureBatch;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeFloatArray;

/** Shared helpers for the learner tests. */
final class LearnerTestSupport {
  private LearnerTestSupport() {
  }

  /** Predictions for every row of {@code rows}, pushed through one batch holding them all. */
  static double[] predict(TrainedModel model, MemoryBudget budget, MatrixRowStream rows, boolean raw) {
    double[] out = new double[(int) rows.rowCount()];
    try (FeatureBatch batch = new FeatureBatch(budget, (int) rows.rowCount(), rows.schema().featureCount())) {
      rows.stream(batch, full -> {
        double[] part = new double[full.rowCount()];
        if (raw) {
          model.predictRaw(full, part);
        } else {
          model.predict(full, part);
        }
        System.arraycopy(part, 0, out, (int) full.firstRowIndex(), full.rowCount());
      });
    }
    return out;
  }

  /**
   * The obvious route: the whole matrix in native memory, handed to {@link DatasetBuilder#buildFromMatrix}.
   */
  static TrainingDataset fromWholeMatrix(MemoryBudget budget, DatasetBuilder builder, MatrixRowStream rows) {
    int rowCount = (int) rows.rowCount();
    int featureCount = rows.schema().featureCount();
    try (NativeFloatArray matrix = new NativeFloatArray(budget, (long) rowCount * featureCount);
        NativeFloatArray labels = new NativeFloatArray(budget, rowCount)) {
      for (int r = 0; r < rowCount; r++) {
        for (int c = 0; c < featureCount; c++) {
          matrix.set(r * featureCount + c, rows.rows()[r][c]);
        }
        labels.set(r, rows.labels()[r]);
      }
      return builder.buildFromMatrix(matrix.address(), rowCount, rows.schema(), labels);
    }
  }
}
