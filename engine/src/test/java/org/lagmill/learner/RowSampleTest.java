package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureBatch;
import org.lagmill.memory.MemoryBudget;

/** The sampling pass against an obvious reference built from the sampled row list. */
class RowSampleTest {
  private static final long MASTER_SEED = TestSeeds.master(31_337L);

  /** Streams {@code rows} through a batch of {@code batchRows} and records which stream rows the sample took. */
  private static RowSample sample(MatrixRowStream rows, int sampleRows, int batchRows, List<Integer> taken) {
    RowSample sample = new RowSample(rows.rowCount(), sampleRows, rows.schema().featureCount(), MASTER_SEED);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        FeatureBatch batch = new FeatureBatch(budget, batchRows, rows.schema().featureCount())) {
      rows.stream(batch, full -> {
        for (int r = 0; r < full.rowCount(); r++) {
          // selection sampling decides row by row, so feeding one-row probes shows which rows it took
          int selectedBefore = sample.rowsSelected();
          sample.accept(single(full, r));
          if (sample.rowsSelected() > selectedBefore) {
            taken.add((int) full.firstRowIndex() + r);
          }
        }
      });
    }
    return sample;
  }

  private static FeatureBatch probe;

  private static FeatureBatch single(FeatureBatch full, int row) {
    probe.reset(full.firstRowIndex() + row);
    probe.addRow(0, 0, 0f, 1f);
    for (int c = 0; c < full.featureCount(); c++) {
      probe.set(0, c, full.get(row, c));
    }
    return probe;
  }

  @Test
  void shouldKeepNonZeroAndNaNValuesWithSamplePositions() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED, 5_000, 4, 1);
    int featureCount = rows.schema().featureCount();
    try (MemoryBudget budget = MemoryBudget.unlimited("probe")) {
      probe = new FeatureBatch(budget, 1, featureCount);
      for (int sampleRows : new int[] {1, 37, 1_000, 5_000}) {
        List<Integer> taken = new ArrayList<>();
        RowSample sample = sample(rows, sampleRows, 333, taken);
        String context = "sample " + sampleRows + ", master seed " + MASTER_SEED;
        assertEquals(5_000, sample.rowsSeen(), context);
        assertEquals(sampleRows, sample.rowsSelected(), context);
        assertEquals(sampleRows, taken.size(), context);
        for (int i = 1; i < taken.size(); i++) {
          assertTrue(taken.get(i) > taken.get(i - 1), "sorted, distinct: " + context);
        }
        // reference: walk the taken rows in order, keep a value when it is NaN or not (almost) zero
        for (int c = 0; c < featureCount; c++) {
          int kept = 0;
          for (int position = 0; position < taken.size(); position++) {
            float value = rows.rows()[taken.get(position)][c];
            if (Float.isNaN(value) || Math.abs(value) > 1e-35) {
              assertEquals(position, sample.position(c, kept), context + ", column " + c);
              assertEquals(Float.floatToIntBits(value), Float.floatToIntBits(sample.value(c, kept)),
                  context + ", column " + c);
              kept++;
            }
          }
          assertEquals(kept, sample.keptCount(c), context + ", column " + c);
        }
      }
      probe.close();
    }
  }

  @Test
  void shouldSampleTheSameRowsForAnyBatchSizeAndSpreadThemEvenly() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 1, 10_000, 1, 0);
    try (MemoryBudget budget = MemoryBudget.unlimited("probe")) {
      probe = new FeatureBatch(budget, 1, 1);
      List<Integer> first = new ArrayList<>();
      sample(rows, 2_000, 10_000, first);
      List<Integer> second = new ArrayList<>();
      sample(rows, 2_000, 7, second);
      assertEquals(first, second);
      // a uniform sample puts about a fifth of its rows in each fifth of the stream (hypergeometric sd about 16; bounds 400 +- 90)
      for (int fifth = 0; fifth < 5; fifth++) {
        int from = fifth * 2_000;
        long inFifth = first.stream().filter(r -> r >= from && r < from + 2_000).count();
        assertTrue(inFifth > 310 && inFifth < 490, "fifth " + fifth + " holds " + inFifth);
      }
      probe.close();
    }
  }
}
