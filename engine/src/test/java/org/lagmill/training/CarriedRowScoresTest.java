package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.TestSeeds;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.learner.Objective;
import org.lagmill.learner.RowScores;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.progress.RecordedNotes;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.SalesHistory;

/**
 * A model trained with its rows' scores kept holds, for every training and validation row, the raw score it predicts
 * for that row (the slow obvious reference: predicting each row again); a training continued from it carries those
 * scores over for every row the model saw and predicts only the newer days, and ends as the training that predicted
 * every starting score. Histories from {@link SmallHistories}: unknown days, pre-launch zeros, a series never
 * launched and one launched 3 days before the end; daily and read as weeks.
 */
class CarriedRowScoresTest {
  private static final long SEED = TestSeeds.master(72_431L);
  private static final int HORIZON_DAYS = 7;
  private static final int FIRST_CUT_DAY_INDEX = 150;
  private static final int NEXT_CUT_DAY_INDEX = FIRST_CUT_DAY_INDEX + HORIZON_DAYS;

  private static TrainingPlan plan(int cutDayIndex, String partition, Objective objective, double zeroRowsKept) {
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 40, cutDayIndex, HORIZON_DAYS,
        partition);
    return new TrainingPlan(plan.spec(), plan.trainParameters().withRounds(40, 5).withObjective(objective),
        plan.datasetParameters(), cutDayIndex, HORIZON_DAYS, partition, false, false, zeroRowsKept);
  }

  /** Every row of {@code rows}: the kept score against the model's prediction, to 1e-9 relative. */
  private static void assertKeptScoresArePredictions(ModelSet.Partition partition, FeaturePass rows,
      RowScores.Cursor cursor, MemoryBudget budget, String context) {
    double[] predicted = new double[(int) rows.rowCount()];
    double[] kept = new double[predicted.length];
    try (FeatureBatch batch = new FeatureBatch(budget, predicted.length, rows.schema().featureCount())) {
      rows.stream(batch, full -> {
        partition.model().predictRaw(full, predicted);
        for (int r = 0; r < full.rowCount(); r++) {
          kept[r] = cursor.find(full.seriesIndexes()[r], full.dayIndexes()[r]);
          double tolerance = 1e-9 * Math.max(1, Math.abs(predicted[r]));
          if (!(Math.abs(kept[r] - predicted[r]) <= tolerance)) {
            throw new AssertionError("series " + full.seriesIndexes()[r] + ", day " + full.dayIndexes()[r]
                + ": kept " + kept[r] + ", predicted " + predicted[r] + " (" + context + ")");
          }
        }
      });
    }
  }

  private static void assertModelKeepsEveryRowsScore(SalesHistory history, String partitionBy, Objective objective,
      double zeroRowsKept) {
    String context = "seed " + SEED + ", partition by " + partitionBy + ", " + objective + ", zero rows kept "
        + zeroRowsKept;
    TrainingPlan plan = plan(FIRST_CUT_DAY_INDEX, partitionBy, objective, zeroRowsKept);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet models = ModelTraining.train(history, plan, budget, ProgressListener.SILENT, true)) {
      for (ModelSet.Partition partition : models.partitions()) {
        FeaturePass training = FeaturePass.training(history, plan.spec(), partition.seriesIndexes(), 0,
            plan.trainingLastDayIndex(), plan.zeroSampling());
        FeaturePass validation = FeaturePass.training(history, plan.spec(), partition.seriesIndexes(),
            plan.validationFirstDayIndex(), plan.cutDayIndex());
        RowScores scores = partition.model().rowScores();
        assertNotNull(scores, context);
        assertEquals(training.rowCount() + validation.rowCount(), scores.rowCount(), context);
        assertEquals(16 * scores.rowCount(), scores.offHeapBytes(), context);
        RowScores.Cursor cursor = scores.cursor(partition.seriesIndexes());
        assertKeptScoresArePredictions(partition, training, cursor, budget, context + ", training rows");
        assertKeptScoresArePredictions(partition, validation, cursor, budget, context + ", validation rows");
      }
    }
  }

  @Test
  void shouldKeepTheScoreTheModelPredictsForEveryTrainingAndValidationRow() {
    ArraySalesHistory history = SmallHistories.history(SEED, 30, 190, 10);
    assertModelKeepsEveryRowsScore(history, null, Objective.TWEEDIE, 1);
    assertModelKeepsEveryRowsScore(history, "store", Objective.TWEEDIE, 1);
    // the identity link, and the rows zero-row sampling keeps (with their weights)
    assertModelKeepsEveryRowsScore(history, "store", Objective.REGRESSION, 0.5);
  }

  @Test
  void shouldKeepNoScoresUnlessAsked() {
    ArraySalesHistory history = SmallHistories.history(SEED + 3, 12, 190, 10);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet models = ModelTraining.train(history, plan(FIRST_CUT_DAY_INDEX, null, Objective.TWEEDIE, 1),
            budget, ProgressListener.SILENT)) {
      assertNull(models.partitions().get(0).model().rowScores());
    }
  }

  private static void assertCarriedContinuationMatchesPredicted(SalesHistory history, String partitionBy,
      double zeroRowsKept) {
    String context = "seed " + SEED + ", partition by " + partitionBy + ", zero rows kept " + zeroRowsKept;
    TrainingPlan first = plan(FIRST_CUT_DAY_INDEX, partitionBy, Objective.TWEEDIE, zeroRowsKept);
    TrainingPlan next = plan(NEXT_CUT_DAY_INDEX, partitionBy, Objective.TWEEDIE, zeroRowsKept);
    RecordedNotes carriedNotes = new RecordedNotes();
    RecordedNotes predictedNotes = new RecordedNotes();
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet withScores = ModelTraining.train(history, first, budget, ProgressListener.SILENT, true);
        ModelSet withoutScores = ModelTraining.train(history, first, budget, ProgressListener.SILENT, false);
        ModelSet carried = ModelTraining.train(history, next.withStartingModels(new StartingModels(withScores,
            "the first cut")), budget, carriedNotes);
        ModelSet predicted = ModelTraining.train(history, next.withStartingModels(new StartingModels(withoutScores,
            "the first cut")), budget, predictedNotes)) {
      List<String> expectedCarried = new ArrayList<>();
      List<String> expectedPredicted = new ArrayList<>();
      for (int p = 0; p < carried.partitions().size(); p++) {
        ModelSet.Partition partition = carried.partitions().get(p);
        long trainingRows = FeaturePass.training(history, next.spec(), partition.seriesIndexes(), 0,
            next.trainingLastDayIndex(), next.zeroSampling()).rowCount();
        long validationRows = FeaturePass.training(history, next.spec(), partition.seriesIndexes(),
            next.validationFirstDayIndex(), next.cutDayIndex()).rowCount();
        // the next cut's training rows are the first cut's training and validation rows: all carried; its validation
        // rows are newer days: all predicted
        expectedCarried.add("starting scores: " + trainingRows + " rows carried over from the starting model's "
            + "training, " + validationRows + " predicted");
        expectedPredicted.add("starting scores: 0 rows carried over from the starting model's training, "
            + (trainingRows + validationRows) + " predicted");
        ModelSet.Partition other = predicted.partitions().get(p);
        // released once the continued training's Datasets held them, not kept through its boosting
        assertNull(withScores.partitions().get(p).model().rowScores(), context);
        assertEquals(other.report().iterationCount(), partition.report().iterationCount(), context);
        assertEquals(other.report().bestIteration(), partition.report().bestIteration(), context);
        FeaturePass forecastRows = FeaturePass.prediction(history, next.spec(), partition.seriesIndexes(),
            NEXT_CUT_DAY_INDEX + 1, HORIZON_DAYS);
        double[] a = new double[(int) forecastRows.rowCount()];
        double[] b = new double[a.length];
        try (FeatureBatch batch = new FeatureBatch(budget, a.length, forecastRows.schema().featureCount())) {
          forecastRows.stream(batch, full -> {
            partition.model().predictRaw(full, a);
            other.model().predictRaw(full, b);
          });
        }
        for (int r = 0; r < a.length; r++) {
          assertEquals(b[r], a[r], 1e-6 * Math.max(1, Math.abs(b[r])), context + ", forecast row " + r);
        }
      }
      assertEquals(expectedCarried, carriedNotes.startingWith("starting scores"), context);
      assertEquals(expectedPredicted, predictedNotes.startingWith("starting scores"), context);
    }
  }

  @Test
  void shouldCarryTheStartingModelsScoresAndPredictOnlyTheNewerDays() {
    ArraySalesHistory history = SmallHistories.history(SEED + 1, 30, 190, 10);
    assertCarriedContinuationMatchesPredicted(history, null, 1);
    assertCarriedContinuationMatchesPredicted(history, "store", 0.5);
  }

  @Test
  void shouldCarryScoresOnAWeeklyStoreKeyedByWeek() {
    // rows keyed by week index, partitions by region (two stores in one, one alone)
    ArraySalesHistory weekly = SmallHistories.asWeeks(SmallHistories.history(SEED + 5, 30, 190, 10));
    assertModelKeepsEveryRowsScore(weekly, "region", Objective.TWEEDIE, 1);
    assertCarriedContinuationMatchesPredicted(weekly, "region", 1);
  }

  @Test
  void shouldSaveTheScoresBesideTheModelAndReadThemOnlyForTheSameStore(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED + 4, 30, 190, 10);
    TrainingPlan first = plan(FIRST_CUT_DAY_INDEX, "store", Objective.TWEEDIE, 1);
    TrainingPlan next = plan(NEXT_CUT_DAY_INDEX, "store", Objective.TWEEDIE, 1);
    Path modelDir = dir.resolve("last-origin");
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, first, budget, ProgressListener.SILENT, true)) {
      ModelDirectory.save(trained, modelDir, history, first, "store-state-1");
      List<String> expected = new ArrayList<>();
      for (ModelSet.Partition partition : trained.partitions()) {
        Path file = modelDir.resolve(ModelDirectory.rowScoresFileName(partition.report().modelFile()));
        // header, 16 bytes per row, checksum
        assertEquals(20 + 16 * partition.model().rowScores().rowCount() + 8, Files.size(file));
        expected.add("partition " + partition.value() + ": " + partition.model().rowScores().rowCount()
            + " saved row scores read");
      }

      try (ModelSet opened = ModelDirectory.open(modelDir, history)) {
        assertEquals(expected, ModelDirectory.attachRowScores(opened, modelDir, "store-state-1", budget));
        RecordedNotes notes = new RecordedNotes();
        try (ModelSet continued = ModelTraining.train(history, next.withStartingModels(new StartingModels(opened,
            modelDir.toString())), budget, notes)) {
          List<String> carried = notes.startingWith("starting scores");
          assertEquals(3, carried.size());
          for (int p = 0; p < 3; p++) {
            long trainingRows = FeaturePass.training(history, next.spec(), continued.partitions().get(p)
                .seriesIndexes(), 0, next.trainingLastDayIndex()).rowCount();
            assertTrue(carried.get(p).startsWith("starting scores: " + trainingRows + " rows carried over"),
                carried.get(p));
          }
        }
      }
      try (ModelSet opened = ModelDirectory.open(modelDir, history)) {
        List<String> other = ModelDirectory.attachRowScores(opened, modelDir, "store-state-2", budget);
        assertEquals("partition " + opened.partitions().get(0).value() + ": the row scores saved with the model were "
            + "computed on another state of the store (its fingerprint differs), so every starting score is "
            + "predicted", other.get(0));
        assertNull(opened.partitions().get(0).model().rowScores());
      }

      // one byte changed in the middle of the first partition's scores
      Path damaged = modelDir.resolve(ModelDirectory.rowScoresFileName(trained.partitions().get(0).report()
          .modelFile()));
      byte[] bytes = Files.readAllBytes(damaged);
      bytes[bytes.length / 2] ^= 0x10;
      Files.write(damaged, bytes);
      try (ModelSet opened = ModelDirectory.open(modelDir, history)) {
        List<String> lines = ModelDirectory.attachRowScores(opened, modelDir, "store-state-1", budget);
        assertEquals("partition " + opened.partitions().get(0).value() + ": the saved row scores cannot be used ("
            + damaged + " is damaged: its checksum does not match its contents), so every starting score is "
            + "predicted", lines.get(0));
        assertNull(opened.partitions().get(0).model().rowScores());
        assertNotNull(opened.partitions().get(1).model().rowScores());
      }
      // only the trained models' own scores are still held: every opened set gave its scores back
      assertEquals(trained.partitions().stream().mapToLong(p -> p.model().rowScores().offHeapBytes()).sum(),
          budget.heldBytes());
    }
  }

  @Test
  void shouldRefuseToCarryScoresOfRowsWhoseFeaturesChanged() {
    ArraySalesHistory history = SmallHistories.history(SEED + 2, 12, 190, 10);
    // the same series and days with other units: the rows' lags differ from what the model saw; small batches so
    // that many carried rows are checked (one per batch)
    ArraySalesHistory rewritten = SmallHistories.scrambledFrom(history, 0, SEED + 2);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet start = ModelTraining.train(history, plan(FIRST_CUT_DAY_INDEX, null, Objective.TWEEDIE, 1), budget,
            ProgressListener.SILENT, true)) {
      TrainingPlan nextPlan = plan(NEXT_CUT_DAY_INDEX, null, Objective.TWEEDIE, 1);
      TrainingPlan next = new TrainingPlan(nextPlan.spec(), nextPlan.trainParameters(), nextPlan.datasetParameters()
          .withBatchRowCount(64), NEXT_CUT_DAY_INDEX, HORIZON_DAYS, null, false, false, 1,
          new StartingModels(start,
              "the first cut"));
      IllegalStateException refused = assertThrows(IllegalStateException.class, () -> ModelTraining.train(
          rewritten, next, budget, ProgressListener.SILENT).close());
      assertTrue(refused.getMessage().contains("but the starting model predicts"), refused.getMessage());
      assertTrue(refused.getMessage().endsWith("so scores cannot carry over (a defect to report with the store; "
          + "trainings from scratch are not affected)"), refused.getMessage());
    }
  }
}
