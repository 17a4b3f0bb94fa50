package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GenerateCommandTest {
  @Test
  void shouldWriteTheThreeFilesAndASummaryLine(@TempDir Path dir) {
    Path out = dir.resolve("scenario");
    MainRun run = MainRun.of("generate", "--out", out.toString(), "--series", "20", "--days", "60");
    assertEquals(0, run.exitCode(), run.err());
    assertTrue(Files.isRegularFile(out.resolve("sales.csv")));
    assertTrue(Files.isRegularFile(out.resolve("calendar.csv")));
    assertTrue(Files.isRegularFile(out.resolve("prices.csv")));
    assertTrue(run.out().startsWith("generated 3 files in " + out + ": 20 series x 60 days = 1200 item-days, "),
        run.out());
  }

  @Test
  void shouldWriteGzipFilesWhenAsked(@TempDir Path dir) {
    MainRun run = MainRun.of("generate", "--out", dir.toString(), "--series", "5", "--days", "10", "--gzip",
        "--start", "2024-03-01", "--seed", "9", "--future-days", "0");
    assertEquals(0, run.exitCode(), run.err());
    assertTrue(Files.isRegularFile(dir.resolve("sales.csv.gz")));
    assertFalse(Files.exists(dir.resolve("sales.csv")));
  }

  @Test
  void shouldRejectZeroSeriesWithAUsageError(@TempDir Path dir) {
    MainRun run = MainRun.of("generate", "--out", dir.toString(), "--series", "0", "--days", "60");
    assertEquals(2, run.exitCode());
    assertEquals("lagmill: series count must be in [1, 50000000], got 0; hint: --series 600 gives a small demo",
        run.err().strip());
  }

  @Test
  void shouldRejectABadDateWithAUsageError(@TempDir Path dir) {
    MainRun run = MainRun.of("generate", "--out", dir.toString(), "--series", "3", "--days", "6", "--start",
        "2023-13-01");
    assertEquals(2, run.exitCode());
    assertTrue(run.err().contains("--start"), run.err());
  }

  @Test
  void shouldShowAnExampleInHelp() {
    MainRun run = MainRun.of("generate", "--help");
    assertEquals(0, run.exitCode());
    assertTrue(run.out().contains("lagmill generate --out demo-data --series 3000"), run.out());
  }
}
