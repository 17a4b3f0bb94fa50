package org.lagmill.eval;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.forecast.ModelSet;
import org.lagmill.forecast.ModelTraining;
import org.lagmill.forecast.TrainingPlan;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.TruncatedHistory;

/**
 * Rolling-origin backtest: for each origin, train only on the history cut at the origin, forecast the horizon with
 * the production strategy, and score the model and the baselines on the same days.
 *
 * <p>Leak-free by construction: training and forecasting see a {@link TruncatedHistory} that ends the day before the
 * origin, and scales and weights use only days before it; a test overwrites every unit at or after an origin and
 * checks that nothing the origin produces changes.
 */
public final class RollingOriginBacktest {
  /** Receives each origin's forecasts as they are made, e.g. to chart them. */
  public interface ForecastListener {
    void onOrigin(int originDayIndex, double[][] pointForecasts, float[] dispersionBySeries);
  }

  private RollingOriginBacktest() {}

  public static BacktestResult run(SalesHistory history, TrainingPlan plan, BacktestSettings settings,
      MemoryBudget budget, ProgressListener progress, ForecastListener listener) {
    int firstOrigin = settings.originDayIndex(history.dayCount(), 0);
    if (firstOrigin - 1 - plan.validationDays() < plan.spec().launchSkipDays()) {
      throw new IllegalArgumentException("the earliest origin (day " + firstOrigin + ", " + history.dateOf(
          Math.max(0, firstOrigin)) + ") leaves too little history to train: it needs more than "
          + (plan.spec().launchSkipDays() + plan.validationDays()) + " days before it; use fewer origins or a "
          + "smaller step");
    }
    Evaluator evaluator = new Evaluator(history, settings.hierarchy(), settings.horizonDays());
    List<BacktestResult.OriginResult> origins = new ArrayList<>();
    for (int k = 0; k < settings.originCount(); k++) {
      int origin = settings.originDayIndex(history.dayCount(), k);
      origins.add(runOrigin(history, plan, settings, evaluator, origin, budget, progress, listener));
    }
    return summarise(origins, settings);
  }

  static BacktestResult.OriginResult runOrigin(SalesHistory history, TrainingPlan plan, BacktestSettings settings,
      Evaluator evaluator, int origin, MemoryBudget budget, ProgressListener progress, ForecastListener listener) {
    TruncatedHistory known = new TruncatedHistory(history, origin);
    long trainStart = System.nanoTime();
    double[][] point;
    float[] alphas;
    List<org.lagmill.forecast.PartitionReport> partitions = new ArrayList<>();
    double trainSeconds;
    long forecastStart;
    try (ModelSet models = ModelTraining.train(known, plan.withCutDayIndex(origin - 1), budget, progress)) {
      trainSeconds = (System.nanoTime() - trainStart) / 1e9;
      forecastStart = System.nanoTime();
      point = models.forecast(known, settings.horizonDays(), budget);
      alphas = models.dispersionBySeries();
      models.partitions().forEach(p -> partitions.add(p.report()));
    }
    double forecastSeconds = (System.nanoTime() - forecastStart) / 1e9;
    if (listener != null) {
      listener.onOrigin(origin, point, alphas);
    }
    OriginStatistics statistics = evaluator.statistics(origin);
    Aggregator aggregator = evaluator.aggregator();
    // Scored on known actuals only: a closed or unknown day leaves both sides of every aggregate (mean and variance).
    double[][] scored = evaluator.withoutUnknownActuals(point, origin);
    QuantileForecasts quantiles = settings.quantileLevels().length == 0 ? null
        : IntervalAggregation.quantiles(aggregator, scored, alphas, settings.quantileLevels());
    EvaluationResult model = evaluator.evaluate(statistics, aggregator.aggregateForecasts(scored), quantiles);
    Double poissonWspl = null;
    if (quantiles != null) {
      QuantileForecasts poisson = IntervalAggregation.quantiles(aggregator, scored, new float[point.length],
          settings.quantileLevels());
      poissonWspl = evaluator.evaluate(statistics, aggregator.aggregateForecasts(scored), poisson).wspl();
    }
    Map<String, EvaluationResult> baselines = scoreBaselines(known, settings.baselines(), settings.horizonDays(),
        evaluator, statistics);
    return new BacktestResult.OriginResult(origin, history.dateOf(origin).toString(), model, baselines, poissonWspl,
        partitions, trainSeconds, forecastSeconds);
  }

  /**
   * Forecasts the horizon after the end of {@code known} with each baseline and scores it, keyed by the kind's name.
   *
   * @param known the history up to the origin (exclusive), e.g. a {@link TruncatedHistory}
   */
  public static Map<String, EvaluationResult> scoreBaselines(SalesHistory known, List<BaselineKind> kinds,
      int horizonDays, Evaluator evaluator, OriginStatistics statistics) {
    Map<String, EvaluationResult> baselines = new LinkedHashMap<>();
    for (BaselineKind kind : kinds) {
      double[][] baseline = BaselineForecaster.forecastAll(known, known.dayCount(), horizonDays, kind);
      double[][] scored = evaluator.withoutUnknownActuals(baseline, statistics.originDay());
      baselines.put(kind.name(), evaluator.evaluate(statistics, evaluator.aggregator().aggregateForecasts(scored),
          null));
    }
    return baselines;
  }

  static BacktestResult summarise(List<BacktestResult.OriginResult> origins, BacktestSettings settings) {
    double sum = 0;
    double sumSquares = 0;
    double wsplSum = 0;
    double poissonSum = 0;
    boolean withIntervals = true;
    for (BacktestResult.OriginResult origin : origins) {
      sum += origin.model().wrmsse();
      sumSquares += origin.model().wrmsse() * origin.model().wrmsse();
      withIntervals &= origin.model().wspl() != null;
      if (origin.model().wspl() != null) {
        wsplSum += origin.model().wspl();
        poissonSum += origin.poissonWspl();
      }
    }
    int n = origins.size();
    double mean = sum / n;
    double std = n > 1 ? Math.sqrt(Math.max(0, (sumSquares - n * mean * mean) / (n - 1))) : 0;
    Map<String, Double> baselineMeans = new LinkedHashMap<>();
    for (BaselineKind kind : settings.baselines()) {
      double total = 0;
      for (BacktestResult.OriginResult origin : origins) {
        total += origin.baselines().get(kind.name()).wrmsse();
      }
      baselineMeans.put(kind.name(), total / n);
    }
    return new BacktestResult(List.copyOf(origins), mean, std, baselineMeans, withIntervals ? wsplSum / n : null,
        withIntervals ? poissonSum / n : null);
  }
}
