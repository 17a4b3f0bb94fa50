package org.lagmill.cli;

import java.util.Locale;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * Reads a byte count for {@code --memory-limit}: plain bytes ({@code 2000000000}) or a whole number with the suffix
 * {@code k}, {@code m}, {@code g} or {@code t} (upper or lower case, an optional trailing {@code b}), each 1024 times
 * the one before, as java's own {@code -Xmx} reads them.
 */
final class ByteSizeConverter implements ITypeConverter<Long> {
  @Override
  public Long convert(String text) {
    return parse(text);
  }

  static long parse(String text) {
    String t = text.strip().toLowerCase(Locale.ROOT);
    if (t.endsWith("b") && t.length() > 1 && !Character.isDigit(t.charAt(t.length() - 2))) {
      t = t.substring(0, t.length() - 1);
    }
    int shift = 0;
    if (!t.isEmpty()) {
      switch (t.charAt(t.length() - 1)) {
        case 'k' -> shift = 10;
        case 'm' -> shift = 20;
        case 'g' -> shift = 30;
        case 't' -> shift = 40;
        default -> shift = 0;
      }
    }
    String digits = shift == 0 ? t : t.substring(0, t.length() - 1);
    if (digits.isEmpty() || !digits.chars().allMatch(Character::isDigit) || digits.length() > 18) {
      throw new TypeConversionException("'" + text + "' is not a size in bytes; write a whole number, optionally "
          + "followed by k, m, g or t (1024-based, as java -Xmx), e.g. 512m or 2g");
    }
    long value = Long.parseLong(digits);
    if (value > (Long.MAX_VALUE >> shift)) {
      throw new TypeConversionException("'" + text + "' is more bytes than a 64-bit count holds; e.g. 512m or 2g");
    }
    return value << shift;
  }
}
