package org.lagmill.io;

/** CSV output cells per RFC 4180: a cell holding a comma, a double quote, CR or LF is quoted, quotes doubled. */
public final class CsvCells {
  private CsvCells() {}

  /** The cell as written. */
  public static String cell(String text) {
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (c == ',' || c == '"' || c == '\n' || c == '\r') {
        return '"' + text.replace("\"", "\"\"") + '"';
      }
    }
    return text;
  }
}
