package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Consumer;
import java.util.function.Function;
import org.lagmill.eval.Hierarchy;
import org.lagmill.features.FeatureSpec;
import org.lagmill.eval.Level;
import org.lagmill.forecast.CountQuantiles;
import org.lagmill.forecast.ForecastFileWriter;
import org.lagmill.forecast.ForecastTable;
import org.lagmill.forecast.Forecaster;
import org.lagmill.forecast.HorizonCoverage;
import org.lagmill.ingest.DateWindow;
import org.lagmill.forecast.MemberAverage;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.PathNames;
import org.lagmill.io.Setting;
import org.lagmill.report.DriverChartBuilder;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.report.ReportJson;
import org.lagmill.report.SeriesChartBuilder;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.SeriesSelection;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;
import org.lagmill.training.ModelCombination;
import org.lagmill.training.ModelManifest;
import org.lagmill.training.ModelSet;

/**
 * The forecast of a store with a trained model, as the {@code forecast} command runs it: open both, forecast every
 * (or the chosen) series over the horizon, write the forecast file, and either the report and {@code run.json} into
 * the report folder or the record beside the forecast file ({@code <file>.run.json}).
 */
public final class ForecastJob {
  private ForecastJob() {}

  /**
   * What to forecast.
   *
   * @param horizonPeriods periods to forecast, or null for the model's horizon
   * @param intervals whether to add the published quantile columns
   * @param wide one row per series and one column per date instead of the long form
   * @param reportDir folder for the report and run.json, or null for none
   * @param backtestDir a backtest's report folder whose accuracy the report shows, or null
   * @param chosenSeriesIds series to forecast by id (empty: no choice by id)
   * @param conditions {@code attribute=value} conditions the forecast series meet (empty: none)
   * @param planCarryForward carry the plan's last values past its end instead of refusing
   * @param hierarchyOf the report's levels, once the store is open
   * @param commandLine shown in the report
   */
  public record Request(Path storeDir, Path modelDir, Integer horizonPeriods, Path forecastFile, boolean intervals,
      boolean wide, Path reportDir, Path backtestDir, List<String> shownSeries, List<String> chosenSeriesIds,
      List<String> conditions, boolean planCarryForward, Function<SalesHistory, Hierarchy> hierarchyOf,
      String commandLine) {}

  /**
   * What was forecast.
   *
   * @param seriesCount series in the forecast file
   * @param firstDate the first forecast period's date
   * @param lastDate the last forecast period's date
   * @param reportHtml the report page, or null when no report was asked for
   */
  public record Outcome(int seriesCount, int horizonPeriods, int periodDays, LocalDate firstDate, LocalDate lastDate,
      Path forecastFile, Path reportHtml) {}

  /**
   * Runs the forecast.
   *
   * @param warnings receives each warning (engine text with setting mentions) as it arises
   */
  public static Outcome run(Request request, Consumer<String> warnings) throws IOException {
    Path out = request.forecastFile();
    try (Run run = Run.unlimited("forecast");
        Stage opening = run.stage("open");
        SalesStore opened = SalesStore.open(request.storeDir(), run.budget().child("store"));
        ModelCombination.Opened models = ModelCombination.open(request.modelDir(), opened)) {
      ModelManifest manifest = models.manifests().get(0);
      FeatureSpec firstSpec = models.models().get(0).spec();
      int horizon = request.horizonPeriods() == null ? firstSpec.horizonDays() : request.horizonPeriods();
      DateWindow.requireHorizonWithin(opened.dateOf(opened.dayCount()), opened.periodDays(), horizon);
      // Members may read different plan columns: each is checked, and a warning said once.
      HorizonCoverage coverage = null;
      Set<String> coverageWarnings = new LinkedHashSet<>();
      for (ModelSet member : models.models()) {
        HorizonCoverage memberCoverage = HorizonCoverage.check(opened, member.spec(), horizon,
            request.planCarryForward());
        coverageWarnings.addAll(memberCoverage.warnings());
        if (coverage == null || memberCoverage.planCarriedSeriesPeriods() > coverage.planCarriedSeriesPeriods()) {
          coverage = memberCoverage;
        }
      }
      run.record().result("planCarriedSeriesPeriods", coverage.planCarriedSeriesPeriods());
      coverageWarnings.forEach(warnings);
      if (models.combined()) {
        run.record().configure("members", models.members().stream().map(ModelCombination.Member::name).toList());
      }
      StoreManifest.Shard shard = opened.manifest().shard();
      // A model trained over every shard records the fingerprint of the store they were split from.
      boolean sameStore = manifest.storeFingerprint().equals(opened.fingerprint())
          || shard != null && manifest.storeFingerprint().equals(shard.sourceFingerprint());
      if (!sameStore) {
        warnings.accept("the model was trained on another version of the store (fingerprint "
            + manifest.storeFingerprint() + ", this store " + opened.fingerprint() + "); retrain after a refresh");
      }
      int[] chosen = SeriesSelection.select(opened, request.chosenSeriesIds(), request.conditions());
      if (chosen != null && request.reportDir() != null) {
        throw new InvalidRequestException(Setting.REPORT + " charts the aggregates of every level, which need every "
            + "series; drop " + Setting.CHOSEN_SERIES + "/" + Setting.SERIES_CONDITION + " to get a report, or drop "
            + Setting.REPORT + " to forecast a subset");
      }
      if (chosen != null && chosen.length == 0) {
        throw new InvalidRequestException("no series meets every " + Setting.SERIES_CONDITION + " condition "
            + request.conditions() + "; list the store's series with " + Setting.Command.SERIES + " " + Setting.STORE
            + " " + request.storeDir());
      }
      opening.close();
      double[][] point;
      float[] dispersion;
      ForecastTable table;
      int forecastSeriesCount;
      try (Stage stage = run.stage("forecast")) {
        List<double[][]> memberPoints = new ArrayList<>();
        for (ModelSet member : models.models()) {
          memberPoints.add(Forecaster.forecast(member, opened, horizon, stage.budget(), chosen));
        }
        point = MemberAverage.point(memberPoints);
        dispersion = MemberAverage.dispersion(models.models().stream().map(ModelSet::dispersionBySeries).toList());
        forecastSeriesCount = chosen == null ? point.length : chosen.length;
        double[] levels = request.intervals() ? ForecastTable.publishedQuantiles() : new double[0];
        table = new ForecastTable(opened.dayCount(), point, levels, request.intervals()
            ? CountQuantiles.quantiles(point, dispersion, levels) : new double[0][][]);
        stage.addRows((long) forecastSeriesCount * horizon);
      }
      long closedSeriesDays = table.zeroClosedDays(opened);
      if (closedSeriesDays > 0) {
        warnings.accept(ForecastTable.closedDaysNote(closedSeriesDays));
      }
      run.record().result("closedSeriesDays", closedSeriesDays).result("fill", opened.manifest().fill());
      try (Stage stage = run.stage("write")) {
        if (request.wide()) {
          ForecastFileWriter.writeWide(table, opened, out);
        } else {
          ForecastFileWriter.writeLong(table, opened, out);
        }
      }
      run.record().configure("store", request.storeDir().toString())
          .configure("model", request.modelDir().toString()).configure("horizonDays", horizon)
          .configure("intervals", request.intervals()).configure("planCarryForward", request.planCarryForward())
          .configure("series", request.chosenSeriesIds()).configure("where", request.conditions())
          .result("seriesCount", forecastSeriesCount).result("forecastFile", out.toString())
          .result("firstDate", opened.dateOf(opened.dayCount()).toString())
          .result("lastDate", opened.dateOf(opened.dayCount() + horizon - 1).toString());
      Path html = null;
      if (request.reportDir() != null) {
        html = writeReport(request, run, opened, models, coverage, point, dispersion, horizon, warnings);
        run.record().write(request.reportDir());
      } else {
        // Without a report folder the record goes beside the forecast file, so every run leaves one.
        run.record().write(PathNames.parentOf(out.toAbsolutePath()), PathNames.nameOf(out) + ".run.json");
      }
      return new Outcome(forecastSeriesCount, horizon, opened.periodDays(), opened.dateOf(opened.dayCount()),
          opened.dateOf(opened.dayCount() + horizon - 1), out, html);
    }
  }

  private static Path writeReport(Request request, Run run, SalesStore opened, ModelCombination.Opened models,
      HorizonCoverage coverage, double[][] point, float[] dispersion, int horizon, Consumer<String> warnings)
      throws IOException {
    ReportData.Builder report = RunReport.start(Setting.shown(Setting.Command.FORECAST.toString()),
        request.commandLine(),
        request.storeDir().toString());
    if (coverage.planCarriedSeriesPeriods() > 0) {
      report.caution(ReportData.DEFAULT_CAUTION + " The promotion plan ended before the horizon: its last values "
          + "were carried forward for " + coverage.planCarriedSeriesPeriods() + " series-periods.");
    }
    report.data(ReportAssembler.dataSummary(StoreSummary.of(opened)))
        .training(ReportAssembler.training(models.partitions()));
    Path backtestDir = request.backtestDir();
    if (backtestDir != null) {
      ReportData backtest = ReportJson.read(backtestDir.resolve(RunReport.JSON_FILE));
      if (backtest.accuracy() == null) {
        throw new InvalidRequestException(Setting.BACKTEST_REPORT + " " + backtestDir + ": its report.json holds no "
            + "accuracy; give the folder " + Setting.Command.BACKTEST + " " + Setting.REPORT + " wrote");
      }
      report.accuracy(backtest.accuracy()).horizon(backtest.horizon());
      BacktestMatch.warnings(backtest, opened, models.models().get(0).spec().horizonDays()).forEach(warnings);
      run.record().configure("backtest", backtestDir.toString());
    }
    List<Level> scoredLevels = request.hierarchyOf().apply(opened).bind(opened);
    SeriesChartBuilder.build(opened, scoredLevels, opened.dayCount(), point, dispersion,
        SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, request.shownSeries()).forEach(report::series);
    if (models.combined()) {
      // Contributions are additive within one model's raw score, not across an average of several models' outputs.
      warnings.accept("the report's drivers explain the combination's first member (" + models.members().get(0)
          .name() + ") only; the forecast averages all " + models.members().size());
    }
    try (Stage stage = run.stage("explain")) {
      DriverChartBuilder.build(opened, scoredLevels, models.models().get(0), horizon, request.shownSeries(),
          SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, stage.budget()).forEach(report::driver);
    }
    RunReport.addStages(report, run.record(), null);
    return RunReport.write(report.build(), request.reportDir());
  }
}
