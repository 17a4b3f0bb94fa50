package org.lagmill.store;

import java.nio.file.Path;
import org.lagmill.io.CorruptFileException;

/** A store or model file fails its magic, version, size or checksum check: "expected … actual …" with the file named. */
public final class CorruptStoreException extends CorruptFileException {
  private static final long serialVersionUID = 1L;

  public CorruptStoreException(Path file, String problem) {
    super(file, problem);
  }

  public CorruptStoreException(Path file, String problem, Throwable cause) {
    super(file, problem, cause);
  }
}
