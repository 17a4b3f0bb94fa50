package org.lagmill.ingest;

import java.io.BufferedInputStream;
import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.zip.GZIPInputStream;
import java.util.zip.ZipException;

/**
 * How every input file is opened, decompressed and how its stream failures are reported, shared by the field-based
 * {@link CsvSource} and the byte-based wide sales reader:
 * <ul>
 *   <li>a name ending in {@code .gz}, in any letter case, is read through gzip ({@link GzipMembers}: one or more
 *       members, nothing after the last);
 *   <li>a missing or unreadable file is an I/O failure (a {@link java.nio.file.NoSuchFileException}, unchecked as
 *       {@link UncheckedIOException} where the reader cannot throw it), the same for sales, calendar, prices, plan,
 *       closures and forecast files;
 *   <li>a damaged gzip stream is bad input ({@link InputFormatException}): not gzip data, cut short, corrupt (with
 *       the byte of the file where it showed), or bytes after its end;
 *   <li>gzip checks a member's data only at the member's end, so damage inside it reaches the reader as wrong text
 *       first; {@link #blameCompressedStream} turns such a reader's error into the stream's when the file's check
 *       fails.
 * </ul>
 */
public final class InputFiles {
  static final String GZIP_SUFFIX = ".gz";
  static final String NOT_GZIP = "not gzip data: expected a gzip stream in a file named .gz";
  static final String TRUNCATED_GZIP = "truncated gzip stream: expected more compressed data, found the end of the file";
  static final String CORRUPT_GZIP = "compressed data is corrupt";
  static final String INTACT_GZIP = ": expected an intact gzip stream";
  private static final int BUFFER_BYTES = 1 << 16;

  private InputFiles() {}

  /** Whether the file is read through gzip: its name ends in {@code .gz}, any case. */
  static boolean isGzip(Path file) {
    return String.valueOf(file.getFileName()).toLowerCase(Locale.ROOT).endsWith(GZIP_SUFFIX);
  }

  /**
   * Opens a file's (decompressed) bytes, buffered.
   *
   * @throws IOException when the file cannot be opened ({@code NoSuchFileException} when missing; a
   *     {@code FileSystemException} whose reason names a folder or a denied permission)
   * @throws InputFormatException when a {@code .gz} file does not start with a gzip header
   */
  static InputStream open(Path file) throws IOException {
    if (Files.isDirectory(file)) {
      throw new FileSystemException(file.toString(), null, "is a folder: expected a file");
    }
    InputStream raw;
    try {
      raw = Files.newInputStream(file);
    } catch (AccessDeniedException e) {
      throw new FileSystemException(file.toString(), null, "cannot be read: permission denied");
    }
    try {
      return isGzip(file) ? new GzipMembers(raw) : new BufferedInputStream(raw, BUFFER_BYTES);
    } catch (IOException e) {
      try {
        raw.close();
      } catch (IOException suppressed) {
        e.addSuppressed(suppressed);
      }
      throw failure(file, 0, e);
    }
  }

  /**
   * The exception for a stream failure at {@code lineNumber} (the line reached, 0 when unknown): a damaged gzip
   * stream is bad input, anything else an I/O failure.
   */
  static RuntimeException failure(Path file, long lineNumber, IOException e) {
    if (e instanceof EOFException) {
      return new InputFormatException(file, lineNumber, 0, TRUNCATED_GZIP, e);
    }
    if (e instanceof GzipMembers.Damage damage) {
      return new InputFormatException(file, lineNumber, 0, describe(file, damage), e);
    }
    if (e instanceof ZipException) {
      return new InputFormatException(file, lineNumber, 0, CORRUPT_GZIP + " (" + e.getMessage() + ")" + INTACT_GZIP,
          e);
    }
    return new UncheckedIOException("cannot read " + file, e);
  }

  private static String describe(Path file, GzipMembers.Damage damage) {
    String at = String.format(Locale.ROOT, "%,d", damage.compressedOffset());
    switch (damage.kind()) {
      case NOT_GZIP :
        return NOT_GZIP;
      case TRAILING_BYTES :
        return String.format(Locale.ROOT, "%,d bytes after the end of the gzip data at byte %s: expected the file to"
            + " end with its last gzip member", trailingBytes(file, damage.compressedOffset()), at);
      default :
        return CORRUPT_GZIP + " (" + damage.getMessage() + ", at byte " + at + " of the file)" + INTACT_GZIP;
    }
  }

  private static long trailingBytes(Path file, long offset) {
    try {
      return Files.size(file) - offset;
    } catch (IOException e) {
      return 0;
    }
  }

  /**
   * The error to report for a reader's complaint about a file: when the file is gzip and its compressed stream turns
   * out corrupt or cut short (checked by decompressing it to the end again), the stream's damage, at the line the
   * reader had reached, since the reader saw its garbled output; otherwise {@code e} itself. Runs only on the error
   * path.
   */
  public static InputFormatException blameCompressedStream(InputFormatException e) {
    Path file = e.file();
    if (file == null || !isGzip(file) || e.getCause() instanceof ZipException || e.getCause() instanceof EOFException) {
      return e;
    }
    byte[] scratch = new byte[BUFFER_BYTES];
    try (InputStream in = new GzipMembers(Files.newInputStream(file))) {
      while (in.read(scratch, 0, scratch.length) >= 0) {
        // decompressing to the end checks every member's CRC-32 and length
      }
    } catch (EOFException | GzipMembers.Damage damage) {
      if (damage instanceof GzipMembers.Damage d && d.kind() == GzipMembers.DamageKind.TRAILING_BYTES) {
        return e;
      }
      InputFormatException blamed = (InputFormatException) failure(file, e.lineNumber(), damage);
      blamed.addSuppressed(e);
      return blamed;
    } catch (IOException | RuntimeException unreadable) {
      e.addSuppressed(unreadable);
    }
    return e;
  }
}
