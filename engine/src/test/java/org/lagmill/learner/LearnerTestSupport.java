package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_void;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;
import com.microsoft.ml.lightgbm.lightgbmlibConstants;
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
   * The obvious route: the whole matrix in native memory, handed to LGBM_DatasetCreateFromMat with the parameter
   * string the builder would use.
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
      SWIGTYPE_p_p_void out = lightgbmlib.new_voidpp();
      int returnCode = lightgbmlib.LGBM_DatasetCreateFromMat(Native.voidPointer(matrix.address()),
          lightgbmlibConstants.C_API_DTYPE_FLOAT32, rowCount, featureCount, 1,
          builder.parameterString(rows.schema(), rowCount), null, out);
      SWIGTYPE_p_void handle = Native.takeHandle(out);
      Native.check(returnCode, "LGBM_DatasetCreateFromMat");
      Native.check(lightgbmlib.LGBM_DatasetSetField(handle, "label", Native.voidPointer(labels.address()), rowCount,
          lightgbmlibConstants.C_API_DTYPE_FLOAT32), "LGBM_DatasetSetField");
      return new TrainingDataset(handle, rows.schema(),
          new DatasetStats(rowCount, featureCount, rowCount, 0, -1, -1), false);
    }
  }
}
