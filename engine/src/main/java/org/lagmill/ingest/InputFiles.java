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
 *   <li>a name ending in {@code .gz}, in any letter case, is read through gzip;
 *   <li>a missing or unreadable file is an I/O failure (a {@link java.nio.file.NoSuchFileException}, unchecked as
 *       {@link UncheckedIOException} where the reader cannot throw it), the same for sales, calendar, prices and
 *       forecast files;
 *   <li>a damaged gzip stream is bad input ({@link InputFormatException}) with one of three messages.
 * </ul>
 */
final class InputFiles {
  static final String GZIP_SUFFIX = ".gz";
  static final String NOT_GZIP = "not gzip data: expected a gzip stream in a file named .gz";
  static final String TRUNCATED_GZIP = "truncated gzip stream: expected more compressed data, found the end of the file";
  static final String CORRUPT_GZIP = "corrupt gzip stream: ";
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
      return isGzip(file) ? new GZIPInputStream(raw, BUFFER_BYTES) : new BufferedInputStream(raw, BUFFER_BYTES);
    } catch (IOException e) {
      try {
        raw.close();
      } catch (IOException suppressed) {
        e.addSuppressed(suppressed);
      }
      throw failure(file, 0, e, true);
    }
  }

  /**
   * The exception for a stream failure at {@code lineNumber} (0 when unknown): a damaged gzip stream is bad input,
   * anything else an I/O failure.
   */
  static RuntimeException failure(Path file, long lineNumber, IOException e) {
    return failure(file, lineNumber, e, false);
  }

  private static RuntimeException failure(Path file, long lineNumber, IOException e, boolean atHeader) {
    if (e instanceof EOFException) {
      return new InputFormatException(file, lineNumber, 0, TRUNCATED_GZIP, e);
    }
    if (e instanceof ZipException) {
      return new InputFormatException(file, lineNumber, 0, atHeader ? NOT_GZIP : CORRUPT_GZIP + e.getMessage(), e);
    }
    return new UncheckedIOException("cannot read " + file, e);
  }
}
