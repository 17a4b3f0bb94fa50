package org.lagmill.store;

import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import org.agrona.concurrent.UnsafeBuffer;

/** Sequential decoding of the variable-length parts of a mapped store file (strings, counts), with bound checks. */
final class MappedFileReads {
  private final Path file;
  private final UnsafeBuffer buffer;
  private final long endOffset;
  private long position;

  /** @param endOffset first byte past what may be decoded (the footer's start) */
  MappedFileReads(Path file, UnsafeBuffer buffer, long startOffset, long endOffset) {
    this.file = file;
    this.buffer = buffer;
    this.position = startOffset;
    this.endOffset = endOffset;
  }

  long position() {
    return position;
  }

  int getInt() {
    check(4);
    int value = buffer.getInt((int) position, ByteOrder.LITTLE_ENDIAN);
    position += 4;
    return value;
  }

  /** A count that must lie in {@code [0, max]}. */
  int getCount(String what, int max) {
    int count = getInt();
    if (count < 0 || count > max) {
      throw new CorruptStoreException(file, "bad " + what + " at byte " + (position - 4) + ": expected 0.." + max
          + ", actual " + count);
    }
    return count;
  }

  String getString() { return getStringOfLength(getCount("string length", Integer.MAX_VALUE)); }

  String getStringOfLength(int byteLength) {
    check(byteLength);
    byte[] utf8 = new byte[byteLength];
    buffer.getBytes((int) position, utf8);
    position += byteLength;
    return new String(utf8, StandardCharsets.UTF_8);
  }

  void alignTo(int alignmentBytes) {
    position = (position + alignmentBytes - 1) / alignmentBytes * alignmentBytes;
  }

  private void check(long byteCount) {
    if (position + byteCount > endOffset) {
      throw new CorruptStoreException(file, "structure runs past the footer: expected at most " + endOffset
          + " bytes of content, actual " + (position + byteCount));
    }
  }
}
