package org.lagmill.cli;

import java.io.PrintWriter;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.store.StoreManifest;

/** The console lines that say which levels a score covers and what the store filled, for backtest and evaluate. */
final class ScoredLevels {
  private ScoredLevels() {}

  /** "levels scored (8): total, dept, …; detected from how the attributes nest: dept > grp > sku; shop". */
  static String describe(EvaluationResult result) {
    String from = "detected".equals(result.levelSource())
        ? "detected from how the attributes nest (the default): " + result.levelBasis()
        : "declared with " + result.levelBasis();
    return "levels scored (" + result.levels().size() + "): " + String.join(", ",
        result.levels().stream().map(EvaluationResult.LevelResult::name).toList()) + "; " + from;
  }

  /** Prints the levels line and, when the store records them, its fill counts. */
  static void print(PrintWriter out, EvaluationResult result, StoreManifest manifest) {
    out.println(describe(result));
    IngestCommand.printFill(out, manifest);
  }
}
