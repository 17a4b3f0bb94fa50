package org.lagmill.features;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * Price features of the row's day. NaN wherever the day's price is missing (before the series' first price).
 * <ul>
 *   <li>{@code price}: the shelf price;
 *   <li>{@code price_to_mean}: price / the series' mean price, the unweighted mean of all its change-point prices (the
 *       store keeps no repeated price except a last point marking how far the price file reached);
 *   <li>{@code price_to_max}: price / the series' regular price;
 *   <li>{@code price_change_7}: price / price 7 days earlier − 1 (in a store of longer periods: one period earlier);
 *   <li>{@code promo}: 1 when the price is below the regular price, else 0;
 *   <li>{@code price_to_group}: price / the mean price that day over the series of its group (series sharing the
 *       values of the price group attributes) that have a price that day.
 * </ul>
 * The regular price is the largest change-point price in the series' whole price table, including announced prices
 * past the last sales day: shelf prices are planned ahead, so this reads no future sales, and one definition serves
 * training and forecasting alike. Means and maxima over change points rather than days keep a feature independent of
 * how many days a pass covers.
 *
 * <p>Memory: the group means are tabulated once per pass, {@code 4 × groups × days} heap bytes for the pass's day
 * range (plus as much again while they are summed).
 */
final class PriceKernel implements FeatureKernel {
  private static final int CHANGE_LAG_DAYS = 7;

  private final int changeLagPeriods;
  private final List<FeatureSpec.PriceFeature> features;
  private final int[] featureCodes;
  private final PriceTable prices;
  private final int[] groupBySeries;
  private final int tableFirstDayIndex;
  private final int tableDayCount;
  private final float[] groupMeanPrices;
  private float seriesMeanPrice;
  private float seriesRegularPrice;
  private int groupOffset;

  /**
   * @param groupAttributeIndexes attributes forming price groups; empty drops {@code price_to_group}
   */
  PriceKernel(SalesHistory history, List<FeatureSpec.PriceFeature> requested, int[] groupAttributeIndexes,
      int firstDayIndex, int endDayIndex) {
    this.features = groupAttributeIndexes.length == 0
        ? requested.stream().filter(f -> f != FeatureSpec.PriceFeature.PRICE_TO_GROUP).toList()
        : List.copyOf(requested);
    this.featureCodes = features.stream().mapToInt(Enum::ordinal).toArray();
    this.prices = history.prices();
    this.changeLagPeriods = Math.max(1, CHANGE_LAG_DAYS / history.periodDays());
    this.tableFirstDayIndex = firstDayIndex;
    this.tableDayCount = Math.max(0, endDayIndex - firstDayIndex);
    if (features.contains(FeatureSpec.PriceFeature.PRICE_TO_GROUP)) {
      this.groupBySeries = groupsOf(history.attributes(), history.seriesCount(), groupAttributeIndexes);
      this.groupMeanPrices = groupMeans(history, groupBySeries, firstDayIndex, tableDayCount);
    } else {
      this.groupBySeries = new int[0];
      this.groupMeanPrices = new float[0];
    }
  }

  private static int[] groupsOf(SeriesAttributes attributes, int seriesCount, int[] attributeIndexes) {
    Map<String, Integer> groupByKey = new HashMap<>();
    int[] groups = new int[seriesCount];
    StringBuilder key = new StringBuilder();
    for (int s = 0; s < seriesCount; s++) {
      key.setLength(0);
      for (int a : attributeIndexes) {
        key.append(attributes.code(s, a)).append('/');
      }
      groups[s] = groupByKey.computeIfAbsent(key.toString(), k -> groupByKey.size());
    }
    return groups;
  }

  private static float[] groupMeans(SalesHistory history, int[] groupBySeries, int firstDayIndex, int dayCount) {
    int groupCount = 0;
    for (int g : groupBySeries) {
      groupCount = Math.max(groupCount, g + 1);
    }
    long cellCount = (long) groupCount * dayCount;
    if (cellCount > Integer.MAX_VALUE - 8) {
      throw new InvalidRequestException("price groups × days = " + cellCount + " exceeds " + (Integer.MAX_VALUE - 8)
          + "; use coarser priceGroupAttributes or a shorter training window");
    }
    double[] sums = new double[(int) cellCount];
    int[] counts = new int[(int) cellCount];
    float[] seriesPrices = new float[dayCount];
    for (int s = 0; s < groupBySeries.length; s++) {
      history.prices().readPrices(s, firstDayIndex, seriesPrices, 0, dayCount);
      int offset = groupBySeries[s] * dayCount;
      for (int d = 0; d < dayCount; d++) {
        float p = seriesPrices[d];
        if (!Float.isNaN(p)) {
          sums[offset + d] += p;
          counts[offset + d]++;
        }
      }
    }
    float[] means = new float[(int) cellCount];
    for (int i = 0; i < means.length; i++) {
      means[i] = counts[i] == 0 ? Float.NaN : (float) (sums[i] / counts[i]);
    }
    return means;
  }

  /** Heap bytes of the group mean table. */
  long heapBytes() {
    return 4L * groupMeanPrices.length + 4L * groupBySeries.length;
  }

  @Override
  public int featureCount() {
    return featureCodes.length;
  }

  @Override
  public void describe(List<String> names, List<Boolean> categorical) {
    for (FeatureSpec.PriceFeature feature : features) {
      names.add(feature.configName());
      categorical.add(false);
    }
  }

  @Override
  public void beginSeries(SeriesContext series) {
    int s = series.seriesIndex;
    int changeCount = prices.changeCount(s);
    double sum = 0;
    int count = 0;
    float max = Float.NaN;
    for (int k = 0; k < changeCount; k++) {
      float p = prices.changePrice(s, k);
      if (!Float.isNaN(p)) {
        sum += p;
        count++;
        max = Float.isNaN(max) ? p : Math.max(max, p);
      }
    }
    seriesMeanPrice = count == 0 ? Float.NaN : (float) (sum / count);
    seriesRegularPrice = max;
    groupOffset = groupBySeries.length == 0 ? 0 : groupBySeries[s] * tableDayCount - tableFirstDayIndex;
  }

  @Override
  public void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    float[] dayPrices = series.prices;
    float mean = seriesMeanPrice;
    float regular = seriesRegularPrice;
    // one column at a time so the choice of formula is made once per chunk, not per value
    for (int k = 0; k < featureCodes.length; k++) {
      int out = firstFeatureIndex + k;
      int end = dayOffset + rowCount;
      switch (featureCodes[k]) {
        case 0 :
          for (int j = dayOffset; j < end; j++, out += rowStride) {
            rows[out] = dayPrices[dayIndexes[j]];
          }
          break;
        case 1 :
          for (int j = dayOffset; j < end; j++, out += rowStride) {
            rows[out] = dayPrices[dayIndexes[j]] / mean;
          }
          break;
        case 2 :
          for (int j = dayOffset; j < end; j++, out += rowStride) {
            rows[out] = dayPrices[dayIndexes[j]] / regular;
          }
          break;
        case 3 :
          for (int j = dayOffset; j < end; j++, out += rowStride) {
            int day = dayIndexes[j];
            float before = day >= changeLagPeriods ? dayPrices[day - changeLagPeriods] : Float.NaN;
            rows[out] = before > 0 ? dayPrices[day] / before - 1f : Float.NaN;
          }
          break;
        case 4 :
          for (int j = dayOffset; j < end; j++, out += rowStride) {
            float price = dayPrices[dayIndexes[j]];
            rows[out] = Float.isNaN(price) ? Float.NaN : (price < regular ? 1f : 0f);
          }
          break;
        case 5 : {
          float[] groupMeans = groupMeanPrices;
          int groupOffset = this.groupOffset;
          for (int j = dayOffset; j < end; j++, out += rowStride) {
            int day = dayIndexes[j];
            rows[out] = dayPrices[day] / groupMeans[groupOffset + day];
          }
          break;
        }
        default :
          throw new AssertionError(featureCodes[k]);
      }
    }
  }
}
