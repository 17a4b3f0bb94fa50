package org.lagmill.memory;

import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Accounts for the off-heap bytes (allocations and memory mappings) a run holds, as a tree of named budgets.
 *
 * <p>A run creates one root budget; each stage (ingest, feature pass, learner) takes a named child, optionally with a
 * limit of its own. A child reserves bytes before it allocates or maps them and releases them when it frees them;
 * every reservation is also charged to its ancestors, so the root always knows the total and each limit on the path
 * binds. Closing a budget that still holds bytes fails and names the stage, which makes every test a leak test. A
 * {@link PeakWindow} watches the largest total a budget holds while it is open, which is how a stage learns the
 * run's peak during the stage rather than since the run began.
 *
 * <p>Thread-safe: reservations use atomic counters. Lifetime: a budget is closed once, after all its children.
 */
public final class MemoryBudget implements AutoCloseable {
  /** A limit that never binds: the default for tests and tools. */
  public static final long UNLIMITED_BYTES = Long.MAX_VALUE;

  private final String name;
  private final MemoryBudget parent;
  private final long limitBytes;
  private final AtomicLong heldBytes = new AtomicLong();
  private final AtomicLong peakBytes = new AtomicLong();
  private final CopyOnWriteArrayList<PeakWindow> windows = new CopyOnWriteArrayList<>();
  private volatile boolean closed;

  private MemoryBudget(String name, MemoryBudget parent, long limitBytes) {
    this.name = name;
    this.parent = parent;
    this.limitBytes = limitBytes;
  }

  /** Creates a root budget that refuses reservations beyond {@code limitBytes} in total. */
  public static MemoryBudget root(String name, long limitBytes) {
    return new MemoryBudget(name, null, checkLimit(limitBytes));
  }

  /** Creates a root budget with no limit. */
  public static MemoryBudget unlimited(String name) {
    return root(name, UNLIMITED_BYTES);
  }

  /** Creates a child budget for one stage with no limit of its own; its reservations count against this budget too. */
  public MemoryBudget child(String stageName) {
    return child(stageName, UNLIMITED_BYTES);
  }

  /**
   * Creates a child budget for one stage that refuses reservations beyond {@code limitBytes} held by it and its
   * children; its reservations count against this budget (and its limit) too.
   *
   * @param limitBytes positive; {@link #UNLIMITED_BYTES} for no limit of its own
   */
  public MemoryBudget child(String stageName, long limitBytes) {
    checkOpen();
    return new MemoryBudget(name + "/" + stageName, this, checkLimit(limitBytes));
  }

  private static long checkLimit(long limitBytes) {
    if (limitBytes <= 0) {
      throw new IllegalArgumentException("limitBytes must be positive, got " + limitBytes);
    }
    return limitBytes;
  }

  /**
   * Reserves {@code byteCount} bytes before they are allocated or mapped.
   *
   * @throws MemoryBudgetExceededException when this budget or an ancestor would exceed its limit
   */
  public void reserve(long byteCount) {
    if (byteCount < 0) {
      throw new IllegalArgumentException("byteCount must be >= 0, got " + byteCount);
    }
    checkOpen();
    long after = heldBytes.addAndGet(byteCount);
    if (after > limitBytes) {
      heldBytes.addAndGet(-byteCount);
      throw new MemoryBudgetExceededException(name, byteCount, after - byteCount, limitBytes);
    }
    if (parent != null) {
      try {
        parent.reserve(byteCount);
      } catch (MemoryBudgetExceededException e) {
        heldBytes.addAndGet(-byteCount);
        throw e;
      }
    }
    peakBytes.accumulateAndGet(after, Math::max);
    for (PeakWindow window : windows) {
      window.peakBytes.accumulateAndGet(after, Math::max);
    }
  }

  /** Releases bytes reserved earlier, after they are freed or unmapped. */
  public void release(long byteCount) {
    long after = heldBytes.addAndGet(-byteCount);
    if (after < 0) {
      heldBytes.addAndGet(byteCount);
      throw new IllegalStateException(
          "budget " + name + " released " + byteCount + " bytes but held only " + (after + byteCount));
    }
    if (parent != null) {
      parent.release(byteCount);
    }
  }

  /** Bytes reserved and not yet released, this budget and its children together. */
  public long heldBytes() {
    return heldBytes.get();
  }

  /** The largest {@link #heldBytes()} seen since creation. */
  public long peakBytes() {
    return peakBytes.get();
  }

  /** This budget's own limit in bytes ({@link #UNLIMITED_BYTES} when it has none). */
  public long limitBytes() {
    return limitBytes;
  }

  public String name() {
    return name;
  }

  /**
   * Starts watching the largest {@link #heldBytes()} of this budget from now until the window closes; the window
   * starts at the bytes held now. Windows may overlap (a stage inside a stage).
   */
  public PeakWindow openPeakWindow() {
    checkOpen();
    PeakWindow window = new PeakWindow(this, heldBytes.get());
    windows.add(window);
    return window;
  }

  private void checkOpen() {
    if (closed) {
      throw new IllegalStateException("budget " + name + " is closed");
    }
  }

  /**
   * Closes this budget.
   *
   * @throws IllegalStateException when bytes are still held: some owner of off-heap memory was not closed
   */
  @Override
  public synchronized void close() {
    if (closed) {
      return;
    }
    long held = heldBytes.get();
    closed = true;
    if (held != 0) {
      throw new IllegalStateException("budget " + name + " closed while still holding " + held
          + " bytes: an owner of off-heap memory in this stage was not closed");
    }
  }

  /** The largest bytes a budget held while the window was open; closing stops the watch. Thread-safe. */
  public static final class PeakWindow implements AutoCloseable {
    private final MemoryBudget budget;
    private final AtomicLong peakBytes;

    private PeakWindow(MemoryBudget budget, long heldBytes) {
      this.budget = budget;
      this.peakBytes = new AtomicLong(heldBytes);
    }

    /** The largest bytes held since the window opened (including what was held when it opened). */
    public long peakBytes() {
      return peakBytes.get();
    }

    @Override
    public void close() {
      budget.windows.remove(this);
    }
  }
}
