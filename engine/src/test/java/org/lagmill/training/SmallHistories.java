package org.lagmill.training;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.RowStream;
import org.lagmill.learner.DatasetParameters;
import org.lagmill.learner.TrainParameters;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesHistory;

/**
 * Small seeded histories of invented series for the orchestration tests: unknown days, pre-launch zeros, a series that
 * never sells, one launching in the last days, price gaps and announced prices, and a calendar reaching past the last
 * sales day. Attributes: series_id, item, store, region (stores st0, st1, st2).
 */
public final class SmallHistories {
  static final LocalDate FIRST_DATE = LocalDate.of(2022, 12, 26);
  static final String[] ATTRIBUTES = {"series_id", "item", "store", "region"};

  private SmallHistories() {}

  /** A history of {@code seriesCount × dayCount} with a calendar of {@code dayCount + extraCalendarDays} days. */
  public static ArraySalesHistory history(long seed, int seriesCount, int dayCount, int extraCalendarDays) {
    SplittableRandom random = new SplittableRandom(seed);
    int[][] units = new int[seriesCount][dayCount];
    String[][] values = new String[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      int item = s / 3;
      int store = s % 3;
      values[s] = new String[] {"it" + item + "_st" + store, "it" + item, "st" + store, store < 2 ? "north" : "south"};
      int launch = s == 1 ? Integer.MAX_VALUE : s == 2 ? dayCount - 3 : random.nextInt(4) == 0
          ? random.nextInt(dayCount / 2) : 0;
      double rate = 0.3 + random.nextDouble() * 6;
      for (int d = 0; d < dayCount; d++) {
        if (random.nextInt(25) == 0) {
          units[s][d] = SalesHistory.UNKNOWN_UNITS;
        } else if (d < launch) {
          units[s][d] = 0;
        } else {
          double dayRate = rate * (d % 7 >= 5 ? 1.6 : 1.0);
          units[s][d] = poisson(random, dayRate);
        }
      }
    }
    int calendarDays = dayCount + extraCalendarDays;
    int[][] changeDays = new int[seriesCount][];
    float[][] changePrices = new float[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      List<Integer> days = new ArrayList<>();
      List<Float> prices = new ArrayList<>();
      if (s % 11 != 5) {
        float base = 1 + random.nextInt(500) / 100f;
        for (int d = random.nextInt(dayCount / 4); d < calendarDays; d += 5 + random.nextInt(40)) {
          days.add(d);
          prices.add(random.nextInt(5) == 0 ? base * 0.7f : base);
        }
      }
      changeDays[s] = days.stream().mapToInt(Integer::intValue).toArray();
      changePrices[s] = new float[prices.size()];
      for (int k = 0; k < prices.size(); k++) {
        changePrices[s][k] = prices.get(k);
      }
    }
    float[] event = new float[calendarDays];
    float[][] payday = new float[2][calendarDays];
    for (int d = 0; d < calendarDays; d++) {
      event[d] = random.nextInt(12) == 0 ? 1 : 0;
      payday[0][d] = d % 14 == 0 ? 1 : 0;
      payday[1][d] = d % 14 == 7 ? 1 : 0;
    }
    ArrayDayCalendar calendar = new ArrayDayCalendar(calendarDays, List.of(
        new ArrayDayCalendar.Column("event", DayCalendar.ColumnKind.NUMERIC, null, null, new float[][] {event}),
        new ArrayDayCalendar.Column("payday", DayCalendar.ColumnKind.NUMERIC, null, "region", payday)));
    return new ArraySalesHistory(FIRST_DATE, units, ArraySeriesAttributes.of(ATTRIBUTES, values),
        new ArrayPriceTable(changeDays, changePrices), calendar);
  }

  /**
   * The same series, units, prices and calendar read as a weekly store: index k is the week starting {@code k} weeks
   * after the first date (a Monday), so row keys, lags and windows count weeks, not days.
   */
  public static ArraySalesHistory asWeeks(SalesHistory daily) {
    int[][] units = new int[daily.seriesCount()][daily.dayCount()];
    for (int s = 0; s < units.length; s++) {
      daily.readUnits(s, 0, units[s], 0, daily.dayCount());
    }
    return new ArraySalesHistory(daily.firstDate(), Periods.WEEKLY, units, daily.attributes(), daily.prices(),
        daily.calendar());
  }

  /**
   * A copy of {@code source} whose units on days {@code >= fromDayIndex} are replaced by random values (some unknown);
   * attributes, prices and calendar are shared.
   */
  public static ArraySalesHistory scrambledFrom(SalesHistory source, int fromDayIndex, long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    int[][] units = new int[source.seriesCount()][source.dayCount()];
    for (int s = 0; s < units.length; s++) {
      source.readUnits(s, 0, units[s], 0, source.dayCount());
      for (int d = fromDayIndex; d < units[s].length; d++) {
        units[s][d] = random.nextInt(10) == 0 ? SalesHistory.UNKNOWN_UNITS : random.nextInt(60);
      }
    }
    return new ArraySalesHistory(source.firstDate(), units, source.attributes(), source.prices(), source.calendar());
  }

  /** Lags, rolling windows, calendar, price and series features, all with shifts >= the horizon. */
  public static FeatureSpec spec(int horizonDays) {
    return FeatureSpec.builder().horizonDays(horizonDays).lagDays(horizonDays, horizonDays + 7, 2 * horizonDays + 7)
        .rollingWindowDays(7, 14).build();
  }

  public static TrainingPlan plan(FeatureSpec spec, int rounds, int cutDayIndex, int validationDays, String partition) {
    TrainParameters train = TrainParameters.defaults().withRounds(rounds, 0).withLeafCount(15).withMinDataInLeaf(20)
        .withLearningRate(0.2).withThreadCount(1).withDeterministic(true);
    DatasetParameters dataset = DatasetParameters.defaults().withDeterministic(true).withThreadCount(1)
        .withSampleRowCount(20_000);
    return new TrainingPlan(spec, train, dataset, cutDayIndex, validationDays, partition, false, false);
  }

  /** Every row of a stream as {@code [seriesIndex, dayIndex, label, weight, features…]}, in stream order. */
  public static List<float[]> rows(RowStream stream, MemoryBudget budget) {
    List<float[]> rows = new ArrayList<>();
    int featureCount = stream.schema().featureCount();
    try (FeatureBatch batch = new FeatureBatch(budget, 257, featureCount)) {
      stream.stream(batch, full -> {
        for (int r = 0; r < full.rowCount(); r++) {
          float[] row = new float[4 + featureCount];
          row[0] = full.seriesIndexes()[r];
          row[1] = full.dayIndexes()[r];
          row[2] = full.labels()[r];
          row[3] = full.weights()[r];
          for (int f = 0; f < featureCount; f++) {
            row[4 + f] = full.get(r, f);
          }
          rows.add(row);
        }
      });
    }
    return rows;
  }

  /** Bitwise comparison (NaN equals NaN) of two row lists; returns a description of the first difference or null. */
  public static String firstDifference(List<float[]> expected, List<float[]> actual) {
    if (expected.size() != actual.size()) {
      return "row count " + expected.size() + " vs " + actual.size();
    }
    for (int i = 0; i < expected.size(); i++) {
      float[] a = expected.get(i);
      float[] b = actual.get(i);
      for (int c = 0; c < a.length; c++) {
        if (Float.floatToIntBits(a[c]) != Float.floatToIntBits(b[c])) {
          return "row " + i + " " + Arrays.toString(Arrays.copyOf(a, 4)) + " column " + c + ": " + a[c] + " vs " + b[c];
        }
      }
    }
    return null;
  }

  private static int poisson(SplittableRandom random, double mean) {
    double limit = Math.exp(-mean);
    double product = random.nextDouble();
    int k = 0;
    while (product > limit) {
      product *= random.nextDouble();
      k++;
    }
    return k;
  }
}
