package org.lagmill.forecast;

import java.util.Arrays;
import java.util.BitSet;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSpec;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.learner.TrainedModel;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.training.ModelSet;

/**
 * Point forecasts of the {@code horizonDays} days after a history's last day, for a chosen set of series.
 *
 * <p>Direct: one feature pass over all horizon days, valid because every lag and rolling shift is at least the horizon,
 * so no row reads a day after the history. Recursive: day by day, each day's rounded predictions written into a
 * {@link ForecastScratch} that the next day's lags read. When every lag is at least the horizon the two give the same
 * numbers, which a test checks.
 */
public final class Forecaster {
  private Forecaster() {}

  /**
   * Point forecasts of the {@code horizonDays} days after the history's last day for every series, each series by its
   * partition's model.
   *
   * @return {@code [seriesIndex][dayOffset]} non-negative expected units
   */
  public static double[][] forecast(ModelSet models, SalesHistory history, int horizonDays, MemoryBudget budget) {
    return forecast(models, history, horizonDays, budget, null);
  }

  /**
   * As {@link #forecast(ModelSet, SalesHistory, int, MemoryBudget)}, for the chosen series only; the rows of the
   * others hold NaN (which the forecast file writer leaves out).
   *
   * @param chosenSeries ascending series indexes, or null for every series
   */
  public static double[][] forecast(ModelSet models, SalesHistory history, int horizonDays, MemoryBudget budget,
      int[] chosenSeries) {
    double[][] out = new double[history.seriesCount()][horizonDays];
    BitSet chosen = null;
    if (chosenSeries != null) {
      chosen = new BitSet(history.seriesCount());
      for (int s : chosenSeries) {
        chosen.set(s);
      }
      for (int s = 0; s < out.length; s++) {
        if (!chosen.get(s)) {
          Arrays.fill(out[s], Double.NaN);
        }
      }
    }
    for (ModelSet.Partition partition : models.partitions()) {
      int[] series = partition.seriesIndexes();
      if (chosen != null) {
        series = Arrays.stream(series).filter(chosen::get).toArray();
      }
      if (series.length > 0) {
        forecast(history, models.spec(), partition.model()::predict, series, horizonDays, budget, out);
      }
    }
    return out;
  }

  /**
   * Forecasts every horizon day of the given series, writing non-negative units into {@code out[s][day]}.
   *
   * @param seriesIndexes the series to forecast (e.g. one model partition); {@code out} is indexed by series index
   * @param out {@code seriesCount × horizonDays}; rows of series not listed are left untouched
   */
  public static void forecast(SalesHistory history, FeatureSpec spec, BatchPredictor predictor, int[] seriesIndexes,
      int horizonDays, MemoryBudget budget, double[][] out) {
    if (horizonDays < 1) {
      throw new InvalidRequestException("horizon must be >= 1 day, got " + horizonDays);
    }
    if (spec.strategy() == FeatureSpec.Strategy.DIRECT) {
      if (spec.shortestShiftDays() < horizonDays) {
        throw new InvalidRequestException("a direct forecast of " + horizonDays + " days needs every lag and rolling"
            + " shift >= " + horizonDays + ", the shortest is " + spec.shortestShiftDays()
            + "; use strategy: recursive or a shorter horizon");
      }
      FeaturePass pass = FeaturePass.prediction(history, spec, seriesIndexes, history.dayCount(), horizonDays);
      predictInto(pass, predictor, history.dayCount(), budget,
          (series, dayOffset, value) -> out[series][dayOffset] = value);
    } else {
      forecastRecursive(history, spec, predictor, seriesIndexes, horizonDays, budget, out);
    }
  }

  /** Forecasts day by day, reading earlier forecast days as if they were history. */
  public static void forecastRecursive(SalesHistory history, FeatureSpec spec, BatchPredictor predictor,
      int[] seriesIndexes, int horizonDays, MemoryBudget budget, double[][] out) {
    ForecastScratch scratch = new ForecastScratch(history, horizonDays);
    int baseDayCount = history.dayCount();
    for (int dayOffset = 0; dayOffset < horizonDays; dayOffset++) {
      FeaturePass pass = FeaturePass.prediction(scratch, spec, seriesIndexes, baseDayCount + dayOffset, 1);
      predictInto(pass, predictor, baseDayCount, budget, (series, offset, value) -> {
        out[series][offset] = value;
        scratch.setForecast(series, offset, value);
      });
      scratch.revealNextDay();
    }
  }

  private interface PredictionSink {
    void accept(int seriesIndex, int dayOffset, double units);
  }

  private static void predictInto(FeaturePass pass, BatchPredictor predictor, int firstHorizonDayIndex,
      MemoryBudget budget, PredictionSink sink) {
    int batchRows = (int) Math.max(1, Math.min(TrainedModel.PREDICTION_BATCH_ROWS, pass.rowCount()));
    double[] predictions = new double[batchRows];
    try (FeatureBatch batch = new FeatureBatch(budget, batchRows, pass.schema().featureCount())) {
      pass.stream(batch, full -> {
        predictor.predict(full, predictions);
        int[] series = full.seriesIndexes();
        int[] days = full.dayIndexes();
        for (int row = 0; row < full.rowCount(); row++) {
          double value = predictions[row];
          sink.accept(series[row], days[row] - firstHorizonDayIndex, Double.isNaN(value) ? 0 : Math.max(0, value));
        }
      });
    }
  }
}
