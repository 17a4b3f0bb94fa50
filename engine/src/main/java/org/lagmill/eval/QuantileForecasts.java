package org.lagmill.eval;

/**
 * Quantile forecasts of every aggregate: one {@link AggregateTable} per quantile level. Build them per aggregate when
 * the forecaster produces them ({@link #ofAggregates}); {@link #bottomUp} is the simple default and only an
 * approximation: a sum of bottom quantiles is not the quantile of the sum (it overstates the spread of aggregates
 * whose series are not perfectly correlated). Immutable after construction.
 */
public final class QuantileForecasts {
  private final double[] quantileLevels;
  private final AggregateTable[] tables;

  private QuantileForecasts(double[] quantileLevels, AggregateTable[] tables) {
    if (quantileLevels.length == 0 || quantileLevels.length != tables.length) {
      throw new IllegalArgumentException("need one table per quantile level, got " + quantileLevels.length
          + " levels and " + tables.length + " tables");
    }
    for (double tau : quantileLevels) {
      if (!(tau > 0 && tau < 1)) {
        throw new IllegalArgumentException("quantile level " + tau + " outside (0, 1)");
      }
    }
    for (AggregateTable table : tables) {
      if (table.dayCount() != tables[0].dayCount() || table.levelCount() != tables[0].levelCount()) {
        throw new IllegalArgumentException("every quantile table needs the same levels and horizon");
      }
    }
    this.quantileLevels = quantileLevels.clone();
    this.tables = tables.clone();
  }

  /** @param tablesByQuantile {@code tablesByQuantile[q]} holds quantile {@code quantileLevels[q]} of each aggregate */
  public static QuantileForecasts ofAggregates(double[] quantileLevels, AggregateTable[] tablesByQuantile) {
    return new QuantileForecasts(quantileLevels, tablesByQuantile);
  }

  /**
   * Sums bottom quantiles up the hierarchy (an approximation, see the class note).
   *
   * @param bottom {@code bottom[q][seriesIndex][dayOffset]}
   */
  public static QuantileForecasts bottomUp(Aggregator aggregator, double[] quantileLevels, double[][][] bottom) {
    if (bottom.length != quantileLevels.length) {
      throw new IllegalArgumentException("need " + quantileLevels.length + " quantile slices, got " + bottom.length);
    }
    AggregateTable[] tables = new AggregateTable[bottom.length];
    for (int q = 0; q < bottom.length; q++) {
      tables[q] = aggregator.aggregateForecasts(bottom[q]);
    }
    return new QuantileForecasts(quantileLevels, tables);
  }

  public int quantileCount() {
    return quantileLevels.length;
  }

  public double quantileLevel(int quantileIndex) {
    return quantileLevels[quantileIndex];
  }

  public AggregateTable table(int quantileIndex) {
    return tables[quantileIndex];
  }

  public int horizon() {
    return tables[0].dayCount();
  }
}
