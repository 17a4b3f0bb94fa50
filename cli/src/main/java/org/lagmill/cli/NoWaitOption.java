package org.lagmill.cli;

import picocli.CommandLine.Option;

/** {@code --no-wait}, for the commands that write a store. */
final class NoWaitOption {
  @Option(names = "--no-wait", description = "fail at once (exit 7) when another command is writing the store, "
      + "instead of waiting for it")
  boolean noWait;

  /** Whether to wait for another writer of the store to finish. */
  boolean waits() {
    return !noWait;
  }
}
