package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;

/**
 * The refit trains the shipped model again on every day up to the cut: it reads the formerly held-out window, never a
 * day after the cut, with the early-stopped round count scaled by the ratio of rows.
 */
class RefitTest {
  private static final long SEED = Long.getLong("lagmill.seed", 20240611L);
  private static final int HORIZON_DAYS = 7;
  private static final int VALIDATION_DAYS = 14;
  private static final int CUT_DAY_INDEX = 170;

  private static TrainingPlan plan(boolean refit) {
    return SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 12, CUT_DAY_INDEX, VALIDATION_DAYS, null)
        .withRefit(refit);
  }

  private static double[] predict(ModelSet models, FeaturePass rows, MemoryBudget budget) {
    double[] out = new double[(int) rows.rowCount()];
    try (FeatureBatch batch = new FeatureBatch(budget, (int) rows.rowCount(), rows.schema().featureCount())) {
      rows.stream(batch, full -> models.partitions().get(0).model().predict(full, out));
    }
    return out;
  }

  @Test
  void shouldTrainAgainOnEveryDayUpToTheCutWithTheRoundsScaledByTheRowRatio() {
    ArraySalesHistory history = SmallHistories.history(SEED, 30, 200, 10);
    TrainingPlan plan = plan(true);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet models = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      PartitionReport report = models.partitions().get(0).report();
      long allRows = FeaturePass.training(history, plan.spec(), null, 0, CUT_DAY_INDEX).rowCount();
      long trainingRows = FeaturePass.training(history, plan.spec(), null, 0, plan.trainingLastDayIndex()).rowCount();
      assertEquals(trainingRows, report.trainingRowCount(), "seed " + SEED);
      assertEquals(allRows, report.refitRowCount(), "seed " + SEED);
      assertTrue(allRows >= trainingRows + report.validationRowCount() && report.validationRowCount() > 0,
          "the refit rows include the held-out window, seed " + SEED);
      assertEquals(Math.max(1, Math.round(report.bestIteration() * (double) allRows / trainingRows)),
          report.refitRounds(), "seed " + SEED);
    }
  }

  @Test
  void shouldLearnFromTheHeldOutWindowButNeverFromDaysAfterTheCut() {
    ArraySalesHistory history = SmallHistories.history(SEED + 1, 30, 200, 10);
    ArraySalesHistory afterCutScrambled = SmallHistories.scrambledFrom(history, CUT_DAY_INDEX + 1, SEED + 2);
    ArraySalesHistory heldOutScrambled = SmallHistories.scrambledFrom(history, plan(true).validationFirstDayIndex(),
        SEED + 3);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet refit = ModelTraining.train(history, plan(true), budget, ProgressListener.SILENT);
        ModelSet refitAfterCut = ModelTraining.train(afterCutScrambled, plan(true), budget, ProgressListener.SILENT);
        ModelSet refitHeldOut = ModelTraining.train(heldOutScrambled, plan(true), budget, ProgressListener.SILENT);
        ModelSet early = ModelTraining.train(history, plan(false), budget, ProgressListener.SILENT)) {
      FeaturePass probe = FeaturePass.prediction(history, plan(true).spec(), null, 120, 40);
      double[] expected = predict(refit, probe, budget);
      assertFalse(Arrays.stream(expected).allMatch(v -> v == expected[0]), "a constant model proves nothing");
      // No training row after the last day the plan may read: scrambling them changes nothing.
      assertArrayEquals(expected, predict(refitAfterCut, probe, budget), "seed " + SEED);
      // At least one training row inside the formerly held-out window: scrambling it changes the refit model.
      assertFalse(Arrays.equals(expected, predict(refitHeldOut, probe, budget)), "seed " + SEED);
      assertFalse(Arrays.equals(expected, predict(early, probe, budget)), "the refit ships a different model");
      assertEquals(0, early.partitions().get(0).report().refitRowCount());
      assertEquals(0, early.partitions().get(0).report().refitRounds());
      // Intervals keep the early-stopped model's held-out errors (the refit model has seen those days).
      assertArrayEquals(early.dispersionBySeries(), refit.dispersionBySeries());
    }
  }

  @Test
  void shouldScaleRoundsByTheRowRatio() {
    assertEquals(46, ModelTraining.refitRounds(40, 1000, 1150));
    assertEquals(40, ModelTraining.refitRounds(40, 1000, 1012)); // 40 × 1.012 = 40.48, rounded
    assertEquals(41, ModelTraining.refitRounds(40, 1000, 1013)); // 40.52
    assertEquals(1, ModelTraining.refitRounds(0, 1000, 1200)); // at least one round
  }
}
