package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.lagmill.eval.BacktestResult;
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

/** Runs a backtest and turns it into console lines and report sections; shared by {@code backtest} and {@code demo}. */
final class BacktestRun {
  static final List<BaselineKind> DEFAULT_BASELINES = List.of(BaselineKind.NAIVE, BaselineKind.SEASONAL_NAIVE,
      BaselineKind.MOVING_AVERAGE, BaselineKind.SES, BaselineKind.CROSTON, BaselineKind.SBA, BaselineKind.ETS);

  final BacktestResult result;
  final int lastOriginDayIndex;
  final double[][] lastOriginForecasts;
  final float[] lastOriginDispersion;
  final Hierarchy hierarchy;

  private BacktestRun(BacktestResult result, int lastOrigin, double[][] forecasts, float[] dispersion,
      Hierarchy hierarchy) {
    this.result = result;
    this.lastOriginDayIndex = lastOrigin;
    this.lastOriginForecasts = forecasts;
    this.lastOriginDispersion = dispersion;
    this.hierarchy = hierarchy;
  }

  static BacktestRun run(SalesHistory history, TrainingPlan plan, int originCount, int stepDays, Hierarchy hierarchy,
      MemoryBudget budget, ProgressListener progress) {
    BacktestSettings settings = new BacktestSettings(originCount, stepDays, plan.spec().horizonDays(),
        DEFAULT_BASELINES, hierarchy, ForecastTable.PUBLISHED_QUANTILES);
    int[] lastOrigin = {-1};
    double[][][] lastForecasts = new double[1][][];
    float[][] lastDispersion = new float[1][];
    BacktestResult result = RollingOriginBacktest.run(history, plan, settings, budget, progress,
        (origin, point, dispersion) -> {
          lastOrigin[0] = origin;
          lastForecasts[0] = point;
          lastDispersion[0] = dispersion;
        });
    return new BacktestRun(result, lastOrigin[0], lastForecasts[0], lastDispersion[0], hierarchy);
  }

  /**
   * Backtests several members on the same origins and their average; the report and summary follow the one with the
   * lowest mean WRMSSE ({@link CombinedBacktestResult#chosenName()}).
   */
  static BacktestRun runMembers(SalesHistory history, List<String> names, List<TrainingPlan> plans, int originCount,
      int stepDays, Hierarchy hierarchy, MemoryBudget budget, ProgressListener progress, CombinedBacktestResult[] out) {
    BacktestSettings settings = new BacktestSettings(originCount, stepDays, plans.get(0).spec().horizonDays(),
        DEFAULT_BASELINES, hierarchy, ForecastTable.PUBLISHED_QUANTILES);
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

  /** One line per member and the combination: mean WRMSSE and the skill ratios; then which one was chosen. */
  static void printMembers(PrintWriter out, CombinedBacktestResult combined) {
    out.println("members and their average on the same origins (WRMSSE, lower is better)");
    out.printf(Locale.ROOT, "%-40s %9s %9s %16s %9s%n", "member", "WRMSSE", "±", "/ seasonal naive", "/ ETS");
    for (int m = 0; m <= combined.members().size(); m++) {
      BacktestResult r = m < combined.members().size() ? combined.members().get(m) : combined.combination();
      String name = m < combined.members().size() ? combined.memberNames().get(m)
          : CombinedBacktestResult.COMBINATION_NAME;
      out.printf(Locale.ROOT, "%-40s %9.4f %9.4f %16.3f %9.3f%n", name, r.meanModelWrmsse(), r.stdModelWrmsse(),
          r.skillRatioAgainstSeasonalNaive(), r.skillRatioAgainst(BaselineKind.ETS));
    }
    out.println("chosen: " + combined.chosenName() + " (the report and the lines below describe it)");
  }

  List<PartitionReport> lastPartitions() {
    return result.origins().get(result.origins().size() - 1).partitions();
  }

  void addTo(ReportData.Builder report, SalesHistory history, List<String> shownSeries) {
    report.accuracy(ReportAssembler.accuracy(result)).horizon(ReportAssembler.horizon(result));
    if (report.build().training() == null) {
      report.training(ReportAssembler.training(lastPartitions()));
    }
    SeriesChartBuilder.build(history, hierarchy.bind(history), lastOriginDayIndex, lastOriginForecasts,
        lastOriginDispersion, SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, shownSeries).forEach(chart ->
        report.series(chart));
  }

  void print(PrintWriter out) {
    List<String> names = new ArrayList<>(result.meanBaselineWrmsse().keySet());
    StringBuilder header = new StringBuilder(String.format(Locale.ROOT, "%-12s %9s", "origin", "model"));
    for (String name : names) {
      header.append(String.format(Locale.ROOT, " %22s", ReportAssembler.label(name)));
    }
    out.println("WRMSSE by origin (lower is better)");
    out.println(header);
    for (BacktestResult.OriginResult origin : result.origins()) {
      StringBuilder line = new StringBuilder(String.format(Locale.ROOT, "%-12s %9.4f", origin.originDate(),
          origin.model().wrmsse()));
      for (String name : names) {
        line.append(String.format(Locale.ROOT, " %22.4f", origin.baselines().get(name).wrmsse()));
      }
      out.println(line);
    }
    StringBuilder mean = new StringBuilder(String.format(Locale.ROOT, "%-12s %9.4f", "mean", result.meanModelWrmsse()));
    for (Map.Entry<String, Double> baseline : result.meanBaselineWrmsse().entrySet()) {
      mean.append(String.format(Locale.ROOT, " %22.4f", baseline.getValue()));
    }
    out.println(mean);
    out.printf(Locale.ROOT, "model WRMSSE %.4f ± %.4f over %d origins; skill against seasonal naive %.3f, against "
        + "ETS %.3f (model / baseline, lower is better)%n", result.meanModelWrmsse(), result.stdModelWrmsse(),
        result.origins().size(), result.skillRatioAgainstSeasonalNaive(), result.skillRatioAgainst(BaselineKind.ETS));
    if (result.meanModelWspl() != null) {
      out.printf(Locale.ROOT, "interval WSPL %.4f (negative binomial, estimated dispersion) vs %.4f (Poisson)%n",
          result.meanModelWspl(), result.meanPoissonWspl());
    }
  }
}
