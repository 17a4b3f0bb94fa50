package org.lagmill.features;

import java.time.LocalDate;
import java.time.temporal.IsoFields;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The slow obvious reference: a long table with one object per series-day, and each feature computed from it by a
 * direct loop over its window every time, following the definitions in the kernels' documentation.
 */
final class SlowFeatures {
  /** One series-day; units -1 when unknown or past the history, price NaN when none. */
  record Cell(int seriesIndex, int dayIndex, int units, float price) {}

  private final RandomStore store;
  private final int salesDayCount;
  private final Map<Long, Cell> cells = new HashMap<>();
  private final int[] firstSale;

  SlowFeatures(RandomStore store, boolean withPrices) {
    this.store = store;
    this.salesDayCount = store.units.length == 0 ? 0 : store.units[0].length;
    int seriesCount = store.units.length;
    firstSale = new int[seriesCount];
    for (int s = 0; s < seriesCount; s++) {
      firstSale[s] = -1;
      for (int d = 0; d < store.calendarDayCount; d++) {
        int u = d < salesDayCount ? store.units[s][d] : -1;
        cells.put(key(s, d), new Cell(s, d, u, withPrices ? priceOf(s, d) : Float.NaN));
        if (u > 0 && firstSale[s] < 0) {
          firstSale[s] = d;
        }
      }
    }
  }

  private static long key(int s, int d) {
    return ((long) s << 32) | (d & 0xffffffffL);
  }

  private float priceOf(int s, int d) {
    float price = Float.NaN;
    for (int k = 0; k < store.changeDays[s].length; k++) {
      if (store.changeDays[s][k] <= d) {
        price = store.changePrices[s][k];
      }
    }
    return price;
  }

  int firstSale(int s) {
    return firstSale[s];
  }

  boolean readable(int s, int d) {
    Cell cell = cells.get(key(s, d));
    return cell != null && d < salesDayCount && cell.units() >= 0 && firstSale[s] >= 0 && d >= firstSale[s];
  }

  int unitsAt(int s, int d) {
    return cells.get(key(s, d)).units();
  }

  float price(int s, int d) {
    Cell cell = cells.get(key(s, d));
    return cell == null ? Float.NaN : cell.price();
  }

  /** Training rows in stream order: {series, day} pairs. */
  List<int[]> trainingRows(FeatureSpec spec, int firstDay, int lastDay) {
    List<int[]> rows = new ArrayList<>();
    int longestLag = spec.launchSkipDays();
    for (int s = 0; s < store.units.length; s++) {
      for (int d = firstDay; d <= lastDay; d++) {
        if (spec.skipPreLaunch() && (firstSale[s] < 0 || d < firstSale[s] + longestLag)) {
          continue;
        }
        if (unitsAt(s, d) < 0) {
          continue;
        }
        rows.add(new int[] {s, d});
      }
    }
    return rows;
  }

  double value(String name, int s, int d) {
    if (name.startsWith("lag_")) {
      int lag = Integer.parseInt(name.substring(4));
      return readable(s, d - lag) ? unitsAt(s, d - lag) : Double.NaN;
    }
    if (name.startsWith("roll_")) {
      String[] parts = name.substring(5).split("_");
      int n = parts.length;
      int shift = Integer.parseInt(parts[n - 1]);
      int window = Integer.parseInt(parts[n - 3]);
      String stat = String.join("_", java.util.Arrays.copyOf(parts, n - 3));
      return rolling(stat, s, d - shift - window + 1, d - shift);
    }
    LocalDate date = RandomStore.FIRST_DATE.plusDays(d);
    switch (name) {
      case "day_of_week" :
        return date.getDayOfWeek().getValue() - 1;
      case "day_of_month" :
        return date.getDayOfMonth();
      case "month" :
        return date.getMonthValue();
      case "week_of_year" :
        return date.get(IsoFields.WEEK_OF_WEEK_BASED_YEAR);
      case "day_of_year" :
        return date.getDayOfYear();
      case "cal_event" :
        return d < store.calendarDayCount ? store.eventFlag[d] : Double.NaN;
      case "cal_event_type" :
        return d < store.calendarDayCount ? store.eventType[d] : Double.NaN;
      case "cal_payday" :
        return d < store.calendarDayCount ? store.payday[store.regionCode(s)][d] : Double.NaN;
      default :
        break;
    }
    if (name.startsWith("price") || name.equals("promo")) {
      return priceFeature(name, s, d);
    }
    if (name.startsWith("attr_")) {
      String attribute = name.substring(5);
      int a = java.util.Arrays.asList(RandomStore.ATTRIBUTES).indexOf(attribute);
      return store.history.attributes().codeOf(a, store.attributeValues[s][a]);
    }
    if (name.equals("days_since_first_sale")) {
      throw new IllegalArgumentException("needs the shift: use daysSinceFirstSale");
    }
    if (name.startsWith("zero_run_shift_")) {
      int end = d - Integer.parseInt(name.substring("zero_run_shift_".length()));
      if (!readable(s, end)) {
        return Double.NaN;
      }
      int run = 0;
      for (int x = end; readable(s, x) && unitsAt(s, x) == 0; x--) {
        run++;
      }
      return run;
    }
    throw new IllegalArgumentException("no reference for " + name);
  }

  double daysSinceFirstSale(int s, int d, int shift) {
    return firstSale[s] >= 0 && firstSale[s] <= d - shift ? d - firstSale[s] : Double.NaN;
  }

  private double rolling(String stat, int s, int from, int to) {
    List<Integer> values = new ArrayList<>();
    for (int x = from; x <= to; x++) {
      if (readable(s, x)) {
        values.add(unitsAt(s, x));
      }
    }
    int n = values.size();
    if (n == 0) {
      return Double.NaN;
    }
    double mean = values.stream().mapToDouble(Integer::doubleValue).sum() / n;
    switch (stat) {
      case "mean" :
        return mean;
      case "std" : {
        if (n < 2) {
          return Double.NaN;
        }
        double squares = 0;
        for (int v : values) {
          squares += (v - mean) * (v - mean);
        }
        return Math.sqrt(squares / (n - 1));
      }
      case "min" :
        return values.stream().mapToInt(Integer::intValue).min().getAsInt();
      case "max" :
        return values.stream().mapToInt(Integer::intValue).max().getAsInt();
      case "zero_share" :
        return values.stream().filter(v -> v == 0).count() / (double) n;
      default :
        throw new IllegalArgumentException(stat);
    }
  }

  private double priceFeature(String name, int s, int d) {
    double price = price(s, d);
    double sum = 0;
    int count = 0;
    double max = Double.NaN;
    for (float p : store.changePrices[s]) {
      if (!Float.isNaN(p)) {
        sum += p;
        count++;
        max = Double.isNaN(max) ? p : Math.max(max, p);
      }
    }
    double mean = count == 0 ? Double.NaN : sum / count;
    switch (name) {
      case "price" :
        return price;
      case "price_to_mean" :
        return price / mean;
      case "price_to_max" :
        return price / max;
      case "price_change_7" : {
        double before = d >= 7 ? price(s, d - 7) : Double.NaN;
        return before > 0 ? price / before - 1 : Double.NaN;
      }
      case "promo" :
        return Double.isNaN(price) ? Double.NaN : price < max ? 1 : 0;
      case "price_to_group" : {
        double groupSum = 0;
        int groupCount = 0;
        for (int o = 0; o < store.units.length; o++) {
          boolean sameGroup = store.attributeValues[o][2].equals(store.attributeValues[s][2])
              && store.attributeValues[o][3].equals(store.attributeValues[s][3]);
          if (sameGroup && !Float.isNaN(price(o, d))) {
            groupSum += price(o, d);
            groupCount++;
          }
        }
        return price / (groupSum / groupCount);
      }
      default :
        throw new IllegalArgumentException(name);
    }
  }
}
