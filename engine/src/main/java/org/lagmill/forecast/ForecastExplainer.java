package org.lagmill.forecast;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureFamily;
import org.lagmill.features.FeaturePass;
import org.lagmill.learner.TrainedModel;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.training.ModelSet;

/**
 * Why a forecast is what it is: per horizon period, the forecast of a series or of a group of series split into a
 * base level and one share per {@link FeatureFamily}, from LightGBM's per-feature contributions (SHAP values).
 *
 * <p>Contributions are additive on the raw score. With a log link (tweedie, poisson) the raw score is log(units), so
 * they multiply the forecast rather than add to it; they are turned into units by the logarithmic mean Divisia index
 * (LMDI) rule: the base is exp(bias), and a family with raw contribution c adds {@code c × L(ŷ, base)} units, where
 * {@code L(a, b) = (a − b) / (ln a − ln b)} (and {@code L(a, a) = a}). Because the contributions sum to
 * {@code ln ŷ − ln base}, the shares sum exactly to {@code ŷ − base}, with no residual, and each share keeps its
 * contribution's sign. With the identity link (l2) the contributions are units already; a negative raw score is floored
 * at zero as in the forecast, and the floor is kept as its own term so the parts still add up. The rows explained are
 * the very rows the forecast predicts (recursive forecasts included), so the explained forecast equals
 * {@link ModelSet#forecast}.
 *
 * <p>Memory: per target, (families + 3) × horizon doubles; one contribution buffer of
 * {@code batch rows × (features + 1)} doubles while predicting. Not thread-safe; stateless between calls.
 */
public final class ForecastExplainer {
  private ForecastExplainer() {}

  /** A forecast to explain: one series, or the sum of several (an aggregate). */
  public record Target(String name, int[] seriesIndexes) {}

  /**
   * One target's forecast in parts, per horizon period: {@code base + Σ families + floor = forecast}.
   *
   * @param families units per family (in {@link FeatureFamily} order), {@code [family][period]}
   * @param floorUnits units added where an identity-link raw score was floored at zero (0 with a log link)
   */
  public record Explanation(String name, int seriesCount, double[] forecast, double[] base, double[][] families,
      double[] floorUnits) {}

  /**
   * Forecasts the targets' series for {@code horizonDays} periods after the history's last one and splits each
   * target's forecast into its parts.
   */
  public static List<Explanation> explain(SalesHistory history, ModelSet models, int horizonDays,
      List<Target> targets, MemoryBudget budget) {
    int familyCount = FeatureFamily.values().length;
    double[][] forecast = new double[targets.size()][horizonDays];
    double[][] base = new double[targets.size()][horizonDays];
    double[][][] families = new double[targets.size()][familyCount][horizonDays];
    double[][] floor = new double[targets.size()][horizonDays];
    // targets of each series, as target positions; most series belong to few targets
    List<List<Integer>> targetsOfSeries = new ArrayList<>();
    for (int s = 0; s < history.seriesCount(); s++) {
      targetsOfSeries.add(null);
    }
    java.util.BitSet needed = new java.util.BitSet();
    for (int t = 0; t < targets.size(); t++) {
      for (int s : targets.get(t).seriesIndexes()) {
        if (targetsOfSeries.get(s) == null) {
          targetsOfSeries.set(s, new ArrayList<>(2));
        }
        targetsOfSeries.get(s).add(t);
        needed.set(s);
      }
    }
    for (ModelSet.Partition partition : models.partitions()) {
      int[] series = java.util.Arrays.stream(partition.seriesIndexes()).filter(needed::get).toArray();
      if (series.length == 0) {
        continue;
      }
      TrainedModel model = partition.model();
      int[] familyOfFeature = familyOfFeature(history, models, series);
      boolean logLink = model.objective().hasLogLink();
      int firstHorizonDayIndex = history.dayCount();
      double[][] out = new double[history.seriesCount()][];
      for (int s : series) {
        out[s] = new double[horizonDays];
      }
      BatchPredictor explaining = new BatchPredictor() {
        private double[] contributions = new double[0];
        private final double[] familyRaw = new double[familyCount];

        @Override
        public void predict(FeatureBatch batch, double[] predictions) {
          model.predict(batch, predictions);
          int width = model.featureCount() + 1;
          if (contributions.length < batch.rowCount() * width) {
            contributions = new double[batch.capacityRows() * width];
          }
          model.predictContributions(batch, contributions);
          int[] seriesOfRow = batch.seriesIndexes();
          int[] dayOfRow = batch.dayIndexes();
          for (int row = 0; row < batch.rowCount(); row++) {
            java.util.Arrays.fill(familyRaw, 0);
            int offset = row * width;
            for (int f = 0; f < width - 1; f++) {
              familyRaw[familyOfFeature[f]] += contributions[offset + f];
            }
            double bias = contributions[offset + width - 1];
            double predicted = Double.isNaN(predictions[row]) ? 0 : Math.max(0, predictions[row]);
            double baseUnits;
            double scale;
            double floorUnits = 0;
            if (logLink) {
              baseUnits = Math.exp(bias);
              scale = logarithmicMean(predicted, baseUnits);
            } else {
              baseUnits = bias;
              scale = 1;
              floorUnits = predicted - predictions[row];
            }
            int day = dayOfRow[row] - firstHorizonDayIndex;
            for (int t : targetsOfSeries.get(seriesOfRow[row])) {
              forecast[t][day] += predicted;
              base[t][day] += baseUnits;
              floor[t][day] += floorUnits;
              for (int k = 0; k < familyCount; k++) {
                families[t][k][day] += familyRaw[k] * scale;
              }
            }
          }
        }
      };
      Forecaster.forecast(history, models.spec(), explaining, series, horizonDays, budget, out);
    }
    List<Explanation> explanations = new ArrayList<>();
    for (int t = 0; t < targets.size(); t++) {
      explanations.add(new Explanation(targets.get(t).name(), targets.get(t).seriesIndexes().length, forecast[t],
          base[t], families[t], floor[t]));
    }
    return explanations;
  }

  /**
   * The logarithmic mean {@code (a − b) / (ln a − ln b)} of two positive numbers, {@code a} when they are equal;
   * between the two, and continuous across {@code a = b}. Zero when either is zero (no units to share out).
   */
  static double logarithmicMean(double a, double b) {
    if (!(a > 0) || !(b > 0)) {
      return 0;
    }
    double logRatio = Math.log(a / b);
    // below this the quotient loses digits; the series a·(1 − x/2 + x²/6) with x = ln(a/b) is exact to 1e-16 there
    if (Math.abs(logRatio) < 1e-6) {
      return a * (1 - logRatio / 2 + logRatio * logRatio / 6);
    }
    return (a - b) / logRatio;
  }

  private static int[] familyOfFeature(SalesHistory history, ModelSet models, int[] series) {
    List<String> names = FeaturePass.prediction(history, models.spec(), series, history.dayCount(), 1).schema()
        .names();
    int[] family = new int[names.size()];
    for (int f = 0; f < names.size(); f++) {
      family[f] = FeatureFamily.of(names.get(f)).ordinal();
    }
    return family;
  }
}
