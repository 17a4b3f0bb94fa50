package org.lagmill.bench;

import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;

/**
 * Wraps a {@link RowStream} and splits each pass's wall time into the time spent producing rows (outside the
 * consumer) and the time the consumer (the row sample, or LightGBM's push) spent on them. Two nanoTime reads per batch,
 * none per row.
 */
final class TimedRowStream implements RowStream {
  private final RowStream rows;
  private final long[] passNanos;
  private final long[] consumerNanos;
  private int passCount;

  TimedRowStream(RowStream rows, int maxPasses) {
    this.rows = rows;
    this.passNanos = new long[maxPasses];
    this.consumerNanos = new long[maxPasses];
  }

  @Override
  public FeatureSchema schema() {
    return rows.schema();
  }

  @Override
  public long rowCount() {
    return rows.rowCount();
  }

  @Override
  public void stream(FeatureBatch batch, BatchConsumer consumer) {
    if (passCount == passNanos.length) {
      throw new IllegalStateException("more than " + passNanos.length + " passes over the rows");
    }
    int pass = passCount++;
    long start = System.nanoTime();
    rows.stream(batch, full -> {
      long consumerStart = System.nanoTime();
      consumer.accept(full);
      consumerNanos[pass] += System.nanoTime() - consumerStart;
    });
    passNanos[pass] = System.nanoTime() - start;
  }

  int passCount() {
    return passCount;
  }

  /** Seconds spent producing rows, summed over every pass so far. */
  double producerSeconds() {
    long total = 0;
    for (int pass = 0; pass < passCount; pass++) {
      total += passNanos[pass] - consumerNanos[pass];
    }
    return total / 1e9;
  }

  /** Seconds the consumer of pass {@code pass} (0-based) spent on its batches. */
  double consumerSeconds(int pass) {
    return consumerNanos[pass] / 1e9;
  }

  /** Wall seconds of pass {@code pass}. */
  double passSeconds(int pass) {
    return passNanos[pass] / 1e9;
  }
}
