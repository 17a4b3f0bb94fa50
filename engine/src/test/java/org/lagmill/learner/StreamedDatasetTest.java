package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeFloatArray;

/** A Dataset pushed in batches from a RowStream must train the same model as the whole matrix handed over at once. */
class StreamedDatasetTest {
  private static final long MASTER_SEED = TestSeeds.master(20_240_611L);

  static {
    NativeLibrary.load();
  }

  @TempDir
  Path folder;

  @Test
  void shouldTrainTheSameModelAsTheWholeMatrix() throws Exception {
    MatrixRowStream training = MatrixRowStream.random(MASTER_SEED, 20_000, 6, 2);
    MatrixRowStream test = MatrixRowStream.random(MASTER_SEED + 1, 2_000, 6, 2);
    // 1,000-row batches over 20,000 rows: twenty pushes; the sample is every row so both routes bin alike
    DatasetParameters datasetParameters = DatasetParameters.defaults().withBatchRowCount(1_000)
        .withDeterministic(true).withThreadCount(2).withSeed(MASTER_SEED);
    TrainParameters trainParameters = TrainParameters.defaults().withRounds(25, 0).withMinDataInLeaf(20)
        .withThreadCount(2).withDeterministic(true).withSeed(MASTER_SEED);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      DatasetBuilder builder = new DatasetBuilder(budget, datasetParameters);
      Trainer trainer = new Trainer(trainParameters);
      double[] streamedPredictions;
      double[] wholePredictions;
      Path streamedFile = folder.resolve("streamed.txt");
      Path wholeFile = folder.resolve("whole.txt");
      try (TrainingDataset streamed = builder.build(training);
          TrainedModel model = trainer.train(streamed, TrainingListener.NONE)) {
        assertEquals(20_000, streamed.rowCount());
        assertEquals(20_000, streamed.stats().sampledRowCount());
        assertEquals(25, model.iterationCount());
        streamedPredictions = LearnerTestSupport.predict(model, budget, test, false);
        model.saveTo(streamedFile);
      }
      try (TrainingDataset whole = LearnerTestSupport.fromWholeMatrix(budget, builder, training);
          TrainedModel model = trainer.train(whole, TrainingListener.NONE)) {
        wholePredictions = LearnerTestSupport.predict(model, budget, test, false);
        model.saveTo(wholeFile);
      }
      assertArrayEquals(wholePredictions, streamedPredictions, 0.0, "master seed " + MASTER_SEED);
      assertEquals(treesOf(wholeFile), treesOf(streamedFile), "master seed " + MASTER_SEED);
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldGiveTheSameModelForAnyBatchSize() {
    MatrixRowStream training = MatrixRowStream.random(MASTER_SEED + 2, 3_001, 4, 1);
    TrainParameters trainParameters = TrainParameters.defaults().withRounds(10, 0).withMinDataInLeaf(10)
        .withThreadCount(1).withDeterministic(true);
    double[] first = null;
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      for (int batchRows : new int[] {3_001, 1_000, 7, 1}) {
        DatasetParameters parameters = DatasetParameters.defaults().withBatchRowCount(batchRows)
            .withDeterministic(true).withThreadCount(1).withSampleRowCount(500);
        try (TrainingDataset dataset = new DatasetBuilder(budget, parameters).build(training);
            TrainedModel model = new Trainer(trainParameters).train(dataset, TrainingListener.NONE)) {
          double[] predictions = LearnerTestSupport.predict(model, budget, training, false);
          if (first == null) {
            first = predictions;
          } else {
            assertArrayEquals(first, predictions, 0.0, "batch rows " + batchRows + ", master seed " + MASTER_SEED);
          }
        }
      }
    }
  }

  @Test
  void shouldPredictExpOfTheRawScoreForTweedie() {
    MatrixRowStream training = MatrixRowStream.random(MASTER_SEED + 3, 5_000, 4, 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults().withBatchRowCount(999))
            .build(training);
        TrainedModel model = new Trainer(TrainParameters.defaults().withRounds(20, 0).withMinDataInLeaf(20))
            .train(dataset, TrainingListener.NONE)) {
      double[] response = LearnerTestSupport.predict(model, budget, training, false);
      double[] raw = LearnerTestSupport.predict(model, budget, training, true);
      for (int row = 0; row < response.length; row++) {
        assertEquals(Math.exp(raw[row]), response[row], 1e-12 * response[row], "row " + row);
        assertTrue(response[row] > 0, "row " + row);
      }
    }
  }

  @Test
  void shouldRejectAMatrixWithFewerLabelsThanRows() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 4, 10, 3, 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        NativeFloatArray matrix = new NativeFloatArray(budget, 30);
        NativeFloatArray labels = new NativeFloatArray(budget, 9)) {
      DatasetBuilder builder = new DatasetBuilder(budget, DatasetParameters.defaults());
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
          () -> builder.buildFromMatrix(matrix.address(), 10, rows.schema(), labels));
      assertEquals("labels hold 9 values for 10 rows; give one label per row", e.getMessage());
      e = assertThrows(IllegalArgumentException.class,
          () -> builder.buildFromMatrix(matrix.address(), 0, rows.schema(), labels));
      assertEquals("a Dataset needs between 1 and 2147483646 rows, got 0 (LightGBM counts rows in int32)",
          e.getMessage());
    }
  }

  @Test
  void shouldKeepTheSameTreesWhenTheTrainingStateIsDropped() throws Exception {
    MatrixRowStream training = MatrixRowStream.random(MASTER_SEED + 5, 4_000, 5, 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults().withThreadCount(1))
            .build(training);
        TrainedModel model = new Trainer(TrainParameters.defaults().withRounds(15, 0).withMinDataInLeaf(20)
            .withThreadCount(1)).train(dataset, TrainingListener.NONE)) {
      // train() already swapped in a trees-only Booster; a second swap must change nothing either
      double[] before = LearnerTestSupport.predict(model, budget, training, true);
      Path first = folder.resolve("first.txt");
      model.saveTo(first);
      model.dropTrainingState();
      double[] after = LearnerTestSupport.predict(model, budget, training, true);
      Path second = folder.resolve("second.txt");
      model.saveTo(second);
      assertArrayEquals(before, after, 0.0, "master seed " + MASTER_SEED);
      assertEquals(treesOf(first), treesOf(second), "master seed " + MASTER_SEED);
      assertEquals(15, model.iterationCount());
    }
  }

  /** The model text from the first tree on: the parameter echo at the end may legitimately differ. */
  private static String treesOf(Path modelFile) throws Exception {
    List<String> lines = Files.readAllLines(modelFile);
    StringBuilder trees = new StringBuilder();
    boolean inTrees = false;
    for (String line : lines) {
      if (line.startsWith("Tree=")) {
        inTrees = true;
      }
      if (line.startsWith("end of trees")) {
        break;
      }
      if (inTrees) {
        trees.append(line).append('\n');
      }
    }
    assertTrue(trees.length() > 0, "no trees in " + modelFile);
    return trees.toString();
  }
}
