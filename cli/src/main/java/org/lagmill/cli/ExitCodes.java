package org.lagmill.cli;

/** Process exit codes, documented in the README; each failure class has its own so scripts can react. */
public final class ExitCodes {
  public static final int OK = 0;
  /** An unexpected internal error: a bug to report. */
  public static final int INTERNAL_ERROR = 1;
  /** Wrong or missing options or arguments (picocli's own convention). */
  public static final int USAGE_ERROR = 2;
  /** An input file (sales, calendar, prices, configuration, forecast) is malformed. */
  public static final int BAD_INPUT = 3;
  /** A store or model directory fails its format or checksum checks. */
  public static final int CORRUPT_STORE = 4;
  /** The run would exceed its memory budget. */
  public static final int OUT_OF_MEMORY_BUDGET = 5;
  /** A file or directory could not be read or written. */
  public static final int IO_ERROR = 6;
  /** Another command is writing the store and {@code --no-wait} was given. */
  public static final int STORE_BUSY = 7;
  /** The Java heap (or the JVM's native memory) ran out: not a budget refusal, the process itself hit its limit. */
  public static final int JVM_OUT_OF_MEMORY = 8;
  /** A distributed training stopped: another rank failed, was killed, did not connect in time, or disagreed. */
  public static final int RANK_FAILED = 9;

  private ExitCodes() {}
}
