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
  public void compute(SeriesContext series, FeatureBatch batch, int batchRow, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int[] lags = lagDays;
    for (int i = 0; i < rowCount; i++) {
      int day = dayIndexes[dayOffset + i];
      int row = batchRow + i;
      for (int k = 0; k < lags.length; k++) {
        batch.set(row, firstFeatureIndex + k, series.unitsOrNaN(day - lags[k]));
      }
    }
  }
}
