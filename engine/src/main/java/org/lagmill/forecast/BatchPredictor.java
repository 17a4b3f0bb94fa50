package org.lagmill.forecast;

import org.lagmill.features.FeatureBatch;

/** Predicts expected units for every row of a filled feature batch; implemented by a trained model. */
@FunctionalInterface
public interface BatchPredictor {
  /** Writes one prediction per row of {@code batch} into {@code out[0 .. batch.rowCount())}. */
  void predict(FeatureBatch batch, double[] out);
}
