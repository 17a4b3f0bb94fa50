package org.lagmill.eval;

import java.util.List;
import java.util.Map;
import org.lagmill.training.PartitionReport;

/**
 * Scores of a rolling-origin backtest: per origin the model and each baseline under the same metric, and their mean
 * and spread over origins.
 */
public record BacktestResult(List<OriginResult> origins, double meanModelWrmsse, double stdModelWrmsse,
    Map<String, Double> meanBaselineWrmsse, Double meanModelWspl, Double meanPoissonWspl) {

  /**
   * One origin.
   *
   * @param poissonWspl WSPL of the same point forecasts with Poisson intervals (no dispersion), to show what the
   *     estimated dispersion buys
   */
  public record OriginResult(int originDayIndex, String originDate, EvaluationResult model,
      Map<String, EvaluationResult> baselines, Double poissonWspl, List<PartitionReport> partitions,
      double trainSeconds, double forecastSeconds) {}

  /** The model's mean WRMSSE over origins divided by seasonal naive's: below 1 means the model beats it. */
  public double skillRatioAgainstSeasonalNaive() {
    return skillRatioAgainst(BaselineKind.SEASONAL_NAIVE);
  }

  /**
   * The model's mean WRMSSE over origins divided by a baseline's (below 1 the model beats it), or NaN when that
   * baseline was not scored or scored 0.
   */
  public double skillRatioAgainst(BaselineKind baseline) {
    Double reference = meanBaselineWrmsse.get(baseline.name());
    return reference == null || reference == 0 ? Double.NaN : meanModelWrmsse / reference;
  }
}
