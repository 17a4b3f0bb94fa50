package org.lagmill.run;

import java.util.List;
import java.util.Map;
import org.lagmill.eval.BacktestResult;
import org.lagmill.eval.BacktestScoringPart;
import org.lagmill.eval.BacktestSettings;
import org.lagmill.eval.BaselineKind;
import org.lagmill.eval.CombinedBacktestResult;
import org.lagmill.eval.Hierarchy;
import org.lagmill.eval.RollingOriginBacktest;
import org.lagmill.forecast.ForecastTable;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.report.SeriesChartBuilder;
import org.lagmill.store.SalesHistory;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.TrainingPlan;

/**
 * A rolling-origin backtest with what its report needs: the result and the last origin's forecasts for the charts.
 * Shared by the backtest job and the demo.
 */
public final class BacktestRun {
  /** The baselines every backtest scores beside the model. */
  public static final List<BaselineKind> DEFAULT_BASELINES = List.of(BaselineKind.NAIVE, BaselineKind.SEASONAL_NAIVE,
      BaselineKind.MOVING_AVERAGE, BaselineKind.SES, BaselineKind.CROSTON, BaselineKind.SBA, BaselineKind.ETS);

  private final BacktestResult result;
  private final int lastOriginDayIndex;
  private final double[][] lastOriginForecasts;
  private final float[] lastOriginDispersion;
  private final Hierarchy hierarchy;

  private BacktestRun(BacktestResult result, int lastOrigin, double[][] forecasts, float[] dispersion,
      Hierarchy hierarchy) {
    this.result = result;
    this.lastOriginDayIndex = lastOrigin;
    this.lastOriginForecasts = forecasts;
    this.lastOriginDispersion = dispersion;
    this.hierarchy = hierarchy;
  }

  public static BacktestRun run(SalesHistory history, TrainingPlan plan, int originCount, int stepDays,
      Hierarchy hierarchy,
      MemoryBudget budget, ProgressListener progress) {
    return run(history, plan, originCount, stepDays, hierarchy, budget, progress, null);
  }

  /**
   * As {@link #run(SalesHistory, TrainingPlan, int, int, Hierarchy, MemoryBudget, ProgressListener)}, handing each
   * origin's point forecasts to {@code scoringParts} (a shard's share of the scores), unless it is null.
   */
  public static BacktestRun run(SalesHistory history, TrainingPlan plan, int originCount, int stepDays,
      Hierarchy hierarchy, MemoryBudget budget, ProgressListener progress,
      BacktestScoringPart.Collector scoringParts) {
    return run(history, plan, originCount, stepDays, hierarchy, budget, progress, scoringParts,
        RollingOriginBacktest.OriginModels.FROM_SCRATCH);
  }

  /**
   * As {@link #run(SalesHistory, TrainingPlan, int, int, Hierarchy, MemoryBudget, ProgressListener,
   * BacktestScoringPart.Collector)}, doing with each origin's models what {@code originModels} says.
   */
  public static BacktestRun run(SalesHistory history, TrainingPlan plan, int originCount, int stepDays,
      Hierarchy hierarchy, MemoryBudget budget, ProgressListener progress,
      BacktestScoringPart.Collector scoringParts, RollingOriginBacktest.OriginModels originModels) {
    BacktestSettings settings = new BacktestSettings(originCount, stepDays, plan.spec().horizonDays(),
        DEFAULT_BASELINES, hierarchy, ForecastTable.publishedQuantiles());
    int[] lastOrigin = {-1};
    double[][][] lastForecasts = new double[1][][];
    float[][] lastDispersion = new float[1][];
    BacktestResult result = RollingOriginBacktest.run(history, plan, settings, originModels, budget, progress,
        (origin, point, dispersion) -> {
          lastOrigin[0] = origin;
          lastForecasts[0] = point;
          lastDispersion[0] = dispersion;
          if (scoringParts != null) {
            scoringParts.onOrigin(origin, point);
          }
        });
    return new BacktestRun(result, lastOrigin[0], lastForecasts[0], lastDispersion[0], hierarchy);
  }

  /**
   * Backtests several members on the same origins and their average; the report and summary follow the one with the
   * lowest mean WRMSSE ({@link CombinedBacktestResult#chosenName()}).
   */
  public static BacktestRun runMembers(SalesHistory history, List<String> names, List<TrainingPlan> plans,
      int originCount,
      int stepDays, Hierarchy hierarchy, MemoryBudget budget, ProgressListener progress, CombinedBacktestResult[] out) {
    BacktestSettings settings = new BacktestSettings(originCount, stepDays, plans.get(0).spec().horizonDays(),
        DEFAULT_BASELINES, hierarchy, ForecastTable.publishedQuantiles());
    Map<Integer, double[][]> lastPoints = new java.util.HashMap<>();
    Map<Integer, float[]> lastDispersions = new java.util.HashMap<>();
    int[] lastOrigin = {-1};
    CombinedBacktestResult combined = RollingOriginBacktest.runMembers(history, names, plans, settings, budget,
        progress, (member, origin, point, dispersion) -> {
          lastOrigin[0] = origin;
          lastPoints.put(member, point);
          lastDispersions.put(member, dispersion);
        });
    out[0] = combined;
    String chosen = combined.chosenName();
    int chosenIndex = chosen.equals(CombinedBacktestResult.COMBINATION_NAME) ? names.size() : names.indexOf(chosen);
    return new BacktestRun(combined.chosen(), lastOrigin[0], lastPoints.get(chosenIndex),
        lastDispersions.get(chosenIndex), hierarchy);
  }

  /** The result: one row per origin, the model's and every baseline's scores. */
  public BacktestResult result() {
    return result;
  }

  /** The partitions trained at the last origin (their reports describe the model in the report). */
  public List<PartitionReport> lastPartitions() {
    return result.origins().get(result.origins().size() - 1).partitions();
  }

  /** Adds the accuracy, horizon, training (unless set) and series chart sections to the report. */
  public void addTo(ReportData.Builder report, SalesHistory history, List<String> shownSeries) {
    report.accuracy(ReportAssembler.accuracy(result)).horizon(ReportAssembler.horizon(result));
    if (report.build().training() == null) {
      report.training(ReportAssembler.training(lastPartitions(), result.origins().stream()
          .flatMap(origin -> origin.partitions().stream()).toList()));
    }
    SeriesChartBuilder.build(history, hierarchy.bind(history), lastOriginDayIndex, lastOriginForecasts,
        lastOriginDispersion, SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, shownSeries)
        .forEach(chart -> report.series(chart));
  }
}
