package org.lagmill.training;

import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;
import org.lagmill.progress.ProgressListener;

/**
 * A {@link RowStream} that reports the running row count of each stream to a {@link ProgressListener}; its
 * {@link #sampleSource} reports into the same running count.
 */
final class ProgressRowStream implements RowStream {
  private final RowStream rows;
  private final ProgressListener progress;
  /** Shared with the sample source: rows streamed over every pass so far. */
  private final long[] streamedRowCount;

  ProgressRowStream(RowStream rows, ProgressListener progress) {
    this(rows, progress, new long[1]);
  }

  private ProgressRowStream(RowStream rows, ProgressListener progress, long[] streamedRowCount) {
    this.rows = rows;
    this.progress = progress;
    this.streamedRowCount = streamedRowCount;
  }

  @Override
  public FeatureSchema schema() { return rows.schema(); }
  @Override
  public long rowCount() { return rows.rowCount(); }

  /** Rows streamed over every pass so far (the learner streams twice: its sample source, then every row). */
  /** A stream over other rows that reports into this stream's running count (validation rows after training rows). */
  ProgressRowStream continuedBy(RowStream next) {
    return new ProgressRowStream(next, progress, streamedRowCount);
  }

  long streamedRowCount() {
    return streamedRowCount[0];
  }

  @Override
  public RowStream sampleSource(long minimumRowCount, long seed) {
    RowStream source = rows.sampleSource(minimumRowCount, seed);
    return source == rows ? this : new ProgressRowStream(source, progress, streamedRowCount);
  }

  @Override
  public void stream(org.lagmill.features.FeatureBatch batch, BatchConsumer consumer) {
    rows.stream(batch, full -> {
      consumer.accept(full);
      streamedRowCount[0] += full.rowCount();
      progress.advance(streamedRowCount[0]);
    });
  }
}
