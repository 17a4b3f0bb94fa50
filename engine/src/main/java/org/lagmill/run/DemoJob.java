package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.function.Consumer;
import org.lagmill.eval.BacktestResult;
import org.lagmill.eval.Hierarchy;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.forecast.CountQuantiles;
import org.lagmill.forecast.ForecastFileWriter;
import org.lagmill.forecast.ForecastTable;
import org.lagmill.forecast.Forecaster;
import org.lagmill.forecast.HorizonCoverage;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.PlanSource;
import org.lagmill.ingest.SalesInputs;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.io.Setting;
import org.lagmill.learner.DatasetParameters;
import org.lagmill.learner.Objective;
import org.lagmill.learner.TrainParameters;
import org.lagmill.progress.ProgressListener;
import org.lagmill.report.DriverChartBuilder;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.report.SeriesChartBuilder;
import org.lagmill.scenario.ScenarioGenerator;
import org.lagmill.scenario.ScenarioSpec;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.TrainingPlan;

/**
 * The whole job on the built-in invented scenario, as the {@code demo} command runs it: generate, ingest, backtest
 * against the baselines (the last four weeks withheld as a final check), train on the full history, forecast four
 * weeks with intervals, write the report. Every step is one stage of {@link #run}, in order.
 */
public final class DemoJob {
  /** Demo sizes: series and days of history. */
  public enum Size {
    SMALL(300, 730),
    MEDIUM(3000, 1095),
    LARGE(10000, 1460);

    public final int seriesCount;
    public final int dayCount;

    Size(int seriesCount, int dayCount) {
      this.seriesCount = seriesCount;
      this.dayCount = dayCount;
    }
  }

  public static final int HORIZON_DAYS = 28;
  public static final int BACKTEST_ORIGINS = 2;

  private DemoJob() {}

  /**
   * What to run.
   *
   * @param outDir folder for the data, store, model, forecast, report and run.json
   * @param seed the scenario's seed
   * @param commandLine shown in the report
   */
  public record Request(Path outDir, Size size, long seed, String commandLine) {}

  /**
   * What the demo found and wrote.
   *
   * @param backtest the backtest origins and, last, the withheld final weeks
   * @param storeManifest the ingested store's manifest, with its fill counts (closed outlet days among them)
   * @param elapsedSeconds the whole run's wall time
   */
  public record Outcome(BacktestResult backtest, StoreManifest storeManifest, Path reportHtml, Path forecastFile,
      double elapsedSeconds) {}

  /**
   * Runs the demo.
   *
   * @param warnings receives each warning (engine text with setting mentions) as it arises
   */
  public static Outcome run(Request request, ProgressListener progress, Consumer<String> warnings)
      throws IOException {
    Size size = request.size();
    Path outDir = request.outDir();
    Path data = outDir.resolve("data");
    Path storeDir = outDir.resolve("store");
    Path reportDir = outDir.resolve("report");
    Path forecastFile = outDir.resolve("forecast.csv");
    Files.createDirectories(outDir);
    long itemDays = (long) size.seriesCount * size.dayCount;
    try (Run run = Run.unlimited("demo")) {
      try (Stage stage = run.stage("generate")) {
        // The generator writes CSV from heap arrays and reserves no off-heap bytes, so its stage records 0 truly.
        ScenarioGenerator.write(new ScenarioSpec(size.seriesCount, size.dayCount, ScenarioSpec.DEFAULT_START_DATE,
            request.seed(), ScenarioSpec.DEFAULT_FUTURE_DAY_COUNT, false), data);
        stage.addRows(itemDays);
      }
      try (Stage stage = run.stage("ingest")) {
        StoreIngest.ingest(IngestOptions.of(SalesInputs.of(data.resolve(ScenarioGenerator.SALES_FILE))
            .with(SideFile.CALENDAR, data.resolve(ScenarioGenerator.CALENDAR_FILE))
            .with(SideFile.PRICES, data.resolve(ScenarioGenerator.PRICES_FILE))
            .withPlan(PlanSource.of(data.resolve(ScenarioGenerator.PLAN_FILE)))
            .with(SideFile.CLOSURES, data.resolve(ScenarioGenerator.CLOSURES_FILE)), storeDir), stage.budget());
        stage.addRows(itemDays);
      }
      ReportData.Builder report = RunReport
          .start(Setting.shown(Setting.Command.DEMO.toString()) + ": Marrowgate & Tillbox, " + size.name()
              .toLowerCase(Locale.ROOT) + " scenario", request.commandLine(), storeDir.toString());
      BacktestRun backtest;
      double[][] point;
      float[] dispersion;
      StoreManifest storeManifest;
      try (SalesStore store = SalesStore.open(storeDir, run.budget().child("store"))) {
        // Closed outlet days (the closures file) are unknown: no training rows, not scored, 0 in the forecast.
        storeManifest = store.manifest();
        report.data(ReportAssembler.dataSummary(StoreSummary.of(store)));
        FeatureSpec spec = spec();
        TrainingPlan plan = new TrainingPlan(spec, trainParameters(), DatasetParameters.defaults(),
            store.dayCount() - 1, HORIZON_DAYS, null, false, TrainingPlan.REFIT_BY_DEFAULT);
        FeatureSpecYaml.write(spec, outDir.resolve("features.yaml"));
        run.record().configure("size", size.name()).configure("seriesCount", size.seriesCount)
            .configure("dayCount", size.dayCount).configure("seed", request.seed()).configure("plan", plan.toString());
        Hierarchy hierarchy = hierarchy();
        // One origin more than the backtest: the last one forecasts the final four weeks, which the backtest's
        // origins never see, as a check that backtest scores predict the score on new days.
        try (Stage stage = run.stage("backtest")) {
          backtest = BacktestRun.run(store, plan, BACKTEST_ORIGINS + 1, HORIZON_DAYS, hierarchy, stage.budget(),
              progress);
          stage.addRows(backtest.result().origins().stream().flatMap(o -> o.partitions().stream())
              .mapToLong(p -> p.trainingRowCount()).sum());
        }
        Stage trainStage = run.stage("train");
        try (ModelSet models = ModelTraining.train(store, plan, trainStage.budget(), progress)) {
          ModelDirectory.save(models, outDir.resolve("model"), store, plan, store.fingerprint());
          trainStage.addRows(models.partitions().stream().mapToLong(p -> p.report().trainingRowCount()).sum())
              .close();
          report.training(ReportAssembler.training(models.partitions().stream().map(p -> p.report()).toList()));
          try (Stage stage = run.stage("forecast")) {
            // The generated plan reaches the last future day, so it covers the horizon; the check says so if not.
            HorizonCoverage.check(store, models.spec(), HORIZON_DAYS).warnings().forEach(warnings);
            point = Forecaster.forecast(models, store, HORIZON_DAYS, stage.budget());
            dispersion = models.dispersionBySeries();
            ForecastTable table = new ForecastTable(store.dayCount(), point, ForecastTable.publishedQuantiles(),
                CountQuantiles.quantiles(point, dispersion, ForecastTable.publishedQuantiles()));
            long closedSeriesDays = table.zeroClosedDays(store);
            if (closedSeriesDays > 0) {
              warnings.accept(ForecastTable.closedDaysNote(closedSeriesDays));
            }
            ForecastFileWriter.writeLong(table, store, forecastFile);
            stage.addRows((long) point.length * HORIZON_DAYS);
          }
          try (Stage stage = run.stage("explain")) {
            DriverChartBuilder.build(store, hierarchy.bind(store), models, HORIZON_DAYS, List.of(),
                SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, stage.budget()).forEach(report::driver);
          }
        } finally {
          trainStage.close();
        }
        backtest.addTo(report, store, List.of());
        report.clearSeries();
        SeriesChartBuilder.build(store, hierarchy.bind(store), store.dayCount(), point, dispersion,
            SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, List.of()).forEach(report::series);
      }
      RunReport.addStages(report, run.record(), backtest.lastPartitions().get(0).datasetBytesPerRow());
      Path html = RunReport.write(report.build(), reportDir);
      run.record().result("backtest", backtest.result());
      run.record().write(outDir);
      return new Outcome(backtest.result(), storeManifest, html, forecastFile, run.record().elapsedSeconds());
    }
  }

  /** The demo's features, the same as docs/examples/recursive-short-lags.yaml. */
  public static FeatureSpec spec() {
    // Recursive with short lags: the demo chain's demand level wanders, and lags of a few days follow it where lags
    // of four weeks cannot (docs/benchmarks.md compares both on the same origins). The same spec is
    // docs/examples/recursive-short-lags.yaml, and each demo run writes it to features.yaml.
    return FeatureSpec.defaults().toBuilder().strategy(FeatureSpec.Strategy.RECURSIVE)
        .lagDays(1, 2, 3, 4, 5, 6, 7, 14, 21, 28, 35).rollingWindowDays(7, 28, 56).rollingShiftDays(1)
        .horizonDays(HORIZON_DAYS).build();
  }

  /**
   * The demo's scored levels: the store side (banner, format, outlet) and the article side (section, family, article)
   * each on their own, the crossings a planner reads (section by banner and by outlet, family by outlet), articles by
   * banner (where prices and promotions are set) and the single series. Banner, format and district cross, so no
   * single chain covers them; the list is explicit.
   */
  public static Hierarchy hierarchy() {
    return Hierarchy.ofLevels(List.of(List.of(), List.of("banner"), List.of("format"), List.of("outlet"),
        List.of("section"), List.of("family"), List.of("banner", "section"), List.of("outlet", "section"),
        List.of("outlet", "family"), List.of("article"), List.of("article", "banner"), List.of("article", "outlet")));
  }

  /** The demo's boosting settings. */
  public static TrainParameters trainParameters() {
    // Tuned for a five-minute demo on two cores: fewer, larger steps and subsampled rows and features per tree.
    return TrainParameters.defaults().withObjective(Objective.TWEEDIE).withLearningRate(0.15).withLeafCount(63)
        .withFractions(0.6, 0.6).withRounds(200, 15);
  }
}
