package org.lagmill.store;

import java.io.IOException;
import java.nio.file.Path;

/** Another writer holds a store's lock and the caller asked not to wait for it. */
public final class StoreBusyException extends IOException {
  private static final long serialVersionUID = 1L;

  public StoreBusyException(Path storeDir, String holder) {
    super("store " + storeDir + " is being changed by " + holder + "; try again when it has finished");
  }
}
