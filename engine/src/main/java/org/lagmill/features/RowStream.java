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

  /**
   * Rows to draw LightGBM's bin sample from: a seeded subset of this stream's rows, with this stream's schema, of at
   * least {@code minimumRowCount} rows, each row exactly as {@link #stream} produces it (features, label, weight).
   * A stream that can produce a subset cheaply (whole series, say) overrides this so the sampling pass does not have
   * to produce every row; the default, and the answer whenever a subset would not be much smaller, is this stream.
   * The subset must stay valid (and may share buffers with this stream) for as long as this stream does; stream one
   * of the two at a time.
   *
   * @param minimumRowCount rows the subset holds at least (callers ask for a few times their sample size)
   * @param seed chooses the subset: the same seed gives the same rows
   */
  default RowStream sampleSource(long minimumRowCount, long seed) {
    return this;
  }
}
