package org.lagmill.eval;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesHistory;

/**
 * Scores forecasts of a history's bottom series against its actuals on every level of a hierarchy: WRMSSE, per-level
 * MAE and bias, per-day errors and, given quantile forecasts, WSPL. Bottom forecasts are summed up the hierarchy
 * (bottom-up reconciliation). Formulas and sources: docs/metrics.md.
 *
 * <p>Usage: {@code new Evaluator(history, Hierarchy.parse(List.of("banner>outlet", "section>family")), horizonDays)
 * .evaluate(originDay, forecasts)}. Not thread-safe (one aggregator buffer); use one evaluator per thread.
 */
public final class Evaluator {
  /** Days before the origin whose sales set the weights of a daily store, as in the published rules. */
  public static final int DEFAULT_WEIGHT_DAYS = 28;

  /**
   * The weight window in periods, the one rule for it: the last {@code horizonDays} periods before the origin (the
   * published rules weight by the last 28 days, which is their horizon). A daily store keeps 28 days whatever the
   * horizon, so daily scores stay as they were; a weekly store weights by its last horizon weeks.
   */
  public static int weightDayCount(int periodDays, int horizonDays) {
    return periodDays == Periods.DAILY ? DEFAULT_WEIGHT_DAYS : Math.max(1, horizonDays);
  }

  private final SalesHistory history;
  private final Aggregator aggregator;
  private final int weightDayCount;
  private final Hierarchy.Source levelSource;
  private final String levelBasis;

  /** As {@link #Evaluator(SalesHistory, Hierarchy, int)} for a horizon of {@link #DEFAULT_WEIGHT_DAYS} periods. */
  public Evaluator(SalesHistory history, Hierarchy hierarchy) {
    this(history, hierarchy, DEFAULT_WEIGHT_DAYS);
  }

  /** Weights by {@link #weightDayCount(int, int)} for forecasts of {@code horizonDays} periods. */
  public Evaluator(SalesHistory history, Hierarchy hierarchy, int horizonDays) {
    this(history, hierarchy.bind(history), weightDayCount(history.periodDays(), horizonDays), hierarchy.source(),
        hierarchy.basis());
  }

  /**
   * Levels given directly count as declared.
   *
   * @param levels levels bound to this history
   * @param weightDayCount days before the origin that set the weights
   */
  public Evaluator(SalesHistory history, List<Level> levels, int weightDayCount) {
    this(history, levels, weightDayCount, Hierarchy.Source.DECLARED, "levels given by the caller");
  }

  private Evaluator(SalesHistory history, List<Level> levels, int weightDayCount, Hierarchy.Source levelSource,
      String levelBasis) {
    this.levelSource = levelSource;
    this.levelBasis = levelBasis;
    this.history = history;
    this.aggregator = new Aggregator(levels);
    this.weightDayCount = weightDayCount;
    if (aggregator.seriesCount() != history.seriesCount()) {
      throw new IllegalArgumentException("levels cover " + aggregator.seriesCount() + " series, history has "
          + history.seriesCount());
    }
  }

  public Aggregator aggregator() {
    return aggregator;
  }

  /** Periods before the origin whose sales set the weights. */
  public int weightDayCount() {
    return weightDayCount;
  }

  /** What the levels were built from, as {@link EvaluationResult#levelBasis()} says it. */
  public String levelBasis() {
    return levelBasis;
  }

  /** Where the levels came from, {@code detected} or {@code declared}. */
  public String levelSource() {
    return levelSource.label();
  }

  /** Scales and weights for an origin; compute once and reuse for several forecasts of the same origin. */
  public OriginStatistics statistics(int originDay) {
    return OriginStatistics.compute(history, aggregator, originDay, weightDayCount);
  }

  /** @param bottomForecasts {@code [seriesIndex][dayOffset]} from the origin day on */
  public EvaluationResult evaluate(int originDay, double[][] bottomForecasts) {
    return evaluate(statistics(originDay),
        aggregator.aggregateForecasts(withoutUnknownActuals(bottomForecasts, originDay)), null);
  }

  /**
   * A copy of bottom forecasts (or quantiles, or variances) from {@code originDay} on, with 0 on every series-day whose
   * actual is unknown or closed. An unknown actual adds nothing to an aggregate's actual, so its forecast must add
   * nothing to the aggregate's forecast either: the day is removed from both sides of every aggregate, and a closed
   * day or a missing cell is never scored as an error. Rows of NaN (series not forecast) are kept as they are.
   *
   * @param bottomForecasts {@code [seriesIndex][dayOffset]}
   */
  public double[][] withoutUnknownActuals(double[][] bottomForecasts, int originDay) {
    double[][] known = new double[bottomForecasts.length][];
    for (int s = 0; s < bottomForecasts.length; s++) {
      known[s] = bottomForecasts[s].clone();
      int dayCount = Math.min(known[s].length, history.dayCount() - originDay);
      for (int d = 0; d < dayCount; d++) {
        if (history.units(s, originDay + d) == SalesHistory.UNKNOWN_UNITS) {
          known[s][d] = 0;
        }
      }
    }
    return known;
  }

  /**
   * Scores forecasts of every aggregate (e.g. from {@link Aggregator#aggregateForecasts}) and optional quantiles.
   *
   * @param quantiles may be null; when given, its horizon must equal the forecasts'
   */
  public EvaluationResult evaluate(OriginStatistics statistics, AggregateTable forecasts, QuantileForecasts quantiles) {
    int origin = statistics.originDay();
    int horizon = forecasts.dayCount();
    if (horizon < 1 || origin + horizon > history.dayCount()) {
      throw new InvalidRequestException("horizon " + horizon + " from origin " + origin + " needs actuals up to day "
          + (origin + horizon - 1) + ", history ends at day " + (history.dayCount() - 1));
    }
    if (quantiles != null && (quantiles.horizon() != horizon
        || quantiles.table(0).levelCount() != forecasts.levelCount())) {
      throw new IllegalArgumentException("quantiles cover " + quantiles.table(0).levelCount() + " levels x "
          + quantiles.horizon() + " days; forecasts cover " + forecasts.levelCount() + " levels x " + horizon);
    }
    if (forecasts.levelCount() != aggregator.levels().size()) {
      throw new IllegalArgumentException("forecasts cover " + forecasts.levelCount() + " levels, expected "
          + aggregator.levels().size());
    }
    AggregateTable actuals = aggregator.aggregateActuals(history, origin, horizon);
    return score(aggregator.levels(), statistics, actuals, forecasts, quantiles, actuals.unknownCount(),
        levelSource.label(), levelBasis);
  }

  /**
   * The scoring rules themselves, on tables of every aggregate's actuals and forecasts over the horizon: the one
   * place they live, used by {@link #evaluate} and by the merge of shards' scoring parts.
   *
   * @param levels give each level's name, aggregate count and aggregate names
   * @param unknownActualCount bottom series-days in the horizon whose actuals were unknown or closed
   */
  static EvaluationResult score(List<Level> levels, OriginStatistics statistics, AggregateTable actuals,
      AggregateTable forecasts, QuantileForecasts quantiles, long unknownActualCount, String levelSource,
      String levelBasis) {
    int origin = statistics.originDay();
    int horizon = forecasts.dayCount();
    int levelCount = levels.size();
    int finest = 0;
    for (int l = 1; l < levelCount; l++) {
      if (levels.get(l).aggregateCount() > levels.get(finest).aggregateCount()) {
        finest = l;
      }
    }
    double[] dayScaledError = new double[horizon];
    double[] finestDayAbsError = new double[horizon];
    List<EvaluationResult.LevelResult> levelResults = new ArrayList<>();
    double wrmsse = 0;
    double wspl = 0;
    for (int l = 0; l < levelCount; l++) {
      double[] y = actuals.levelValues(l);
      double[] f = forecasts.levelValues(l);
      int aggregateCount = levels.get(l).aggregateCount();
      double weightedRmsse = 0;
      double weightedSpl = 0;
      double absSum = 0;
      double biasSum = 0;
      List<EvaluationResult.AggregateError> aggregateErrors = new ArrayList<>(aggregateCount);
      for (int g = 0; g < aggregateCount; g++) {
        int base = g * horizon;
        double squaredSum = 0;
        double aggregateAbs = 0;
        double aggregateBias = 0;
        double aggregateActual = 0;
        for (int k = 0; k < horizon; k++) {
          double e = f[base + k] - y[base + k];
          squaredSum += e * e;
          aggregateAbs += Math.abs(e);
          aggregateBias += e;
          aggregateActual += y[base + k];
          if (l == finest) {
            finestDayAbsError[k] += Math.abs(e);
          }
        }
        absSum += aggregateAbs;
        biasSum += aggregateBias;
        double w = statistics.weight(l, g);
        double rmsse = w == 0 ? 0 : Math.sqrt(squaredSum / horizon / statistics.squaredScale(l, g));
        aggregateErrors.add(new EvaluationResult.AggregateError(levels.get(l).aggregateName(g), w * rmsse / levelCount,
            aggregateAbs / horizon, aggregateBias / horizon, aggregateActual / horizon));
        if (w == 0) {
          continue;
        }
        double scale = statistics.squaredScale(l, g);
        weightedRmsse += w * rmsse;
        double rootScale = Math.sqrt(scale);
        for (int k = 0; k < horizon; k++) {
          dayScaledError[k] += w * Math.abs(f[base + k] - y[base + k]) / rootScale;
        }
        if (quantiles != null) {
          weightedSpl += w * scaledPinball(quantiles, l, g, y, base, horizon, statistics.absoluteScale(l, g));
        }
      }
      double cells = (double) aggregateCount * horizon;
      levelResults.add(new EvaluationResult.LevelResult(levels.get(l).name(), aggregateCount,
          weightedRmsse / levelCount, weightedRmsse, absSum / cells, biasSum / cells, statistics.excludedCount(l),
          quantiles == null ? null : weightedSpl, worst(aggregateErrors)));
      wrmsse += weightedRmsse;
      wspl += weightedSpl;
    }
    List<EvaluationResult.HorizonDayError> days = new ArrayList<>();
    for (int k = 0; k < horizon; k++) {
      days.add(new EvaluationResult.HorizonDayError(k, dayScaledError[k] / levelCount,
          finestDayAbsError[k] / levels.get(finest).aggregateCount()));
    }
    return new EvaluationResult(origin, horizon, statistics.weightBasis().name(), wrmsse / levelCount,
        quantiles == null ? null : wspl / levelCount, levelResults, days, unknownActualCount,
        statistics.unknownTrainingCount(), levelSource, levelBasis);
  }

  /** The aggregates with the largest share of the WRMSSE, largest first, ties by name; at most the kept count. */
  static List<EvaluationResult.AggregateError> worst(List<EvaluationResult.AggregateError> errors) {
    errors.sort(java.util.Comparator.comparingDouble(EvaluationResult.AggregateError::wrmsseContribution).reversed()
        .thenComparing(EvaluationResult.AggregateError::name));
    return errors.subList(0, Math.min(EvaluationResult.WORST_AGGREGATE_COUNT, errors.size()));
  }

  /** SPL of one aggregate: mean over quantile levels of (1/h) Σ pinball / absolute scale. */
  private static double scaledPinball(QuantileForecasts quantiles, int levelIndex, int aggregateIndex, double[] y,
      int base, int horizon, double absoluteScale) {
    double total = 0;
    for (int q = 0; q < quantiles.quantileCount(); q++) {
      double tau = quantiles.quantileLevel(q);
      double[] values = quantiles.table(q).levelValues(levelIndex);
      double sum = 0;
      for (int k = 0; k < horizon; k++) {
        sum += SeriesMetrics.pinball(tau, y[base + k], values[aggregateIndex * horizon + k]);
      }
      total += sum / horizon / absoluteScale;
    }
    return total / quantiles.quantileCount();
  }
}
