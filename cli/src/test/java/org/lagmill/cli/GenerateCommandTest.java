package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GenerateCommandTest {
  @Test
  void shouldWriteTheFiveFilesAndASummaryLine(@TempDir Path dir) {
    Path out = dir.resolve("scenario");
    MainRun run = MainRun.of("generate", "--out", out.toString(), "--series", "20", "--days", "60");
    assertEquals(0, run.exitCode(), run.err());
    for (String file : List.of("sales.csv", "calendar.csv", "prices.csv", "plan.csv", "closures.csv")) {
      assertTrue(Files.isRegularFile(out.resolve(file)), file);
    }
    assertTrue(run.out().startsWith("generated 5 files in " + out + ": 20 series x 60 days = 1200 item-days, "),
        run.out());
  }

  @Test
  void shouldWriteWeeklyFilesWhenAsked(@TempDir Path dir) throws IOException {
    MainRun run = MainRun.of("generate", "--out", dir.toString(), "--series", "8", "--days", "70", "--period",
        "week", "--start", "2024-03-04");
    assertEquals(0, run.exitCode(), run.err());
    assertTrue(run.out().startsWith("generated 5 files in " + dir + ": 8 series x 70 days = 560 item-days in 10 "
        + "weeks, "), run.out());
    String header = Files.readAllLines(dir.resolve("sales.csv")).get(0);
    assertTrue(header.endsWith(",2024-03-04,2024-03-11,2024-03-18,2024-03-25,2024-04-01,2024-04-08,2024-04-15,"
        + "2024-04-22,2024-04-29,2024-05-06"), header);
    assertEquals("article,outlet,from,price", Files.readAllLines(dir.resolve("prices.csv")).get(0));
  }

  @Test
  void shouldRejectAnUnknownPeriodAndPartWeeks(@TempDir Path dir) {
    MainRun month = MainRun.of("generate", "--out", dir.toString(), "--series", "3", "--days", "70", "--period",
        "month");
    assertEquals(2, month.exitCode());
    assertEquals("lagmill: --period must be day or week, got 'month'", month.err().strip());
    MainRun partWeek = MainRun.of("generate", "--out", dir.toString(), "--series", "3", "--days", "60", "--period",
        "week");
    assertEquals(2, partWeek.exitCode());
    assertEquals("lagmill: weekly output needs whole weeks: --days and --future-days must be multiples of 7, got 60 "
        + "and 28; hint: --days 56 --future-days 28", partWeek.err().strip());
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
