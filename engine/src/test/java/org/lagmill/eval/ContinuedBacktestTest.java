package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeaturePass;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.progress.RecordedNotes;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.TruncatedHistory;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;

/**
 * A backtest whose origins continue from the previous origin's models: the first origin is the plain one, each later
 * origin starts from the one before, the last origin's models reach the caller while open, and it stays leak-free.
 */
class ContinuedBacktestTest {
  private static final long SEED = TestSeeds.master(5_530_221L);
  private static final int HORIZON_DAYS = 7;
  private static final Hierarchy HIERARCHY = Hierarchy.parse(List.of("region>store", "item"));

  @Test
  void shouldContinueEachOriginFromThePreviousOneWithoutReadingPastIt() {
    ArraySalesHistory history = SmallHistories.history(SEED, 30, 200, 10);
    TrainingPlan small = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 25, 0, HORIZON_DAYS, "store");
    TrainingPlan plan = new TrainingPlan(small.spec(), small.trainParameters().withRounds(25, 4),
        small.datasetParameters(), 0,
        HORIZON_DAYS, "store", false, false);
    BacktestSettings settings = new BacktestSettings(3, HORIZON_DAYS, HORIZON_DAYS, List.of(BaselineKind.NAIVE),
        HIERARCHY, new double[0]);
    int lastOrigin = settings.originDayIndex(history.dayCount(), 2);
    ArraySalesHistory scrambled = SmallHistories.scrambledFrom(history, lastOrigin, SEED + 1);
    Map<Integer, double[][]> scratch = new HashMap<>();
    Map<Integer, double[][]> continued = new HashMap<>();
    Map<Integer, double[][]> continuedScrambled = new HashMap<>();
    List<Integer> lastCuts = new ArrayList<>();
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      RollingOriginBacktest.run(history, plan, settings, budget, ProgressListener.SILENT,
          (origin, point, alphas) -> scratch.put(origin, point));
      RollingOriginBacktest.OriginModels continuing = new RollingOriginBacktest.OriginModels(true,
          (models, trainedPlan, known) -> {
            lastCuts.add(trainedPlan.cutDayIndex());
            assertEquals(3, models.partitions().size());
            assertEquals(lastOrigin, known.dayCount());
            assertFalse(models.partitions().get(0).model().modelText().isEmpty(), "still open");
          });
      BacktestResult result = RollingOriginBacktest.run(history, plan, settings, continuing, budget,
          ProgressListener.SILENT, (origin, point, alphas) -> continued.put(origin, point));
      RollingOriginBacktest.run(scrambled, plan, settings, new RollingOriginBacktest.OriginModels(true, null),
          budget, ProgressListener.SILENT, (origin, point, alphas) -> continuedScrambled.put(origin, point));

      assertEquals(List.of(lastOrigin - 1), lastCuts);
      List<BacktestResult.OriginResult> origins = result.origins();
      for (int k = 0; k < 3; k++) {
        for (int p = 0; p < 3; p++) {
          PartitionReport report = origins.get(k).partitions().get(p);
          String context = "origin " + k + ", partition " + report.partitionValue() + ", seed " + SEED;
          if (k == 0) {
            assertNull(report.continuedFrom(), context);
          } else {
            assertEquals("the model of origin " + origins.get(k - 1).originDate(), report.continuedFrom(), context);
            assertEquals(origins.get(k - 1).partitions().get(p).iterationCount(), report.startingRounds(), context);
          }
        }
      }
    }
    int firstOrigin = settings.originDayIndex(history.dayCount(), 0);
    for (int s = 0; s < history.seriesCount(); s++) {
      assertArrayEquals(scratch.get(firstOrigin)[s], continued.get(firstOrigin)[s], "the first origin is the plain "
          + "one, series " + s + ", seed " + SEED);
    }
    for (int origin : continued.keySet()) {
      for (int s = 0; s < history.seriesCount(); s++) {
        assertArrayEquals(continued.get(origin)[s], continuedScrambled.get(origin)[s], "nothing from the last "
            + "origin on is read, origin " + origin + ", series " + s + ", seed " + SEED);
      }
    }
  }

  /**
   * A weekly store's continued backtest: with the validation weeks equal to the step between origins, every origin
   * after the first carries the scores of all its training rows (the previous origin's training and validation rows)
   * and predicts only its validation rows, which are weeks the previous model never saw.
   */
  @Test
  void shouldCarryEachOriginsScoresToTheNextOnAWeeklyStore() {
    ArraySalesHistory weekly = SmallHistories.asWeeks(SmallHistories.history(SEED + 2, 18, 200, 10));
    TrainingPlan small = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 25, 0, HORIZON_DAYS, null);
    TrainingPlan plan = new TrainingPlan(small.spec(), small.trainParameters().withRounds(25, 4),
        small.datasetParameters(), 0, HORIZON_DAYS, null, false, false);
    BacktestSettings settings = new BacktestSettings(3, HORIZON_DAYS, HORIZON_DAYS, List.of(BaselineKind.NAIVE),
        HIERARCHY, new double[0]);
    RecordedNotes notes = new RecordedNotes();
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      RollingOriginBacktest.run(weekly, plan, settings, new RollingOriginBacktest.OriginModels(true, null), budget,
          notes, null);
      // the held scores were given back with their models
      assertEquals(0, budget.heldBytes());
    }
    int[] everySeries = IntStream.range(0, weekly.seriesCount()).toArray();
    List<String> expected = new ArrayList<>();
    for (int k = 1; k < 3; k++) {
      int origin = settings.originDayIndex(weekly.dayCount(), k);
      TrainingPlan originPlan = plan.withCutDayIndex(origin - 1);
      TruncatedHistory known = new TruncatedHistory(weekly, origin);
      long trainingRows = FeaturePass.training(known, plan.spec(), everySeries, 0, originPlan.trainingLastDayIndex())
          .rowCount();
      long validationRows = FeaturePass.training(known, plan.spec(), everySeries, originPlan
          .validationFirstDayIndex(), originPlan.cutDayIndex()).rowCount();
      expected.add("starting scores: " + trainingRows + " rows carried over from the starting model's training, "
          + validationRows + " predicted");
    }
    assertEquals(expected, notes.startingWith("starting scores"), "seed " + SEED);
  }
}
