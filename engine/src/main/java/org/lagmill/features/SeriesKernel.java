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
  public void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int attributeCount = attributeIndexes.length;
    int out = firstFeatureIndex;
    for (int a = 0; a < attributeCount; a++) {
      float code = series.attributeCodes[attributeIndexes[a]];
      for (int i = 0, o = out + a; i < rowCount; i++, o += rowStride) {
        rows[o] = code;
      }
    }
    out += attributeCount;
    int firstSale = series.firstSaleDayIndex;
    if (daysSinceFirstSale) {
      for (int i = 0, o = out; i < rowCount; i++, o += rowStride) {
        int day = dayIndexes[dayOffset + i];
        boolean seen = firstSale != SalesHistory.NO_SALE && firstSale <= day - shiftDays;
        rows[o] = seen ? day - firstSale : Float.NaN;
      }
      out++;
    }
    if (zeroRun) {
      int[] readable = series.readableUnits;
      // zero runs are followed in the padded day coordinates of readableUnits
      int endOffset = series.lookbackDays - shiftDays;
      for (int i = 0, o = out; i < rowCount; i++, o += rowStride) {
        int readDay = dayIndexes[dayOffset + i] + endOffset;
        if (zeroRunStarted && readDay == zeroRunEndDayIndex + 1) {
          // the common step, one day on
          zeroRunDays = readable[readDay] == 0 ? zeroRunDays + 1 : 0;
          zeroRunEndDayIndex = readDay;
        } else {
          advanceZeroRun(readable, readDay);
        }
        rows[o] = readable[readDay] >= 0 ? zeroRunDays : Float.NaN;
      }
    }
  }

  /** The farthest day before a row's day this kernel reads. */
  int lookbackDays() {
    return zeroRun ? shiftDays : 0;
  }

  private void advanceZeroRun(int[] readable, int endDayIndex) {
    if (!zeroRunStarted || endDayIndex < zeroRunEndDayIndex) {
      // first row of the series: count backwards once, then extend day by day; day −1 is never readable, so the
      // backward count stops inside the padding
      zeroRunDays = 0;
      for (int d = endDayIndex; readable[d] == 0; d--) {
        zeroRunDays++;
      }
      zeroRunStarted = true;
    } else {
      for (int d = zeroRunEndDayIndex + 1; d <= endDayIndex; d++) {
        zeroRunDays = readable[d] == 0 ? zeroRunDays + 1 : 0;
      }
    }
    zeroRunEndDayIndex = endDayIndex;
  }
}
