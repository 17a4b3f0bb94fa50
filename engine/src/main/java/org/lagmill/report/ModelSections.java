package org.lagmill.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.lagmill.features.FeatureFamily;

/** Training ({@code #training}), accuracy ({@code #accuracy}) and error by horizon day ({@code #horizon}). */
final class ModelSections {
  /** Feature importance shows at most this many features, by gain. */
  static final int TOP_FEATURE_COUNT = 20;

  private ModelSections() {}

  static String training(TrainingSummary training, String periodUnit) {
    if (training == null) {
      return Html.section("training", "Model details", Html.absent("No model was trained for this report."));
    }
    StringBuilder b = new StringBuilder();
    if (training.rowNotice() != null) {
      b.append(Html.note(training.rowNotice()));
    }
    TrainingSummary.ValidationCurve curve = training.validation();
    if (training.continuation() != null) {
      b.append(continuation(training.continuation(), curve));
    }
    b.append(Html.h3("Validation curve"));
    if (curve == null || curve.values().length == 0) {
      b.append(Html.absent("No validation curve was recorded."));
    } else {
      LineChart chart = SvgCharts.lineChart(ChartFrame.WIDE, curve.values().length)
          .title("Validation " + curve.metricName() + " per boosting iteration")
          .xLabels(i -> Integer.toString(i + 1)).yTitle(curve.metricName());
      int step = (int) Math.max(1, AxisScale.niceStep(curve.values().length / 8.0));
      // ticks on round iteration numbers (50, 100, ...), which sit at index iteration - 1
      chart.xTicks(step, step - 1);
      if (curve.trainingValues() != null) {
        chart.line("training rows", curve.trainingValues(), SvgCharts.TRAINING_COLOUR, "7 4", false);
      }
      chart.line("validation days", curve.values(), SvgCharts.MODEL_COLOUR, null, false);
      if (curve.bestIteration() > 0) {
        chart.marker(curve.bestIteration() - 1, "best iteration " + curve.bestIteration());
      }
      b.append(Html.figure(null, chart.render()));
      String best = curve.bestIteration() > 0
          ? " Early stopping kept iteration " + curve.bestIteration() + ", where the validation "
              + curve.metricName() + " is " + ReportFormat.fixed(curve.values()[curve.bestIteration() - 1], 4) + "."
          : "";
      b.append(Html.note(curve.metricName() + " after each boosting iteration on the held-out validation days; lower "
          + "is better." + best));
    }
    b.append(Html.h3("Feature importance"));
    if (training.importance().isEmpty()) {
      b.append(Html.absent("No feature importance was recorded."));
    } else {
      b.append(importance(training.importance(), periodUnit));
    }
    return Html.section("training", "Model details", b.toString());
  }

  private static String continuation(TrainingSummary.Continuation continued, TrainingSummary.ValidationCurve curve) {
    String loss = continued.startingValidationLoss() == null || curve == null ? ""
        : " On the validation days the starting model's " + curve.metricName() + " was "
            + ReportFormat.fixed(continued.startingValidationLoss(), 4) + "; the added rounds had to beat it.";
    return Html.h3("Continued training") + Html.note("This model continued from " + continued.source() + " ("
        + ReportFormat.count((long) continued.startingRounds()) + " rounds) instead of boosting from scratch and added "
        + ReportFormat.count((long) continued.addedRounds()) + " rounds ("
        + ReportFormat.count((long) continued.startingRounds()
            + continued.addedRounds())
        + " in all); the curve below counts the added rounds." + loss);
  }

  private static String importance(List<TrainingSummary.FeatureImportance> all, String periodUnit) {
    double totalGain = 0;
    for (TrainingSummary.FeatureImportance f : all) {
      totalGain += f.gain();
    }
    List<TrainingSummary.FeatureImportance> top = new ArrayList<>(all);
    top.sort(Comparator.comparingDouble(TrainingSummary.FeatureImportance::gain).reversed()
        .thenComparing(TrainingSummary.FeatureImportance::featureName));
    top = top.subList(0, Math.min(TOP_FEATURE_COUNT, top.size()));
    BarChart chart = SvgCharts.barChart(920).title("Feature importance by total gain").axisTitle("share of gain, %");
    for (TrainingSummary.FeatureImportance f : top) {
      double share = totalGain > 0 ? f.gain() / totalGain : 0;
      chart.bar(f.featureName(), share * 100, ReportFormat.percent(share) + " \u00b7 "
          + ReportFormat.count(f.splitCount()) + " splits");
    }
    HtmlTable labels = new HtmlTable("feature-labels", "What each feature is", List.of("feature", "meaning",
        "family", "share of gain"), new boolean[] {false, false, false, true});
    for (TrainingSummary.FeatureImportance f : top) {
      labels.row(List.of(f.featureName(), FeatureFamily.label(f.featureName(), periodUnit + "s"),
          FeatureFamily.of(f.featureName()).label(), ReportFormat.percent(totalGain > 0 ? f.gain() / totalGain : 0)));
    }
    return Html.figure(null, chart.render()) + Html.note("The " + top.size() + " features with the highest total gain"
        + " of " + all.size() + ", as a share of all gain, with the number of splits on each. Gain shows what the "
        + "trees leaned on, not cause and effect.") + labels.finish();
  }

  private static final String ETS_LABEL = ReportAssembler.label(org.lagmill.eval.BaselineKind.ETS.name());

  static String accuracy(AccuracySummary a) {
    if (a == null) {
      return Html.section("accuracy", "Accuracy", Html.absent("No accuracy evaluation was run for this report.")
          + Html.absent("No backtest was run for this report."));
    }
    List<String> baselines = a.baselineNames();
    String ref = a.referenceBaseline();
    // The strongest statistical benchmark gets its own ratio column beside the reference's.
    String ets = baselines.contains(ETS_LABEL) && !ETS_LABEL.equals(ref) ? ETS_LABEL : null;
    StringBuilder b = new StringBuilder();
    b.append(headline(a));
    List<String> headers = new ArrayList<>(List.of("level", "series", "model"));
    baselines.forEach(headers::add);
    if (ref != null) {
      headers.add("model \u00f7 " + ref);
    }
    if (ets != null) {
      headers.add("model \u00f7 " + ets);
    }
    boolean[] numeric = new boolean[headers.size()];
    java.util.Arrays.fill(numeric, 1, numeric.length, true);
    HtmlTable levels = new HtmlTable("levels", "RMSSE by aggregation level (lower is better; best of each row in bold)",
        headers, numeric);
    for (AccuracySummary.LevelScore l : a.levels()) {
      List<String> row = new ArrayList<>(List.of(l.levelName(), ReportFormat.count(l.aggregateCount())));
      addScores(row, l.modelRmsse(), l.baselineRmsse(), baselines);
      if (ref != null) {
        row.add(ReportFormat.score(ratio(l.modelRmsse(), l.baselineRmsse().get(ref))));
      }
      if (ets != null) {
        row.add(ReportFormat.score(ratio(l.modelRmsse(), l.baselineRmsse().get(ets))));
      }
      levels.row(row);
    }
    List<String> total = new ArrayList<>(List.of("WRMSSE (all levels)", ""));
    addScores(total, a.modelWrmsse(), a.baselineWrmsse(), baselines);
    if (ref != null) {
      total.add(ReportFormat.score(a.skillRatio()));
    }
    if (ets != null) {
      total.add(ReportFormat.score(ratio(a.modelWrmsse(), a.baselineWrmsse().get(ets))));
    }
    levels.footerRow(total);
    if (a.modelWspl() != null) {
      List<String> wspl = new ArrayList<>(List.of("WSPL (quantiles)", ""));
      addScores(wspl, a.modelWspl(), a.baselineWspl(), baselines);
      if (ref != null) {
        wspl.add(ReportFormat.score(ratio(a.modelWspl(), a.baselineWspl().get(ref))));
      }
      if (ets != null) {
        wspl.add(ReportFormat.score(ratio(a.modelWspl(), a.baselineWspl().get(ets))));
      }
      levels.footerRow(wspl);
    }
    b.append(levels.finish());
    b.append(Html.h3("Backtest origins"));
    b.append(origins(a, baselines, ref));
    return Html.section("accuracy", "Accuracy", b.toString());
  }

  private static String headline(AccuracySummary a) {
    StringBuilder text = new StringBuilder("Model WRMSSE " + ReportFormat.score(a.modelWrmsse()));
    Double ratio = a.skillRatio();
    if (ratio != null) {
      String ref = a.referenceBaseline();
      text.append(", ").append(ref).append(' ').append(ReportFormat.score(a.baselineWrmsse().get(ref)))
          .append(": ratio model \u00f7 ").append(ref).append(" = ").append(ReportFormat.score(ratio))
          .append(" (lower is better");
      if (Double.isFinite(ratio)) {
        double change = Math.abs(1 - ratio) * 100;
        text.append(String.format(Locale.ROOT, "; the model's error is %.1f%% %s the %s's", change,
            ratio <= 1 ? "below" : "above", ref));
      }
      text.append(")");
      Double etsScore = a.baselineWrmsse().get(ETS_LABEL);
      if (etsScore != null && !ETS_LABEL.equals(ref)) {
        text.append("; ETS (exponential smoothing with trend and season, chosen per series) ")
            .append(ReportFormat.score(etsScore)).append(": ratio model \u00f7 ETS = ")
            .append(ReportFormat.score(ratio(a.modelWrmsse(), etsScore)));
      }
      text.append('.');
    } else {
      text.append(". No seasonal naive baseline was scored, so there is no skill ratio.");
    }
    return "<p class=\"headline\">" + ReportFormat.escape(text.toString()) + "</p>";
  }

  private static String origins(AccuracySummary a, List<String> baselines, String ref) {
    if (a.origins().isEmpty()) {
      return Html.absent("No backtest was run for this report.");
    }
    List<String> headers = new ArrayList<>(List.of("origin", "model"));
    baselines.forEach(headers::add);
    if (ref != null) {
      headers.add("model \u00f7 " + ref);
    }
    boolean[] numeric = new boolean[headers.size()];
    java.util.Arrays.fill(numeric, 1, numeric.length, true);
    HtmlTable t = new HtmlTable("origins", "WRMSSE per rolling origin", headers, numeric);
    int columnCount = headers.size() - 1;
    double[][] columns = new double[columnCount][a.origins().size()];
    for (int r = 0; r < a.origins().size(); r++) {
      AccuracySummary.OriginScore o = a.origins().get(r);
      List<String> row = new ArrayList<>(List.of(o.originDate().toString()));
      addScores(row, o.modelWrmsse(), o.baselineWrmsse(), baselines);
      columns[0][r] = o.modelWrmsse();
      for (int c = 0; c < baselines.size(); c++) {
        Double v = o.baselineWrmsse().get(baselines.get(c));
        columns[c + 1][r] = v == null ? Double.NaN : v;
      }
      if (ref != null) {
        Double ratio = ratio(o.modelWrmsse(), o.baselineWrmsse().get(ref));
        row.add(ReportFormat.score(ratio));
        columns[columnCount - 1][r] = ratio == null ? Double.NaN : ratio;
      }
      t.row(row);
    }
    List<String> mean = new ArrayList<>(List.of("mean"));
    List<String> sd = new ArrayList<>(List.of("standard deviation"));
    List<String> range = new ArrayList<>(List.of("lowest \u2013 highest"));
    for (double[] column : columns) {
      Spread s = Spread.of(column);
      mean.add(ReportFormat.score(s.mean()));
      sd.add(ReportFormat.score(s.standardDeviation()));
      range.add(ReportFormat.score(s.min()) + " \u2013 " + ReportFormat.score(s.max()));
    }
    t.footerRow(mean).footerRow(sd).footerRow(range);
    return t.finish() + Html.note("Each origin is a leak-free split: the model and the baselines saw only the days up"
        + " to the origin. The spread across origins shows how much a single backtest's score can vary; the standard"
        + " deviation is the sample one (n \u2212 1) and is blank with a single origin.");
  }

  /** Appends the model's score and each baseline's; the lowest finite score of the row is marked bold. */
  private static void addScores(List<String> row, double model, Map<String, Double> byBaseline,
      List<String> baselines) {
    double best = Double.isFinite(model) ? model : Double.POSITIVE_INFINITY;
    for (String name : baselines) {
      Double v = byBaseline.get(name);
      if (v != null && Double.isFinite(v)) {
        best = Math.min(best, v);
      }
    }
    int bestCount = 0;
    List<Double> values = new ArrayList<>();
    values.add(model);
    for (String name : baselines) {
      values.add(byBaseline.get(name));
    }
    for (Double v : values) {
      bestCount += v != null && v == best ? 1 : 0;
    }
    for (Double v : values) {
      String text = ReportFormat.score(v);
      boolean mark = bestCount > 0 && values.size() > 1 && v != null && v == best;
      row.add(mark ? HtmlTable.STRONG + text : text);
    }
  }

  private static Double ratio(double model, Double reference) {
    return reference == null ? null : model / reference;
  }

  static String horizon(HorizonErrors h, String periodUnit) {
    if (h == null || h.model().length == 0) {
      return Html.section("horizon", "Error by horizon " + periodUnit,
          Html.absent("No error by horizon " + periodUnit + " was recorded for this report."));
    }
    int dayCount = h.model().length;
    // Seven legend entries (six baselines and the model) take two rows, so the plot starts lower than usual.
    ChartFrame frame = new ChartFrame(ChartFrame.WIDE.widthPx(), ChartFrame.WIDE.heightPx() + 16,
        ChartFrame.WIDE.leftPx(), ChartFrame.WIDE.rightPx(), ChartFrame.WIDE.topPx() + 16, ChartFrame.WIDE.bottomPx());
    LineChart chart = SvgCharts.lineChart(frame, dayCount)
        .title(h.metricName() + " by horizon " + periodUnit + ", model and baselines")
        .xLabels(i -> Integer.toString(i + 1))
        .yTitle(h.metricName()).includeZero(true);
    if (dayCount >= 14) {
      chart.xTicks(7, 6);
    }
    for (int i = 0; i < h.baselines().size(); i++) {
      HorizonErrors.NamedCurve c = h.baselines().get(i);
      chart.line(c.name(), c.values(), SvgCharts.baselineColour(i), SvgCharts.baselineDash(i), true);
    }
    chart.line("model", h.model(), SvgCharts.MODEL_COLOUR, null, true);
    return Html.section("horizon", "Error by horizon " + periodUnit, Html.figure(null, chart.render())
        + Html.note(h.metricName() + " of each forecast " + periodUnit + " after the origin (" + periodUnit + " 1 is "
            + "the " + periodUnit + " after the last known "
            + periodUnit + "), over all backtest origins; lower is better. Error usually grows with the horizon."));
  }

  /** Mean, sample standard deviation, lowest and highest of the finite values of a column. */
  record Spread(double mean, double standardDeviation, double min, double max) {
    static Spread of(double[] values) {
      int n = 0;
      double sum = 0;
      double min = Double.POSITIVE_INFINITY;
      double max = Double.NEGATIVE_INFINITY;
      for (double v : values) {
        if (Double.isFinite(v)) {
          n++;
          sum += v;
          min = Math.min(min, v);
          max = Math.max(max, v);
        }
      }
      if (n == 0) {
        return new Spread(Double.NaN, Double.NaN, Double.NaN, Double.NaN);
      }
      double mean = sum / n;
      double squares = 0;
      for (double v : values) {
        if (Double.isFinite(v)) {
          squares += (v - mean) * (v - mean);
        }
      }
      return new Spread(mean, n > 1 ? Math.sqrt(squares / (n - 1)) : Double.NaN, min, max);
    }
  }
}
