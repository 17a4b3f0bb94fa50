package org.lagmill.store;

import java.nio.file.Path;

/** A store or model file fails its magic, version, size or checksum check: "expected … actual …" with the file named. */
public final class CorruptStoreException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public CorruptStoreException(Path file, String problem) {
    super(file + ": " + problem);
  }

  public CorruptStoreException(Path file, String problem, Throwable cause) {
    super(file + ": " + problem, cause);
  }
}
