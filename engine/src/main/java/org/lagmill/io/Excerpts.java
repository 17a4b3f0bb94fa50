package org.lagmill.io;

/**
 * The one way an error message quotes text from a user's file: at most {@link #MAX_CHARS} characters of it, and
 * control characters written as escapes, so a message stays one short readable line whatever the file holds (a
 * 100,000-character cell, a NUL byte, a line break inside a quoted cell).
 */
public final class Excerpts {
  /** Characters of the quoted text kept in a message; longer text is cut and its full length named. */
  public static final int MAX_CHARS = 60;

  private Excerpts() {}

  /**
   * {@code text} as a message shows it: unchanged when short and printable; otherwise cut to {@link #MAX_CHARS}
   * characters followed by {@code "… (N characters)"}, with control characters as {@code \0}, {@code \t}, {@code \n},
   * {@code \r} or {@code \}{@code uXXXX}.
   */
  public static String of(String text) {
    if (text == null) {
      return "";
    }
    int shownChars = Math.min(text.length(), MAX_CHARS);
    // a surrogate pair is never split: the excerpt ends before its first half
    if (shownChars < text.length() && shownChars > 0 && Character.isHighSurrogate(text.charAt(shownChars - 1))) {
      shownChars--;
    }
    StringBuilder b = new StringBuilder(shownChars + 24);
    for (int i = 0; i < shownChars; i++) {
      char c = text.charAt(i);
      if (c >= 0x20 && c != 0x7F) {
        b.append(c);
      } else if (c == 0) {
        b.append("\\0");
      } else if (c == '\t') {
        b.append("\\t");
      } else if (c == '\n') {
        b.append("\\n");
      } else if (c == '\r') {
        b.append("\\r");
      } else {
        b.append(String.format("\\u%04X", (int) c));
      }
    }
    if (shownChars < text.length()) {
      b.append("… (").append(text.length()).append(" characters)");
    }
    return b.toString();
  }
}
