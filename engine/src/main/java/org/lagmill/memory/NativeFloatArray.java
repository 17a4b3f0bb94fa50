package org.lagmill.memory;

import java.nio.FloatBuffer;
import org.agrona.concurrent.UnsafeBuffer;

/**
 * A fixed-length array of float32 in native memory, reserved from a {@link MemoryBudget}. Its {@link #address()} can
 * be handed to native code (LightGBM reads pushed rows straight from it), so no value crosses JNI one by one.
 *
 * <p>Not thread-safe. Closing frees the memory and releases the reservation; use after close throws.
 */
public final class NativeFloatArray implements AutoCloseable {
  private final long length;
  private final NativeMemory memory;
  private FloatBuffer floats;

  /** @param length number of floats; at most 2^29 - 1 so the byte size fits one buffer */
  public NativeFloatArray(MemoryBudget budget, long length) {
    if (length < 0 || length > (Integer.MAX_VALUE / Float.BYTES)) {
      throw new IllegalArgumentException("length must be in [0, " + (Integer.MAX_VALUE / Float.BYTES) + "], got "
          + length);
    }
    this.length = length;
    this.memory = new NativeMemory(budget, length * Float.BYTES, "native float array is closed");
    floats = memory.byteBuffer().asFloatBuffer();
  }

  public long length() {
    return length;
  }

  /** Bytes of native memory held. */
  public long offHeapBytes() {
    return memory.offHeapBytes();
  }

  public void set(int index, float value) {
    assert index >= 0 && index < length : index;
    memory.view().putFloat(index * Float.BYTES, value);
  }

  public float get(int index) {
    assert index >= 0 && index < length : index;
    return memory.view().getFloat(index * Float.BYTES);
  }

  /** Sets {@code count} elements from {@code from} to one value. */
  public void fill(int from, int count, float value) {
    UnsafeBuffer view = memory.view();
    for (int i = 0; i < count; i++) {
      view.putFloat((from + i) * Float.BYTES, value);
    }
  }

  /**
   * Copies {@code count} floats from a heap array into elements {@code [index, index + count)} with one bounds check
   * and one memory copy, instead of one checked store per value.
   *
   * @throws IndexOutOfBoundsException when either range is outside its array
   */
  public void put(int index, float[] src, int srcOffset, int count) {
    memory.checkOpen();
    floats.put(index, src, srcOffset, count);
  }

  /** Native address of element 0; valid until {@link #close()}. */
  public long address() {
    memory.checkOpen();
    return memory.view().addressOffset();
  }

  @Override
  public void close() {
    memory.close();
    floats = null;
  }
}
