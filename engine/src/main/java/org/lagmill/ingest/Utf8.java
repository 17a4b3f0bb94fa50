package org.lagmill.ingest;

/** UTF-8 well-formedness (RFC 3629: no overlongs, no surrogates, at most U+10FFFF). */
final class Utf8 {
  private Utf8() {}

  /** Index of the first byte that breaks UTF-8 in {@code bytes[0 .. length)}, or -1 when all is well-formed. */
  static int firstInvalidByte(byte[] bytes, int length) {
    int i = 0;
    while (i < length) {
      int b = bytes[i] & 0xFF;
      if (b < 0x80) {
        i++;
        continue;
      }
      int extra;
      int min;
      if (b >= 0xC2 && b <= 0xDF) {
        extra = 1;
        min = 0x80;
      } else if (b >= 0xE0 && b <= 0xEF) {
        extra = 2;
        min = 0x800;
      } else if (b >= 0xF0 && b <= 0xF4) {
        extra = 3;
        min = 0x10000;
      } else {
        return i;
      }
      if (i + extra >= length) {
        return i;
      }
      int codePoint = b & (0x3F >> extra);
      for (int k = 1; k <= extra; k++) {
        int c = bytes[i + k] & 0xFF;
        if ((c & 0xC0) != 0x80) {
          return i + k;
        }
        codePoint = (codePoint << 6) | (c & 0x3F);
      }
      if (codePoint < min || codePoint > 0x10FFFF || (codePoint >= 0xD800 && codePoint <= 0xDFFF)) {
        return i;
      }
      i += extra + 1;
    }
    return -1;
  }
}
