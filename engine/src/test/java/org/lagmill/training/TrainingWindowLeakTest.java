package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;

/**
 * The validation window never overlaps the training window, and no training row reads a unit inside the validation
 * window: scrambling every unit from the validation window on changes neither the training rows nor the trained model.
 */
class TrainingWindowLeakTest {
  private static final long SEED = TestSeeds.master(5_318_008L);
  private static final int HORIZON_DAYS = 7;
  private static final int VALIDATION_DAYS = 14;

  @Test
  void shouldBuildTheSameTrainingRowsWhateverTheValidationWindowHolds() {
    ArraySalesHistory history = SmallHistories.history(SEED, 40, 220, 10);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 5, 200, VALIDATION_DAYS, null);
    assertEquals(187, plan.validationFirstDayIndex());
    assertEquals(186, plan.trainingLastDayIndex());
    ArraySalesHistory scrambled = SmallHistories.scrambledFrom(history, plan.validationFirstDayIndex(), SEED + 1);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      List<float[]> original = SmallHistories.rows(FeaturePass.training(history, plan.spec(), null, 0,
          plan.trainingLastDayIndex()), budget);
      List<float[]> changed = SmallHistories.rows(FeaturePass.training(scrambled, plan.spec(), null, 0,
          plan.trainingLastDayIndex()), budget);
      assertTrue(original.size() > 3000, "too few rows to mean anything: " + original.size());
      assertNull(SmallHistories.firstDifference(original, changed), "seed " + SEED);
      for (float[] row : original) {
        assertTrue(row[1] < plan.validationFirstDayIndex(), "training row on day " + row[1] + ", seed " + SEED);
      }
    }
  }

  @Test
  void shouldTrainTheSameModelWhateverTheValidationWindowHolds() {
    ArraySalesHistory history = SmallHistories.history(SEED + 2, 40, 200, 10);
    // Early stopping reads the validation rows, so it is off here; sales-value weights read days before validation.
    TrainingPlan unweighted = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 10, 190, VALIDATION_DAYS, null);
    TrainingPlan plan = new TrainingPlan(unweighted.spec(), unweighted.trainParameters(),
        unweighted.datasetParameters().withUseWeights(true), 190, VALIDATION_DAYS, null, true, false);
    ArraySalesHistory scrambled = SmallHistories.scrambledFrom(history, plan.validationFirstDayIndex(), SEED + 3);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet first = ModelTraining.train(history, plan, budget, ProgressListener.SILENT);
        ModelSet second = ModelTraining.train(scrambled, plan, budget, ProgressListener.SILENT)) {
      FeaturePass probe = FeaturePass.prediction(history, plan.spec(), null, 150, 60);
      double[] expected = predict(first, probe, budget);
      double[] actual = predict(second, probe, budget);
      assertArrayEquals(expected, actual, "seed " + (SEED + 2));
      assertFalse(java.util.Arrays.stream(expected).allMatch(v -> v == expected[0]), "a constant model proves nothing");
      PartitionReport a = first.partitions().get(0).report();
      PartitionReport b = second.partitions().get(0).report();
      assertEquals(a.trainingRowCount(), b.trainingRowCount());
      assertEquals(10, b.iterationCount());
    }
  }

  private static double[] predict(ModelSet models, FeaturePass rows, MemoryBudget budget) {
    double[] out = new double[(int) rows.rowCount()];
    try (FeatureBatch batch = new FeatureBatch(budget, (int) rows.rowCount(), rows.schema().featureCount())) {
      rows.stream(batch, full -> models.partitions().get(0).model().predict(full, out));
    }
    return out;
  }
}
