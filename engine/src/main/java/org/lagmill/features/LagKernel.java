package org.lagmill.features;

import java.util.List;

/** Units {@code lag} days before the row's day ({@code lag_<days>}); NaN when that day is not readable. */
final class LagKernel implements FeatureKernel {
  private final int[] lagDays;

  LagKernel(int[] lagDays) {
    this.lagDays = lagDays.clone();
  }

  @Override
  public int featureCount() {
    return lagDays.length;
  }

  @Override
  public void describe(List<String> names, List<Boolean> categorical) {
    for (int lag : lagDays) {
      names.add("lag_" + lag);
      categorical.add(false);
    }
  }

  @Override
  public void beginSeries(SeriesContext series) {}

  @Override
  public void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int[] lags = lagDays;
    int lagCount = lags.length;
    float[] values = series.readableValues;
    int pad = series.lookbackDays;
    int out = firstFeatureIndex;
    for (int i = 0; i < rowCount; i++) {
      int base = pad + dayIndexes[dayOffset + i];
      for (int k = 0; k < lagCount; k++) {
        rows[out + k] = values[base - lags[k]];
      }
      out += rowStride;
    }
  }

  /** The farthest day before a row's day this kernel reads. */
  int lookbackDays() {
    int longest = 0;
    for (int lag : lagDays) {
      longest = Math.max(longest, lag);
    }
    return longest;
  }
}
