package org.lagmill.report;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.lagmill.eval.AggregateTable;
import org.lagmill.eval.Aggregator;
import org.lagmill.eval.IntervalAggregation;
import org.lagmill.eval.Level;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.store.SalesHistory;

/**
 * Charts of actual against forecast with an interval band: for the largest aggregate of each level (by units over the
 * shown history) and for series the user names. Aggregate bands come from the summed means and variances of the
 * series' count distributions, as in the scored intervals.
 */
public final class SeriesChartBuilder {
  /** Days of history shown before the forecast origin. */
  public static final int DEFAULT_CONTEXT_DAYS = 56;
  static final double LOWER_QUANTILE = 0.025;
  static final double UPPER_QUANTILE = 0.975;

  private SeriesChartBuilder() {}

  /**
   * @param originDayIndex first forecast day; actuals are drawn where the history has them (a backtest) and left
   *     blank past its end (a forward forecast)
   * @param point {@code [seriesIndex][dayOffset]} point forecasts from the origin
   * @param shownSeriesIds extra bottom series to chart, by series id
   */
  public static List<SeriesChart> build(SalesHistory history, List<Level> levels, int originDayIndex,
      double[][] point, float[] alphas, int contextDays, List<String> shownSeriesIds) {
    int horizon = point[0].length;
    int firstDay = Math.max(0, originDayIndex - contextDays);
    int shownDays = originDayIndex + horizon - firstDay;
    int knownDays = Math.min(history.dayCount(), originDayIndex + horizon) - firstDay;
    Aggregator aggregator = new Aggregator(levels);
    AggregateTable actual = aggregator.aggregateActuals(history, firstDay, knownDays);
    IntervalAggregation.Distribution forecast = IntervalAggregation.distribution(aggregator, point, alphas);
    List<LocalDate> dates = new ArrayList<>();
    for (int d = 0; d < shownDays; d++) {
      dates.add(history.dateOf(firstDay + d));
    }
    List<SeriesChart> charts = new ArrayList<>();
    for (int l = 0; l < levels.size(); l++) {
      Level level = levels.get(l);
      int top = largestAggregate(actual, l, originDayIndex - firstDay);
      String title = level.attributeNames().isEmpty() ? "total" : level.name() + ": " + level.aggregateName(top);
      charts.add(chart(title, dates, actual, l, top, knownDays, forecast, originDayIndex - firstDay, horizon));
    }
    Level bottom = levels.get(levels.size() - 1);
    for (String id : shownSeriesIds) {
      int series = history.attributes().seriesIndexOf(id);
      if (series < 0) {
        throw new InvalidRequestException(Setting.SHOWN_SERIES + " " + id + ": no such series in the store");
      }
      if (bottom.isBottom()) {
        int aggregate = bottom.aggregateIndexOf(series);
        charts.add(chart("series " + id, dates, actual, levels.size() - 1, aggregate, knownDays, forecast,
            originDayIndex - firstDay, horizon));
      }
    }
    return charts;
  }

  private static SeriesChart chart(String title, List<LocalDate> dates, AggregateTable actual, int level,
      int aggregate, int knownDays, IntervalAggregation.Distribution forecastDistribution, int originIndex,
      int horizon) {
    int shownDays = dates.size();
    double[] actualValues = new double[shownDays];
    double[] forecast = new double[shownDays];
    double[] lower = new double[shownDays];
    double[] upper = new double[shownDays];
    Arrays.fill(actualValues, Double.NaN);
    Arrays.fill(forecast, Double.NaN);
    Arrays.fill(lower, Double.NaN);
    Arrays.fill(upper, Double.NaN);
    for (int d = 0; d < knownDays; d++) {
      actualValues[d] = actual.get(level, aggregate, d);
    }
    for (int d = 0; d < horizon; d++) {
      forecast[originIndex + d] = forecastDistribution.means().get(level, aggregate, d);
      lower[originIndex + d] = forecastDistribution.quantile(level, aggregate, d, LOWER_QUANTILE);
      upper[originIndex + d] = forecastDistribution.quantile(level, aggregate, d, UPPER_QUANTILE);
    }
    return new SeriesChart(title, dates, actualValues, forecast, lower, upper, LOWER_QUANTILE, UPPER_QUANTILE,
        originIndex);
  }

  static int largestAggregate(AggregateTable actual, int level, int dayCount) {
    int best = 0;
    double bestTotal = -1;
    for (int a = 0; a < actual.aggregateCount(level); a++) {
      double total = 0;
      for (int d = 0; d < Math.min(dayCount, actual.dayCount()); d++) {
        total += actual.get(level, a, d);
      }
      if (total > bestTotal) {
        bestTotal = total;
        best = a;
      }
    }
    return best;
  }
}
