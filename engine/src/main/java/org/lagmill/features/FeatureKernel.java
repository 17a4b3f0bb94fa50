package org.lagmill.features;

import java.util.List;

/**
 * One family of feature columns (lags, rolling windows, calendar, price, series). The pass calls
 * {@link #beginSeries} once per series, then {@link #compute} for consecutive chunks of that series' rows, in
 * ascending day order; a chunk ends where the batch or the pass's staging strip fills. Implementations keep their per-series running state in
 * fields allocated once, so nothing is allocated per row or per series.
 */
interface FeatureKernel {
  int featureCount();

  /** Appends this kernel's column names and categorical flags, in column order. */
  void describe(List<String> names, List<Boolean> categorical);

  void beginSeries(SeriesContext series);

  /**
   * Writes the kernel's columns of {@code rowCount} rows into a row-major heap strip that the pass then copies into
   * the batch in bulk: row {@code i} of the chunk, kernel column {@code k} goes to
   * {@code rows[i * rowStride + firstFeatureIndex + k]}.
   *
   * @param rows the pass's staging strip, at least {@code rowCount * rowStride} floats
   * @param rowStride floats per row (the schema's feature count)
   * @param dayIndexes day of each row of the series, ascending; this chunk is {@code [dayOffset, dayOffset + rowCount)}
   * @param firstFeatureIndex column of this kernel's first feature
   */
  void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset, int rowCount,
      int firstFeatureIndex);
}
