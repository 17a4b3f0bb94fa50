package org.lagmill.forecast;

import java.util.Locale;
import org.lagmill.store.SalesHistory;

/**
 * Forecasts of every series of a store for consecutive days: point forecasts and, optionally, quantiles.
 *
 * @param firstDayIndex store day index of the first forecast day (the store's dayCount for a forward forecast)
 * @param point {@code [seriesIndex][dayOffset]} expected units; a row of NaN for a series not forecast
 * @param quantileLevels probabilities of the quantile columns, ascending; empty without intervals
 * @param quantiles {@code [quantileIndex][seriesIndex][dayOffset]}
 */
public record ForecastTable(int firstDayIndex, double[][] point, double[] quantileLevels, double[][][] quantiles) {
  private static final double[] PUBLISHED_QUANTILES = {0.005, 0.025, 0.165, 0.25, 0.5, 0.75, 0.835, 0.975, 0.995};

  /** The nine quantiles the weighted scaled pinball loss is published with (a fresh copy). */
  public static double[] publishedQuantiles() {
    return PUBLISHED_QUANTILES.clone();
  }

  public int horizonDays() {
    return point.length == 0 ? 0 : point[0].length;
  }

  /**
   * Sets the point forecast and every quantile to 0 on each horizon day a series is declared closed (a series
   * cannot sell while closed); the forecast file marks those days.
   *
   * @return the series-days set to 0
   */
  /** What a forecast says when {@link #zeroClosedDays} set {@code closedSeriesDays > 0} series-days to 0. */
  public static String closedDaysNote(long closedSeriesDays) {
    return "forecast 0 for " + closedSeriesDays + " series-days declared closed (marked in the forecast file's closed "
        + "column)";
  }

  public long zeroClosedDays(SalesHistory history) {
    if (history.closures().isEmpty()) {
      return 0;
    }
    long count = 0;
    for (int s = 0; s < point.length; s++) {
      if (Double.isNaN(point[s][0])) {
        continue;
      }
      for (int d = 0; d < point[s].length; d++) {
        if (history.isClosed(s, firstDayIndex + d)) {
          point[s][d] = 0;
          for (double[][] quantile : quantiles) {
            quantile[s][d] = 0;
          }
          count++;
        }
      }
    }
    return count;
  }

  /** Column name of a quantile, e.g. {@code q0.025}. */
  public static String quantileColumn(double level) {
    String text = String.format(Locale.ROOT, "%.6f", level).replaceAll("0+$", "");
    return "q" + (text.endsWith(".") ? text + "0" : text);
  }
}
