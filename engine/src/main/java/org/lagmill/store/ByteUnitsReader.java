package org.lagmill.store;

import org.agrona.concurrent.UnsafeBuffer;

/** Decodes a BYTE units column: unsigned 0..254, 0xFF = unknown. */
final class ByteUnitsReader {
  private ByteUnitsReader() {}

  /** Maps the sentinel 255 to -1 without a branch: only 255 carries into bit 8. */
  static int decode(int unsignedValue) {
    return unsignedValue - (((unsignedValue + 1) >> 8) << 8);
  }

  static int get(UnsafeBuffer buffer, int columnOffset, int dayIndex) {
    return decode(buffer.getByte(columnOffset + dayIndex) & 0xFF);
  }

  static void read(UnsafeBuffer buffer, int columnOffset, int fromDayIndex, int[] dst, int dstOffset, int count) {
    int offset = columnOffset + fromDayIndex;
    for (int i = 0; i < count; i++) {
      dst[dstOffset + i] = decode(buffer.getByte(offset + i) & 0xFF);
    }
  }
}
