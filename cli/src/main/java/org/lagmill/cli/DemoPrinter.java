package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import org.lagmill.eval.BacktestResult;
import org.lagmill.eval.BaselineKind;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.report.ReportAssembler;
import org.lagmill.run.DemoJob;

/** The demo's summary: the backtest origins and the withheld weeks against the baselines, and where things went. */
final class DemoPrinter {
  private DemoPrinter() {}

  static void print(PrintWriter out, DemoJob.Outcome outcome) {
    BacktestResult result = outcome.backtest();
    List<BacktestResult.OriginResult> origins = result.origins();
    double backtestMean = 0;
    for (int k = 0; k < DemoJob.BACKTEST_ORIGINS; k++) {
      backtestMean += origins.get(k).model().wrmsse() / DemoJob.BACKTEST_ORIGINS;
    }
    BacktestResult.OriginResult withheld = origins.get(origins.size() - 1);
    out.println();
    IngestPrinter.printFill(out, outcome.storeManifest());
    out.println("lagmill demo: " + origins.size() + " forecast origins scored against baselines (WRMSSE, lower is "
        + "better)");
    out.printf(Locale.ROOT, "  model                  %.4f  (backtest origins %s: %.4f; withheld last 28 days from %s: "
        + "%.4f)%n", result.meanModelWrmsse(), origins.get(0).originDate() + ", " + origins.get(1).originDate(),
        backtestMean, withheld.originDate(), withheld.model().wrmsse());
    result.meanBaselineWrmsse().forEach((name, value) -> out.printf(Locale.ROOT, "  %-22s %.4f%n",
        ReportAssembler.label(name), value));
    out.printf(Locale.ROOT, "  skill vs seasonal naive %.3f (model / seasonal naive), vs ETS %.3f (model / ETS)%n",
        result.skillRatioAgainstSeasonalNaive(), result.skillRatioAgainst(BaselineKind.ETS));
    if (result.meanModelWspl() != null) {
      out.printf(Locale.ROOT, "  interval WSPL %.4f (Poisson intervals would score %.4f)%n", result.meanModelWspl(),
          result.meanPoissonWspl());
    }
    out.printf(Locale.ROOT, "peak memory %,d MB, %.0f s in all%n", ProcessMemory.peakResidentBytes() >> 20,
        outcome.elapsedSeconds());
    out.println("report:   " + outcome.reportHtml());
    out.println("forecast: " + outcome.forecastFile() + " (28 days with quantiles q0.005 .. q0.995)");
    out.println("Forecasts are estimates for a planner to review, never automatic orders.");
  }
}
