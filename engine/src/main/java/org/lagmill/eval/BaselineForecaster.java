package org.lagmill.eval;

import java.util.stream.IntStream;
import org.lagmill.store.SalesHistory;

/** Runs a {@link BaselineKind} over every series of a history; aggregate the result with {@link Aggregator}. */
public final class BaselineForecaster {
  private BaselineForecaster() {}

  /**
   * Forecasts days {@code originDay .. originDay+horizon-1} of every series from days before the origin only.
   *
   * @param originDay {@code 1 .. history.dayCount()}; days from the origin on are never read
   * @return {@code [seriesIndex][dayOffset]}, non-negative
   */
  public static double[][] forecastAll(SalesHistory history, int originDay, int horizon, BaselineKind kind) {
    if (originDay < 1 || originDay > history.dayCount()) {
      throw new IllegalArgumentException("originDay " + originDay + " outside 1.." + history.dayCount());
    }
    if (horizon < 1) {
      throw new IllegalArgumentException("horizon must be >= 1, got " + horizon);
    }
    double[][] result = new double[history.seriesCount()][horizon];
    int seasonLength = history.seasonLength();
    if (kind == BaselineKind.ETS) {
      // Fitting costs milliseconds per series, so the series are shared among the cores (a history is safe for
      // concurrent reads); each worker owns its fitter and buffer, and every series' result is the same in any order.
      int workerCount = Math.max(1, Math.min(result.length, 4 * Runtime.getRuntime().availableProcessors()));
      IntStream.range(0, workerCount).parallel().forEach(worker -> {
        EtsFitter fitter = new EtsFitter(seasonLength);
        int[] units = new int[originDay];
        for (int s = worker; s < result.length; s += workerCount) {
          history.readUnits(s, 0, units, 0, originDay);
          fitter.forecastUnits(units, 0, originDay, horizon, result[s], 0);
        }
      });
      return result;
    }
    int[] units = new int[originDay];
    for (int s = 0; s < result.length; s++) {
      history.readUnits(s, 0, units, 0, originDay);
      kind.forecast(units, 0, originDay, horizon, seasonLength, result[s], 0);
    }
    return result;
  }
}
