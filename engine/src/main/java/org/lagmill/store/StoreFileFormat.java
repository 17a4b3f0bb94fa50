package org.lagmill.store;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.lagmill.io.Crc32c;

/**
 * The header and footer every binary store file carries, and their verification.
 *
 * <p>Header ({@value #HEADER_BYTES} bytes, little-endian): magic int, file kind int, format version int, reserved int
 * (0). Footer ({@value #FOOTER_BYTES} bytes): footer magic int, then the CRC32C of every byte before the checksum
 * itself. A file is verified whole at open: size against the manifest, magic, kind, version, checksum.
 */
final class StoreFileFormat {
  /** "LGMS" read as a little-endian int. */
  static final int MAGIC = 0x534D474C;
  static final int FOOTER_MAGIC = ~MAGIC;
  /**
   * Layout version written into every binary file's header. The five binary layouts have not changed since the
   * first store format, so it is still 1; the store as a whole is versioned by its manifest
   * ({@link StoreManifest#FORMAT_VERSION_CURRENT}).
   */
  static final int FILE_VERSION_CURRENT = 1;
  /** Oldest binary layout version a reader accepts. */
  static final int FILE_VERSION_OLDEST = 1;
  static final int HEADER_BYTES = 16;
  static final int FOOTER_BYTES = 8;
  private static final int CHECKSUM_READ_BYTES = 1 << 16;

  private StoreFileFormat() {}

  /** Bytes of a file whose payload (between header and footer) is {@code payloadBytes}. */
  static long fileBytes(long payloadBytes) {
    return HEADER_BYTES + payloadBytes + FOOTER_BYTES;
  }

  /**
   * Checks one file against its expected kind, size and checksum, reading it once from disk.
   *
   * @return the CRC32C stored in its footer
   * @throws CorruptStoreException naming the file and "expected … actual …" on the first check that fails
   */
  static int verify(Path file, FileKind kind, long expectedBytes, int expectedChecksum) throws IOException {
    try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
      long actualBytes = channel.size();
      if (actualBytes != expectedBytes) {
        throw new CorruptStoreException(file, "wrong size: expected " + expectedBytes + " bytes, actual "
            + actualBytes + " bytes");
      }
      if (actualBytes < HEADER_BYTES + FOOTER_BYTES) {
        throw new CorruptStoreException(file, "too short for a header and a footer: expected at least "
            + (HEADER_BYTES + FOOTER_BYTES) + " bytes, actual " + actualBytes + " bytes");
      }
      ByteBuffer header = ByteBuffer.allocate(HEADER_BYTES).order(ByteOrder.LITTLE_ENDIAN);
      readFully(channel, header, 0);
      checkHeader(file, header, kind);
      ByteBuffer footer = ByteBuffer.allocate(FOOTER_BYTES).order(ByteOrder.LITTLE_ENDIAN);
      readFully(channel, footer, actualBytes - FOOTER_BYTES);
      int footerMagic = footer.getInt(0);
      if (footerMagic != FOOTER_MAGIC) {
        throw new CorruptStoreException(file, "wrong footer magic: expected " + hex(FOOTER_MAGIC) + ", actual "
            + hex(footerMagic));
      }
      int storedChecksum = footer.getInt(4);
      int actualChecksum = checksum(channel, actualBytes - Integer.BYTES);
      if (storedChecksum != actualChecksum) {
        throw new CorruptStoreException(file, "checksum mismatch: expected " + hex(storedChecksum)
            + " (footer), actual " + hex(actualChecksum));
      }
      if (storedChecksum != expectedChecksum) {
        throw new CorruptStoreException(file, "checksum differs from the manifest: expected "
            + hex(expectedChecksum) + ", actual " + hex(storedChecksum));
      }
      return storedChecksum;
    }
  }

  private static void checkHeader(Path file, ByteBuffer header, FileKind kind) {
    int magic = header.getInt(0);
    if (magic != MAGIC) {
      throw new CorruptStoreException(file, "wrong magic: expected " + hex(MAGIC) + ", actual " + hex(magic));
    }
    int kindNumber = header.getInt(4);
    if (kindNumber != kind.kindNumber()) {
      throw new CorruptStoreException(file, "wrong file kind: expected " + kind.kindNumber() + " (" + kind
          + "), actual " + kindNumber);
    }
    int version = header.getInt(8);
    if (version < FILE_VERSION_OLDEST || version > FILE_VERSION_CURRENT) {
      throw new CorruptStoreException(file,
          "unsupported format version: expected " + (FILE_VERSION_OLDEST == FILE_VERSION_CURRENT
              ? String.valueOf(FILE_VERSION_CURRENT) : FILE_VERSION_OLDEST + " to "
                  + FILE_VERSION_CURRENT)
              + ", actual " + version);
    }
  }

  private static int checksum(FileChannel channel, long byteCount) throws IOException {
    return Crc32c.ofChannel(channel, byteCount);
  }

  private static void readFully(FileChannel channel, ByteBuffer dst, long position) throws IOException {
    long at = position;
    while (dst.hasRemaining()) {
      int read = channel.read(dst, at);
      if (read < 0) {
        throw new IOException("unexpected end of file at byte " + at);
      }
      at += read;
    }
  }

  static String hex(int value) {
    return String.format("0x%08X", value);
  }
}
