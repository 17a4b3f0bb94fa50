package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class ConsoleProgressTest {

  @Test
  void shouldPrintOneLinePerStageEventWhenNotATerminal() {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    ConsoleProgress progress = new ConsoleProgress(new PrintStream(bytes, true, StandardCharsets.UTF_8), false);
    progress.startStage("train", "iterations", 100);
    progress.advance(10);
    progress.note("iteration 10, validation tweedie 1.23");
    progress.endStage();
    String[] lines = bytes.toString(StandardCharsets.UTF_8).split("\n");
    assertEquals("[train] started, 100 iterations", lines[0]);
    assertEquals("[train] iteration 10, validation tweedie 1.23", lines[1]);
    assertTrue(lines[2].startsWith("[train] done: 10 iterations in "), lines[2]);
    assertEquals(3, lines.length, "an advance within the first seconds prints nothing: " + String.join(" | ", lines));
    assertTrue(!bytes.toString(StandardCharsets.UTF_8).contains("\r"), "no carriage returns in a log");
  }

  @Test
  void shouldRedrawOnATerminal() {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    ConsoleProgress progress = new ConsoleProgress(new PrintStream(bytes, true, StandardCharsets.UTF_8), true);
    progress.startStage("dataset", "rows", 1000);
    progress.endStage();
    String text = bytes.toString(StandardCharsets.UTF_8);
    assertTrue(text.startsWith("\r[dataset] done: 0 rows in "), text);
  }

  @Test
  void shouldFormatDurationsForAnEta() {
    assertEquals("45s", ConsoleProgress.formatDuration(44.6));
    assertEquals("2m05s", ConsoleProgress.formatDuration(125));
    assertEquals("1h01m", ConsoleProgress.formatDuration(3700));
  }
}
