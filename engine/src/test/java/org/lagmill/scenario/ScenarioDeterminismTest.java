package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.List;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ScenarioDeterminismTest {
  private static final LocalDate START = LocalDate.of(2023, 1, 2);
  private static final String[] FILES = {"sales.csv", "calendar.csv", "prices.csv", "plan.csv", "closures.csv"};

  @Test
  void shouldWriteByteIdenticalFilesForEqualSpecs(@TempDir Path dir) throws IOException {
    ScenarioSpec spec = new ScenarioSpec(250, 400, START, 42, 28, false);
    ScenarioGenerator.write(spec, dir.resolve("a"));
    ScenarioGenerator.write(spec, dir.resolve("b"));
    for (String file : FILES) {
      assertArrayEquals(Files.readAllBytes(dir.resolve("a").resolve(file)),
          Files.readAllBytes(dir.resolve("b").resolve(file)), file);
    }
  }

  @Test
  void shouldDifferForAnotherSeed(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(250, 400, START, 42, 28, false), dir.resolve("a"));
    ScenarioGenerator.write(new ScenarioSpec(250, 400, START, 43, 28, false), dir.resolve("b"));
    assertFalse(Arrays.equals(Files.readAllBytes(dir.resolve("a/sales.csv")),
        Files.readAllBytes(dir.resolve("b/sales.csv"))));
    assertFalse(Arrays.equals(Files.readAllBytes(dir.resolve("a/prices.csv")),
        Files.readAllBytes(dir.resolve("b/prices.csv"))));
    assertFalse(Arrays.equals(Files.readAllBytes(dir.resolve("a/plan.csv")),
        Files.readAllBytes(dir.resolve("b/plan.csv"))));
    // The calendar and closures depend on dates and outlets only, not on the seed.
    assertArrayEquals(Files.readAllBytes(dir.resolve("a/calendar.csv")),
        Files.readAllBytes(dir.resolve("b/calendar.csv")));
    assertArrayEquals(Files.readAllBytes(dir.resolve("a/closures.csv")),
        Files.readAllBytes(dir.resolve("b/closures.csv")));
  }

  @Test
  void shouldKeepEachSeriesIndependentOfHowManyFollow(@TempDir Path dir) throws IOException {
    // Both counts give four outlets, so series i is the same article-outlet in both runs.
    ScenarioGenerator.write(new ScenarioSpec(50, 300, START, 7, 28, false), dir.resolve("small"));
    ScenarioGenerator.write(new ScenarioSpec(80, 300, START, 7, 28, false), dir.resolve("large"));
    List<String> small = Files.readAllLines(dir.resolve("small/sales.csv"));
    List<String> large = Files.readAllLines(dir.resolve("large/sales.csv"));
    assertEquals(small, large.subList(0, small.size()));
  }

  @Test
  void shouldDecompressGzipOutputToThePlainBytes(@TempDir Path dir) throws IOException {
    ScenarioSummary plain = ScenarioGenerator.write(new ScenarioSpec(90, 200, START, 11, 28, false),
        dir.resolve("plain"));
    ScenarioSummary gzip = ScenarioGenerator.write(new ScenarioSpec(90, 200, START, 11, 28, true), dir.resolve("gz"));
    assertEquals(plain.itemDayCount(), gzip.itemDayCount());
    for (String file : FILES) {
      Path compressed = dir.resolve("gz").resolve(file + ".gz");
      try (InputStream in = new GZIPInputStream(Files.newInputStream(compressed))) {
        assertArrayEquals(Files.readAllBytes(dir.resolve("plain").resolve(file)), in.readAllBytes(), file);
      }
    }
    ScenarioGenerator.write(new ScenarioSpec(90, 200, START, 11, 28, true), dir.resolve("gz2"));
    for (String file : FILES) {
      assertArrayEquals(Files.readAllBytes(dir.resolve("gz").resolve(file + ".gz")),
          Files.readAllBytes(dir.resolve("gz2").resolve(file + ".gz")), file + ".gz");
    }
  }
}
