package org.lagmill.memory;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import org.agrona.BufferUtil;
import org.agrona.concurrent.UnsafeBuffer;

/**
 * One block of direct memory in native byte order, reserved from a {@link MemoryBudget} before it is allocated and
 * released after it is freed: the ownership the typed native arrays share. Idempotent close.
 */
final class NativeMemory implements AutoCloseable {
  private final MemoryBudget budget;
  private final long byteCount;
  private final String closedMessage;
  private ByteBuffer memory;
  private UnsafeBuffer view;

  /**
   * @param byteCount in {@code [0, Integer.MAX_VALUE]}; the caller checks its own length bound first
   * @param closedMessage the {@link IllegalStateException} message for use after close
   */
  NativeMemory(MemoryBudget budget, long byteCount, String closedMessage) {
    assert byteCount >= 0 && byteCount <= Integer.MAX_VALUE : byteCount;
    this.budget = budget;
    this.byteCount = byteCount;
    this.closedMessage = closedMessage;
    budget.reserve(byteCount);
    try {
      memory = ByteBuffer.allocateDirect((int) byteCount).order(ByteOrder.nativeOrder());
    } catch (OutOfMemoryError e) {
      budget.release(byteCount);
      throw e;
    }
    view = new UnsafeBuffer(memory);
  }

  /** The memory as a direct buffer in native order; null after close. */
  ByteBuffer byteBuffer() {
    return memory;
  }

  /** The memory for unchecked reads and writes; null after close. */
  UnsafeBuffer view() {
    return view;
  }

  /** Bytes of native memory held (0 after close). */
  long offHeapBytes() {
    return memory == null ? 0 : byteCount;
  }

  void checkOpen() {
    if (memory == null) {
      throw new IllegalStateException(closedMessage);
    }
  }

  @Override
  public void close() {
    if (memory != null) {
      BufferUtil.free(memory);
      memory = null;
      view = null;
      budget.release(byteCount);
    }
  }
}
