package org.lagmill.io;

import java.io.IOException;
import java.nio.file.Path;

/**
 * An output path holds something lagmill did not write, or something the caller did not ask to replace; nothing was
 * changed. The message names the path and what is there.
 */
public final class OutputRefusedException extends IOException {
  private static final long serialVersionUID = 1L;

  /** Why the path was refused, so the command line can add the option that would allow it. */
  public enum Reason {
    /** The path holds something that is not ours: never replaced. */
    NOT_OURS,
    /** The path holds one of ours and replacing it was not asked for. */
    EXISTS
  }

  private final Path path;
  private final Reason reason;

  public OutputRefusedException(Path path, Reason reason, String problem) {
    super("refusing to write " + path + ": " + problem);
    this.path = path;
    this.reason = reason;
  }

  public Path path() {
    return path;
  }

  public Reason reason() {
    return reason;
  }
}
