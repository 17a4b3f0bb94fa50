package org.lagmill.store;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.zip.Checksum;
import org.agrona.BufferUtil;
import org.lagmill.io.Crc32c;
import org.lagmill.memory.MemoryBudget;

/**
 * Writes one binary store file sequentially through a small direct buffer: the header first, little-endian values,
 * then {@link #finish()} appends the footer with the CRC32C of everything before it. The buffer is reserved from the
 * writer's budget. Not thread-safe.
 */
final class ChecksummedFileWriter implements AutoCloseable {
  static final int BUFFER_BYTES = 1 << 16;

  private final Path file;
  private final FileChannel channel;
  private final MemoryBudget budget;
  private final Checksum crc = Crc32c.running();
  private ByteBuffer buffer;
  private long flushedBytes;
  private int checksum;
  private boolean finished;

  ChecksummedFileWriter(Path file, FileKind kind, MemoryBudget budget) throws IOException {
    this.file = file;
    this.budget = budget;
    budget.reserve(BUFFER_BYTES);
    try {
      buffer = ByteBuffer.allocateDirect(BUFFER_BYTES).order(ByteOrder.LITTLE_ENDIAN);
      channel = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
    } catch (IOException | RuntimeException e) {
      releaseBuffer();
      throw e;
    }
    putInt(StoreFileFormat.MAGIC);
    putInt(kind.kindNumber());
    putInt(StoreFileFormat.FILE_VERSION_CURRENT);
    putInt(0);
  }

  Path file() {
    return file;
  }

  /** Bytes written so far, header included: the file offset of the next value. */
  long position() {
    return flushedBytes + buffer.position();
  }

  void putByte(int value) throws IOException {
    ensure(1);
    buffer.put((byte) value);
  }

  void putShort(int value) throws IOException {
    ensure(2);
    buffer.putShort((short) value);
  }

  void putInt(int value) throws IOException {
    ensure(4);
    buffer.putInt(value);
  }

  void putLong(long value) throws IOException {
    ensure(8);
    buffer.putLong(value);
  }

  void putFloat(float value) throws IOException {
    ensure(4);
    buffer.putFloat(value);
  }

  void putBytes(byte[] src, int offset, int length) throws IOException {
    int at = offset;
    int left = length;
    while (left > 0) {
      ensure(1);
      int chunk = Math.min(left, buffer.remaining());
      buffer.put(src, at, chunk);
      at += chunk;
      left -= chunk;
    }
  }

  /** A length-prefixed UTF-8 string: int byte count, then the bytes. */
  void putString(String value) throws IOException {
    byte[] utf8 = value.getBytes(StandardCharsets.UTF_8);
    putInt(utf8.length);
    putBytes(utf8, 0, utf8.length);
  }

  /** Zero bytes up to the next multiple of {@code alignmentBytes}, so columns after it start aligned. */
  void padTo(int alignmentBytes) throws IOException {
    while (position() % alignmentBytes != 0) {
      putByte(0);
    }
  }

  /** Ensures room for {@code byteCount} more bytes in the buffer; values up to 8 bytes never straddle a flush. */
  ByteBuffer ensure(int byteCount) throws IOException {
    if (buffer.remaining() < byteCount) {
      flush();
    }
    return buffer;
  }

  private void flush() throws IOException {
    buffer.flip();
    crc.update(buffer.duplicate());
    while (buffer.hasRemaining()) {
      flushedBytes += channel.write(buffer);
    }
    buffer.clear();
  }

  /**
   * Writes the footer and closes the file.
   *
   * @return the file's CRC32C, as stored in its footer
   */
  int finish() throws IOException {
    if (finished) {
      throw new IllegalStateException(file + " is already finished");
    }
    putInt(StoreFileFormat.FOOTER_MAGIC);
    flush();
    checksum = (int) crc.getValue();
    ByteBuffer footer = ensure(4);
    footer.putInt(checksum);
    flush();
    channel.force(false);
    finished = true;
    close();
    return checksum;
  }

  /** Total bytes of the finished file. */
  long fileBytes() {
    if (!finished) {
      throw new IllegalStateException(file + " is not finished");
    }
    return flushedBytes;
  }

  int checksum() {
    return checksum;
  }

  @Override
  public void close() throws IOException {
    if (buffer != null) {
      try {
        channel.close();
      } finally {
        releaseBuffer();
      }
    }
  }

  private void releaseBuffer() {
    if (buffer != null) {
      BufferUtil.free(buffer);
      buffer = null;
      budget.release(BUFFER_BYTES);
    }
  }
}
