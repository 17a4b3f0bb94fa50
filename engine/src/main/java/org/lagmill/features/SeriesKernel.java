package org.lagmill.features;

import java.util.List;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * Series features: attribute codes as categorical columns ({@code attr_<name>}), and, reading units no later than
 * {@code t − shift} where {@code shift} is the spec's shortest lag or rolling shift:
 * <ul>
 *   <li>{@code days_since_first_sale}: {@code t − firstSale}, NaN unless the first sale lies on or before
 *       {@code t − shift} (otherwise the feature would reveal a launch the model cannot yet have seen);
 *   <li>{@code zero_run_shift_<shift>}: the number of consecutive known zero days ending at day {@code t − shift}
 *       (0 when that day sold); NaN when that day is not readable (unknown, pre-launch or past the history). An unknown
 *       day ends the run.
 * </ul>
 */
final class SeriesKernel implements FeatureKernel {
  private final int[] attributeIndexes;
  private final String[] attributeNames;
  private final boolean daysSinceFirstSale;
  private final boolean zeroRun;
  private final int shiftDays;
  private boolean zeroRunStarted;
  private int zeroRunEndDayIndex;
  private int zeroRunDays;

  SeriesKernel(SeriesAttributes attributes, int[] attributeIndexes, List<FeatureSpec.SeriesFeature> features,
      int shiftDays) {
    this.attributeIndexes = attributeIndexes.clone();
    this.attributeNames = new String[attributeIndexes.length];
    for (int i = 0; i < attributeIndexes.length; i++) {
      attributeNames[i] = attributes.attributeName(attributeIndexes[i]);
    }
    this.daysSinceFirstSale = features.contains(FeatureSpec.SeriesFeature.DAYS_SINCE_FIRST_SALE);
    this.zeroRun = features.contains(FeatureSpec.SeriesFeature.ZERO_RUN);
    this.shiftDays = shiftDays;
  }

  @Override
  public int featureCount() {
    return attributeIndexes.length + (daysSinceFirstSale ? 1 : 0) + (zeroRun ? 1 : 0);
  }

  @Override
  public void describe(List<String> names, List<Boolean> categorical) {
    for (String name : attributeNames) {
      names.add("attr_" + name);
      categorical.add(true);
    }
    if (daysSinceFirstSale) {
      names.add("days_since_first_sale");
      categorical.add(false);
    }
    if (zeroRun) {
      names.add("zero_run_shift_" + shiftDays);
      categorical.add(false);
    }
  }

  @Override
  public void beginSeries(SeriesContext series) {
    zeroRunStarted = false;
  }

  @Override
  public void compute(SeriesContext series, FeatureBatch batch, int batchRow, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int attributeCount = attributeIndexes.length;
    int firstSale = series.firstSaleDayIndex;
    for (int i = 0; i < rowCount; i++) {
      int day = dayIndexes[dayOffset + i];
      int row = batchRow + i;
      for (int a = 0; a < attributeCount; a++) {
        batch.set(row, firstFeatureIndex + a, series.attributeCodes[attributeIndexes[a]]);
      }
      int column = firstFeatureIndex + attributeCount;
      int readDay = day - shiftDays;
      if (daysSinceFirstSale) {
        boolean seen = firstSale != SalesHistory.NO_SALE && firstSale <= readDay;
        batch.set(row, column++, seen ? day - firstSale : Float.NaN);
      }
      if (zeroRun) {
        advanceZeroRun(series, readDay);
        batch.set(row, column, series.isReadable(readDay) ? zeroRunDays : Float.NaN);
      }
    }
  }

  private void advanceZeroRun(SeriesContext series, int endDayIndex) {
    if (!zeroRunStarted || endDayIndex < zeroRunEndDayIndex) {
      // first row of the series: count backwards once, then extend day by day
      zeroRunDays = 0;
      for (int d = endDayIndex; isZero(series, d); d--) {
        zeroRunDays++;
      }
      zeroRunStarted = true;
    } else {
      for (int d = zeroRunEndDayIndex + 1; d <= endDayIndex; d++) {
        zeroRunDays = isZero(series, d) ? zeroRunDays + 1 : 0;
      }
    }
    zeroRunEndDayIndex = endDayIndex;
  }

  private static boolean isZero(SeriesContext series, int dayIndex) {
    return series.isReadable(dayIndex) && series.units[dayIndex] == 0;
  }
}
