package org.lagmill.bench;

import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;

/**
 * Wraps a {@link RowStream} and splits each pass's wall time into the time spent producing rows (outside the
 * consumer) and the time the consumer (the row sample, or LightGBM's push) spent on them. Two nanoTime reads per batch,
 * none per row. Its {@link #sampleSource} is timed into the same pass list, so a build's sampling pass over a subset
 * of the rows counts as a pass with its own row count.
 */
final class TimedRowStream implements RowStream {
  private final RowStream rows;
  private final Passes passes;

  /** Times and row counts of every pass, shared by a stream and its sample source. */
  private static final class Passes {
    final long[] passNanos;
    final long[] consumerNanos;
    final long[] passRows;
    int passCount;

    Passes(int maxPasses) {
      passNanos = new long[maxPasses];
      consumerNanos = new long[maxPasses];
      passRows = new long[maxPasses];
    }
  }

  TimedRowStream(RowStream rows, int maxPasses) {
    this(rows, new Passes(maxPasses));
  }

  private TimedRowStream(RowStream rows, Passes passes) {
    this.rows = rows;
    this.passes = passes;
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
  public RowStream sampleSource(long minimumRowCount, long seed) {
    RowStream source = rows.sampleSource(minimumRowCount, seed);
    return source == rows ? this : new TimedRowStream(source, passes);
  }

  @Override
  public void stream(FeatureBatch batch, BatchConsumer consumer) {
    Passes p = passes;
    if (p.passCount == p.passNanos.length) {
      throw new IllegalStateException("more than " + p.passNanos.length + " passes over the rows");
    }
    int pass = p.passCount++;
    long start = System.nanoTime();
    rows.stream(batch, full -> {
      long consumerStart = System.nanoTime();
      p.passRows[pass] += full.rowCount();
      consumer.accept(full);
      p.consumerNanos[pass] += System.nanoTime() - consumerStart;
    });
    p.passNanos[pass] = System.nanoTime() - start;
  }

  int passCount() {
    return passes.passCount;
  }

  /** Seconds spent producing rows, summed over every pass so far. */
  double producerSeconds() {
    double total = 0;
    for (int pass = 0; pass < passes.passCount; pass++) {
      total += producerSeconds(pass);
    }
    return total;
  }

  /** Seconds spent producing the rows of pass {@code pass} (0-based). */
  double producerSeconds(int pass) {
    return (passes.passNanos[pass] - passes.consumerNanos[pass]) / 1e9;
  }

  /** Rows produced in pass {@code pass}. */
  long passRowCount(int pass) {
    return passes.passRows[pass];
  }

  /** Seconds the consumer of pass {@code pass} (0-based) spent on its batches. */
  double consumerSeconds(int pass) {
    return passes.consumerNanos[pass] / 1e9;
  }

  /** Wall seconds of pass {@code pass}. */
  double passSeconds(int pass) {
    return passes.passNanos[pass] / 1e9;
  }
}
