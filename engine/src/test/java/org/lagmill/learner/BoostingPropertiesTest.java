package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.stat.descriptive.moment.Mean;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureSchema;
import org.lagmill.memory.MemoryBudget;

/** Hand-checkable models whose predictions follow from the definition of gradient boosting. */
class BoostingPropertiesTest {
  private static final long MASTER_SEED = TestSeeds.master(9_001L);

  static {
    NativeLibrary.load();
  }

  /** 200 rows, one 0/1 feature (group), a second noise feature, labels drawn around a group-dependent level. */
  private static MatrixRowStream twoGroups(long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    int rowCount = 200;
    float[][] rows = new float[rowCount][2];
    float[] labels = new float[rowCount];
    float[] weights = new float[rowCount];
    for (int r = 0; r < rowCount; r++) {
      rows[r][0] = r % 2;
      rows[r][1] = 0f;
      labels[r] = (float) ((r % 2 == 0 ? 2.0 : 7.0) + random.nextDouble() * 3);
      weights[r] = 1 + random.nextInt(4);
    }
    FeatureSchema schema = new FeatureSchema(List.of("group", "flat"), List.of(false, false));
    return new MatrixRowStream(schema, rows, labels, weights);
  }

  private static TrainParameters oneStumpOfFullStep() {
    return TrainParameters.defaults().withObjective(Objective.REGRESSION).withRounds(1, 0).withLearningRate(1.0)
        .withLeafCount(2).withMinDataInLeaf(1).withFractions(1.0, 1.0).withLambdaL2(0.0).withThreadCount(1)
        .withDeterministic(true);
  }

  /**
   * Friedman (2001), "Greedy function approximation: a gradient boosting machine", Annals of Statistics 29(5),
   * Algorithm 2 (LS_Boost), quoted from memory: under squared error the initial model is the label mean and a
   * terminal node's value is the mean residual of its rows. With shrinkage 1, one two-leaf tree split on the group
   * therefore predicts each group's own mean (LightGBM starts from the mean because boost_from_average is on by
   * default for regression, per its parameter documentation). The group means come from commons-math3.
   */
  @Test
  void shouldPredictGroupMeansAfterOneFullStepOfSquaredError() {
    assertGroupMeans(false);
  }

  /** The same with row weights: leaves and the starting score become weighted means. */
  @Test
  void shouldPredictWeightedGroupMeansWhenWeightsAreUsed() {
    assertGroupMeans(true);
  }

  private static void assertGroupMeans(boolean useWeights) {
    MatrixRowStream rows = twoGroups(MASTER_SEED);
    double[] expected = new double[2];
    for (int group = 0; group < 2; group++) {
      int g = group;
      int[] members = java.util.stream.IntStream.range(0, 200).filter(r -> r % 2 == g).toArray();
      double[] labels = java.util.Arrays.stream(members).mapToDouble(r -> rows.labels()[r]).toArray();
      double[] weights = java.util.Arrays.stream(members).mapToDouble(r -> weightOf(rows, r, useWeights)).toArray();
      expected[group] = new Mean().evaluate(labels, weights);
    }
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults().withThreadCount(1)
            .withBatchRowCount(64).withUseWeights(useWeights)).build(rows);
        TrainedModel model = new Trainer(oneStumpOfFullStep()).train(dataset, TrainingListener.NONE)) {
      double[] predicted = LearnerTestSupport.predict(model, budget, rows, false);
      for (int r = 0; r < predicted.length; r++) {
        // LightGBM keeps gradients and hessians in float32, so a leaf value carries float32 rounding (measured:
        // about 3e-8 here); 1e-6 relative still tells a group mean from anything else
        assertEquals(expected[r % 2], predicted[r], 1e-6 * expected[r % 2], "row " + r + ", master seed "
            + MASTER_SEED);
      }
    }
  }

  private static double weightOf(MatrixRowStream rows, int row, boolean useWeights) {
    if (!useWeights) {
      return 1.0;
    }
    float[] weights = new float[(int) rows.rowCount()];
    try (MemoryBudget budget = MemoryBudget.unlimited("weights");
        org.lagmill.features.FeatureBatch batch = new org.lagmill.features.FeatureBatch(budget, 200, 2)) {
      rows.stream(batch, full -> System.arraycopy(full.weights(), 0, weights, 0, full.rowCount()));
    }
    return weights[row];
  }

  /**
   * LightGBM's parameter documentation (boost_from_average: "adjusts initial score to the mean of labels for faster
   * convergence"); that for poisson the start is on the log link, log(mean), is from memory of its regression
   * objectives. When no split is allowed (every leaf would need all 100 rows) the model is that start alone: the
   * raw score is log(mean label) and the prediction the mean label.
   */
  @Test
  void shouldStartPoissonFromTheLogOfTheMeanLabel() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 1, 100, 3, 0);
    double mean = new Mean().evaluate(java.util.stream.IntStream.range(0, 100)
        .mapToDouble(r -> rows.labels()[r]).toArray());
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults().withThreadCount(1))
            .build(rows);
        TrainedModel model = new Trainer(TrainParameters.defaults().withObjective(Objective.POISSON)
            .withRounds(5, 0).withMinDataInLeaf(100).withFractions(1.0, 1.0).withThreadCount(1))
            .train(dataset, TrainingListener.NONE)) {
      double[] raw = LearnerTestSupport.predict(model, budget, rows, true);
      double[] predicted = LearnerTestSupport.predict(model, budget, rows, false);
      assertEquals(0, model.bestIteration(), "no split possible: the constant start only");
      for (int r = 0; r < raw.length; r++) {
        assertEquals(Math.log(mean), raw[r], 1e-12, "row " + r + ", master seed " + MASTER_SEED);
        assertEquals(mean, predicted[r], 1e-12 * mean, "row " + r);
      }
    }
  }
}
