package org.lagmill.training;

/**
 * A distributed training cannot go on: another rank failed, was killed, did not connect in time, trains something
 * else, or the ranks fell out of step. The message names the rank and the cause; the command exits with its own code.
 */
public final class RankFailureException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public RankFailureException(String message) {
    super(message);
  }

  public RankFailureException(String message, Throwable cause) {
    super(message, cause);
  }
}
