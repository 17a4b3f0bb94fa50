package org.lagmill.report;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.eval.BacktestResult;
import org.lagmill.eval.BaselineKind;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.store.Periods;
import org.lagmill.store.StoreSummary;
import org.lagmill.training.PartitionReport;

/**
 * Turns engine results (store summary, training reports, backtest and evaluation results) into the report's own
 * records, so the HTML and the run's JSON hold the very numbers the engine computed.
 */
public final class ReportAssembler {
  private ReportAssembler() {}

  public static DataSummary dataSummary(StoreSummary store) {
    Map<String, Long> cardinalities = new LinkedHashMap<>();
    store.attributeCardinalities().forEach((name, count) -> cardinalities.put(name, count.longValue()));
    double itemDays = (double) store.seriesCount() * store.dayCount();
    return new DataSummary((long) store.seriesCount(), store.dayCount(), store.firstDate(), store.lastDate(),
        cardinalities, store.zeroDayShare(), store.storeBytesPerItemDay(), store.int64ColumnBytes() / itemDays,
        store.sourceCsvBytes() > 0 ? store.sourceCsvBytes() / itemDays : null,
        store.periodDays() == Periods.DAILY ? null : store.periodDays(), store.fill());
  }

  /** Validation curve of the largest partition and feature gain summed over partitions. */
  public static TrainingSummary training(List<PartitionReport> partitions) {
    return training(partitions, partitions);
  }

  /**
   * As {@link #training(List)} for {@code shown}, with the row notice (zero-sales rows dropped) summed over
   * {@code trained}: every training of a run, the origins of a backtest say, of which {@code shown} is one.
   */
  public static TrainingSummary training(List<PartitionReport> shown, List<PartitionReport> trained) {
    List<PartitionReport> partitions = shown;
    if (partitions.isEmpty()) {
      return null;
    }
    PartitionReport largest = partitions.get(0);
    Map<String, double[]> importance = new LinkedHashMap<>();
    for (PartitionReport partition : partitions) {
      if (partition.trainingRowCount() > largest.trainingRowCount()) {
        largest = partition;
      }
      for (PartitionReport.FeatureImportanceRow row : partition.featureImportance()) {
        double[] sums = importance.computeIfAbsent(row.feature(), k -> new double[2]);
        sums[0] += row.gain();
        sums[1] += row.splitCount();
      }
    }
    List<TrainingSummary.FeatureImportance> rows = new ArrayList<>();
    importance.forEach((name, sums) -> rows.add(new TrainingSummary.FeatureImportance(name, sums[0],
        (long) sums[1])));
    rows.sort((a, b) -> Double.compare(b.gain(), a.gain()));
    TrainingSummary.ValidationCurve curve = largest.validationCurve().length == 0 ? null
        : new TrainingSummary.ValidationCurve(largest.validationMetric(), largest.validationCurve(), null,
            largest.bestIteration());
    String dropped = PartitionReport.zeroRowsNotice(trained);
    TrainingSummary.Continuation continuation = largest.continued() ? new TrainingSummary.Continuation(
        largest.continuedFrom(), largest.startingRounds(), largest.addedRounds(), largest.startingValidationLoss())
        : null;
    return new TrainingSummary(curve, rows, dropped == null ? null : "Training " + dropped + ".", continuation);
  }

  /** Per-level table averaged over the origins, the mean WRMSSE of the model and each baseline, and per origin. */
  public static AccuracySummary accuracy(BacktestResult backtest) {
    List<BacktestResult.OriginResult> origins = backtest.origins();
    EvaluationResult first = origins.get(0).model();
    List<AccuracySummary.LevelScore> levels = new ArrayList<>();
    for (int level = 0; level < first.levels().size(); level++) {
      double model = 0;
      double mae = 0;
      double bias = 0;
      Map<String, Double> baselines = new LinkedHashMap<>();
      for (BacktestResult.OriginResult origin : origins) {
        model += origin.model().levels().get(level).weightedRmsse() / origins.size();
        mae += origin.model().levels().get(level).mae() / origins.size();
        bias += origin.model().levels().get(level).bias() / origins.size();
        for (Map.Entry<String, EvaluationResult> baseline : origin.baselines().entrySet()) {
          baselines.merge(label(baseline.getKey()), baseline.getValue().levels().get(level).weightedRmsse()
              / origins.size(), Double::sum);
        }
      }
      EvaluationResult.LevelResult row = first.levels().get(level);
      levels.add(new AccuracySummary.LevelScore(row.name(), row.aggregateCount(), model, baselines, mae, bias));
    }
    Map<String, Double> baselineMeans = new LinkedHashMap<>();
    backtest.meanBaselineWrmsse().forEach((name, value) -> baselineMeans.put(label(name), value));
    List<AccuracySummary.OriginScore> originScores = new ArrayList<>();
    for (BacktestResult.OriginResult origin : origins) {
      Map<String, Double> scores = new LinkedHashMap<>();
      origin.baselines().forEach((name, result) -> scores.put(label(name), result.wrmsse()));
      originScores.add(new AccuracySummary.OriginScore(LocalDate.parse(origin.originDate()), origin.model().wrmsse(),
          scores));
    }
    Map<String, Double> baselineWspl = new LinkedHashMap<>();
    if (backtest.meanPoissonWspl() != null) {
      baselineWspl.put("Poisson intervals (no dispersion)", backtest.meanPoissonWspl());
    }
    String reference = baselineMeans.containsKey(label(BaselineKind.SEASONAL_NAIVE.name()))
        ? label(BaselineKind.SEASONAL_NAIVE.name()) : null;
    return new AccuracySummary(reference, levels, backtest.meanModelWrmsse(), baselineMeans,
        backtest.meanModelWspl(), baselineWspl, originScores,
        worst(origins.stream().map(BacktestResult.OriginResult::model).toList()), first.levelSource(),
        first.levelBasis());
  }

  /**
   * One evaluation (a forecast file scored against the actuals, beside the baselines from the same origin) as an
   * accuracy summary with a single origin.
   */
  public static AccuracySummary accuracy(EvaluationResult model, Map<String, EvaluationResult> baselines,
      LocalDate originDate) {
    List<AccuracySummary.LevelScore> levels = new ArrayList<>();
    for (int level = 0; level < model.levels().size(); level++) {
      Map<String, Double> scores = new LinkedHashMap<>();
      for (Map.Entry<String, EvaluationResult> baseline : baselines.entrySet()) {
        scores.put(label(baseline.getKey()), baseline.getValue().levels().get(level).weightedRmsse());
      }
      EvaluationResult.LevelResult row = model.levels().get(level);
      levels.add(new AccuracySummary.LevelScore(row.name(), row.aggregateCount(), row.weightedRmsse(), scores,
          row.mae(), row.bias()));
    }
    Map<String, Double> wrmsse = new LinkedHashMap<>();
    Map<String, Double> wspl = new LinkedHashMap<>();
    baselines.forEach((name, result) -> {
      wrmsse.put(label(name), result.wrmsse());
      if (result.wspl() != null) {
        wspl.put(label(name), result.wspl());
      }
    });
    String seasonal = label(BaselineKind.SEASONAL_NAIVE.name());
    return new AccuracySummary(wrmsse.containsKey(seasonal) ? seasonal : null, levels, model.wrmsse(), wrmsse,
        model.wspl(), wspl, List.of(new AccuracySummary.OriginScore(originDate, model.wrmsse(), wrmsse)),
        worst(List.of(model)), model.levelSource(), model.levelBasis());
  }

  /** Aggregates kept per level in the report's list of where the forecast fails (the page shows fewer). */
  static final int WORST_KEPT_PER_LEVEL = EvaluationResult.WORST_AGGREGATE_COUNT;

  /**
   * Per level, the aggregates with the largest mean share of the WRMSSE over the evaluations (an aggregate outside an
   * origin's kept list counts 0 there, so the mean is a lower bound for it); MAE, bias and actual are means over the
   * origins that list it.
   */
  static List<AccuracySummary.WorstAggregate> worst(List<EvaluationResult> evaluations) {
    List<AccuracySummary.WorstAggregate> out = new ArrayList<>();
    EvaluationResult first = evaluations.get(0);
    for (int level = 0; level < first.levels().size(); level++) {
      Map<String, double[]> sums = new LinkedHashMap<>();
      for (EvaluationResult evaluation : evaluations) {
        for (EvaluationResult.AggregateError e : evaluation.levels().get(level).worstAggregates()) {
          double[] s = sums.computeIfAbsent(e.name(), k -> new double[5]);
          s[0] += e.wrmsseContribution();
          s[1] += e.mae();
          s[2] += e.bias();
          s[3] += e.actualMean();
          s[4]++;
        }
      }
      List<AccuracySummary.WorstAggregate> rows = new ArrayList<>();
      String levelName = first.levels().get(level).name();
      sums.forEach((name, s) -> rows.add(new AccuracySummary.WorstAggregate(levelName, name,
          s[0] / evaluations.size(), s[1] / s[4], s[2] / s[4], s[3] / s[4])));
      rows.sort(java.util.Comparator.comparingDouble(AccuracySummary.WorstAggregate::wrmsseContribution).reversed()
          .thenComparing(AccuracySummary.WorstAggregate::aggregateName));
      out.addAll(rows.subList(0, Math.min(WORST_KEPT_PER_LEVEL, rows.size())));
    }
    return out;
  }

  /** Scaled error per horizon day averaged over origins, the model beside each baseline. */
  public static HorizonErrors horizon(BacktestResult backtest) {
    List<BacktestResult.OriginResult> origins = backtest.origins();
    int horizon = origins.get(0).model().horizonDays().size();
    double[] model = new double[horizon];
    Map<String, double[]> baselines = new LinkedHashMap<>();
    for (BacktestResult.OriginResult origin : origins) {
      for (int d = 0; d < horizon; d++) {
        model[d] += origin.model().horizonDays().get(d).weightedScaledError() / origins.size();
      }
      for (Map.Entry<String, EvaluationResult> baseline : origin.baselines().entrySet()) {
        double[] values = baselines.computeIfAbsent(label(baseline.getKey()), k -> new double[horizon]);
        for (int d = 0; d < horizon; d++) {
          values[d] += baseline.getValue().horizonDays().get(d).weightedScaledError() / origins.size();
        }
      }
    }
    List<HorizonErrors.NamedCurve> curves = new ArrayList<>();
    baselines.forEach((name, values) -> curves.add(new HorizonErrors.NamedCurve(name, values)));
    return new HorizonErrors("weighted scaled error (RMSSE of one day, WRMSSE weights)", model, curves);
  }

  /** Scaled error per horizon period of one evaluation, the model beside each baseline. */
  public static HorizonErrors horizon(EvaluationResult model, Map<String, EvaluationResult> baselines) {
    int horizon = model.horizonDays().size();
    double[] values = new double[horizon];
    for (int d = 0; d < horizon; d++) {
      values[d] = model.horizonDays().get(d).weightedScaledError();
    }
    List<HorizonErrors.NamedCurve> curves = new ArrayList<>();
    baselines.forEach((name, result) -> {
      double[] curve = new double[horizon];
      for (int d = 0; d < horizon; d++) {
        curve[d] = result.horizonDays().get(d).weightedScaledError();
      }
      curves.add(new HorizonErrors.NamedCurve(label(name), curve));
    });
    return new HorizonErrors("weighted scaled error (RMSSE of one period, WRMSSE weights)", values, curves);
  }

  /** Display name of a baseline kind, e.g. SEASONAL_NAIVE → "seasonal naive". */
  public static String label(String baselineKind) {
    return switch (baselineKind) {
      case "SES" -> "exponential smoothing";
      case "SBA" -> "Croston (SBA)";
      case "CROSTON" -> "Croston";
      case "ETS" -> "ETS";
      default -> baselineKind.toLowerCase(java.util.Locale.ROOT).replace('_', ' ');
    };
  }
}
