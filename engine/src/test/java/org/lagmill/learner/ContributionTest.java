package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.features.FeatureBatch;
import org.lagmill.memory.MemoryBudget;

/** Per-feature contributions (LightGBM's predict type contrib) and the objective a model reports. */
class ContributionTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);

  static {
    NativeLibrary.load();
  }

  @TempDir
  Path folder;

  /**
   * LightGBM's own guarantee (its documentation of predict_contrib: "the sum of the feature contributions is equal
   * to the raw prediction of the model"), checked for every objective on seeded random rows with NaNs and categories.
   */
  @Test
  void shouldSumContributionsAndBiasToTheRawScore() {
    for (Objective objective : Objective.values()) {
      long seed = MASTER_SEED + objective.ordinal();
      MatrixRowStream rows = MatrixRowStream.random(seed, 2_000, 4, 2);
      try (MemoryBudget budget = MemoryBudget.unlimited("test");
          TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults().withBatchRowCount(500))
              .build(rows);
          TrainedModel model = new Trainer(TrainParameters.defaults().withObjective(objective).withRounds(15, 0)
              .withMinDataInLeaf(20).withThreadCount(1)).train(dataset, TrainingListener.NONE)) {
        assertEquals(objective, model.objective(), "seed " + seed);
        int width = model.featureCount() + 1;
        try (FeatureBatch batch = new FeatureBatch(budget, 500, rows.schema().featureCount())) {
          rows.stream(batch, full -> {
            double[] raw = new double[full.rowCount()];
            double[] response = new double[full.rowCount()];
            double[] contributions = new double[full.rowCount() * width];
            model.predictRaw(full, raw);
            model.predict(full, response);
            model.predictContributions(full, contributions);
            for (int r = 0; r < full.rowCount(); r++) {
              double sum = 0;
              for (int f = 0; f < width; f++) {
                sum += contributions[r * width + f];
              }
              assertEquals(raw[r], sum, 1e-9 * Math.max(1, Math.abs(raw[r])), "seed " + seed + ", " + objective
                  + ", row " + (full.firstRowIndex() + r));
              double expected = objective.hasLogLink() ? Math.exp(raw[r]) : raw[r];
              assertEquals(expected, response[r], 1e-9 * Math.max(1, Math.abs(expected)), "seed " + seed);
            }
          });
        }
      }
    }
  }

  /**
   * Hand-checkable case from the definition of Shapley values (Lundberg, Erion and Lee, "Consistent individualized
   * feature attribution for tree ensembles", 2018): a single tree with one split gives the split feature
   * {@code leaf value − E[f]} and every other feature 0, where E[f] is the leaves' values weighted by their training
   * counts, which is also the bias. Leaf values and counts are read from the saved model text.
   */
  @Test
  void shouldMatchShapleyValuesOfASingleSplitTree() throws Exception {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED, 1_000, 3, 0);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults()).build(rows);
        TrainedModel model = new Trainer(TrainParameters.defaults().withObjective(Objective.REGRESSION)
            .withRounds(1, 0).withLeafCount(2).withMinDataInLeaf(20).withFractions(1, 1).withThreadCount(1))
            .train(dataset, TrainingListener.NONE)) {
      Path file = folder.resolve("model.txt");
      model.saveTo(file);
      List<String> text = Files.readAllLines(file);
      double[] leafValue = numbers(text, "leaf_value=");
      double[] leafCount = numbers(text, "leaf_count=");
      int splitFeature = (int) numbers(text, "split_feature=")[0];
      assertEquals(2, leafValue.length);
      double expectation = (leafValue[0] * leafCount[0] + leafValue[1] * leafCount[1]) / (leafCount[0] + leafCount[1]);
      int width = model.featureCount() + 1;
      try (FeatureBatch batch = new FeatureBatch(budget, 1_000, rows.schema().featureCount())) {
        rows.stream(batch, full -> {
          double[] raw = new double[full.rowCount()];
          double[] contributions = new double[full.rowCount() * width];
          model.predictRaw(full, raw);
          model.predictContributions(full, contributions);
          for (int r = 0; r < full.rowCount(); r++) {
            assertEquals(expectation, contributions[r * width + width - 1], 1e-9, "bias, row " + r);
            for (int f = 0; f < width - 1; f++) {
              double expected = f == splitFeature ? raw[r] - expectation : 0;
              assertEquals(expected, contributions[r * width + f], 1e-9, "feature " + f + ", row " + r);
            }
          }
        });
      }
    }
  }

  @Test
  void shouldKnowTheObjectiveOfALoadedModel() {
    assertEquals(Objective.TWEEDIE, Objective.ofModelText("tree\nversion=v4\nobjective=tweedie "
        + "tweedie_variance_power:1.1\nfeature_names=a b\n"));
    assertEquals(Objective.REGRESSION, Objective.ofModelText("tree\nobjective=regression\n"));
    assertEquals("the model's objective 'lambdarank' is not one lagmill trains (tweedie, poisson, regression)",
        org.junit.jupiter.api.Assertions.assertThrows(LearnerException.class,
            () -> Objective.ofModelText("tree\nobjective=lambdarank\n")).getMessage());
  }

  private static double[] numbers(List<String> text, String prefix) {
    for (String line : text) {
      if (line.startsWith(prefix)) {
        String[] parts = line.substring(prefix.length()).trim().split(" ");
        double[] out = new double[parts.length];
        for (int i = 0; i < parts.length; i++) {
          out[i] = Double.parseDouble(parts[i]);
        }
        return out;
      }
    }
    throw new AssertionError("no line " + prefix);
  }
}
