package org.lagmill.store;

import java.nio.ByteOrder;
import org.agrona.concurrent.UnsafeBuffer;

/**
 * Decodes an INT units column: 0..Integer.MAX_VALUE-1, all ones = unknown. The all-ones int is -1, which is already
 * {@link SalesHistory#UNKNOWN_UNITS}, so values are copied as they are.
 */
final class IntUnitsReader {
  private IntUnitsReader() {}

  static int get(UnsafeBuffer buffer, int columnOffset, int dayIndex) {
    return buffer.getInt(columnOffset + 4 * dayIndex, ByteOrder.LITTLE_ENDIAN);
  }

  static void read(UnsafeBuffer buffer, int columnOffset, int fromDayIndex, int[] dst, int dstOffset, int count) {
    int offset = columnOffset + 4 * fromDayIndex;
    for (int i = 0; i < count; i++) {
      dst[dstOffset + i] = buffer.getInt(offset + 4 * i, ByteOrder.LITTLE_ENDIAN);
    }
  }
}
