package org.lagmill.memory;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import org.agrona.concurrent.UnsafeBuffer;

/**
 * A fixed-length array of int32 in native memory, reserved from a {@link MemoryBudget}: scratch space too large for
 * the heap (for example the units matrix of long-format sales while it is filled out of order).
 *
 * <p>Not thread-safe. Closing frees the memory and releases the reservation; use after close throws.
 */
public final class NativeIntArray implements AutoCloseable {
  /** Largest length: the byte size must fit one direct buffer. */
  public static final long MAX_LENGTH = Integer.MAX_VALUE / Integer.BYTES;

  private final long length;
  private final NativeMemory memory;

  /** @param length number of ints, in {@code [0, MAX_LENGTH]}; the contents start at 0 */
  public NativeIntArray(MemoryBudget budget, long length) {
    if (length < 0 || length > MAX_LENGTH) {
      throw new IllegalArgumentException("length must be in [0, " + MAX_LENGTH + "], got " + length
          + "; split the data into smaller arrays");
    }
    this.length = length;
    this.memory = new NativeMemory(budget, length * Integer.BYTES, "native int array is closed");
  }

  public long length() {
    return length;
  }

  /** Bytes of native memory held (0 after close). */
  public long offHeapBytes() {
    return memory.offHeapBytes();
  }

  public void set(int index, int value) {
    assert index >= 0 && index < length : index;
    memory.checkOpen();
    memory.view().putInt(index * Integer.BYTES, value);
  }

  public int get(int index) {
    assert index >= 0 && index < length : index;
    memory.checkOpen();
    return memory.view().getInt(index * Integer.BYTES);
  }

  /** Sets {@code count} elements from {@code from} to one value. */
  public void fill(int from, int count, int value) {
    memory.checkOpen();
    assert from >= 0 && count >= 0 && from + (long) count <= length : from + "+" + count;
    UnsafeBuffer view = memory.view();
    for (int i = 0; i < count; i++) {
      view.putInt((from + i) * Integer.BYTES, value);
    }
  }

  /** Copies {@code count} elements from {@code from} into {@code dst[dstOffset ..]}. */
  public void read(int from, int[] dst, int dstOffset, int count) {
    memory.checkOpen();
    assert from >= 0 && count >= 0 && from + (long) count <= length : from + "+" + count;
    UnsafeBuffer view = memory.view();
    for (int i = 0; i < count; i++) {
      dst[dstOffset + i] = view.getInt((from + i) * Integer.BYTES);
    }
  }

  /**
   * The array's bytes as a fresh buffer (position 0, limit the byte size, native order) over the same memory: for
   * bulk file reads and writes and checksums without copying through the heap. Valid until {@link #close()}.
   */
  public ByteBuffer bytes() {
    memory.checkOpen();
    return memory.byteBuffer().duplicate().order(ByteOrder.nativeOrder()).clear();
  }

  @Override
  public void close() {
    memory.close();
  }
}
