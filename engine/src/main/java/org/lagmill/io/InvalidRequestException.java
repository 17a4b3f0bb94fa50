package org.lagmill.io;

/**
 * What the user asked for cannot be done as asked: an option, a feature spec, a selection, a hierarchy or a date
 * range that does not fit the data. The message states the facts in the user's terms (the value given, what is
 * allowed, what the data holds) and, where one helps, a next step; it is shown as it is, with the usage exit code.
 *
 * <p>Internal contract failures (a caller passing arrays of the wrong length, a negative count) stay plain
 * {@link IllegalArgumentException}s: those are bugs, reported as internal errors. This type extends it so that code
 * and tests that accept any argument failure keep working.
 */
public class InvalidRequestException extends IllegalArgumentException {
  private static final long serialVersionUID = 1L;

  public InvalidRequestException(String message) {
    super(message);
  }

  public InvalidRequestException(String message, Throwable cause) {
    super(message, cause);
  }
}
