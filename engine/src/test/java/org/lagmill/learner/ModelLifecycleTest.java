package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.memory.MemoryBudget;

/** Saving, loading, categorical columns, importances, closing and misuse. */
class ModelLifecycleTest {
  private static final long MASTER_SEED = TestSeeds.master(4_242L);

  static {
    NativeLibrary.load();
  }

  @TempDir
  Path folder;

  @Test
  void shouldPredictIdenticallyAfterSaveAndLoad() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED, 3_000, 5, 2);
    Path modelFile = folder.resolve("model.txt");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      double[] before;
      double[] splitImportance;
      try (TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults().withBatchRowCount(700))
          .build(rows);
          TrainedModel model = new Trainer(TrainParameters.defaults().withRounds(12, 0).withMinDataInLeaf(20))
              .train(dataset, TrainingListener.NONE)) {
        before = LearnerTestSupport.predict(model, budget, rows, false);
        splitImportance = model.featureImportance(FeatureImportance.SPLIT);
        double[] gain = model.featureImportance(FeatureImportance.GAIN);
        assertEquals(7, splitImportance.length);
        assertTrue(Arrays.stream(splitImportance).sum() > 0);
        // the label depends on code_0 and num_2 only (see MatrixRowStream.random): they must carry the most gain
        double[] sortedGain = gain.clone();
        Arrays.sort(sortedGain);
        assertTrue(gain[0] >= sortedGain[5] && gain[2] >= sortedGain[5], Arrays.toString(gain));
        model.saveTo(modelFile);
        model.saveTo(modelFile);
      }
      assertFalse(Files.exists(folder.resolve("model.txt.tmp")));
      try (TrainedModel loaded = TrainedModel.load(modelFile)) {
        assertEquals(12, loaded.iterationCount());
        assertEquals(12, loaded.bestIteration());
        assertArrayEquals(before, LearnerTestSupport.predict(loaded, budget, rows, false), 0.0);
        assertArrayEquals(splitImportance, loaded.featureImportance(FeatureImportance.SPLIT), 0.0);
      }
    }
  }

  @Test
  void shouldDeclareCategoricalColumnsToLightGbm() throws Exception {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 1, 2_000, 3, 2);
    Path modelFile = folder.resolve("categorical.txt");
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults()).build(rows);
        TrainedModel model = new Trainer(TrainParameters.defaults().withRounds(3, 0).withMinDataInLeaf(20))
            .train(dataset, TrainingListener.NONE)) {
      model.saveTo(modelFile);
    }
    String featureInfos = Files.readAllLines(modelFile).stream().filter(l -> l.startsWith("feature_infos="))
        .findFirst().orElseThrow().substring("feature_infos=".length());
    List<String> infos = List.of(featureInfos.split(" "));
    assertEquals(5, infos.size(), featureInfos);
    // LightGBM writes a categorical feature's categories as "a:b:c", a numeric one's range as "[min:max]"
    for (int column = 0; column < 5; column++) {
      boolean numeric = infos.get(column).startsWith("[");
      assertEquals(column >= 2, numeric, "column " + column + " in " + featureInfos);
    }
    // the ten codes 0..9 each get a category; LightGBM lists -1 first for its catch-all bin (measured, 4.3.0)
    assertEquals(java.util.Set.of("-1", "0", "1", "2", "3", "4", "5", "6", "7", "8", "9"),
        java.util.Set.of(infos.get(0).split(":")), featureInfos);
  }

  @Test
  void shouldCloseTwiceAndRefuseUseAfterClose() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 2, 500, 2, 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      DatasetBuilder builder = new DatasetBuilder(budget, DatasetParameters.defaults());
      Trainer trainer = new Trainer(TrainParameters.defaults().withRounds(2, 0).withMinDataInLeaf(10));
      TrainingDataset dataset = builder.build(rows);
      TrainedModel model = trainer.train(dataset, TrainingListener.NONE);
      dataset.close();
      dataset.close();
      assertTrue(dataset.isClosed());
      assertEquals("training dataset is closed",
          assertThrows(IllegalStateException.class, () -> trainer.train(dataset, TrainingListener.NONE))
              .getMessage());
      assertThrows(IllegalStateException.class, () -> builder.createValidation(dataset, rows));
      // the model no longer needs its Dataset
      double[] predictions = LearnerTestSupport.predict(model, budget, rows, false);
      assertEquals(500, predictions.length);
      model.close();
      model.close();
      try (FeatureBatch batch = new FeatureBatch(budget, 10, 3)) {
        assertEquals("trained model is closed",
            assertThrows(IllegalStateException.class, () -> model.predict(batch, new double[10])).getMessage());
      }
      assertThrows(IllegalStateException.class, () -> model.saveTo(folder.resolve("closed.txt")));
      assertThrows(IllegalStateException.class, () -> model.featureImportance(FeatureImportance.GAIN));
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldRejectMisuseWithClearMessages() {
    MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED + 3, 300, 2, 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      DatasetBuilder builder = new DatasetBuilder(budget, DatasetParameters.defaults());
      float[] labels = rows.labels().clone();
      labels[123] = Float.NaN;
      assertEquals("label of row 123 is NaN; training rows need a finite label (rows to forecast belong in a "
          + "prediction stream)",
          assertThrows(IllegalArgumentException.class, () -> builder.build(rows.withLabels(labels))).getMessage());
      assertEquals(0, budget.heldBytes(), "a failed build frees its buffers");

      MatrixRowStream empty = rows.slice(0, 0);
      assertEquals("a Dataset needs between 1 and 2147483646 rows, got 0 (LightGBM counts rows in int32; train on "
          + "fewer days or per partition)",
          assertThrows(IllegalArgumentException.class, () -> builder.build(empty)).getMessage());

      FeatureSchema other = new FeatureSchema(List.of("a", "b", "c"), List.of(false, false, false));
      MatrixRowStream otherRows = new MatrixRowStream(other, rows.rows(), rows.labels(), rows.labels());
      try (TrainingDataset train = builder.build(rows);
          TrainedModel model = new Trainer(TrainParameters.defaults().withRounds(1, 0).withMinDataInLeaf(10))
              .train(train, TrainingListener.NONE)) {
        assertThrows(IllegalArgumentException.class, () -> builder.createValidation(train, otherRows));
        assertEquals("validation data must come from DatasetBuilder.createValidation so it shares the training "
            + "Dataset's bins",
            assertThrows(IllegalArgumentException.class,
                () -> new Trainer(TrainParameters.defaults()).train(train, train, TrainingListener.NONE))
                .getMessage());
        try (FeatureBatch wide = new FeatureBatch(budget, 4, 5)) {
          wide.reset(0);
          wide.addRow(0, 0, 0f, 1f);
          assertEquals("batch has 5 features but the model was trained on 3; predict with the feature definition the "
              + "model was trained with",
              assertThrows(IllegalArgumentException.class, () -> model.predict(wide, new double[4])).getMessage());
        }
      }
      assertEquals("learningRate must be in [1.0E-6, 1.0], got 0.0 (0.05 is a common choice)",
          assertThrows(IllegalArgumentException.class, () -> TrainParameters.defaults().withLearningRate(0))
              .getMessage());
      assertEquals("maxBinCount must be in [2, 65535], got 1 (LightGBM's max_bin; 255 is the usual choice)",
          assertThrows(IllegalArgumentException.class, () -> DatasetParameters.defaults().withMaxBinCount(1))
              .getMessage());
      assertThrows(UncheckedIOException.class, () -> TrainedModel.load(folder.resolve("missing.txt")));
    }
  }

  @Test
  void shouldReportLightGbmErrorsAsLearnerExceptions() throws Exception {
    Path garbage = folder.resolve("garbage.txt");
    Files.writeString(garbage, "this is not a model\n");
    LearnerException error = assertThrows(LearnerException.class, () -> TrainedModel.load(garbage));
    assertTrue(error.getMessage().startsWith("LightGBM LGBM_BoosterCreateFromModelfile(" + garbage + ") failed"),
        error.getMessage());
  }
}
