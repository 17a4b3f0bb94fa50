package org.lagmill.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;
import org.lagmill.memory.MemoryBudget;

/** Rows written to a dump and streamed back must be the same rows, in the same order, for any chunk size. */
class RowDumpTest {
  private static final long MASTER_SEED = 20_261_202L;

  @TempDir
  Path folder;

  /** Seeded random rows with NaNs (missing values) and a categorical column. */
  private static final class RandomRows implements RowStream {
    final float[][] values;
    final float[] labels;
    final FeatureSchema schema = new FeatureSchema(List.of("lag_28", "mean_7", "store"), List.of(false, false, true));

    RandomRows(int rowCount) {
      SplittableRandom random = new SplittableRandom(MASTER_SEED);
      values = new float[rowCount][3];
      labels = new float[rowCount];
      for (int r = 0; r < rowCount; r++) {
        values[r][0] = random.nextInt(10) == 0 ? Float.NaN : random.nextInt(20);
        values[r][1] = (float) random.nextDouble(5);
        values[r][2] = random.nextInt(4);
        labels[r] = random.nextInt(7);
      }
    }

    @Override
    public FeatureSchema schema() { return schema; }

    @Override
    public long rowCount() { return labels.length; }

    @Override
    public void stream(FeatureBatch batch, BatchConsumer consumer) {
      batch.reset(0);
      for (int r = 0; r < labels.length; r++) {
        int row = batch.addRow(r, r, labels[r], 1f);
        for (int f = 0; f < 3; f++) {
          batch.set(row, f, values[r][f]);
        }
        if (batch.isFull()) {
          consumer.accept(batch);
          batch.reset(r + 1);
        }
      }
      if (batch.rowCount() > 0) {
        consumer.accept(batch);
      }
    }
  }

  @Test
  void shouldStreamBackTheSameRowsForAnyChunkSize() throws IOException {
    RandomRows rows = new RandomRows(1_001);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      RowDump.Header header = RowDump.write(rows, folder, budget, 64);
      assertEquals(1_001, header.rowCount());
      assertEquals(rows.schema, header.schema());
      assertEquals(1_001L * 3 * Float.BYTES, Files.size(folder.resolve(RowDump.FEATURES_FILE)));
      for (int chunkRows : new int[] {1_001, 100, 7, 1}) {
        List<Long> firstRows = new ArrayList<>();
        int[] seen = {0};
        try (RowDump.FileRowStream back = new RowDump.FileRowStream(folder);
            FeatureBatch batch = new FeatureBatch(budget, chunkRows, 3)) {
          assertEquals(rows.schema, back.schema());
          for (int pass = 0; pass < 2; pass++) {
            seen[0] = 0;
            back.stream(batch, full -> {
              firstRows.add(full.firstRowIndex());
              for (int row = 0; row < full.rowCount(); row++) {
                int r = (int) full.firstRowIndex() + row;
                assertEquals(seen[0]++, r, "chunk " + chunkRows);
                assertEquals(rows.labels[r], full.labels()[row], "row " + r + ", master seed " + MASTER_SEED);
                for (int f = 0; f < 3; f++) {
                  // assertEquals on floats treats NaN as equal to NaN: missing values must survive the file
                  assertEquals(rows.values[r][f], full.get(row, f), "row " + r + " feature " + f + ", master seed "
                      + MASTER_SEED);
                }
              }
            });
            assertEquals(1_001, seen[0], "chunk " + chunkRows + " pass " + pass);
          }
        }
        assertEquals(0L, firstRows.get(0));
        assertEquals(2L * ((1_001 + chunkRows - 1) / chunkRows), firstRows.size(), "chunk " + chunkRows);
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldRejectADumpWhoseFeatureFileWasCut() throws IOException {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      RowDump.write(new RandomRows(10), folder, budget, 4);
    }
    Path features = folder.resolve(RowDump.FEATURES_FILE);
    byte[] bytes = Files.readAllBytes(features);
    Files.write(features, java.util.Arrays.copyOf(bytes, bytes.length - 4));
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> RowDump.readHeader(folder));
    assertEquals("row dump " + features + ": expected 120 bytes for 10 rows x 3 features, actual 116",
        e.getMessage());
  }

  @Test
  void shouldSplitPassTimeBetweenProducerAndConsumer() {
    RandomRows rows = new RandomRows(50);
    TimedRowStream timed = new TimedRowStream(rows, 2);
    try (MemoryBudget budget = MemoryBudget.unlimited("test"); FeatureBatch batch = new FeatureBatch(budget, 8, 3)) {
      timed.stream(batch, full -> {});
      timed.stream(batch, full -> {});
      assertEquals(2, timed.passCount());
      assertTrue(timed.producerSeconds() >= 0 && timed.consumerSeconds(1) <= timed.passSeconds(1));
      assertThrows(IllegalStateException.class, () -> timed.stream(batch, full -> {}));
    }
  }

  @Test
  void shouldHoldAMatrixAndRefuseUseAfterClose() {
    OffHeapMatrix matrix = new OffHeapMatrix(5);
    matrix.set(4, 2.5f);
    matrix.set(0, Float.NaN);
    assertEquals(2.5f, matrix.get(4));
    assertTrue(Float.isNaN(matrix.get(0)));
    matrix.close();
    matrix.close();
    assertThrows(IllegalStateException.class, () -> matrix.get(4));
  }
}
