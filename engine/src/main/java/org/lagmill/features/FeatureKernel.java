package org.lagmill.features;

import java.util.List;

/**
 * One family of feature columns (lags, rolling windows, calendar, price, series). The pass calls
 * {@link #beginSeries} once per series, then {@link #compute} for consecutive chunks of that series' rows, in
 * ascending day order; a chunk ends where the batch fills. Implementations keep their per-series running state in
 * fields allocated once, so nothing is allocated per row or per series.
 */
interface FeatureKernel {
  int featureCount();

  /** Appends this kernel's column names and categorical flags, in column order. */
  void describe(List<String> names, List<Boolean> categorical);

  void beginSeries(SeriesContext series);

  /**
   * Writes the kernel's columns of {@code rowCount} rows.
   *
   * @param batchRow batch row of the first row in this chunk
   * @param dayIndexes day of each row of the series, ascending; this chunk is {@code [dayOffset, dayOffset + rowCount)}
   * @param firstFeatureIndex batch column of this kernel's first feature
   */
  void compute(SeriesContext series, FeatureBatch batch, int batchRow, int[] dayIndexes, int dayOffset, int rowCount,
      int firstFeatureIndex);
}
