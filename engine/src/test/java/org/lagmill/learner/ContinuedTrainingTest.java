package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureBatch;
import org.lagmill.memory.MemoryBudget;

/**
 * Training continued from a starting model (LightGBM's init model): the rows start from the starting model's raw
 * scores, its trees stay in front of the added ones unchanged, and early stopping keeps no added round that does not
 * beat the starting model on the validation rows.
 */
class ContinuedTrainingTest {
  private static final long MASTER_SEED = TestSeeds.master(40_117L);
  private static final int STARTING_ROUNDS = 20;

  static {
    NativeLibrary.load();
  }

  private static TrainParameters parameters() {
    return TrainParameters.defaults().withObjective(Objective.REGRESSION).withLearningRate(0.1).withLeafCount(15)
        .withMinDataInLeaf(20).withThreadCount(1).withDeterministic(true).withSeed(MASTER_SEED);
  }

  private static DatasetBuilder builder(MemoryBudget budget) {
    return new DatasetBuilder(budget, DatasetParameters.defaults().withBatchRowCount(700).withThreadCount(1)
        .withDeterministic(true));
  }

  private static TrainedModel startingModel(MemoryBudget budget, MatrixRowStream rows) {
    try (TrainingDataset training = builder(budget).build(rows)) {
      return new Trainer(parameters().withRounds(STARTING_ROUNDS, 0)).train(training, TrainingListener.NONE);
    }
  }

  /** Raw scores of the iterations {@code [first, first + count)} for every row, through one batch. */
  private static double[] rawIterations(TrainedModel model, MemoryBudget budget, MatrixRowStream rows, int first,
      int count) {
    double[] out = new double[(int) rows.rowCount()];
    try (FeatureBatch batch = new FeatureBatch(budget, (int) rows.rowCount(), rows.schema().featureCount())) {
      rows.stream(batch, full -> model.predictRawIterations(full, out, first, count));
    }
    return out;
  }

  /** LightGBM's l2 metric: the mean squared error (LightGBM docs, Parameters, metric "l2, square loss"). */
  private static double meanSquaredError(double[] predicted, float[] labels) {
    double squares = 0;
    for (int r = 0; r < predicted.length; r++) {
      double error = predicted[r] - labels[r];
      squares += error * error;
    }
    return squares / predicted.length;
  }

  /** The model text's tree blocks ("Tree=0 ..." up to the next tree or the end of the trees), in order. */
  private static List<String> trees(String modelText) {
    String trees = modelText.substring(modelText.indexOf("\nTree=0"), modelText.indexOf("\nend of trees"));
    return Arrays.stream(trees.split("\nTree=")).filter(block -> !block.isBlank()).map(String::strip).toList();
  }

  @Test
  void shouldAddTreesFittedFromTheStartingScoresBehindTheStartingTrees() {
    MatrixRowStream all = MatrixRowStream.random(MASTER_SEED, 7_500, 6, 1);
    MatrixRowStream firstRows = all.slice(0, 3_000);
    MatrixRowStream moreRows = all.slice(0, 6_000);
    MatrixRowStream validation = all.slice(6_000, 7_500);
    String context = "master seed " + MASTER_SEED;
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainedModel start = startingModel(budget, firstRows)) {
      DatasetBuilder builder = builder(budget);
      try (TrainingDataset training = builder.build(moreRows, start);
          TrainingDataset valid = builder.createValidation(training, validation, start);
          TrainedModel continued = new Trainer(parameters().withRounds(40, 5)).continueFrom(start, training, valid,
              TrainingListener.NONE)) {
        int added = continued.bestIteration();
        assertTrue(added >= 1, "the added rows must let some round improve, " + context);
        assertEquals(STARTING_ROUNDS, continued.startingIterationCount(), context);
        assertEquals(STARTING_ROUNDS + added, continued.iterationCount(), context);

        // the starting trees, untouched, in front: their text and their predictions
        List<String> startingTrees = trees(start.modelText());
        List<String> continuedTrees = trees(continued.modelText());
        assertEquals(STARTING_ROUNDS, startingTrees.size());
        assertEquals(STARTING_ROUNDS + added, continuedTrees.size(), context);
        assertEquals(startingTrees, continuedTrees.subList(0, STARTING_ROUNDS), context);
        double[] startRaw = LearnerTestSupport.predict(start, budget, validation, true);
        assertArrayEquals(startRaw, rawIterations(continued, budget, validation, 0, STARTING_ROUNDS), 0.0, context);

        // raw score = the starting model's + the added trees' contribution
        double[] addedRaw = rawIterations(continued, budget, validation, STARTING_ROUNDS, added);
        double[] continuedRaw = LearnerTestSupport.predict(continued, budget, validation, true);
        for (int r = 0; r < continuedRaw.length; r++) {
          assertEquals(startRaw[r] + addedRaw[r], continuedRaw[r], 1e-12 * Math.max(1, Math.abs(continuedRaw[r])),
              "row " + r + ", " + context);
        }

        // LightGBM's validation loss before and after each added round is that of the merged model cut there: the
        // rows really started from the starting model's scores
        assertEquals(meanSquaredError(startRaw, validation.labels()), continued.startingValidationLoss(),
            1e-9 * continued.startingValidationLoss(), context);
        double[] curve = continued.validationCurve();
        for (int k : new int[] {1, added}) {
          double expected = meanSquaredError(rawIterations(continued, budget, validation, 0, STARTING_ROUNDS + k),
              validation.labels());
          assertEquals(expected, curve[k - 1], 1e-9 * expected, "added round " + k + ", " + context);
        }
        assertTrue(curve[added - 1] < continued.startingValidationLoss(), context);
      }
    }
  }

  @Test
  void shouldKeepExactlyTheStartingModelWhenNoAddedRoundBeatsIt(@TempDir Path dir) {
    MatrixRowStream all = MatrixRowStream.random(MASTER_SEED + 1, 6_000, 5, 1);
    MatrixRowStream firstRows = all.slice(0, 3_000);
    String context = "master seed " + MASTER_SEED;
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainedModel start = startingModel(budget, firstRows)) {
      // validation labels the starting model already predicts (to float precision): no added tree can do better
      MatrixRowStream probe = all.slice(4_500, 6_000);
      double[] startPredictions = LearnerTestSupport.predict(start, budget, probe, false);
      float[] labels = new float[startPredictions.length];
      for (int r = 0; r < labels.length; r++) {
        labels[r] = (float) startPredictions[r];
      }
      MatrixRowStream validation = probe.withLabels(labels);
      DatasetBuilder builder = builder(budget);
      try (TrainingDataset training = builder.build(all.slice(0, 4_500), start);
          TrainingDataset valid = builder.createValidation(training, validation, start);
          TrainedModel continued = new Trainer(parameters().withRounds(30, 3)).continueFrom(start, training, valid,
              TrainingListener.NONE)) {
        assertEquals(0, continued.bestIteration(), context);
        assertEquals(3, continued.validationCurve().length, "stopped by patience, " + context);
        assertEquals(STARTING_ROUNDS, continued.iterationCount(), context);
        assertEquals(trees(start.modelText()), trees(continued.modelText()), context);
        assertArrayEquals(startPredictions, LearnerTestSupport.predict(continued, budget, probe, false), 0.0, context);
        assertArrayEquals(LearnerTestSupport.predict(start, budget, all, true),
            LearnerTestSupport.predict(continued, budget, all, true), 0.0, context);

        // saved and loaded, it still predicts what the starting model predicts
        Path file = dir.resolve("model.txt");
        continued.saveTo(file);
        try (TrainedModel loaded = TrainedModel.load(file)) {
          assertEquals(STARTING_ROUNDS, loaded.iterationCount());
          assertArrayEquals(startPredictions, LearnerTestSupport.predict(loaded, budget, probe, false), 0.0, context);
        }
      }
    }
  }

  @Test
  void shouldRefuseDatasetsThatDoNotStartFromTheStartingModel() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 2, 2_000, 4, 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainedModel start = startingModel(budget, rows)) {
      DatasetBuilder builder = builder(budget);
      try (TrainingDataset plain = builder.build(rows);
          TrainingDataset continuing = builder.build(rows, start)) {
        Trainer trainer = new Trainer(parameters().withRounds(3, 0));
        assertThrows(IllegalArgumentException.class, () -> trainer.continueFrom(start, plain, null,
            TrainingListener.NONE));
        assertThrows(IllegalArgumentException.class, () -> trainer.train(continuing, TrainingListener.NONE));
        assertThrows(IllegalArgumentException.class, () -> builder.createValidation(continuing, rows));
      }
    }
  }
}
