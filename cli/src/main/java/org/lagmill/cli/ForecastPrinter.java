package org.lagmill.cli;

import java.io.PrintWriter;
import org.lagmill.run.ForecastJob;
import org.lagmill.store.Periods;

/** A forecast's console lines: where the report and the forecast went, and what the forecast is for. */
final class ForecastPrinter {
  private ForecastPrinter() {}

  static void print(PrintWriter out, ForecastJob.Outcome outcome) {
    if (outcome.reportHtml() != null) {
      out.println("report written to " + outcome.reportHtml());
    }
    out.printf("forecast %,d series x %s (%s .. %s) written to %s%n", outcome.seriesCount(),
        Periods.count(outcome.horizonPeriods(), outcome.periodDays()), outcome.firstDate(), outcome.lastDate(),
        outcome.forecastFile());
    out.println("These are estimates for a planner to review, not orders.");
  }
}
