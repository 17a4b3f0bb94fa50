package org.lagmill.eval;

import java.util.List;
import org.lagmill.store.SalesHistory;

/**
 * Sums bottom series into every aggregate of every level. Streams series by series through one reused unit buffer, so
 * memory is the output table plus one row of units; no long (series × day) table is built.
 *
 * <p>Unknown units ({@link SalesHistory#UNKNOWN_UNITS}) add 0 to every sum and are counted in
 * {@link AggregateTable#unknownCount()}: a missing cell must not make a whole region's total unknown, and the count lets
 * a report say how much of a sum was filled. Bottom-series forecasts are summed the same way (bottom-up
 * reconciliation). Not thread-safe (the unit buffer is shared); use one aggregator per thread.
 */
public final class Aggregator {
  private final List<Level> levels;
  private final int seriesCount;
  private final int[][] aggregateIndexByLevelAndSeries;
  private int[] unitBuffer = new int[0];

  /** @param levels bound levels, all over the same series (see {@link Hierarchy#bind}) */
  public Aggregator(List<Level> levels) {
    if (levels.isEmpty()) {
      throw new IllegalArgumentException("need at least one level, got none");
    }
    this.levels = List.copyOf(levels);
    this.seriesCount = levels.get(0).seriesCount();
    this.aggregateIndexByLevelAndSeries = new int[levels.size()][seriesCount];
    for (int l = 0; l < levels.size(); l++) {
      Level level = levels.get(l);
      if (level.seriesCount() != seriesCount) {
        throw new IllegalArgumentException("level '" + level.name() + "' covers " + level.seriesCount()
            + " series, expected " + seriesCount + " like level '" + levels.get(0).name() + "'");
      }
      for (int s = 0; s < seriesCount; s++) {
        aggregateIndexByLevelAndSeries[l][s] = level.aggregateIndexOf(s);
      }
    }
  }

  public List<Level> levels() {
    return levels;
  }

  public int seriesCount() {
    return seriesCount;
  }

  /** Actual units of every aggregate on days {@code firstDay .. firstDay+dayCount-1}. */
  public AggregateTable aggregateActuals(SalesHistory history, int firstDay, int dayCount) {
    AggregateTable table = AggregateTable.forLevels(levels, dayCount);
    aggregateActualsInto(history, firstDay, dayCount, table);
    return table;
  }

  /**
   * Clears {@code dst} and fills its first {@code dayCount} days; {@code dst} may hold more days (a reused block).
   *
   * @param firstDay {@code >= 0}, with {@code firstDay + dayCount <= history.dayCount()}
   */
  public void aggregateActualsInto(SalesHistory history, int firstDay, int dayCount, AggregateTable dst) {
    if (history.seriesCount() != seriesCount) {
      throw new IllegalArgumentException("history has " + history.seriesCount() + " series, levels cover "
          + seriesCount);
    }
    if (firstDay < 0 || dayCount < 0 || firstDay + dayCount > history.dayCount()) {
      throw new IllegalArgumentException("day range " + firstDay + " + " + dayCount + " outside 0.."
          + history.dayCount() + " of the history");
    }
    checkShape(dst, dayCount);
    dst.clear();
    if (unitBuffer.length < dayCount) {
      unitBuffer = new int[dayCount];
    }
    int[] units = unitBuffer;
    int stride = dst.dayCount();
    long unknown = 0;
    for (int s = 0; s < seriesCount; s++) {
      history.readUnits(s, firstDay, units, 0, dayCount);
      for (int d = 0; d < dayCount; d++) {
        if (units[d] < 0) {
          units[d] = 0;
          unknown++;
        }
      }
      for (int l = 0; l < aggregateIndexByLevelAndSeries.length; l++) {
        double[] values = dst.levelValues(l);
        int base = aggregateIndexByLevelAndSeries[l][s] * stride;
        for (int d = 0; d < dayCount; d++) {
          values[base + d] += units[d];
        }
      }
    }
    dst.addUnknown(unknown);
  }

  /** Bottom-up sums of forecasts given as {@code [seriesIndex][dayOffset]}, every row of the same horizon. */
  public AggregateTable aggregateForecasts(double[][] forecastsBySeries) {
    if (forecastsBySeries.length != seriesCount) {
      throw new IllegalArgumentException("need forecasts for " + seriesCount + " series, got "
          + forecastsBySeries.length);
    }
    int horizon = seriesCount == 0 ? 0 : forecastsBySeries[0].length;
    AggregateTable table = AggregateTable.forLevels(levels, horizon);
    for (int s = 0; s < seriesCount; s++) {
      if (forecastsBySeries[s].length != horizon) {
        throw new IllegalArgumentException("forecast row of series " + s + " has " + forecastsBySeries[s].length
            + " days, expected " + horizon + " like series 0");
      }
      addForecastRow(table, s, forecastsBySeries[s], 0, horizon);
    }
    return table;
  }

  /** Bottom-up sums of forecasts given series-major in one array: {@code flat[seriesIndex * horizon + dayOffset]}. */
  public AggregateTable aggregateForecasts(double[] flat, int horizon) {
    if (horizon < 0 || (long) seriesCount * horizon != flat.length) {
      throw new IllegalArgumentException("need " + seriesCount + " series x " + horizon + " days = "
          + (long) seriesCount * horizon + " forecasts, got " + flat.length);
    }
    AggregateTable table = AggregateTable.forLevels(levels, horizon);
    for (int s = 0; s < seriesCount; s++) {
      addForecastRow(table, s, flat, s * horizon, horizon);
    }
    return table;
  }

  /** Sums one value per bottom series into one value per aggregate: {@code result[level][aggregate]}. */
  public double[][] aggregateValues(double[] valueBySeries) {
    if (valueBySeries.length != seriesCount) {
      throw new IllegalArgumentException("need " + seriesCount + " values, got " + valueBySeries.length);
    }
    double[][] result = new double[levels.size()][];
    for (int l = 0; l < result.length; l++) {
      result[l] = new double[levels.get(l).aggregateCount()];
      for (int s = 0; s < seriesCount; s++) {
        result[l][aggregateIndexByLevelAndSeries[l][s]] += valueBySeries[s];
      }
    }
    return result;
  }

  private void addForecastRow(AggregateTable table, int seriesIndex, double[] row, int offset, int horizon) {
    for (int d = 0; d < horizon; d++) {
      double v = row[offset + d];
      if (!Double.isFinite(v)) {
        throw new IllegalArgumentException("forecast of series " + seriesIndex + " day " + d + " is " + v
            + "; expected a finite number");
      }
    }
    for (int l = 0; l < aggregateIndexByLevelAndSeries.length; l++) {
      double[] values = table.levelValues(l);
      int base = aggregateIndexByLevelAndSeries[l][seriesIndex] * horizon;
      for (int d = 0; d < horizon; d++) {
        values[base + d] += row[offset + d];
      }
    }
  }

  private void checkShape(AggregateTable table, int dayCount) {
    if (table.levelCount() != levels.size() || table.dayCount() < dayCount) {
      throw new IllegalArgumentException("table has " + table.levelCount() + " levels x " + table.dayCount()
          + " days; expected " + levels.size() + " levels and >= " + dayCount + " days");
    }
    for (int l = 0; l < levels.size(); l++) {
      if (table.aggregateCount(l) != levels.get(l).aggregateCount()) {
        throw new IllegalArgumentException("table level " + l + " has " + table.aggregateCount(l)
            + " aggregates, expected " + levels.get(l).aggregateCount());
      }
    }
  }
}
