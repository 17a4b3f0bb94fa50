package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.lagmill.eval.BacktestResult;
import org.lagmill.eval.BaselineKind;
import org.lagmill.eval.CombinedBacktestResult;
import org.lagmill.report.ReportAssembler;
import org.lagmill.training.PartitionReport;

/** A backtest's console lines, for {@code backtest} and {@code demo}. */
final class BacktestPrinter {
  private BacktestPrinter() {}

  /** One line per member and the combination: mean WRMSSE and the skill ratios; then which one was chosen. */
  static void printMembers(PrintWriter out, CombinedBacktestResult combined) {
    out.println("members and their average on the same origins (WRMSSE, lower is better)");
    out.printf(Locale.ROOT, "%-40s %9s %9s %16s %9s%n", "member", "WRMSSE", "±", "/ seasonal naive", "/ ETS");
    for (int m = 0; m <= combined.members().size(); m++) {
      BacktestResult r = m < combined.members().size() ? combined.members().get(m) : combined.combination();
      String name = m < combined.members().size() ? combined.memberNames().get(m)
          : CombinedBacktestResult.COMBINATION_NAME;
      out.printf(Locale.ROOT, "%-40s %9.4f %9.4f %16.3f %9.3f%n", name, r.meanModelWrmsse(), r.stdModelWrmsse(),
          r.skillRatioAgainstSeasonalNaive(), r.skillRatioAgainst(BaselineKind.ETS));
    }
    out.println("chosen: " + combined.chosenName() + " (the report and the lines below describe it)");
  }

  /** One line per partition of each origin that continued from an earlier origin's model: from where, the rounds. */
  static void printContinued(PrintWriter out, BacktestResult result) {
    for (BacktestResult.OriginResult origin : result.origins()) {
      for (PartitionReport p : origin.partitions()) {
        if (p.continued()) {
          out.println(String.format(Locale.ROOT, "origin %s, model %s: ", origin.originDate(), p.partitionValue())
              + TrainPrinter.continuation(p));
        }
      }
    }
  }

  /** The WRMSSE of the model and every baseline per origin, their means, skill ratios and interval scores. */
  static void print(PrintWriter out, BacktestResult result) {
    List<String> names = new ArrayList<>(result.meanBaselineWrmsse().keySet());
    StringBuilder header = new StringBuilder(String.format(Locale.ROOT, "%-12s %9s", "origin", "model"));
    for (String name : names) {
      header.append(String.format(Locale.ROOT, " %22s", ReportAssembler.label(name)));
    }
    out.println("WRMSSE by origin (lower is better)");
    out.println(header);
    for (BacktestResult.OriginResult origin : result.origins()) {
      StringBuilder line = new StringBuilder(String.format(Locale.ROOT, "%-12s %9.4f", origin.originDate(),
          origin.model().wrmsse()));
      for (String name : names) {
        line.append(String.format(Locale.ROOT, " %22.4f", origin.baselines().get(name).wrmsse()));
      }
      out.println(line);
    }
    StringBuilder mean = new StringBuilder(String.format(Locale.ROOT, "%-12s %9.4f", "mean", result.meanModelWrmsse()));
    for (Map.Entry<String, Double> baseline : result.meanBaselineWrmsse().entrySet()) {
      mean.append(String.format(Locale.ROOT, " %22.4f", baseline.getValue()));
    }
    out.println(mean);
    out.printf(Locale.ROOT, "model WRMSSE %.4f ± %.4f over %d origins; skill against seasonal naive %.3f, against "
        + "ETS %.3f (model / baseline, lower is better)%n", result.meanModelWrmsse(), result.stdModelWrmsse(),
        result.origins().size(), result.skillRatioAgainstSeasonalNaive(), result.skillRatioAgainst(BaselineKind.ETS));
    String dropped = PartitionReport.zeroRowsNotice(result.origins().stream()
        .flatMap(origin -> origin.partitions().stream()).toList());
    if (dropped != null) {
      out.printf(Locale.ROOT, "training over the %d origins %s%n", result.origins().size(), dropped);
    }
    if (result.meanModelWspl() != null) {
      out.printf(Locale.ROOT, "interval WSPL %.4f (negative binomial, estimated dispersion) vs %.4f (Poisson)%n",
          result.meanModelWspl(), result.meanPoissonWspl());
    }
  }
}
