package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;

/** Early stopping on a validation Dataset built by reference. */
class EarlyStoppingTest {
  private static final long MASTER_SEED = TestSeeds.master(77_031L);

  static {
    NativeLibrary.load();
  }

  /** Labels independent of the features: every tree only fits noise, so the validation loss soon rises. */
  private static MatrixRowStream noise(long seed, int rowCount) {
    MatrixRowStream rows = MatrixRowStream.random(seed, rowCount, 5, 1);
    SplittableRandom random = new SplittableRandom(seed ^ 0x5DEECE66DL);
    float[] labels = new float[rowCount];
    for (int r = 0; r < rowCount; r++) {
      labels[r] = (float) random.nextGaussian();
    }
    return rows.withLabels(labels);
  }

  @Test
  void shouldStopAndKeepTheBestIterationWhenValidationLossRises() {
    MatrixRowStream training = noise(MASTER_SEED, 4_000);
    MatrixRowStream validation = noise(MASTER_SEED + 1, 2_000);
    TrainParameters parameters = TrainParameters.defaults().withObjective(Objective.REGRESSION).withRounds(300, 10)
        .withLearningRate(0.3).withLeafCount(63).withMinDataInLeaf(5).withThreadCount(1).withDeterministic(true)
        .withSeed(MASTER_SEED);
    DatasetParameters datasetParameters = DatasetParameters.defaults().withBatchRowCount(512).withThreadCount(1)
        .withDeterministic(true);
    List<Double> heardLosses = new ArrayList<>();
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      DatasetBuilder builder = new DatasetBuilder(budget, datasetParameters);
      double[] bestPredictions;
      int bestIteration;
      try (TrainingDataset train = builder.build(training);
          TrainingDataset valid = builder.createValidation(train, validation);
          TrainedModel model = new Trainer(parameters).train(train, valid,
              (iteration, seconds, loss) -> {
                assertEquals(heardLosses.size() + 1, iteration);
                heardLosses.add(loss);
              })) {
        double[] curve = model.validationCurve();
        bestIteration = model.bestIteration();
        String context = "curve " + java.util.Arrays.toString(curve) + ", master seed " + MASTER_SEED;
        assertTrue(bestIteration >= 1 && bestIteration < 290, context);
        assertEquals(bestIteration + 10, curve.length, "stopped by patience: " + context);
        assertEquals(java.util.Arrays.stream(curve).min().orElseThrow(), curve[bestIteration - 1], context);
        assertTrue(curve[curve.length - 1] > curve[bestIteration - 1], context);
        assertEquals(curve.length, heardLosses.size());
        assertEquals(curve[0], heardLosses.get(0));
        assertEquals(bestIteration, model.iterationCount(), "rolled back to the best iteration");

        // the metric LightGBM reports must match the model it keeps: l2 = mean squared error, rmse its root
        double[] predicted = LearnerTestSupport.predict(model, budget, validation, false);
        double squares = 0;
        for (int r = 0; r < predicted.length; r++) {
          double error = predicted[r] - validation.labels()[r];
          squares += error * error;
        }
        double meanSquare = squares / predicted.length;
        assertEquals(meanSquare, curve[bestIteration - 1], 1e-9 * meanSquare, context);
        assertEquals(Math.sqrt(meanSquare), model.validationRmseCurve()[bestIteration - 1], 1e-9, context);
        bestPredictions = LearnerTestSupport.predict(model, budget, training, false);
      }
      // validation rows never steer the trees, so training exactly bestIteration rounds gives the same model
      try (TrainingDataset train = builder.build(training);
          TrainedModel plain = new Trainer(parameters.withRounds(bestIteration, 0)).train(train,
              TrainingListener.NONE)) {
        assertEquals(bestIteration, plain.bestIteration());
        assertEquals(0, plain.validationCurve().length);
        assertArrayEquals(bestPredictions, LearnerTestSupport.predict(plain, budget, training, false), 0.0,
            "master seed " + MASTER_SEED);
      }
    }
  }

  @Test
  void shouldTrainEveryRoundWhenValidationKeepsImproving() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 2, 3_000, 4, 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      DatasetBuilder builder = new DatasetBuilder(budget, DatasetParameters.defaults().withThreadCount(1));
      try (TrainingDataset train = builder.build(rows.slice(0, 2_000));
          TrainingDataset valid = builder.createValidation(train, rows.slice(2_000, 3_000));
          TrainedModel model = new Trainer(TrainParameters.defaults().withObjective(Objective.POISSON)
              .withRounds(15, 50).withMinDataInLeaf(50).withThreadCount(1)).train(train, valid,
                  TrainingListener.NONE)) {
        assertEquals(15, model.validationCurve().length);
        assertEquals(15, model.bestIteration());
        assertEquals(15, model.iterationCount());
      }
    }
  }
}
