package org.lagmill.report;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

/** Reports of an invented chain (regions Northvale, Eastmoor, Southbay) built from a seed, for the report tests. */
final class SampleReports {
  static final List<String> BASELINES = List.of("seasonal naive", "naive", "moving average 28");
  static final LocalDate ORIGIN = LocalDate.of(2024, 5, 26);

  private SampleReports() {}

  /** A report with every part present. */
  static ReportData full(long seed) {
    Random rnd = new Random(seed);
    ReportData.Builder b = ReportData.builder("Northvale Grocers: 28-day forecast, May 2024")
        .run(new RunInfo(Instant.parse("2024-05-27T06:15:00Z"), "0.1.0-SNAPSHOT",
            "lagmill run --store stores/nvg --horizon 28 --origins 4 --out runs/2024-05-27", 2, 2L << 30,
            "stores/nvg"))
        .data(new DataSummary(2_400L, 1_096, LocalDate.of(2021, 5, 27), ORIGIN,
            linked("region", 3L, "store", 8L, "department", 5L, "item", 300L), 0.583, 1.31, 8.0, 2.62));
    b.stage(new StageStats("ingest", 14.2, 310L << 20, 40L << 20, 2_630_400L, 185_239.4, null));
    b.stage(new StageStats("feature pass", 22.8, 420L << 20, 96L << 20, 2_630_400L, 115_368.4, null));
    b.stage(new StageStats("dataset build", 9.6, 640L << 20, 150L << 20, 2_630_400L, 274_000.0, 43.5));
    b.stage(new StageStats("training", 185.0, 910L << 20, 150L << 20, 2_630_400L, 14_218.4, null));
    b.stage(new StageStats("backtest", 412.5, 930L << 20, 160L << 20, 10_521_600L, 25_506.9, null));
    b.stage(new StageStats("forecast", 6.1, 700L << 20, 20L << 20, 67_200L, 11_016.4, null));
    b.training(training(rnd));
    b.accuracy(accuracy(rnd));
    b.horizon(horizon(rnd));
    b.series(series("total", rnd, 84, 28, 4_200, false));
    b.series(series("region Northvale", rnd, 84, 28, 1_500, false));
    b.series(series("item-store PNT-D2-0041@NV-03", rnd, 84, 28, 1.2, true));
    b.driver(driver("total", 2_400, rnd, 28, 4_200));
    b.driver(driver("series PNT-D2-0041@NV-03", 1, rnd, 28, 1.2));
    return b.build();
  }

  /** Why-this-forecast parts: a base, five families of either sign (one all zero is left out), parts add up. */
  static DriverChart driver(String title, int seriesCount, Random rnd, int horizonDays, double level) {
    List<LocalDate> dates = new ArrayList<>();
    for (int d = 0; d < horizonDays; d++) {
      dates.add(ORIGIN.plusDays(d));
    }
    String[] names = {"base level", "recent level", "weekly pattern", "season", "events and holidays", "price"};
    List<DriverChart.Part> parts = new ArrayList<>();
    double[] forecast = new double[horizonDays];
    for (String name : names) {
      double[] units = new double[horizonDays];
      for (int d = 0; d < horizonDays; d++) {
        units[d] = name.equals("base level") ? level : level * 0.3 * rnd.nextGaussian();
        forecast[d] += units[d];
      }
      parts.add(new DriverChart.Part(name, units));
    }
    return new DriverChart(title, seriesCount, dates, forecast, parts);
  }

  static TrainingSummary training(Random rnd) {
    int iterations = 300;
    double[] validation = new double[iterations];
    double[] training = new double[iterations];
    for (int i = 0; i < iterations; i++) {
      training[i] = 1.9 + 2.2 * Math.exp(-i / 40.0) - 0.0006 * i;
      validation[i] = 2.05 + 2.1 * Math.exp(-i / 45.0) + 0.000012 * (i - 212) * (i - 212) / 10 + 0.004 * rnd
          .nextGaussian();
    }
    String[] names = {"lag_28", "rolling_mean_7_lag_28", "rolling_mean_28_lag_28", "day_of_week", "price",
        "price_change_4w", "item", "store", "department", "rolling_std_28_lag_28", "lag_35", "lag_42",
        "day_of_month", "week_of_year", "event_holiday", "rolling_mean_91_lag_28", "price_rel_department",
        "zero_run_length", "region", "month", "lag_364", "days_since_launch", "rolling_max_28_lag_28",
        "event_sport", "rolling_min_28_lag_28", "year"};
    List<TrainingSummary.FeatureImportance> importance = new ArrayList<>();
    for (int i = 0; i < names.length; i++) {
      importance.add(new TrainingSummary.FeatureImportance(names[i], 9.5e5 * Math.pow(0.78, i) * (0.9 + 0.2
          * rnd.nextDouble()), 40 + rnd.nextInt(3_000)));
    }
    return new TrainingSummary(new TrainingSummary.ValidationCurve("tweedie", validation, training, 212),
        importance);
  }

  static AccuracySummary accuracy(Random rnd) {
    String[] levels = {"total", "region", "store", "department", "item", "item-store"};
    long[] counts = {1, 3, 8, 5, 300, 2_400};
    List<AccuracySummary.LevelScore> rows = new ArrayList<>();
    for (int i = 0; i < levels.length; i++) {
      double model = 0.45 + 0.08 * i + 0.02 * rnd.nextDouble();
      double mae = 4_200.0 / counts[i] * (0.08 + 0.3 * i / 5.0);
      rows.add(new AccuracySummary.LevelScore(levels[i], counts[i], model, baselineScores(model, rnd), mae,
          mae * (rnd.nextDouble() - 0.6) * 0.5));
    }
    List<AccuracySummary.WorstAggregate> worst = new ArrayList<>();
    String[][] names = {{"total"}, {"Northvale", "Eastmoor", "Southbay"},
        {"NV-01", "NV-02", "NV-03", "EM-01", "EM-02", "EM-03", "SB-01", "SB-02"},
        {"Pantry", "Garden", "Fresh", "Frozen", "Home"}};
    for (int i = 0; i < levels.length; i++) {
      int shown = i < names.length ? names[i].length : 14;
      for (int g = 0; g < shown; g++) {
        String name = i < names.length ? names[i][g] : levels[i].toUpperCase(java.util.Locale.ROOT) + "-" + g;
        double actual = 4_200.0 / counts[i] * (0.5 + rnd.nextDouble());
        worst.add(new AccuracySummary.WorstAggregate(levels[i], name, 0.02 * Math.pow(0.8, g) / (i + 1),
            actual * 0.3, actual * (rnd.nextDouble() - 0.5) * 0.2, actual));
      }
    }
    List<AccuracySummary.OriginScore> origins = new ArrayList<>();
    for (int k = 3; k >= 0; k--) {
      double model = 0.62 + 0.06 * rnd.nextDouble();
      origins.add(new AccuracySummary.OriginScore(ORIGIN.minusDays(28L * k), model, baselineScores(model, rnd)));
    }
    double model = 0.651;
    return new AccuracySummary("seasonal naive", rows, model, baselineScores(model, rnd), 0.212,
        linked("seasonal naive", 0.268, "naive", 0.301), origins, worst);
  }

  private static Map<String, Double> baselineScores(double model, Random rnd) {
    return linked("seasonal naive", model * (1.15 + 0.1 * rnd.nextDouble()),
        "naive", model * (1.3 + 0.1 * rnd.nextDouble()), "moving average 28", model * (1.05 + 0.1 * rnd.nextDouble()));
  }

  static HorizonErrors horizon(Random rnd) {
    int days = 28;
    double[] model = new double[days];
    List<HorizonErrors.NamedCurve> baselines = new ArrayList<>();
    for (int h = 0; h < days; h++) {
      model[h] = 0.55 + 0.004 * h + 0.02 * rnd.nextDouble();
    }
    double[] factors = {1.2, 1.35, 1.1};
    for (int k = 0; k < BASELINES.size(); k++) {
      double[] v = new double[days];
      for (int h = 0; h < days; h++) {
        v[h] = model[h] * (factors[k] + 0.002 * h * (k + 1) + 0.03 * rnd.nextDouble());
      }
      baselines.add(new HorizonErrors.NamedCurve(BASELINES.get(k), v));
    }
    return new HorizonErrors("RMSSE", model, baselines);
  }

  /**
   * A chart of {@code historyDays} known days then {@code horizonDays} forecast days around a weekly pattern; with
   * {@code sparse} the series is intermittent and has two unknown days in its history.
   */
  static SeriesChart series(String title, Random rnd, int historyDays, int horizonDays, double level,
      boolean sparse) {
    int n = historyDays + horizonDays;
    List<LocalDate> dates = new ArrayList<>();
    double[] actual = new double[n];
    double[] forecast = new double[n];
    double[] lower = new double[n];
    double[] upper = new double[n];
    LocalDate first = ORIGIN.minusDays(historyDays - 1L);
    for (int i = 0; i < n; i++) {
      LocalDate d = first.plusDays(i);
      dates.add(d);
      double weekly = 1 + 0.25 * Math.sin(2 * Math.PI * d.getDayOfWeek().getValue() / 7.0);
      double mean = level * weekly;
      actual[i] = i < historyDays
          ? (sparse ? (rnd.nextDouble() < 0.45 ? rnd.nextInt(4) : 0) : Math.round(mean * (1 + 0.08
              * rnd.nextGaussian())))
          : Double.NaN;
      boolean inHorizon = i >= historyDays;
      forecast[i] = inHorizon ? mean : Double.NaN;
      lower[i] = inHorizon ? Math.max(0, mean * (sparse ? 0 : 0.82 - 0.002 * (i - historyDays))) : Double.NaN;
      upper[i] = inHorizon ? mean * (sparse ? 2.6 : 1.18 + 0.003 * (i - historyDays)) : Double.NaN;
    }
    if (sparse) {
      actual[20] = Double.NaN;
      actual[50] = Double.NaN;
    }
    return new SeriesChart(title, dates, actual, forecast, lower, upper, 0.1, 0.9, historyDays);
  }

  @SuppressWarnings("unchecked")
  static <V> Map<String, V> linked(Object... keyValues) {
    Map<String, V> m = new LinkedHashMap<>();
    for (int i = 0; i < keyValues.length; i += 2) {
      m.put((String) keyValues[i], (V) keyValues[i + 1]);
    }
    return m;
  }
}
