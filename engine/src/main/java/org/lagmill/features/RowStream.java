package org.lagmill.features;

/**
 * Feature rows of a fixed set of (series, day) pairs, produced in a fixed order into a reusable {@link FeatureBatch}.
 * The row count is known before streaming, so the learner can size its Dataset; streaming twice yields the same
 * rows in the same order (the learner samples in one pass and pushes in the next).
 */
public interface RowStream {
  /** Called each time the batch is full, and once more with the last partial batch (if it holds rows). */
  interface BatchConsumer {
    void accept(FeatureBatch batch);
  }

  FeatureSchema schema();

  /** Exact number of rows {@link #stream} will produce. */
  long rowCount();

  /** Produces every row into {@code batch} (whose featureCount matches the schema), handing each full batch on. */
  void stream(FeatureBatch batch, BatchConsumer consumer);
}
