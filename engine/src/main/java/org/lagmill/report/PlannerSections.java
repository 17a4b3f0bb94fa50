package org.lagmill.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.lagmill.io.Setting;

/**
 * The first sections a planner reads: how good the forecast is, in plain words and in units ({@code #headline}),
 * and where it fails ({@code #failures}): the series and groups that carry most of the error, and the bias by group.
 */
final class PlannerSections {
  /** Rows of each "worst" table. */
  static final int WORST_SHOWN = 10;
  /** Levels with at most this many aggregates get a bias-by-group table (all their aggregates). */
  static final int BIAS_TABLE_MAX_GROUPS = 25;

  private PlannerSections() {}

  static String headline(AccuracySummary a, DataSummary data, String periodUnit) {
    String heading = "How good is the forecast";
    if (a == null) {
      String hint = "No accuracy was measured for this report: run " + Setting.Command.BACKTEST + " on the same store "
          + "and pass its folder with " + Setting.Command.FORECAST + " " + Setting.BACKTEST_REPORT + " DIR, or score a "
          + "past forecast with " + Setting.Command.EVALUATE + " " + Setting.REPORT + " DIR.";
      return Html.section("headline", heading, Html.absent(Setting.shown(hint)) + fillNote(data, periodUnit));
    }
    StringBuilder b = new StringBuilder("<p class=\"headline\">").append(ReportFormat.escape(plainWords(a,
        periodUnit))).append("</p>");
    String best = a.bestBaseline();
    HtmlTable t = new HtmlTable("units", "Error in units per " + periodUnit + ", by level", List.of("level", "series",
        "MAE, units", "bias, units", "scaled error (RMSSE)", best == null ? "best baseline" : best),
        new boolean[] {false, true, true, true, true, true});
    for (AccuracySummary.LevelScore l : a.levels()) {
      t.row(List.of(l.levelName(), ReportFormat.count(l.aggregateCount()), units(l.modelMae()),
          signedUnits(l.modelBias()), ReportFormat.score(l.modelRmsse()),
          best == null ? ReportFormat.MISSING : ReportFormat.score(l.baselineRmsse().get(best))));
    }
    b.append(t.finish());
    b.append(Html.note("MAE is the mean absolute error; bias the mean of forecast minus actual, above 0 the forecast "
        + "ran high. Scaled errors have no unit (1 is as bad as a one-" + periodUnit + "-ago guess was inside "
        + "the history; lower is better) so levels and baselines compare directly; MAE and bias are in units sold per "
        + periodUnit + " and per aggregate of the level. " + (a.origins().size() > 1 ? "Means over "
            + a.origins().size() + " backtest origins." : "One origin.")));
    b.append(levelsNote(a));
    b.append(fillNote(data, periodUnit));
    return Html.section("headline", heading, b.toString());
  }

  /** Which levels were scored and where they came from, so a reader knows what the WRMSSE averages over. */
  static String levelsNote(AccuracySummary a) {
    if (a.levelSource() == null) {
      return "";
    }
    List<String> names = a.levels().stream().map(AccuracySummary.LevelScore::levelName).toList();
    String from = "detected".equals(a.levelSource())
        ? "from how the attributes nest in the data (the default): " + a.levelBasis()
        : "as declared with " + Setting.shown(a.levelBasis());
    return Html.note("Levels scored (" + names.size() + "): " + String.join(", ", names) + "; " + from + ".");
  }

  /** What the store filled, left unknown or holds as closed, with counts: nothing a score rests on is silent. */
  static String fillNote(DataSummary data, String periodUnit) {
    if (data == null || data.fill() == null) {
      return "";
    }
    org.lagmill.store.StoreManifest.Fill fill = data.fill();
    String item = "item-" + periodUnit + "s";
    StringBuilder text = new StringBuilder(String.format(Locale.ROOT, "Data: %s %s with no row in long sales read "
        + "as zero sales; %s %s unknown and %s closed, both left out of training and scores",
        ReportFormat.count(fill.zeroFilledItemDays()), item, ReportFormat.count(fill.unknownItemDays()), item,
        ReportFormat.count(fill.closedItemDays())));
    if (fill.partlyClosedItemDays() > 0) {
      text.append(String.format(Locale.ROOT, "; %s %s partly closed, kept open",
          ReportFormat.count(fill.partlyClosedItemDays()), item));
    }
    return Html.note(text.append('.').toString());
  }

  /** The headline sentence: model against the best baseline, then the error in units at the top and bottom. */
  static String plainWords(AccuracySummary a, String periodUnit) {
    StringBuilder text = new StringBuilder();
    String best = a.bestBaseline();
    if (best == null) {
      text.append(String.format(Locale.ROOT, "The model's scaled error (WRMSSE) is %s; no baseline was scored to "
          + "compare it with.", ReportFormat.score(a.modelWrmsse())));
    } else {
      double baseline = a.baselineWrmsse().get(best);
      double change = (a.modelWrmsse() / baseline - 1) * 100;
      text.append(String.format(Locale.ROOT, "The model's scaled error (WRMSSE) is %s against %s for the best simple "
          + "method (%s): %s.", ReportFormat.score(a.modelWrmsse()), ReportFormat.score(baseline), best,
          Math.abs(change) < 0.05 ? "the same" : String.format(Locale.ROOT, "%.1f%% %s", Math.abs(change),
              change < 0 ? "lower, so the model adds accuracy" : "higher, so the model does not beat it")));
    }
    List<AccuracySummary.LevelScore> levels = a.levels();
    if (!levels.isEmpty() && levels.get(0).modelMae() != null) {
      AccuracySummary.LevelScore top = levels.get(0);
      text.append(String.format(Locale.ROOT, " In units: at the %s level the forecast misses by %s units per %s on "
          + "average and runs %s.", top.levelName(), units(top.modelMae()), periodUnit,
          direction(top.modelBias(),
              periodUnit)));
      AccuracySummary.LevelScore bottom = levels.get(levels.size() - 1);
      if (levels.size() > 1 && bottom.modelMae() != null) {
        text.append(String.format(Locale.ROOT, " At the %s level (%s series) the miss is %s units per %s and series,"
            + " running %s.", bottom.levelName(), ReportFormat.count(bottom.aggregateCount()),
            units(bottom.modelMae()), periodUnit, direction(bottom.modelBias(), periodUnit)));
      }
    }
    return text.toString();
  }

  static String failures(AccuracySummary a, String periodUnit) {
    String heading = "Where it fails";
    if (a == null || a.worstAggregates().isEmpty()) {
      return Html.section("failures", heading, Html.absent("No per-series errors were recorded for this report."));
    }
    Map<String, List<AccuracySummary.WorstAggregate>> byLevel = new LinkedHashMap<>();
    for (AccuracySummary.WorstAggregate w : a.worstAggregates()) {
      byLevel.computeIfAbsent(w.levelName(), k -> new ArrayList<>()).add(w);
    }
    List<String> levelNames = new ArrayList<>(byLevel.keySet());
    String bottom = levelNames.get(levelNames.size() - 1);
    List<AccuracySummary.WorstAggregate> groups = new ArrayList<>();
    for (int i = 1; i < levelNames.size() - 1; i++) {
      groups.addAll(byLevel.get(levelNames.get(i)));
    }
    groups.sort(java.util.Comparator.comparingDouble(AccuracySummary.WorstAggregate::wrmsseContribution).reversed()
        .thenComparing(AccuracySummary.WorstAggregate::aggregateName));
    StringBuilder b = new StringBuilder(Html.note("Ranked by each one's share of the overall scaled error (WRMSSE), "
        + "which weighs errors by sales value: fixing the top rows helps most. Bias above 0 means the forecast ran "
        + "high (too much stock), below 0 low (lost sales)."));
    b.append(worstTable("worst-series", "Series with the largest share of the error",
        byLevel.get(bottom), a.modelWrmsse(), periodUnit, false));
    if (!groups.isEmpty()) {
      b.append(worstTable("worst-groups", "Groups with the largest share of the error", groups, a.modelWrmsse(),
          periodUnit, true));
    }
    for (int i = 1; i < levelNames.size() - 1; i++) {
      List<AccuracySummary.WorstAggregate> rows = byLevel.get(levelNames.get(i));
      long aggregateCount = a.levels().stream().filter(l -> l.levelName().equals(rows.get(0).levelName()))
          .mapToLong(AccuracySummary.LevelScore::aggregateCount).findFirst().orElse(Long.MAX_VALUE);
      if (aggregateCount <= BIAS_TABLE_MAX_GROUPS && rows.size() == aggregateCount) {
        b.append(biasTable(levelNames.get(i), rows, periodUnit));
      }
    }
    return Html.section("failures", heading, b.toString());
  }

  private static String worstTable(String cssClass, String caption, List<AccuracySummary.WorstAggregate> rows,
      double wrmsse, String periodUnit, boolean withLevel) {
    List<String> headers = new ArrayList<>();
    if (withLevel) {
      headers.add("level");
    }
    headers.addAll(List.of("name", "share of error", "MAE, units per " + periodUnit, "bias, units per " + periodUnit,
        "actual, units per " + periodUnit));
    boolean[] numeric = new boolean[headers.size()];
    java.util.Arrays.fill(numeric, withLevel ? 2 : 1, numeric.length, true);
    HtmlTable t = new HtmlTable(cssClass, caption, headers, numeric);
    for (AccuracySummary.WorstAggregate w : rows.subList(0, Math.min(WORST_SHOWN, rows.size()))) {
      List<String> row = new ArrayList<>();
      if (withLevel) {
        row.add(w.levelName());
      }
      row.addAll(List.of(w.aggregateName(), ReportFormat.percent(wrmsse > 0 ? w.wrmsseContribution() / wrmsse : null),
          units(w.mae()), signedUnits(w.bias()), units(w.actualMean())));
      t.row(row);
    }
    return t.finish();
  }

  private static String biasTable(String levelName, List<AccuracySummary.WorstAggregate> rows, String periodUnit) {
    List<AccuracySummary.WorstAggregate> sorted = new ArrayList<>(rows);
    sorted.sort(java.util.Comparator.comparing(AccuracySummary.WorstAggregate::aggregateName));
    HtmlTable t = new HtmlTable("bias-by-group", "Bias by " + levelName + " (forecast minus actual)",
        List.of(levelName, "bias, units per " + periodUnit, "bias, % of actual", "actual, units per " + periodUnit),
        new boolean[] {false, true, true, true});
    for (AccuracySummary.WorstAggregate w : sorted) {
      t.row(List.of(w.aggregateName(), signedUnits(w.bias()), w.actualMean() > 0
          ? String.format(Locale.ROOT, "%+.1f%%", 100 * w.bias() / w.actualMean()) : ReportFormat.MISSING,
          units(w.actualMean())));
    }
    return t.finish();
  }

  private static String direction(Double bias, String periodUnit) {
    if (bias == null) {
      return "with unknown bias";
    }
    if (Math.abs(bias) < 0.005) {
      return "without bias";
    }
    return String.format(Locale.ROOT, "%s units per %s %s (bias)", units(Math.abs(bias)), periodUnit,
        bias > 0 ? "high" : "low");
  }

  static String units(Double value) {
    if (value == null || !Double.isFinite(value)) {
      return ReportFormat.MISSING;
    }
    return ReportFormat.fixed(value, Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : 2);
  }

  static String signedUnits(Double value) {
    String text = units(value);
    return value != null && value > 0 && Double.isFinite(value) ? "+" + text : text;
  }
}
