package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.Function;
import org.lagmill.eval.AggregateTable;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.eval.Evaluator;
import org.lagmill.eval.Hierarchy;
import org.lagmill.eval.OriginStatistics;
import org.lagmill.eval.QuantileForecasts;
import org.lagmill.eval.RollingOriginBacktest;
import org.lagmill.eval.ScoringPart;
import org.lagmill.forecast.ForecastFileReader;
import org.lagmill.forecast.ForecastTable;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;
import org.lagmill.store.TruncatedHistory;

/**
 * The score of a forecast file against the actuals a store holds, as the {@code evaluate} command runs it: WRMSSE per
 * level beside the baselines forecast from the same origin; optionally the report and this store's scoring part.
 */
public final class EvaluateJob {
  private EvaluateJob() {}

  /**
   * What to score.
   *
   * @param reportDir folder for the report, or null for none
   * @param scoringPartFile where to write this store's additive share of the score, or null for none
   * @param hierarchyOf the levels to score, once the store is open
   * @param commandLine shown in the report
   */
  public record Request(Path storeDir, Path forecastFile, Path reportDir, Path scoringPartFile,
      Function<SalesHistory, Hierarchy> hierarchyOf, String commandLine) {}

  /**
   * What the score is.
   *
   * @param baselineWrmsse each baseline's WRMSSE by its label, in the order they were scored
   * @param firstDate the forecast's first date
   * @param lastDate the forecast's last date
   * @param reportHtml the report page, or null when no report was asked for
   */
  public record Outcome(EvaluationResult result, Map<String, Double> baselineWrmsse, StoreManifest manifest,
      Path forecastFile, LocalDate firstDate, LocalDate lastDate, int horizonPeriods, int periodDays,
      Path reportHtml) {}

  public static Outcome run(Request request) throws IOException {
    try (Run run = Run.unlimited("evaluate");
        SalesStore opened = SalesStore.open(request.storeDir(), run.budget().child("store"))) {
      ForecastTable table = ForecastFileReader.read(request.forecastFile(), opened);
      int origin = table.firstDayIndex();
      int lastDay = origin + table.horizonDays() - 1;
      if (origin < 1 || lastDay >= opened.dayCount()) {
        throw new InvalidRequestException("the forecast covers " + opened.dateOf(origin) + " .. "
            + opened.dateOf(lastDay) + " but the store holds actuals for " + opened.firstDate() + " .. "
            + opened.dateOf(opened.dayCount() - 1) + "; append the actuals first (" + Setting.Command.APPEND + ")");
      }
      Evaluator evaluator = new Evaluator(opened, request.hierarchyOf().apply(opened), table.horizonDays());
      OriginStatistics statistics = evaluator.statistics(origin);
      // Closed or unknown actuals leave both sides of every aggregate.
      double[][][] knownQuantiles = new double[table.quantiles().length][][];
      for (int q = 0; q < knownQuantiles.length; q++) {
        knownQuantiles[q] = evaluator.withoutUnknownActuals(table.quantiles()[q], origin);
      }
      QuantileForecasts quantiles = table.quantileLevels().length == 0 ? null
          : QuantileForecasts.bottomUp(evaluator.aggregator(), table.quantileLevels(), knownQuantiles);
      AggregateTable aggregated = evaluator.aggregator()
          .aggregateForecasts(evaluator.withoutUnknownActuals(table.point(), origin));
      EvaluationResult result = evaluator.evaluate(statistics, aggregated, quantiles);
      if (request.scoringPartFile() != null) {
        StoreManifest manifest = opened.manifest();
        ScoringPart.build(opened, evaluator, origin, aggregated, quantiles, manifest.shard(),
            manifest.nesting() != null ? manifest.nesting() : opened.nesting().parents())
            .write(request.scoringPartFile());
      }
      Map<String, Double> baselines = new LinkedHashMap<>();
      Map<String, EvaluationResult> baselineResults = RollingOriginBacktest.scoreBaselines(
          new TruncatedHistory(opened, origin), BacktestRun.DEFAULT_BASELINES, table.horizonDays(), evaluator,
          statistics);
      baselineResults.forEach((kind, score) -> baselines.put(ReportAssembler.label(kind), score.wrmsse()));
      Path html = null;
      if (request.reportDir() != null) {
        ReportData.Builder report = RunReport.start(Setting.shown(Setting.Command.EVALUATE.toString()),
            request.commandLine(),
            request.storeDir().toString());
        report.data(ReportAssembler.dataSummary(StoreSummary.of(opened)))
            .accuracy(ReportAssembler.accuracy(result, baselineResults, opened.dateOf(origin)))
            .horizon(ReportAssembler.horizon(result, baselineResults));
        html = RunReport.write(report.build(), request.reportDir());
      }
      return new Outcome(result, baselines, opened.manifest(), request.forecastFile(), opened.dateOf(origin),
          opened.dateOf(lastDay), table.horizonDays(), opened.periodDays(), html);
    }
  }
}
