package org.lagmill.memory;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;

/**
 * A fixed-length array of float64 in native memory, reserved from a {@link MemoryBudget}: values native code writes
 * and reads in place (LightGBM writes raw scores into it and reads a Dataset's initial scores from it), so no value
 * crosses JNI one by one.
 *
 * <p>Not thread-safe. Closing frees the memory and releases the reservation; use after close throws.
 */
public final class NativeDoubleArray implements AutoCloseable {
  /** Largest length: the byte size must fit one direct buffer. */
  public static final long MAX_LENGTH = Integer.MAX_VALUE / Double.BYTES;

  private final long length;
  private final NativeMemory memory;

  /** @param length number of doubles, in {@code [0, MAX_LENGTH]}; the contents start at 0 */
  public NativeDoubleArray(MemoryBudget budget, long length) {
    if (length < 0 || length > MAX_LENGTH) {
      throw new IllegalArgumentException("length must be in [0, " + MAX_LENGTH + "], got " + length
          + "; split the data into smaller arrays");
    }
    this.length = length;
    this.memory = new NativeMemory(budget, length * Double.BYTES, "native double array is closed");
  }

  public long length() {
    return length;
  }

  /** Bytes of native memory held (0 after close). */
  public long offHeapBytes() {
    return memory.offHeapBytes();
  }

  public void set(int index, double value) {
    assert index >= 0 && index < length : index;
    memory.checkOpen();
    memory.view().putDouble(index * Double.BYTES, value);
  }

  public double get(int index) {
    assert index >= 0 && index < length : index;
    memory.checkOpen();
    return memory.view().getDouble(index * Double.BYTES);
  }

  /**
   * Native address of element {@code index}; valid until {@link #close()}.
   *
   * @param index in {@code [0, length]} (the end is allowed: an empty range's start)
   */
  public long address(long index) {
    if (index < 0 || index > length) {
      throw new IndexOutOfBoundsException("index " + index + " outside [0, " + length + "]");
    }
    memory.checkOpen();
    return memory.view().addressOffset() + index * Double.BYTES;
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
