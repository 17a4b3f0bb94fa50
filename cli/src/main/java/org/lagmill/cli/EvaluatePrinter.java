package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.run.EvaluateJob;
import org.lagmill.store.Periods;

/** An evaluation's console lines, for {@code evaluate} (and the level table for {@code merge-scores}). */
final class EvaluatePrinter {
  private EvaluatePrinter() {}

  /** The forecast's days, the level table, each baseline beside the model, and the scored levels and fills. */
  static void print(PrintWriter out, EvaluateJob.Outcome outcome) {
    EvaluationResult result = outcome.result();
    out.printf(Locale.ROOT, "forecast %s, %s .. %s, %s%n", outcome.forecastFile(), outcome.firstDate(),
        outcome.lastDate(), Periods.count(outcome.horizonPeriods(), outcome.periodDays()));
    printLevels(out, result);
    outcome.baselineWrmsse()
        .forEach((name, value) -> out.printf(Locale.ROOT, "  baseline %-24s WRMSSE %.4f  (model / baseline %.3f)%n",
            name, value, result.wrmsse() / value));
    ScoredLevels.print(out, result, outcome.manifest());
  }

  /** The JSON document {@code evaluate --json} prints: the score, the baselines' WRMSSE and the store's fills. */
  static Map<String, Object> document(EvaluateJob.Outcome outcome) {
    Map<String, Object> document = new LinkedHashMap<>();
    document.put("forecast", outcome.result());
    document.put("baselineWrmsse", outcome.baselineWrmsse());
    document.put("fill", outcome.manifest().fill());
    return document;
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
