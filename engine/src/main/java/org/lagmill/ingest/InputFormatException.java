package org.lagmill.ingest;

import java.nio.file.Path;

/**
 * A user's input file does not hold what lagmill expects. The message names the file, the 1-based line and column
 * (0 when they do not apply), what was found and what was expected, so the user can fix the file without guessing.
 */
public final class InputFormatException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  private final transient Path file;
  private final long lineNumber;
  private final int columnNumber;

  public InputFormatException(Path file, long lineNumber, int columnNumber, String problem) {
    super(format(file, lineNumber, columnNumber, problem));
    this.file = file;
    this.lineNumber = lineNumber;
    this.columnNumber = columnNumber;
  }

  public InputFormatException(Path file, long lineNumber, int columnNumber, String problem, Throwable cause) {
    super(format(file, lineNumber, columnNumber, problem), cause);
    this.file = file;
    this.lineNumber = lineNumber;
    this.columnNumber = columnNumber;
  }

  private static String format(Path file, long lineNumber, int columnNumber, String problem) {
    StringBuilder b = new StringBuilder().append(file);
    if (lineNumber > 0) {
      b.append(", line ").append(lineNumber);
    }
    if (columnNumber > 0) {
      b.append(", column ").append(columnNumber);
    }
    return b.append(": ").append(problem).toString();
  }

  public Path file() { return file; }

  /** 1-based line number, 0 when the problem is not on one line. */
  public long lineNumber() { return lineNumber; }

  /** 1-based column number, 0 when the problem is not in one column. */
  public int columnNumber() {
    return columnNumber;
  }
}
