package org.lagmill.ingest;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Path;
import java.util.zip.ZipException;

/**
 * A refillable byte window over a (possibly gzip-compressed: opened by {@link InputFiles}) input file, for hand-written
 * parsers: {@link #buffer}, {@link #position} and {@link #limit} are read and advanced by the parser directly.
 * {@link #ensure(int)} guarantees a lookahead so short cells never straddle a refill.
 */
final class CsvByteSource implements AutoCloseable {
  static final int BUFFER_BYTES = 1 << 20;

  final Path file;
  final byte[] buffer = new byte[BUFFER_BYTES];
  int position;
  int limit;
  private final InputStream in;
  private boolean endOfInput;
  /** Line number reported with a failure of the underlying stream. */
  long lineNumber;

  CsvByteSource(Path file) throws IOException {
    this.file = file;
    this.in = InputFiles.open(file);
  }

  boolean endOfInput() {
    return endOfInput && position >= limit;
  }

  /** Makes at least {@code byteCount} bytes available from {@link #position}, unless the input ends first. */
  void ensure(int byteCount) throws IOException {
    if (limit - position >= byteCount || endOfInput) {
      return;
    }
    System.arraycopy(buffer, position, buffer, 0, limit - position);
    limit -= position;
    position = 0;
    while (limit < byteCount && !endOfInput) {
      int read;
      try {
        read = in.read(buffer, limit, buffer.length - limit);
      } catch (EOFException | ZipException e) {
        throw InputFiles.failure(file, lineNumber, e);
      }
      if (read < 0) {
        endOfInput = true;
      } else {
        limit += read;
      }
    }
  }

  /** Refills for at least one byte; false at the end of input. */
  boolean hasByte() throws IOException {
    if (position < limit) {
      return true;
    }
    ensure(1);
    return position < limit;
  }

  @Override
  public void close() throws IOException {
    in.close();
  }
}
