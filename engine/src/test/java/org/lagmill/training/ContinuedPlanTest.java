package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSpec;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.learner.Objective;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;

/**
 * A plan continued from the models of an earlier cut: each partition continues its own model, the report says from
 * which and how many rounds it added, the saved directory holds the starting trees first, and a starting model of
 * another spec, objective or partitioning is refused naming what differs.
 */
class ContinuedPlanTest {
  private static final long SEED = TestSeeds.master(61_203L);
  private static final int HORIZON_DAYS = 7;
  private static final int FIRST_CUT_DAY_INDEX = 150;
  private static final int LAST_CUT_DAY_INDEX = 178;

  private static TrainingPlan plan(int cutDayIndex, String partition) {
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 40, cutDayIndex, HORIZON_DAYS,
        partition);
    return new TrainingPlan(plan.spec(), plan.trainParameters().withRounds(40, 5), plan.datasetParameters(),
        cutDayIndex, HORIZON_DAYS, partition, false, false);
  }

  private static double[] rawScores(ModelSet models, int partitionIndex, FeaturePass rows, MemoryBudget budget) {
    double[] out = new double[(int) rows.rowCount()];
    try (FeatureBatch batch = new FeatureBatch(budget, (int) rows.rowCount(), rows.schema().featureCount())) {
      rows.stream(batch, full -> models.partitions().get(partitionIndex).model().predictRaw(full, out));
    }
    return out;
  }

  @Test
  void shouldContinueEachPartitionFromItsOwnModelAndSaveTheStartingTreesFirst(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED, 30, 190, 10);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet start = ModelTraining.train(history, plan(FIRST_CUT_DAY_INDEX, "store"), budget,
            ProgressListener.SILENT);
        ModelSet continued = ModelTraining.train(history, plan(LAST_CUT_DAY_INDEX, "store").withStartingModels(
            new StartingModels(start, "the first cut")), budget, ProgressListener.SILENT)) {
      assertEquals(3, continued.partitions().size());
      for (int p = 0; p < 3; p++) {
        PartitionReport startReport = start.partitions().get(p).report();
        PartitionReport report = continued.partitions().get(p).report();
        String context = "partition " + report.partitionValue() + ", seed " + SEED;
        assertEquals(startReport.partitionValue(), report.partitionValue());
        assertEquals("the first cut", report.continuedFrom(), context);
        assertEquals(startReport.iterationCount(), report.startingRounds(), context);
        assertEquals(report.startingRounds() + report.bestIteration(), report.iterationCount(), context);
        assertEquals(report.bestIteration(), report.addedRounds(), context);
        assertTrue(report.startingValidationLoss() != null && report.startingValidationLoss() > 0, context);
        assertEquals(report.validationCurve().length > 0, true, context);
        assertNull(startReport.continuedFrom());
        assertEquals(0, startReport.startingRounds());
        assertEquals(startReport.iterationCount(), startReport.addedRounds());
      }

      // saved and opened again: the model files hold the starting trees, then the added ones
      Path modelDir = dir.resolve("continued");
      ModelManifest manifest = ModelDirectory.save(continued, modelDir, history, plan(LAST_CUT_DAY_INDEX, "store"),
          "fp");
      assertEquals("the first cut", manifest.partitions().get(0).continuedFrom());
      FeaturePass probe = FeaturePass.prediction(history, continued.spec(), null, 181, HORIZON_DAYS);
      try (ModelSet opened = ModelDirectory.open(modelDir, history)) {
        ModelManifest read = ModelDirectory.readManifest(modelDir);
        for (int p = 0; p < 3; p++) {
          assertEquals(continued.partitions().get(p).report().startingRounds(), read.partitions().get(p)
              .startingRounds());
          assertEquals(continued.partitions().get(p).model().iterationCount(), opened.partitions().get(p).model()
              .iterationCount());
          FeaturePass rows = FeaturePass.prediction(history, continued.spec(), continued.partitions().get(p)
              .seriesIndexes(), 181, HORIZON_DAYS);
          assertArrayEquals(rawScores(continued, p, rows, budget), rawScores(opened, p, rows, budget), 0.0);
        }
        assertTrue(probe.rowCount() > 0);
      }
    }
  }

  @Test
  void shouldRefuseAStartingModelOfAnotherSpecObjectiveOrPartitioning() {
    ArraySalesHistory history = SmallHistories.history(SEED + 1, 18, 190, 10);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet start = ModelTraining.train(history, plan(FIRST_CUT_DAY_INDEX, null), budget,
            ProgressListener.SILENT)) {
      StartingModels starting = new StartingModels(start, "week 12's model");
      FeatureSpec otherLags = SmallHistories.spec(HORIZON_DAYS).toBuilder().lagDays(HORIZON_DAYS, 30).build();
      InvalidRequestException spec = assertThrows(InvalidRequestException.class, () -> ModelTraining.train(history,
          plan(LAST_CUT_DAY_INDEX, null).withSpec(otherLags).withStartingModels(starting), budget,
          ProgressListener.SILENT));
      assertEquals("the model to continue from (week 12's model) was trained on another feature spec: its lagDays is "
          + "[7,14,21] where this training's is [7,30]; continue only with the feature spec (and plan columns) it was "
          + "trained with", spec.getMessage());

      TrainingPlan poisson = plan(LAST_CUT_DAY_INDEX, null);
      poisson = new TrainingPlan(poisson.spec(), poisson.trainParameters().withObjective(Objective.POISSON),
          poisson.datasetParameters(), LAST_CUT_DAY_INDEX, HORIZON_DAYS, null, false, false)
          .withStartingModels(starting);
      TrainingPlan poissonPlan = poisson;
      assertEquals("the model to continue from (week 12's model) was trained for the tweedie objective, this "
          + "training for poisson; continue with the objective it was trained for",
          assertThrows(InvalidRequestException.class, () -> ModelTraining.train(history, poissonPlan, budget,
              ProgressListener.SILENT)).getMessage());

      assertEquals("the model to continue from (week 12's model) is partitioned by nothing (one model), this "
          + "training by 'store'; give the same \u2039partition-by\u203a",
          assertThrows(InvalidRequestException.class, () -> ModelTraining.train(history, plan(LAST_CUT_DAY_INDEX,
              "store").withStartingModels(starting), budget, ProgressListener.SILENT)).getMessage());

      assertEquals("\u2039refit\u203a cannot be combined with continuing from the model to continue from (week 12's "
          + "model) yet: leave out one of them",
          assertThrows(InvalidRequestException.class, () -> ModelTraining.train(history, plan(LAST_CUT_DAY_INDEX,
              null).withRefit(true).withStartingModels(starting), budget, ProgressListener.SILENT)).getMessage());
      assertEquals(List.of("all"), start.partitions().stream().map(ModelSet.Partition::value).toList());
    }
  }
}
