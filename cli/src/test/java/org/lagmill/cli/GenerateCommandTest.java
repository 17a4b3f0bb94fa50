package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GenerateCommandTest {
  @BeforeAll
  static void createTempRoot() throws IOException {
    // The build points java.io.tmpdir at a per-fork folder it does not create; @TempDir needs it to exist.
    Files.createDirectories(Path.of(System.getProperty("java.io.tmpdir")));
  }

  @Test
  void shouldWriteTheThreeFilesAndASummaryLine(@TempDir Path dir) {
    Path out = dir.resolve("scenario");
    String[] streams = run("generate", "--out", out.toString(), "--series", "20", "--days", "60");
    assertEquals("0", streams[2], streams[1]);
    assertTrue(Files.isRegularFile(out.resolve("sales.csv")));
    assertTrue(Files.isRegularFile(out.resolve("calendar.csv")));
    assertTrue(Files.isRegularFile(out.resolve("prices.csv")));
    assertTrue(streams[0].startsWith("generated 3 files in " + out + ": 20 series x 60 days = 1200 item-days, "),
        streams[0]);
  }

  @Test
  void shouldWriteGzipFilesWhenAsked(@TempDir Path dir) {
    String[] streams = run("generate", "--out", dir.toString(), "--series", "5", "--days", "10", "--gzip",
        "--start", "2024-03-01", "--seed", "9", "--future-days", "0");
    assertEquals("0", streams[2], streams[1]);
    assertTrue(Files.isRegularFile(dir.resolve("sales.csv.gz")));
    assertFalse(Files.exists(dir.resolve("sales.csv")));
  }

  @Test
  void shouldRejectZeroSeriesWithAUsageError(@TempDir Path dir) {
    String[] streams = run("generate", "--out", dir.toString(), "--series", "0", "--days", "60");
    assertEquals("2", streams[2]);
    assertEquals("lagmill: series count must be in [1, 50000000], got 0; hint: --series 600 gives a small demo",
        streams[1].strip());
  }

  @Test
  void shouldRejectABadDateWithAUsageError(@TempDir Path dir) {
    String[] streams = run("generate", "--out", dir.toString(), "--series", "3", "--days", "6", "--start", "2023-13-01");
    assertEquals("2", streams[2]);
    assertTrue(streams[1].contains("--start"), streams[1]);
  }

  @Test
  void shouldShowAnExampleInHelp() {
    String[] streams = run("generate", "--help");
    assertEquals("0", streams[2]);
    assertTrue(streams[0].contains("lagmill generate --out demo-data --series 3000"), streams[0]);
  }

  /** Runs the command line with captured streams: stdout, stderr, exit code. */
  private static String[] run(String... args) {
    PrintStream stdout = System.out;
    PrintStream stderr = System.err;
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    try {
      System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
      System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
      int exitCode = Main.run(args);
      return new String[] {out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8),
          Integer.toString(exitCode)};
    } finally {
      System.setOut(stdout);
      System.setErr(stderr);
    }
  }
}
