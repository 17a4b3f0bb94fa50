package org.lagmill.io;

import java.nio.file.Path;

/**
 * A file lagmill wrote fails a check on reading (magic, version, size, checksum, a decoded value out of range):
 * "expected … actual …" with the file named. Subclasses name the kind of directory it belongs to.
 */
public class CorruptFileException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public CorruptFileException(Path file, String problem) {
    super(file + ": " + problem);
  }

  public CorruptFileException(Path file, String problem, Throwable cause) {
    super(file + ": " + problem, cause);
  }
}
