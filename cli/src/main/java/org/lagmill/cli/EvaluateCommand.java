package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.lagmill.eval.AggregateTable;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.eval.Evaluator;
import org.lagmill.eval.OriginStatistics;
import org.lagmill.eval.QuantileForecasts;
import org.lagmill.eval.RollingOriginBacktest;
import org.lagmill.eval.ScoringPart;
import org.lagmill.forecast.ForecastFileReader;
import org.lagmill.forecast.ForecastTable;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.store.StoreSummary;
import org.lagmill.store.Periods;
import org.lagmill.run.BacktestRun;
import org.lagmill.run.Run;
import org.lagmill.run.RunRecord;
import org.lagmill.run.RunReport;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.TruncatedHistory;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill evaluate}: scores a forecast file against the actuals the store holds for its days. */
@Command(name = "evaluate", header = "Score a forecast file against the actuals held in a store.",
    mixinStandardHelpOptions = true,
    description = {"Score a forecast file (long form: attributes or series_id, date, forecast, optional q… columns)",
        "against the store's actuals: WRMSSE and the per-level table, beside the baselines from the same origin."},
    footer = {"", "Example:", "  lagmill evaluate --store stores/chain --forecast week45.csv.gz --json"})
final class EvaluateCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store holding the actuals")
  Path store;

  @Option(names = "--forecast", required = true, paramLabel = "FILE", description = "forecast CSV (.gz allowed)")
  Path forecast;

  @Option(names = "--json", description = "print the result as JSON")
  boolean json;

  @Option(names = "--report", paramLabel = "DIR", description = "also write report.html and report.json here")
  Path reportDir;

  @Option(names = "--scoring-part", paramLabel = "FILE", description = {"also write this store's additive share of",
      "the score (for a shard: merge every shard's part with lagmill merge-scores)"})
  Path scoringPart;

  @Mixin
  HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = commandSpec.commandLine().getOut();
    try (Run run = Run.unlimited("evaluate"); SalesStore opened = SalesStore.open(store, run.budget().child("store"))) {
      ForecastTable table = ForecastFileReader.read(forecast, opened);
      int origin = table.firstDayIndex();
      int lastDay = origin + table.horizonDays() - 1;
      if (origin < 1 || lastDay >= opened.dayCount()) {
        throw new InvalidRequestException("the forecast covers " + opened.dateOf(origin) + " .. "
            + opened.dateOf(lastDay) + " but the store holds actuals for " + opened.firstDate() + " .. "
            + opened.dateOf(opened.dayCount() - 1) + "; append the actuals first (lagmill append)");
      }
      Evaluator evaluator = new Evaluator(opened, hierarchyOptions.hierarchy(opened), table.horizonDays());
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
      if (scoringPart != null) {
        StoreManifest manifest = opened.manifest();
        ScoringPart.build(opened, evaluator, origin, aggregated, quantiles, manifest.shard(),
            manifest.nesting() != null ? manifest.nesting() : opened.nesting().parents()).write(scoringPart);
      }
      Map<String, Double> baselines = new LinkedHashMap<>();
      Map<String, EvaluationResult> baselineResults = RollingOriginBacktest.scoreBaselines(
          new TruncatedHistory(opened, origin), BacktestRun.DEFAULT_BASELINES, table.horizonDays(), evaluator,
          statistics);
      baselineResults.forEach((kind, score) -> baselines.put(ReportAssembler.label(kind), score.wrmsse()));
      if (reportDir != null) {
        ReportData.Builder report = RunReport.start("lagmill evaluate", "lagmill evaluate --store " + store
            + " --forecast " + forecast, store.toString());
        report.data(ReportAssembler.dataSummary(StoreSummary.of(opened)))
            .accuracy(ReportAssembler.accuracy(result, baselineResults, opened.dateOf(origin)))
            .horizon(ReportAssembler.horizon(result, baselineResults));
        Path html = RunReport.write(report.build(), reportDir);
        if (!json) {
          out.println("report written to " + html);
        }
      }
      if (json) {
        Map<String, Object> document = new LinkedHashMap<>();
        document.put("forecast", result);
        document.put("baselineWrmsse", baselines);
        document.put("fill", opened.manifest().fill());
        out.println(RunRecord.JSON.writeValueAsString(document));
        return ExitCodes.OK;
      }
      out.printf(Locale.ROOT, "forecast %s, %s .. %s, %s%n", forecast, opened.dateOf(origin),
          opened.dateOf(lastDay), Periods.count(table.horizonDays(), opened.periodDays()));
      printLevels(out, result);
      baselines
          .forEach((name, value) -> out.printf(Locale.ROOT, "  baseline %-24s WRMSSE %.4f  (model / baseline %.3f)%n",
              name, value, result.wrmsse() / value));
      ScoredLevels.print(out, result, opened.manifest());
    }
    return ExitCodes.OK;
  }

  /** The per-level table and the WRMSSE line, as evaluate and merge-scores print them. */
  static void printLevels(PrintWriter out, EvaluationResult result) {
    out.printf(Locale.ROOT, "%-40s %6s %10s %10s %10s%n", "level", "series", "RMSSE", "MAE", "bias");
    for (EvaluationResult.LevelResult level : result.levels()) {
      out.printf(Locale.ROOT, "%-40s %6d %10.4f %10.3f %10.3f%n", level.name(), level.aggregateCount(),
          level.weightedRmsse(), level.mae(), level.bias());
    }
    out.printf(Locale.ROOT, "WRMSSE %.4f%s%n", result.wrmsse(), result.wspl() == null ? ""
        : String.format(Locale.ROOT, ", WSPL %.4f (aggregate quantiles summed from the series' quantiles)",
            result.wspl()));
  }
}
