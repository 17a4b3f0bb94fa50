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
    float[] values = series.readableValues;
    int base = series.lookbackDays;
    // one column at a time: a long inner loop over the rows rather than a short one over the lags
    for (int k = 0; k < lagDays.length; k++) {
      int offset = base - lagDays[k];
      for (int i = 0, out = firstFeatureIndex + k; i < rowCount; i++, out += rowStride) {
        rows[out] = values[offset + dayIndexes[dayOffset + i]];
      }
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
