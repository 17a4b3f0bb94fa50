package org.lagmill.scenario;

import java.io.IOException;
import java.io.OutputStream;

/**
 * Writes ASCII CSV text into its own 1 MiB buffer with hand-rolled number formatting, so a sales cell costs a few
 * byte stores and no allocation. Not thread-safe; closing flushes and closes the underlying stream once.
 */
final class AsciiWriter implements AutoCloseable {
  static final int BUFFER_BYTES = 1 << 20;
  /** Longest single write (an int, a date, a field): flushing this early keeps each write free of bounds checks. */
  private static final int MAX_TOKEN_BYTES = 64;

  private final OutputStream out;
  private final byte[] buffer = new byte[BUFFER_BYTES];
  private int position;
  private long writtenBytes;
  private boolean closed;

  AsciiWriter(OutputStream out) {
    this.out = out;
  }

  /** Bytes accepted so far (before any compression). */
  long writtenBytes() {
    return writtenBytes + position;
  }

  void writeByte(int b) throws IOException {
    ensure(1);
    buffer[position++] = (byte) b;
  }

  void writeBytes(byte[] bytes) throws IOException {
    if (bytes.length > BUFFER_BYTES - position) {
      flushBuffer();
      if (bytes.length > BUFFER_BYTES) {
        out.write(bytes);
        writtenBytes += bytes.length;
        return;
      }
    }
    System.arraycopy(bytes, 0, buffer, position, bytes.length);
    position += bytes.length;
  }

  /** Writes a string that must be plain ASCII (names of our own invented scenario). */
  void writeAscii(String text) throws IOException {
    int length = text.length();
    if (length > BUFFER_BYTES - position) {
      flushBuffer();
    }
    for (int i = 0; i < length; i++) {
      char c = text.charAt(i);
      assert c < 128 : "non-ASCII character in " + text;
      if (position == BUFFER_BYTES) {
        flushBuffer();
      }
      buffer[position++] = (byte) c;
    }
  }

  /** Writes a non-negative integer in decimal. */
  void writeInt(int value) throws IOException {
    assert value >= 0 : value;
    ensure(MAX_TOKEN_BYTES);
    if (value < 10) {
      buffer[position++] = (byte) ('0' + value);
      return;
    }
    int digitCount = digitCount(value);
    int end = position + digitCount;
    for (int i = end - 1; i >= position; i--) {
      buffer[i] = (byte) ('0' + value % 10);
      value /= 10;
    }
    position = end;
  }

  /** Writes a non-negative integer left-padded with zeros to at least {@code width} digits. */
  void writeZeroPadded(int value, int width) throws IOException {
    assert value >= 0 && width <= MAX_TOKEN_BYTES - 12 : value + " " + width;
    ensure(MAX_TOKEN_BYTES);
    for (int i = digitCount(value); i < width; i++) {
      buffer[position++] = '0';
    }
    writeInt(value);
  }

  /** Writes an amount of cents as a price with two decimals, e.g. 1249 as {@code 12.49}. */
  void writeCents(int cents) throws IOException {
    assert cents >= 0 : cents;
    writeInt(cents / 100);
    ensure(3);
    int fraction = cents % 100;
    buffer[position++] = '.';
    buffer[position++] = (byte) ('0' + fraction / 10);
    buffer[position++] = (byte) ('0' + fraction % 10);
  }

  static int digitCount(int value) {
    int count = 1;
    while (value >= 10) {
      value /= 10;
      count++;
    }
    return count;
  }

  private void ensure(int byteCount) throws IOException {
    if (BUFFER_BYTES - position < byteCount) {
      flushBuffer();
    }
  }

  private void flushBuffer() throws IOException {
    out.write(buffer, 0, position);
    writtenBytes += position;
    position = 0;
  }

  @Override
  public void close() throws IOException {
    if (closed) {
      return;
    }
    closed = true;
    try (OutputStream stream = out) {
      flushBuffer();
    }
  }
}
