package org.lagmill.run;

import org.lagmill.memory.MemoryBudget;

/**
 * One run of a command: owns the run's root {@link MemoryBudget} and its {@link RunRecord}, and hands out
 * {@link Stage}s that time themselves and put their figures into the record, so what {@code run.json} and the report
 * say about time and memory is what the stages measured.
 *
 * <p>Resources that outlive one stage (an open store) take a child of {@link #budget()} directly. Closing the run
 * closes the root budget, which fails and names the budget when any owner of off-heap memory was left open.
 *
 * <p>Not thread-safe: one thread drives a run; stages run one after another (a stage may hold a nested one).
 */
public final class Run implements AutoCloseable {
  private final MemoryBudget budget;
  private final RunRecord record;

  private Run(String command, long memoryLimitBytes) {
    this.budget = MemoryBudget.root("lagmill", memoryLimitBytes);
    this.record = new RunRecord(command);
  }

  /**
   * Starts a run.
   *
   * @param command the command's name, recorded in {@code run.json}
   * @param memoryLimitBytes the off-heap limit of the whole run in bytes, or {@link MemoryBudget#UNLIMITED_BYTES}
   * @throws IllegalArgumentException when the limit is not positive
   */
  public static Run start(String command, long memoryLimitBytes) {
    return new Run(command, memoryLimitBytes);
  }

  /** A run without an off-heap limit. */
  public static Run unlimited(String command) {
    return start(command, MemoryBudget.UNLIMITED_BYTES);
  }

  /** The root budget; take children of it for resources that span stages. */
  public MemoryBudget budget() {
    return budget;
  }

  public RunRecord record() {
    return record;
  }

  /** Starts a stage with its own child budget and no limit of its own. */
  public Stage stage(String name) {
    return stage(name, MemoryBudget.UNLIMITED_BYTES);
  }

  /**
   * Starts a stage whose child budget refuses reservations beyond {@code limitBytes}; the run's limit binds too.
   */
  public Stage stage(String name, long limitBytes) {
    return new Stage(name, budget, limitBytes, record);
  }

  /** Closes the root budget; fails, naming the budget, when off-heap bytes are still held. */
  @Override
  public void close() {
    budget.close();
  }
}
