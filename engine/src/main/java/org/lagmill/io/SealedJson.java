package org.lagmill.io;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/**
 * A JSON object file that carries its own CRC32C as its last member, {@code "crc32c" : "<8 hex digits>"}, over the
 * exact bytes of the file with that member left out. The check is on bytes, not on parsed values, so it does not
 * depend on how a JSON library prints numbers; any edit of the file (a changed digit, a re-indent) fails it.
 *
 * <p>Writers hand over the JSON object's bytes as their library printed them; {@link #seal} inserts the member before
 * the closing brace. Readers pass the file's bytes to {@link #unseal}, which checks and returns the bytes to parse.
 * A file without the member is returned as it is, flagged, so a reader can accept a previous format version that
 * had none and refuse a current one without it.
 */
public final class SealedJson {
  /** Name of the checksum member. */
  public static final String MEMBER = "crc32c";
  private static final String MEMBER_PREFIX = ",\n  \"" + MEMBER + "\" : \"";

  private SealedJson() {}

  /** The bytes of a JSON object, as printed, and whether they carried a checksum. */
  public record Unsealed(byte[] bytes, boolean sealed) {}

  /**
   * Adds the checksum member to a pretty-printed JSON object ({@code {\n  …\n}} with an optional final newline).
   *
   * @throws IllegalArgumentException when the bytes do not end with a closing brace
   */
  public static byte[] seal(byte[] json) {
    String text = new String(json, StandardCharsets.UTF_8);
    int close = text.lastIndexOf('}');
    if (close < 0 || !text.substring(close + 1).isBlank()) {
      throw new IllegalArgumentException("expected a JSON object ending in '}', got " + text.length() + " chars");
    }
    int crc = Crc32c.of(json);
    int bodyEnd = close;
    while (bodyEnd > 0 && Character.isWhitespace(text.charAt(bodyEnd - 1))) {
      bodyEnd--;
    }
    String sealed = text.substring(0, bodyEnd) + MEMBER_PREFIX + Crc32c.hex(crc) + "\"" + text.substring(bodyEnd);
    return sealed.getBytes(StandardCharsets.UTF_8);
  }

  /**
   * Checks and removes the checksum member.
   *
   * @throws CorruptFileException naming the file when the member is malformed or the checksum does not match
   */
  public static Unsealed unseal(Path file, byte[] bytes) {
    String text = new String(bytes, StandardCharsets.UTF_8);
    int member = text.lastIndexOf(MEMBER_PREFIX);
    if (member < 0) {
      return new Unsealed(bytes, false);
    }
    int valueStart = member + MEMBER_PREFIX.length();
    int valueEnd = valueStart + 8;
    if (valueEnd + 1 > text.length() || text.charAt(valueEnd) != '"'
        || !text.substring(valueStart, valueEnd).matches("[0-9a-f]{8}")) {
      throw new CorruptFileException(file, "malformed " + MEMBER + " member: expected 8 lowercase hex digits");
    }
    String body = text.substring(0, member) + text.substring(valueEnd + 1);
    byte[] original = body.getBytes(StandardCharsets.UTF_8);
    String expected = text.substring(valueStart, valueEnd);
    String actual = Crc32c.hex(Crc32c.of(original));
    if (!expected.equals(actual)) {
      throw new CorruptFileException(file, "checksum mismatch: expected " + expected + " (its " + MEMBER
          + " member), actual " + actual + "; the file was changed after lagmill wrote it");
    }
    return new Unsealed(original, true);
  }
}
