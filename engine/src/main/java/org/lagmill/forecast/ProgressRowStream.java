package org.lagmill.forecast;

import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;
import org.lagmill.progress.ProgressListener;

/** A {@link RowStream} that reports the running row count of each stream to a {@link ProgressListener}. */
final class ProgressRowStream implements RowStream {
  private final RowStream rows;
  private final ProgressListener progress;
  private long streamedRowCount;

  ProgressRowStream(RowStream rows, ProgressListener progress) {
    this.rows = rows;
    this.progress = progress;
  }

  @Override public FeatureSchema schema() { return rows.schema(); }
  @Override public long rowCount() { return rows.rowCount(); }

  /** Rows streamed over every pass so far (the learner streams twice: sample, then push). */
  long streamedRowCount() {
    return streamedRowCount;
  }

  @Override
  public void stream(org.lagmill.features.FeatureBatch batch, BatchConsumer consumer) {
    rows.stream(batch, full -> {
      consumer.accept(full);
      streamedRowCount += full.rowCount();
      progress.advance(streamedRowCount);
    });
  }
}
