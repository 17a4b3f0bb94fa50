package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.lagmill.features.FeatureFamily;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSpec;
import org.lagmill.learner.Objective;
import org.lagmill.learner.TrainParameters;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.TrainingPlan;

/** The explained forecast against a slow reference built from every row's raw contributions. */
class ForecastExplainerTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);
  private static final int HORIZON_DAYS = 7;

  @Test
  void shouldSplitDirectForecastsIntoFamiliesLikeTheSlowReference() {
    check(MASTER_SEED, SmallHistories.spec(HORIZON_DAYS), null, Objective.TWEEDIE);
  }

  @Test
  void shouldSplitRecursivePartitionedForecastsLikeTheSlowReference() {
    FeatureSpec recursive = FeatureSpec.builder().horizonDays(HORIZON_DAYS).strategy(FeatureSpec.Strategy.RECURSIVE)
        .lagDays(1, 2, 7).rollingWindowDays(7).rollingShiftDays(1).build();
    check(MASTER_SEED + 1, recursive, "store", Objective.POISSON);
  }

  @Test
  void shouldKeepTheZeroFloorOfAnIdentityLinkAsItsOwnTerm() {
    check(MASTER_SEED + 2, SmallHistories.spec(HORIZON_DAYS), null, Objective.REGRESSION);
  }

  /** Hand-worked values of the logarithmic mean L(a, b) = (a − b) / (ln a − ln b). */
  @Test
  void shouldComputeTheLogarithmicMean() {
    assertEquals(1 / Math.log(2), ForecastExplainer.logarithmicMean(2, 1), 1e-15); // 1.4426950408889634
    assertEquals(Math.E - 1, ForecastExplainer.logarithmicMean(Math.E, 1), 1e-15);
    assertEquals(3.0, ForecastExplainer.logarithmicMean(3, 3), 0);
    assertEquals(3.0000005, ForecastExplainer.logarithmicMean(3.000001, 3), 1e-12);
    assertEquals(0, ForecastExplainer.logarithmicMean(0, 3), 0);
  }

  private static void check(long seed, FeatureSpec spec, String partition, Objective objective) {
    ArraySalesHistory history = SmallHistories.history(seed, 24, 200, 20);
    TrainingPlan base = SmallHistories.plan(spec, 12, history.dayCount() - 1, HORIZON_DAYS, partition);
    TrainingPlan plan = new TrainingPlan(spec, base.trainParameters().withObjective(objective),
        base.datasetParameters(), base.cutDayIndex(), base.validationDays(), partition, false, base.refit());
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet models = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      List<ForecastExplainer.Target> targets = new ArrayList<>();
      int[] all = new int[history.seriesCount()];
      for (int s = 0; s < all.length; s++) {
        all[s] = s;
        targets.add(new ForecastExplainer.Target("series " + s, new int[] {s}));
      }
      targets.add(new ForecastExplainer.Target("total", all));
      targets.add(new ForecastExplainer.Target("first half", java.util.Arrays.copyOf(all, all.length / 2)));
      List<ForecastExplainer.Explanation> explained = ForecastExplainer.explain(history, models, HORIZON_DAYS,
          targets, budget);

      // slow reference: every row's full contribution vector, recorded while the forecast runs as in production
      Map<Long, double[]> contributionsByRow = new HashMap<>();
      Map<Long, Double> predictionByRow = new HashMap<>();
      double[][] forecast = new double[history.seriesCount()][HORIZON_DAYS];
      List<String> names = FeaturePass.prediction(history, spec, all, history.dayCount(), 1).schema().names();
      for (ModelSet.Partition p : models.partitions()) {
        Forecaster.forecast(history, spec, (batch, out) -> {
          p.model().predict(batch, out);
          int width = names.size() + 1;
          double[] c = new double[batch.rowCount() * width];
          p.model().predictContributions(batch, c);
          for (int r = 0; r < batch.rowCount(); r++) {
            long key = (long) batch.seriesIndexes()[r] << 32 | batch.dayIndexes()[r];
            contributionsByRow.put(key, java.util.Arrays.copyOfRange(c, r * width, (r + 1) * width));
            predictionByRow.put(key, out[r]);
          }
        }, p.seriesIndexes(), HORIZON_DAYS, budget, forecast);
      }
      double[][] production = Forecaster.forecast(models, history, HORIZON_DAYS, budget);
      for (int t = 0; t < targets.size(); t++) {
        ForecastExplainer.Explanation e = explained.get(t);
        for (int d = 0; d < HORIZON_DAYS; d++) {
          double expectedForecast = 0;
          double expectedBase = 0;
          double[] expectedFamilies = new double[FeatureFamily.values().length];
          for (int s : targets.get(t).seriesIndexes()) {
            long key = (long) s << 32 | (history.dayCount() + d);
            double[] c = contributionsByRow.get(key);
            double raw = 0;
            for (double v : c) {
              raw += v;
            }
            double y = Math.max(0, predictionByRow.get(key));
            assertEquals(production[s][d], y, 1e-12, "seed " + seed + ": the explained rows are the forecast's");
            double b = objective.hasLogLink() ? Math.exp(c[c.length - 1]) : c[c.length - 1];
            double scale = !objective.hasLogLink() ? 1 : Math.abs(y - b) < 1e-12 * b ? b
                : (y - b) / (Math.log(y) - Math.log(b));
            for (int f = 0; f < names.size(); f++) {
              expectedFamilies[FeatureFamily.of(names.get(f)).ordinal()] += c[f] * scale;
            }
            expectedForecast += y;
            expectedBase += b;
            assertEquals(objective.hasLogLink() ? Math.exp(raw) : raw, predictionByRow.get(key),
                1e-9 * Math.max(1, Math.abs(raw)), "seed " + seed + ": contributions must sum to the raw score");
          }
          String where = "seed " + seed + ", " + objective + ", " + e.name() + ", day " + d;
          double tolerance = 1e-9 * Math.max(1, expectedForecast);
          assertEquals(expectedForecast, e.forecast()[d], tolerance, where);
          assertEquals(expectedBase, e.base()[d], tolerance, where);
          double parts = e.base()[d] + e.floorUnits()[d];
          for (int k = 0; k < expectedFamilies.length; k++) {
            assertEquals(expectedFamilies[k], e.families()[k][d], tolerance, where + ", " + FeatureFamily.values()[k]);
            parts += e.families()[k][d];
          }
          assertEquals(e.forecast()[d], parts, tolerance, where + ": base + families + floor = forecast");
        }
      }
    }
  }
}
