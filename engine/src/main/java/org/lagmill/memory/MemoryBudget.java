package org.lagmill.memory;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Accounts for the off-heap bytes (allocations and memory mappings) a run holds, as a tree of named budgets.
 *
 * <p>The command line creates one root budget; each stage (ingest, feature pass, learner) takes a named child. A child
 * reserves bytes before it allocates or maps them and releases them when it frees them; every reservation is also
 * charged to its ancestors, so the root always knows the total. Closing a budget that still holds bytes fails and
 * names the stage, which makes every test a leak test.
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
  private final List<MemoryBudget> children = new ArrayList<>();
  private volatile boolean closed;

  private MemoryBudget(String name, MemoryBudget parent, long limitBytes) {
    this.name = name;
    this.parent = parent;
    this.limitBytes = limitBytes;
  }

  /** Creates a root budget that refuses reservations beyond {@code limitBytes} in total. */
  public static MemoryBudget root(String name, long limitBytes) {
    if (limitBytes <= 0) {
      throw new IllegalArgumentException("limitBytes must be positive, got " + limitBytes);
    }
    return new MemoryBudget(name, null, limitBytes);
  }

  /** Creates a root budget with no limit. */
  public static MemoryBudget unlimited(String name) {
    return root(name, UNLIMITED_BYTES);
  }

  /** Creates a child budget for one stage; its reservations count against this budget too. */
  public synchronized MemoryBudget child(String stageName) {
    checkOpen();
    MemoryBudget child = new MemoryBudget(name + "/" + stageName, this, UNLIMITED_BYTES);
    children.add(child);
    return child;
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

  public String name() {
    return name;
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
    if (parent != null) {
      synchronized (parent) {
        parent.children.remove(this);
      }
    }
  }
}
