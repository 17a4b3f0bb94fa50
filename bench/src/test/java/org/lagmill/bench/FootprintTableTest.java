package org.lagmill.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class FootprintTableTest {
  private static final long MIB = 1L << 20;

  @TempDir
  Path folder;

  private static ProbeResult peakOnly(String mode, long rows, long peakMib) {
    return new ProbeResult(mode, rows, 20, 0, 0, peakMib * MIB, 0, 2.0, 0.5, 8.0, 10.0, 2, 0, rows / 4, 0.4);
  }

  @Test
  void shouldComputeBytesPerRowAboveTheBaseline() {
    // hand-checked: (1,100 MiB - 100 MiB) / 10M rows = 1,000 MiB / 1e7 = 104.8576 bytes
    assertEquals(104.8576, FootprintTable.bytesPerRow(peakOnly("stream", 10_000_000, 1_100), 100 * MIB), 1e-9);
  }

  @Test
  void shouldWriteOneMemoryRowPerSizeWithRatiosAndTheDataframeReference() {
    ProbeResult baseline = peakOnly("baseline", 0, 100);
    FootprintTable.SizeResult size = new FootprintTable.SizeResult(10_000, 1_000, peakOnly("stream", 9_000_000, 1_200),
        peakOnly("floor", 9_000_000, 1_000), peakOnly("matrix", 9_000_000, 2_400), null, null);
    String table = FootprintTable.markdown(baseline, List.of(size));
    // B/row: 1,100, 900 and 2,300 MiB over 9e6 rows = 128.16, 104.86, 267.96; stream/floor 1200/1000 = 1.20,
    // matrix/stream 2400/1200 = 2.00; dataframe 400 B x 1e7 item-days = 3,814 MiB, / 1,200 MiB = 3.2
    String expected = "| 10M (10000 × 1000) | 9,000,000 | 20 | 1,200 | 1,000 | 2,400 | 128.2 | 104.9 | 268.0 | 1.20 "
        + "| 2.00 | 3,814 | 3.2× |";
    assertTrue(table.contains(expected), table);
    assertTrue(table.startsWith("Baseline JVM with LightGBM loaded: 100 MB peak RSS."), table);
    assertTrue(!table.contains("partition-by"), "no partition table without partition figures:\n" + table);
  }

  @Test
  void shouldSaySkippedMatrixDoesNotFitAndShowThePartitionTable() {
    FootprintTable.SizeResult size = new FootprintTable.SizeResult(20_000, 2_500, peakOnly("stream", 45_000_000, 5_000),
        peakOnly("floor", 45_000_000, 4_500), null, "does not fit", new FootprintTable.PartitionResult(
            1_000 * MIB, 300 * MIB, 9_000_000, 900_000, 10));
    String table = FootprintTable.markdown(peakOnly("baseline", 0, 100), List.of(size));
    assertTrue(table.contains("| 50M (20000 × 2500) | 45,000,000 | 20 | 5,000 | 4,500 | does not fit |"), table);
    assertTrue(table.contains("| 50M | 1,000 | 300 | 10 | 9,000,000 | 900,000 | 0.30 |"), table);
  }

  @Test
  void shouldShowStageTimesAndRowsPerSecond() {
    FootprintTable.SizeResult size = new FootprintTable.SizeResult(1_000, 1_000, peakOnly("stream", 800_000, 200),
        peakOnly("floor", 800_000, 190), peakOnly("matrix", 800_000, 300), null, null);
    String table = FootprintTable.markdown(peakOnly("baseline", 0, 100), List.of(size));
    // sampling pass 0.4 s over 200,000 rows, push pass 2.0 - 0.4 = 1.6 s over 800,000 rows = 500,000 rows/s;
    // LightGBM 8.0 s = 100,000 rows/s; both passes 2.0 / 8.0 = 0.25
    assertTrue(table.contains("| 1M | 800,000 | 200,000 | 0.4 / 1.6 | 500,000 | 0.5 | 8.0 | 100,000 | 0.25 | 8.0 "
        + "| 10.0 / 10.0 / 10.0 | 2.0 | 8.0 |"), table);
  }

  @Test
  void shouldNameFractionalSizesInMillions() {
    assertEquals("1M", FootprintTable.millions(1_000_000));
    assertEquals("0.2M", FootprintTable.millions(150_000));
  }

  @Test
  void shouldReadTrainingRowsFromTheTrainSummary() throws IOException {
    Path log = folder.resolve("train.log");
    Files.writeString(log, String.join("\n",
        "[train] iteration 1, validation tweedie 13.40972, 0.9 s",
        "model store-1      3,300 series, Dataset 2,912,345 rows x 23 features (41.0 bytes per row), best iteration 10",
        "model store-2      3,300 series, Dataset 912 rows x 23 features (41.0 bytes per row), best iteration 10",
        "peak RSS 139 MB (5858.0 bytes per training row of the largest partition)"));
    assertEquals(List.of(2_912_345L, 912L), FootprintHarness.datasetRows(log));
  }
}
