package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
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
import org.lagmill.ingest.StoreIngest;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.learner.DatasetParameters;
import org.lagmill.learner.Objective;
import org.lagmill.learner.TrainParameters;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.progress.ProgressListener;
import org.lagmill.report.DriverChartBuilder;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.report.SeriesChartBuilder;
import org.lagmill.run.BacktestRun;
import org.lagmill.run.Run;
import org.lagmill.run.RunRecord;
import org.lagmill.run.RunReport;
import org.lagmill.run.Stage;
import org.lagmill.scenario.ScenarioGenerator;
import org.lagmill.scenario.ScenarioSpec;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreSummary;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.TrainingPlan;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code lagmill demo}: the whole job on the built-in invented scenario: generate, ingest, backtest against the
 * baselines (the last four weeks withheld as a final check), train on the full history, forecast four weeks with
 * intervals, write the report.
 */
@Command(name = "demo",
    header = "Run the whole job on built-in demo data, from invented history to forecast and report.",
    mixinStandardHelpOptions = true,
    description = {"Run the whole job on built-in demo data: generate an invented chain's history, ingest it, backtest",
        "against baselines, train on the full history, forecast 28 days with intervals and write the report."},
    footer = {"", "Example:", "  lagmill demo --out demo-run --size small"})
final class DemoCommand implements Callable<Integer> {
  /** Demo sizes: series and days of history. */
  enum Size {
    SMALL(300, 730), MEDIUM(3000, 1095), LARGE(10000, 1460);

    final int seriesCount;
    final int dayCount;

    Size(int seriesCount, int dayCount) {
      this.seriesCount = seriesCount;
      this.dayCount = dayCount;
    }
  }

  static final int HORIZON_DAYS = 28;
  static final int BACKTEST_ORIGINS = 2;

  @Spec
  CommandSpec commandSpec;

  @Option(names = "--out", paramLabel = "DIR", defaultValue = "demo-run", description = "output folder (default: "
      + "${DEFAULT-VALUE})")
  Path outDir;

  @Option(names = "--size", paramLabel = "SIZE", defaultValue = "medium", description = "small (300 series x 2 "
      + "years), medium (3,000 x 3 years) or large (10,000 x 4 years) (default: ${DEFAULT-VALUE})")
  String size;

  @Option(names = "--seed", paramLabel = "N", defaultValue = "42", description = "scenario seed (default: "
      + "${DEFAULT-VALUE})")
  long seed;

  @Option(names = "--quiet", description = "print only the summary")
  boolean quiet;

  @Override
  public Integer call() throws Exception {
    Size chosen = parseSize(size);
    ProgressListener progress = ConsoleProgress.forCommand(quiet);
    PrintWriter out = commandSpec.commandLine().getOut();
    Path data = outDir.resolve("data");
    Path storeDir = outDir.resolve("store");
    Path reportDir = outDir.resolve("report");
    Path forecastFile = outDir.resolve("forecast.csv");
    Files.createDirectories(outDir);
    long itemDays = (long) chosen.seriesCount * chosen.dayCount;
    try (Run run = Run.unlimited("demo")) {
      try (Stage stage = run.stage("generate")) {
        // The generator writes CSV from heap arrays and reserves no off-heap bytes, so its stage records 0 truly.
        ScenarioGenerator.write(new ScenarioSpec(chosen.seriesCount, chosen.dayCount, ScenarioSpec.DEFAULT_START_DATE,
            seed, ScenarioSpec.DEFAULT_FUTURE_DAY_COUNT, false), data);
        stage.addRows(itemDays);
      }
      try (Stage stage = run.stage("ingest")) {
        StoreIngest.ingest(IngestOptions.of(data.resolve(ScenarioGenerator.SALES_FILE), storeDir)
            .withCalendarFile(data.resolve(ScenarioGenerator.CALENDAR_FILE))
            .withPricesFile(data.resolve(ScenarioGenerator.PRICES_FILE))
            .withPlan(PlanSource.of(data.resolve(ScenarioGenerator.PLAN_FILE))), stage.budget());
        stage.addRows(itemDays);
      }
      // The demo does not ingest closures yet: it scores closed outlet days as zero sales. Say so rather than drop the
      // file silently. The promotion plan is ingested: its columns become plan_<column> features.
      commandSpec.commandLine().getErr().println("warning: the demo data's " + ScenarioGenerator.CLOSURES_FILE
          + " is not ingested by the demo; closed outlet days count as zero sales");
      ReportData.Builder report = RunReport.start("lagmill demo: Marrowgate & Tillbox, " + chosen.name()
          .toLowerCase(Locale.ROOT) + " scenario", "lagmill demo --size " + size, storeDir.toString());
      BacktestRun backtest;
      double[][] point;
      float[] dispersion;
      try (SalesStore store = SalesStore.open(storeDir, run.budget().child("store"))) {
        report.data(ReportAssembler.dataSummary(StoreSummary.of(store)));
        FeatureSpec spec = demoSpec();
        TrainingPlan plan = new TrainingPlan(spec, demoTrainParameters(), DatasetParameters.defaults(),
            store.dayCount() - 1, HORIZON_DAYS, null, false, true);
        FeatureSpecYaml.write(spec, outDir.resolve("features.yaml"));
        run.record().configure("size", chosen.name()).configure("seriesCount", chosen.seriesCount)
            .configure("dayCount", chosen.dayCount).configure("seed", seed).configure("plan", plan.toString());
        Hierarchy hierarchy = demoHierarchy();
        // One origin more than the backtest: the last one forecasts the final four weeks, which the backtest's
        // origins never see, as a check that backtest scores predict the score on new days.
        try (Stage stage = run.stage("backtest")) {
          backtest = BacktestRun.run(store, plan, BACKTEST_ORIGINS + 1, HORIZON_DAYS, hierarchy, stage.budget(),
              progress);
          stage.addRows(rowCount(backtest));
        }
        Stage trainStage = run.stage("train");
        try (ModelSet models = ModelTraining.train(store, plan, trainStage.budget(), progress)) {
          ModelDirectory.save(models, outDir.resolve("model"), store, plan, store.fingerprint());
          trainStage.addRows(models.partitions().stream().mapToLong(p -> p.report().trainingRowCount()).sum())
              .close();
          report.training(ReportAssembler.training(models.partitions().stream().map(p -> p.report()).toList()));
          try (Stage stage = run.stage("forecast")) {
            // The generated plan reaches the last future day, so it covers the horizon; the check says so if not.
            HorizonCoverage.check(store, models.spec(), HORIZON_DAYS).warnings()
                .forEach(w -> commandSpec.commandLine().getErr().println("warning: " + w));
            point = Forecaster.forecast(models, store, HORIZON_DAYS, stage.budget());
            dispersion = models.dispersionBySeries();
            ForecastTable table = new ForecastTable(store.dayCount(), point, ForecastTable.publishedQuantiles(),
                CountQuantiles.quantiles(point, dispersion, ForecastTable.publishedQuantiles()));
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
      printSummary(out, backtest.result(), html, forecastFile, run.record());
    }
    return ExitCodes.OK;
  }

  static FeatureSpec demoSpec() {
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
  static Hierarchy demoHierarchy() {
    return Hierarchy.ofLevels(List.of(List.of(), List.of("banner"), List.of("format"), List.of("outlet"),
        List.of("section"), List.of("family"), List.of("banner", "section"), List.of("outlet", "section"),
        List.of("outlet", "family"), List.of("article"), List.of("article", "banner"), List.of("article", "outlet")));
  }

  static TrainParameters demoTrainParameters() {
    // Tuned for a five-minute demo on two cores: fewer, larger steps and subsampled rows and features per tree.
    return TrainParameters.defaults().withObjective(Objective.TWEEDIE).withLearningRate(0.15).withLeafCount(63)
        .withFractions(0.6, 0.6).withRounds(200, 15);
  }

  private static long rowCount(BacktestRun backtest) {
    return backtest.result().origins().stream().flatMap(o -> o.partitions().stream())
        .mapToLong(p -> p.trainingRowCount()).sum();
  }

  private static Size parseSize(String text) {
    try {
      return Size.valueOf(text.toUpperCase(Locale.ROOT));
    } catch (IllegalArgumentException e) {
      throw new InvalidRequestException("--size must be small, medium or large, got '" + text + "'");
    }
  }

  private static void printSummary(PrintWriter out, BacktestResult result, Path html, Path forecastFile,
      RunRecord run) {
    List<BacktestResult.OriginResult> origins = result.origins();
    double backtestMean = 0;
    for (int k = 0; k < BACKTEST_ORIGINS; k++) {
      backtestMean += origins.get(k).model().wrmsse() / BACKTEST_ORIGINS;
    }
    BacktestResult.OriginResult withheld = origins.get(origins.size() - 1);
    out.println();
    out.println("lagmill demo: " + origins.size() + " forecast origins scored against baselines (WRMSSE, lower is "
        + "better)");
    out.printf(Locale.ROOT, "  model                  %.4f  (backtest origins %s: %.4f; withheld last 28 days from %s: "
        + "%.4f)%n", result.meanModelWrmsse(), origins.get(0).originDate() + ", " + origins.get(1).originDate(),
        backtestMean, withheld.originDate(), withheld.model().wrmsse());
    result.meanBaselineWrmsse().forEach((name, value) -> out.printf(Locale.ROOT, "  %-22s %.4f%n",
        ReportAssembler.label(name), value));
    out.printf(Locale.ROOT, "  skill vs seasonal naive %.3f (model / seasonal naive), vs ETS %.3f (model / ETS)%n",
        result.skillRatioAgainstSeasonalNaive(), result.skillRatioAgainst(org.lagmill.eval.BaselineKind.ETS));
    if (result.meanModelWspl() != null) {
      out.printf(Locale.ROOT, "  interval WSPL %.4f (Poisson intervals would score %.4f)%n", result.meanModelWspl(),
          result.meanPoissonWspl());
    }
    out.printf(Locale.ROOT, "peak memory %,d MB, %.0f s in all%n", ProcessMemory.peakResidentBytes() >> 20,
        run.elapsedSeconds());
    out.println("report:   " + html);
    out.println("forecast: " + forecastFile + " (28 days with quantiles q0.005 .. q0.995)");
    out.println("Forecasts are estimates for a planner to review, never automatic orders.");
  }
}
