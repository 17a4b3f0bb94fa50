package org.lagmill.store;

import java.nio.ByteOrder;
import org.agrona.concurrent.UnsafeBuffer;

/** Decodes a SHORT units column: unsigned little-endian 0..65534, 0xFFFF = unknown. */
final class ShortUnitsReader {
  private ShortUnitsReader() {}

  /** Maps the sentinel 65535 to -1 without a branch: only 65535 carries into bit 16. */
  static int decode(int unsignedValue) {
    return unsignedValue - (((unsignedValue + 1) >> 16) << 16);
  }

  static int get(UnsafeBuffer buffer, int columnOffset, int dayIndex) {
    return decode(buffer.getShort(columnOffset + 2 * dayIndex, ByteOrder.LITTLE_ENDIAN) & 0xFFFF);
  }

  static void read(UnsafeBuffer buffer, int columnOffset, int fromDayIndex, int[] dst, int dstOffset, int count) {
    int offset = columnOffset + 2 * fromDayIndex;
    for (int i = 0; i < count; i++) {
      dst[dstOffset + i] = decode(buffer.getShort(offset + 2 * i, ByteOrder.LITTLE_ENDIAN) & 0xFFFF);
    }
  }
}
