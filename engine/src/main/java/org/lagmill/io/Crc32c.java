package org.lagmill.io;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.zip.CRC32C;
import java.util.zip.Checksum;

/**
 * The one CRC32C (Castagnoli) of the code base: every checksum lagmill writes or checks (store files, model files,
 * manifests, run records) comes from here, formatted the same way.
 */
public final class Crc32c {
  private static final int READ_BYTES = 1 << 16;

  private Crc32c() {}

  /** CRC32C of a byte range. */
  public static int of(byte[] bytes, int offset, int length) {
    CRC32C crc = new CRC32C();
    crc.update(bytes, offset, length);
    return (int) crc.getValue();
  }

  /** CRC32C of a whole array. */
  public static int of(byte[] bytes) {
    return of(bytes, 0, bytes.length);
  }

  /** CRC32C of the first {@code byteCount} bytes of a file, read in 64 KiB chunks. */
  public static int ofFile(Path file, long byteCount) throws IOException {
    try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
      return ofChannel(channel, byteCount);
    }
  }

  /** CRC32C of a whole file. */
  public static int ofFile(Path file) throws IOException {
    try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
      return ofChannel(channel, channel.size());
    }
  }

  /** CRC32C of the first {@code byteCount} bytes of an open channel (positional reads; the position is unchanged). */
  public static int ofChannel(FileChannel channel, long byteCount) throws IOException {
    CRC32C crc = new CRC32C();
    ByteBuffer chunk = ByteBuffer.allocate(READ_BYTES);
    long position = 0;
    while (position < byteCount) {
      chunk.clear().limit((int) Math.min(READ_BYTES, byteCount - position));
      while (chunk.hasRemaining()) {
        int read = channel.read(chunk, position + chunk.position());
        if (read < 0) {
          throw new IOException("unexpected end of file at byte " + (position + chunk.position()));
        }
      }
      chunk.flip();
      position += chunk.remaining();
      crc.update(chunk);
    }
    return (int) crc.getValue();
  }

  /** A running CRC32C for writers that checksum while they stream (store files). */
  public static Checksum running() {
    return new CRC32C();
  }

  /** The written form: 8 lowercase hex digits. */
  public static String hex(int crc) {
    return String.format("%08x", crc);
  }
}
