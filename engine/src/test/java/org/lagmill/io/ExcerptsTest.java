package org.lagmill.io;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class ExcerptsTest {
  @Test
  void shouldKeepShortPrintableTextAsItIs() {
    assertEquals("oat_bar/north_1", Excerpts.of("oat_bar/north_1"));
    assertEquals("", Excerpts.of(""));
    assertEquals("x".repeat(60), Excerpts.of("x".repeat(60)));
  }

  @Test
  void shouldCutLongTextAndNameItsLength() {
    assertEquals("y".repeat(60) + "… (100000 characters)", Excerpts.of("y".repeat(100_000)));
  }

  @Test
  void shouldEscapeControlCharacters() {
    assertEquals("a\\0b\\tc\\nd\\re\\u0001", Excerpts.of("a\0b\tc\nd\re\u0001"));
  }

  @Test
  void shouldNotSplitASurrogatePair() {
    String text = "z".repeat(59) + "\uD83D\uDE00" + "tail";
    assertEquals("z".repeat(59) + "… (65 characters)", Excerpts.of(text));
  }
}
