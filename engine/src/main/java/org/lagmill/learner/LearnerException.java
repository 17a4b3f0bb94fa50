package org.lagmill.learner;

/** A LightGBM call returned an error code; the message names the call and carries LightGBM's own message. */
public final class LearnerException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public LearnerException(String message) {
    super(message);
  }
}
