package org.lagmill.eval;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.forecast.Forecaster;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.TruncatedHistory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.StartingModels;
import org.lagmill.training.TrainingPlan;

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

  /**
   * What a backtest does with each origin's models besides forecasting with them.
   *
   * @param continueFromPreviousOrigin every origin after the first continues from the previous origin's models
   *     (LightGBM's init model) instead of boosting from scratch. Leak-free as well: the previous models learned only
   *     from days before the previous origin; this origin's training days hold theirs plus their validation window
   * @param lastModels receives the last origin's models before they are closed (e.g. to save them), or null
   */
  public record OriginModels(boolean continueFromPreviousOrigin, LastModels lastModels) {
    /** Every origin boosts from scratch and its models are closed after its forecast. */
    public static final OriginModels FROM_SCRATCH = new OriginModels(false, null);
  }

  /** Receives the models of the last origin while they are open. */
  @FunctionalInterface
  public interface LastModels {
    /**
     * @param plan the plan they were trained with (cut the day before the origin, plan columns resolved)
     * @param known the history up to the origin (exclusive) they were trained on
     */
    void accept(ModelSet models, TrainingPlan plan, SalesHistory known);
  }

  public static BacktestResult run(SalesHistory history, TrainingPlan plan, BacktestSettings settings,
      MemoryBudget budget, ProgressListener progress, ForecastListener listener) {
    return run(history, plan, settings, OriginModels.FROM_SCRATCH, budget, progress, listener);
  }

  /**
   * As {@link #run(SalesHistory, TrainingPlan, BacktestSettings, MemoryBudget, ProgressListener, ForecastListener)},
   * doing with each origin's models what {@code originModels} says. Continuing keeps one origin's models (trees only,
   * a few MB) open until the next origin has trained.
   */
  public static BacktestResult run(SalesHistory history, TrainingPlan plan, BacktestSettings settings,
      OriginModels originModels, MemoryBudget budget, ProgressListener progress, ForecastListener listener) {
    checkEarliestOrigin(history, plan, settings);
    if (plan.startingModels() != null) {
      throw new IllegalArgumentException("a backtest plan starts from scratch; continuing is an origin option");
    }
    Evaluator evaluator = new Evaluator(history, settings.hierarchy(), settings.horizonDays());
    List<BacktestResult.OriginResult> origins = new ArrayList<>();
    ModelSet previous = null;
    try {
      for (int k = 0; k < settings.originCount(); k++) {
        int origin = settings.originDayIndex(history.dayCount(), k);
        TrainingPlan originPlan = plan.withCutDayIndex(origin - 1);
        if (previous != null) {
          originPlan = originPlan.withStartingModels(new StartingModels(previous, "the model of origin "
              + history.dateOf(settings.originDayIndex(history.dayCount(), k - 1))));
        }
        boolean last = k == settings.originCount() - 1;
        boolean keep = originModels.continueFromPreviousOrigin() && !last;
        LastModels lastModels = last ? originModels.lastModels() : null;
        ModelSet[] kept = new ModelSet[1];
        try {
          // a saved last model keeps its rows' scores too: a final fit continued from it carries them over
          origins.add(runOrigin(history, originPlan, settings, evaluator, origin, budget, progress, listener,
              keep || lastModels != null,
              (models, trainedPlan, known) -> {
                if (lastModels != null) {
                  lastModels.accept(models, trainedPlan, known);
                }
                kept[0] = keep ? models : null;
                return keep;
              }));
        } finally {
          // the previous origin's models were this origin's start: done with them, whatever happened
          if (previous != null) {
            previous.close();
          }
          previous = kept[0];
        }
      }
    } finally {
      if (previous != null) {
        previous.close();
      }
    }
    return summarise(origins, settings);
  }

  /**
   * One origin: train on the history before it, forecast, score.
   *
   * @param plan cut the day before {@code origin}
   * @param keepRowScores the models keep their rows' scores, for the next origin to continue from
   * @param models sees the origin's models after its forecast; if it keeps them it closes them, else they are
   *     closed before this returns; null for none
   */
  static BacktestResult.OriginResult runOrigin(SalesHistory history, TrainingPlan plan, BacktestSettings settings,
      Evaluator evaluator, int origin, MemoryBudget budget, ProgressListener progress, ForecastListener listener,
      boolean keepRowScores, ModelsKeeper models) {
    TruncatedHistory known = new TruncatedHistory(history, origin);
    ModelForecast forecast = trainAndForecast(known, plan, settings, budget, progress, keepRowScores, models);
    if (listener != null) {
      listener.onOrigin(origin, forecast.point(), forecast.dispersion());
    }
    OriginStatistics statistics = evaluator.statistics(origin);
    Map<String, EvaluationResult> baselines = scoreBaselines(known, settings.baselines(), settings.horizonDays(),
        evaluator, statistics);
    return score(history, settings, evaluator, statistics, origin, forecast, baselines);
  }

  /** Sees an origin's models once they have forecast. */
  @FunctionalInterface
  interface ModelsKeeper {
    /** @return true when it keeps the models open (and closes them itself later) */
    boolean accept(ModelSet models, TrainingPlan plan, SalesHistory known);
  }

  /**
   * Several training plans (members) on the same origins, each scored, and their average (the mean of the members'
   * point forecasts per series and day; intervals from the mean of their dispersions). Members train one after
   * another and each member's models are closed before the next trains, so memory is that of the largest member.
   *
   * @param memberNames one name per plan, for the result
   * @param listener receives each member's forecasts per origin (member index), then the combination's (index
   *     {@code plans.size()}); may be null
   */
  public static CombinedBacktestResult runMembers(SalesHistory history, List<String> memberNames,
      List<TrainingPlan> plans, BacktestSettings settings, MemoryBudget budget, ProgressListener progress,
      MemberListener listener) {
    if (plans.isEmpty() || plans.size() != memberNames.size()) {
      throw new IllegalArgumentException("need one name per member and at least one member, got " + memberNames.size()
          + " names for " + plans.size() + " plans");
    }
    for (TrainingPlan plan : plans) {
      checkEarliestOrigin(history, plan, settings);
      if (plan.spec().horizonDays() != settings.horizonDays()) {
        throw new InvalidRequestException("every member must forecast the same horizon: a member's spec has "
            + plan.spec().horizonDays() + " days, the backtest " + settings.horizonDays() + "; give each member's "
            + "config the same horizonDays");
      }
    }
    Evaluator evaluator = new Evaluator(history, settings.hierarchy(), settings.horizonDays());
    List<List<BacktestResult.OriginResult>> memberOrigins = new ArrayList<>();
    plans.forEach(p -> memberOrigins.add(new ArrayList<>()));
    List<BacktestResult.OriginResult> combinedOrigins = new ArrayList<>();
    for (int k = 0; k < settings.originCount(); k++) {
      int origin = settings.originDayIndex(history.dayCount(), k);
      TruncatedHistory known = new TruncatedHistory(history, origin);
      OriginStatistics statistics = evaluator.statistics(origin);
      Map<String, EvaluationResult> baselines = scoreBaselines(known, settings.baselines(), settings.horizonDays(),
          evaluator, statistics);
      List<ModelForecast> forecasts = new ArrayList<>();
      for (int m = 0; m < plans.size(); m++) {
        ModelForecast forecast = trainAndForecast(known, plans.get(m).withCutDayIndex(origin - 1), settings, budget,
            progress, false, null);
        if (listener != null) {
          listener.onForecast(m, origin, forecast.point(), forecast.dispersion());
        }
        forecasts.add(forecast);
        memberOrigins.get(m).add(score(history, settings, evaluator, statistics, origin, forecast, baselines));
      }
      ModelForecast combined = ModelForecast.mean(forecasts);
      if (listener != null) {
        listener.onForecast(plans.size(), origin, combined.point(), combined.dispersion());
      }
      combinedOrigins.add(score(history, settings, evaluator, statistics, origin, combined, baselines));
    }
    List<BacktestResult> members = new ArrayList<>();
    memberOrigins.forEach(origins -> members.add(summarise(origins, settings)));
    return new CombinedBacktestResult(memberNames, members, summarise(combinedOrigins, settings));
  }

  /** Receives the forecasts of each member and of the combination at each origin. */
  public interface MemberListener {
    void onForecast(int memberIndex, int originDayIndex, double[][] pointForecasts, float[] dispersionBySeries);
  }

  private static void checkEarliestOrigin(SalesHistory history, TrainingPlan plan, BacktestSettings settings) {
    int firstOrigin = settings.originDayIndex(history.dayCount(), 0);
    if (firstOrigin - 1 - plan.validationDays() < plan.spec().launchSkipDays()) {
      throw new InvalidRequestException("the earliest origin (day " + firstOrigin + ", " + history.dateOf(
          Math.max(0, firstOrigin)) + ") leaves too little history to train: it needs more than "
          + (plan.spec().launchSkipDays() + plan.validationDays()) + " days before it; use fewer origins or a "
          + "smaller step");
    }
  }

  /**
   * @param plan cut the day before the origin
   * @param keepRowScores the models keep their training and validation rows' scores ({@link ModelTraining})
   * @param keeper sees the models after the forecast, or null; the models are closed here unless it keeps them
   */
  private static ModelForecast trainAndForecast(TruncatedHistory known, TrainingPlan plan, BacktestSettings settings,
      MemoryBudget budget, ProgressListener progress, boolean keepRowScores, ModelsKeeper keeper) {
    long trainStart = System.nanoTime();
    List<PartitionReport> partitions = new ArrayList<>();
    ModelSet models = ModelTraining.train(known, plan, budget, progress, keepRowScores);
    boolean kept = false;
    try {
      double trainSeconds = (System.nanoTime() - trainStart) / 1e9;
      long forecastStart = System.nanoTime();
      double[][] point = Forecaster.forecast(models, known, settings.horizonDays(), budget);
      float[] alphas = models.dispersionBySeries();
      models.partitions().forEach(p -> partitions.add(p.report()));
      double forecastSeconds = (System.nanoTime() - forecastStart) / 1e9;
      kept = keeper != null && keeper.accept(models, plan.withSpec(models.spec()), known);
      return new ModelForecast(point, alphas, partitions, trainSeconds, forecastSeconds);
    } finally {
      if (!kept) {
        models.close();
      }
    }
  }

  private static BacktestResult.OriginResult score(SalesHistory history, BacktestSettings settings,
      Evaluator evaluator, OriginStatistics statistics, int origin, ModelForecast forecast,
      Map<String, EvaluationResult> baselines) {
    double[][] point = forecast.point();
    Aggregator aggregator = evaluator.aggregator();
    // Scored on known actuals only: a closed or unknown day leaves both sides of every aggregate (mean and variance).
    double[][] scored = evaluator.withoutUnknownActuals(point, origin);
    QuantileForecasts quantiles = settings.quantileLevels().length == 0 ? null
        : IntervalAggregation.quantiles(aggregator, scored, forecast.dispersion(), settings.quantileLevels());
    EvaluationResult model = evaluator.evaluate(statistics, aggregator.aggregateForecasts(scored), quantiles);
    Double poissonWspl = null;
    if (quantiles != null) {
      QuantileForecasts poisson = IntervalAggregation.quantiles(aggregator, scored, new float[point.length],
          settings.quantileLevels());
      poissonWspl = evaluator.evaluate(statistics, aggregator.aggregateForecasts(scored), poisson).wspl();
    }
    return new BacktestResult.OriginResult(origin, history.dateOf(origin).toString(), model, baselines, poissonWspl,
        forecast.partitions(), forecast.trainSeconds(), forecast.forecastSeconds());
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
