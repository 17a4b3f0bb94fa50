package org.lagmill.run;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.report.ReportData;
import org.lagmill.store.SalesHistory;

/** Whether a backtest's report describes the store and horizon a forecast report adds it to; says so when not. */
final class BacktestMatch {
  private BacktestMatch() {}

  /** One warning per mismatch between the backtest's data and this store and horizon; empty when they match. */
  static List<String> warnings(ReportData backtest, SalesHistory store, int horizonDays) {
    List<String> out = new ArrayList<>();
    if (backtest.data() != null && backtest.data().seriesCount() != null
        && backtest.data().seriesCount() != store.seriesCount()) {
      out.add("the backtest scored " + backtest.data().seriesCount() + " series, this store has "
          + store.seriesCount() + "; its accuracy describes another set of series");
    }
    if (backtest.data() != null && backtest.data().lastDate() != null
        && backtest.data().lastDate().isAfter(store.dateOf(store.dayCount() - 1))) {
      out.add("the backtest's store ends " + backtest.data().lastDate() + ", after this store's last day "
          + store.dateOf(store.dayCount() - 1));
    }
    if (backtest.horizon() != null && backtest.horizon().model().length != horizonDays) {
      out.add("the backtest scored a horizon of " + backtest.horizon().model().length + " periods, this model "
          + "forecasts " + horizonDays);
    }
    return out;
  }
}
