package org.lagmill.bench;

import java.lang.reflect.Field;
import sun.misc.Unsafe;

/**
 * A row-major float32 matrix in one native allocation of any size, for the whole-matrix route only. The engine's
 * {@code NativeFloatArray} stops at 2 GiB, and a 45M-row matrix of 23 features is 4 GB; a benchmark may reach for
 * {@code sun.misc.Unsafe} where the engine must not. Not budgeted: the probe's peak RSS is the measure here.
 */
final class OffHeapMatrix implements AutoCloseable {
  private static final Unsafe UNSAFE = unsafe();

  private final long valueCount;
  private long address;

  OffHeapMatrix(long valueCount) {
    if (valueCount < 1) {
      throw new IllegalArgumentException("valueCount must be >= 1, got " + valueCount);
    }
    this.valueCount = valueCount;
    this.address = UNSAFE.allocateMemory(valueCount * Float.BYTES);
  }

  void set(long index, float value) {
    assert index >= 0 && index < valueCount : index;
    UNSAFE.putFloat(address() + index * Float.BYTES, value);
  }

  float get(long index) {
    assert index >= 0 && index < valueCount : index;
    return UNSAFE.getFloat(address() + index * Float.BYTES);
  }

  long address() {
    if (address == 0) {
      throw new IllegalStateException("matrix is closed");
    }
    return address;
  }

  @Override
  public void close() {
    if (address != 0) {
      UNSAFE.freeMemory(address);
      address = 0;
    }
  }

  private static Unsafe unsafe() {
    try {
      Field field = Unsafe.class.getDeclaredField("theUnsafe");
      field.setAccessible(true);
      return (Unsafe) field.get(null);
    } catch (ReflectiveOperationException e) {
      throw new IllegalStateException("sun.misc.Unsafe is not reachable in this JVM", e);
    }
  }
}
