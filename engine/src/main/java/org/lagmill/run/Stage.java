package org.lagmill.run;

import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.ProcessMemory;

/**
 * One stage of a {@link Run}: owns a named child budget, counts the rows it handles, and on close records its
 * {@link StageRecord} (wall time, the run's peak off-heap bytes while the stage ran, the process's peak resident
 * memory at its end) and closes its budget, which fails naming the stage when it still holds bytes.
 *
 * <p>Use in try-with-resources; closing twice records once. Not thread-safe.
 */
public final class Stage implements AutoCloseable {
  private final String name;
  private final MemoryBudget budget;
  private final MemoryBudget.PeakWindow runPeak;
  private final RunRecord record;
  private final long startNanos = System.nanoTime();
  private long rowCount;
  private boolean closed;

  Stage(String name, MemoryBudget root, long limitBytes, RunRecord record) {
    this.name = name;
    this.budget = root.child(name, limitBytes);
    this.runPeak = root.openPeakWindow();
    this.record = record;
  }

  public String name() {
    return name;
  }

  /** The stage's own budget: reserve everything the stage allocates or maps from it. */
  public MemoryBudget budget() {
    return budget;
  }

  /** Counts rows (item-days, training rows, forecasts) the stage handled, for its rows-per-second figure. */
  public Stage addRows(long count) {
    rowCount += count;
    return this;
  }

  /**
   * Records the stage and closes its budget.
   *
   * @throws IllegalStateException naming the stage when its budget still holds bytes
   */
  @Override
  public void close() {
    if (closed) {
      return;
    }
    closed = true;
    runPeak.close();
    record.addStage(new StageRecord(name, (System.nanoTime() - startNanos) / 1e9, ProcessMemory.peakResidentBytes(),
        runPeak.peakBytes(), rowCount));
    budget.close();
  }
}
