package org.lagmill.memory;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.FloatBuffer;
import org.agrona.BufferUtil;
import org.agrona.concurrent.UnsafeBuffer;

/**
 * A fixed-length array of float32 in native memory, reserved from a {@link MemoryBudget}. Its {@link #address()} can
 * be handed to native code (LightGBM reads pushed rows straight from it), so no value crosses JNI one by one.
 *
 * <p>Not thread-safe. Closing frees the memory and releases the reservation; use after close throws.
 */
public final class NativeFloatArray implements AutoCloseable {
  private final MemoryBudget budget;
  private final long length;
  private final long byteCount;
  private ByteBuffer memory;
  private UnsafeBuffer view;
  private FloatBuffer floats;

  /** @param length number of floats; at most 2^29 - 1 so the byte size fits one buffer */
  public NativeFloatArray(MemoryBudget budget, long length) {
    if (length < 0 || length > (Integer.MAX_VALUE / Float.BYTES)) {
      throw new IllegalArgumentException("length must be in [0, " + (Integer.MAX_VALUE / Float.BYTES) + "], got "
          + length);
    }
    this.budget = budget;
    this.length = length;
    this.byteCount = length * Float.BYTES;
    budget.reserve(byteCount);
    try {
      memory = ByteBuffer.allocateDirect((int) byteCount).order(ByteOrder.nativeOrder());
    } catch (OutOfMemoryError e) {
      budget.release(byteCount);
      throw e;
    }
    view = new UnsafeBuffer(memory);
    floats = memory.asFloatBuffer();
  }

  public long length() {
    return length;
  }

  /** Bytes of native memory held. */
  public long offHeapBytes() {
    return memory == null ? 0 : byteCount;
  }

  public void set(int index, float value) {
    assert index >= 0 && index < length : index;
    view.putFloat(index * Float.BYTES, value);
  }

  public float get(int index) {
    assert index >= 0 && index < length : index;
    return view.getFloat(index * Float.BYTES);
  }

  /** Sets {@code count} elements from {@code from} to one value. */
  public void fill(int from, int count, float value) {
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
    checkOpen();
    floats.put(index, src, srcOffset, count);
  }

  /** Native address of element 0; valid until {@link #close()}. */
  public long address() {
    checkOpen();
    return view.addressOffset();
  }

  private void checkOpen() {
    if (memory == null) {
      throw new IllegalStateException("native float array is closed");
    }
  }

  @Override
  public void close() {
    if (memory != null) {
      BufferUtil.free(memory);
      memory = null;
      view = null;
      floats = null;
      budget.release(byteCount);
    }
  }
}
