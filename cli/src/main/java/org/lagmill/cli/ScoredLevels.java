package org.lagmill.cli;

import java.io.PrintWriter;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.store.StoreManifest;

/** The console lines that say which levels a score covers and what the store filled, for backtest and evaluate. */
final class ScoredLevels {
  private ScoredLevels() {}

  /** Prints the levels line and, when the store records them, its fill counts. */
  static void print(PrintWriter out, EvaluationResult result, StoreManifest manifest) {
    out.println(FlagNames.render(result.scoredLevelsLine()));
    IngestPrinter.printFill(out, manifest);
  }
}
