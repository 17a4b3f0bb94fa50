package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.ingest.InputFormatException;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.training.SmallHistories;

class ForecastFileRoundTripTest {
  private static final long SEED = TestSeeds.master(88_123L);
  private static final double[] LEVELS = ForecastTable.publishedQuantiles();

  @Test
  void shouldReadBackWhatItWroteToFourDecimals(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED, 9, 40, 10);
    ForecastTable table = randomTable(history, 5, new SplittableRandom(SEED));
    for (String name : List.of("f.csv", "f.csv.gz")) {
      Path file = dir.resolve(name);
      ForecastFileWriter.writeLong(table, history, file);
      ForecastTable read = ForecastFileReader.read(file, history);
      assertEquals(history.dayCount(), read.firstDayIndex());
      assertArrayEquals(LEVELS, read.quantileLevels());
      for (int s = 0; s < history.seriesCount(); s++) {
        for (int d = 0; d < 5; d++) {
          String context = name + " series " + s + " day " + d + ", seed " + SEED;
          assertEquals(table.point()[s][d], read.point()[s][d], 0.5e-4 + 1e-12, context);
          for (int q = 0; q < LEVELS.length; q++) {
            assertEquals(table.quantiles()[q][s][d], read.quantiles()[q][s][d], 0.5e-4 + 1e-12, context);
          }
        }
      }
      assertEquals(name.endsWith(".gz"), isGzip(file), name);
    }
    Path wide = dir.resolve("w.csv");
    ForecastFileWriter.writeWide(table, history, wide);
    List<String> lines = Files.readAllLines(wide);
    assertEquals(1 + history.seriesCount(), lines.size());
    // Day 40 from 2022-12-26 is 2023-02-04.
    assertEquals("series_id,item,store,region,2023-02-04,2023-02-05,2023-02-06,2023-02-07,2023-02-08", lines.get(0));
  }

  @Test
  void shouldFormatWithAtMostFourDecimalsAndNoTrailingZeros() {
    assertEquals("3", ForecastFileWriter.format(3.0));
    assertEquals("0.1235", ForecastFileWriter.format(0.123456));
    assertEquals("1", ForecastFileWriter.format(0.99999));
    assertEquals("2.5", ForecastFileWriter.format(2.5));
  }

  @Test
  void shouldNameFileLineAndColumnOfEachError(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED, 2, 40, 10);
    String header = "series_id,date,forecast\n";
    String good = "it0_st0,2023-02-04,1.5\nit0_st1,2023-02-04,2\n";
    expectError(dir, history, header + "it0_st0,2023-02-04,1.5\nit9_st9,2023-02-04,2\n",
        ", line 3, column 1: expected a series of the store, found 'it9_st9'");
    expectError(dir, history, header + "it0_st0,2023-02-31,1.5\n",
        ", line 2, column 2: expected an ISO date (YYYY-MM-DD), found \"2023-02-31\"");
    expectError(dir, history, header + "it0_st0,2023-02-04,-1\n",
        ", line 2, column 3: expected a non-negative number of units, found \"-1\"");
    expectError(dir, history, header + good + "it0_st1,2023-02-04,3\n",
        ", line 4, column 2: duplicate forecast for series 'it0_st1' on 2023-02-04");
    expectError(dir, history, header + good + "it0_st0,2023-02-05,1\n",
        ": expected a forecast for every series on every day from 2023-02-04 to 2023-02-05, missing: series 'it0_st1'"
            + " on 2023-02-05");
  }

  @Test
  void shouldRefuseNonFiniteValuesAndCrossingQuantiles(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED, 2, 40, 10);
    for (String bad : new String[] {"NaN", "Infinity", "-Infinity", "1e400"}) {
      expectError(dir, history, "series_id,date,forecast\nit0_st0,2023-02-04," + bad + "\n",
          ", line 2, column 3: expected a non-negative number of units, found \"" + bad + "\"");
    }
    expectError(dir, history, "series_id,date,forecast,q0.25,q0.75\nit0_st0,2023-02-04,1,0,NaN\n",
        ", line 2, column 5: expected a non-negative number of units, found \"NaN\"");
    // columns in any order; the check follows the levels
    expectError(dir, history, "series_id,date,forecast,q0.75,q0.5,q0.25\nit0_st0,2023-02-04,1,4,2,1\n"
        + "it0_st1,2023-02-04,1,2,3,1\n",
        ", line 3, column 4: q0.5 is 3.0 but q0.75 is 2.0: expected quantiles that"
            + " do not decrease as the level rises");
  }

  @Test
  void shouldRefuseARepeatedOrZeroQuantileLevel(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED, 2, 40, 10);
    // q0.5 and q0.50 are one level: scored twice, its loss would count double
    expectError(dir, history, "series_id,date,forecast,q0.5,q0.50\nit0_st0,2023-02-04,1,1,1\n"
        + "it0_st1,2023-02-04,1,1,1\n",
        ", line 1, column 5: quantile column q0.50 repeats the level of q0.5 (column"
            + " 4): expected each level once");
    expectError(dir, history, "series_id,date,forecast,q0.0\nit0_st0,2023-02-04,1,0\nit0_st1,2023-02-04,1,0\n",
        ", line 1, column 4: quantile column q0.0: expected a level above 0 and below 1, e.g. q0.5");
  }

  private static void expectError(Path dir, ArraySalesHistory history, String text, String expectedTail)
      throws IOException {
    Path file = Files.writeString(dir.resolve("bad.csv"), text, StandardCharsets.UTF_8);
    InputFormatException e = assertThrows(InputFormatException.class, () -> ForecastFileReader.read(file, history));
    assertEquals(file + expectedTail, e.getMessage());
  }

  private static ForecastTable randomTable(ArraySalesHistory history, int horizon, SplittableRandom random) {
    double[][] point = new double[history.seriesCount()][horizon];
    double[][][] quantiles = new double[LEVELS.length][history.seriesCount()][horizon];
    for (int s = 0; s < point.length; s++) {
      for (int d = 0; d < horizon; d++) {
        point[s][d] = random.nextInt(5) == 0 ? random.nextInt(9) : random.nextDouble() * 30;
        double value = 0;
        for (int q = 0; q < LEVELS.length; q++) {
          value += random.nextInt(3);
          quantiles[q][s][d] = value;
        }
      }
    }
    return new ForecastTable(history.dayCount(), point, LEVELS, quantiles);
  }

  private static boolean isGzip(Path file) throws IOException {
    try (InputStream in = Files.newInputStream(file)) {
      if (in.read() != 0x1f || in.read() != 0x8b) {
        return false;
      }
    }
    try (InputStream unzipped = new GZIPInputStream(Files.newInputStream(file))) {
      return unzipped.read() == 's';
    }
  }

}
