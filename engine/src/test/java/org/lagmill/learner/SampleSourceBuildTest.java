package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.RowStream;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ArraySalesHistory;

/** The build's sampling pass streams the feature pass's sample source, its push pass every row. */
class SampleSourceBuildTest {
  private static final long MASTER_SEED = TestSeeds.master(20_261_202L);

  static {
    NativeLibrary.load();
  }

  /** Counts the rows of each pass, its sample source's passes included. */
  private static final class CountingRowStream implements RowStream {
    private final RowStream rows;
    private final List<Long> passRowCounts;

    CountingRowStream(RowStream rows, List<Long> passRowCounts) {
      this.rows = rows;
      this.passRowCounts = passRowCounts;
    }

    @Override
    public FeatureSchema schema() { return rows.schema(); }
    @Override
    public long rowCount() { return rows.rowCount(); }

    @Override
    public RowStream sampleSource(long minimumRowCount, long seed) {
      RowStream source = rows.sampleSource(minimumRowCount, seed);
      return source == rows ? this : new CountingRowStream(source, passRowCounts);
    }

    @Override
    public void stream(FeatureBatch batch, BatchConsumer consumer) {
      long[] count = {0};
      rows.stream(batch, full -> {
        count[0] += full.rowCount();
        consumer.accept(full);
      });
      passRowCounts.add(count[0]);
    }
  }

  private static ArraySalesHistory randomHistory(long seed, int seriesCount, int dayCount) {
    Random random = new Random(seed);
    int[][] units = new int[seriesCount][dayCount];
    for (int s = 0; s < seriesCount; s++) {
      int launch = random.nextInt(dayCount / 2);
      for (int d = launch; d < dayCount; d++) {
        units[s][d] = random.nextDouble() < 0.4 ? 0 : 1 + random.nextInt(1 + s % 20);
      }
    }
    return ArraySalesHistory.ofUnits(LocalDate.of(2024, 1, 1), units);
  }

  @Test
  void shouldSampleFromTheSampleSourceAndPushEveryRow() {
    FeaturePass pass = FeaturePass.training(randomHistory(MASTER_SEED, 200, 120), FeatureSpec.defaults());
    DatasetParameters parameters = DatasetParameters.defaults().withSampleRowCount(1_000).withThreadCount(1)
        .withBatchRowCount(777).withSeed(MASTER_SEED);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      DatasetBuilder builder = new DatasetBuilder(budget, parameters);
      RowStream source = builder.sampleSource(pass);
      assertNotSame(pass, source, pass.rowCount() + " rows, master seed " + MASTER_SEED);
      // max(2 x 1,000, rowCount / 32) rows at least
      long minimumRowCount = Math.max(2_000, pass.rowCount() / 32);
      assertTrue(source.rowCount() >= minimumRowCount && source.rowCount() < minimumRowCount + 120,
          source.rowCount() + " rows, master seed " + MASTER_SEED);
      List<Long> passes = new ArrayList<>();
      double[] first;
      try (TrainingDataset dataset = builder.build(new CountingRowStream(pass, passes))) {
        assertEquals(List.of(source.rowCount(), pass.rowCount()), passes, "master seed " + MASTER_SEED);
        assertEquals(pass.rowCount(), dataset.rowCount());
        assertEquals(1_000, dataset.stats().sampledRowCount());
        first = trainAndPredict(dataset, budget, pass);
      }
      try (TrainingDataset again = builder.build(pass)) {
        assertArrayEquals(first, trainAndPredict(again, budget, pass), 0.0, "same seed, same model; master seed "
            + MASTER_SEED);
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldSampleFromEveryRowOfASmallStream() {
    FeaturePass pass = FeaturePass.training(randomHistory(MASTER_SEED + 1, 30, 100), FeatureSpec.defaults());
    // a sample of 1,000 asks for at least 2,000 rows; the pass holds under 4,000, so a subset would save little
    assertTrue(pass.rowCount() <= 4_000, pass.rowCount() + " rows");
    DatasetParameters parameters = DatasetParameters.defaults().withSampleRowCount(1_000).withThreadCount(1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      DatasetBuilder builder = new DatasetBuilder(budget, parameters);
      assertSame(pass, builder.sampleSource(pass));
      List<Long> passes = new ArrayList<>();
      try (TrainingDataset dataset = builder.build(new CountingRowStream(pass, passes))) {
        assertEquals(List.of(pass.rowCount(), pass.rowCount()), passes);
      }
    }
  }

  @Test
  void shouldRefuseASampleSourceSmallerThanTheSample() {
    FeaturePass pass = FeaturePass.training(randomHistory(MASTER_SEED + 2, 100, 120), FeatureSpec.defaults());
    RowStream shrinking = new RowStream() {
      @Override
      public FeatureSchema schema() { return pass.schema(); }
      @Override
      public long rowCount() { return pass.rowCount(); }
      @Override
      public void stream(FeatureBatch batch, BatchConsumer consumer) { pass.stream(batch, consumer); }
      @Override
      public RowStream sampleSource(long minimumRowCount, long seed) {
        // ignores the minimum: a broken override
        return pass.sampleSource(1, seed);
      }
    };
    IllegalStateException e = assertThrows(IllegalStateException.class,
        () -> DatasetBuilder.sampleSource(shrinking, 500, 1));
    assertTrue(e.getMessage().contains("cannot stand for a stream of " + pass.rowCount() + " rows"), e.getMessage());
  }

  /** Trains five rounds and predicts every row of {@code rows}. */
  private static double[] trainAndPredict(TrainingDataset dataset, MemoryBudget budget, FeaturePass rows) {
    TrainParameters train = TrainParameters.defaults().withRounds(5, 0).withThreadCount(1).withDeterministic(true)
        .withSeed(MASTER_SEED);
    double[] predictions = new double[(int) rows.rowCount()];
    try (TrainedModel model = new Trainer(train).train(dataset, TrainingListener.NONE);
        FeatureBatch batch = new FeatureBatch(budget, 512, rows.schema().featureCount())) {
      double[] out = new double[512];
      rows.stream(batch, full -> {
        model.predict(full, out);
        System.arraycopy(out, 0, predictions, (int) full.firstRowIndex(), full.rowCount());
      });
    }
    return predictions;
  }
}
