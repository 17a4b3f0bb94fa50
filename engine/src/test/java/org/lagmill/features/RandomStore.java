package org.lagmill.features;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.SalesHistory;

/**
 * A seeded random store of invented series with the awkward cases the feature pass must handle: unknown days,
 * pre-launch zeros, series that never sell or launch near the end, price gaps (NaN change points, series with no
 * price), and a calendar with a global numeric, a global categorical and a per-region column reaching past the last
 * sales day. Day 0 is 2019-12-23 so ISO weeks cross a year boundary.
 */
final class RandomStore {
  static final LocalDate FIRST_DATE = LocalDate.of(2019, 12, 23);
  static final String[] ATTRIBUTES = {"series_id", "item", "department", "store", "region"};

  final int[][] units;
  final String[][] attributeValues;
  final int[][] changeDays;
  final float[][] changePrices;
  final int calendarDayCount;
  final float[] eventFlag;
  final float[] eventType;
  /** payday[regionCode][day]. */
  final float[][] payday;
  final ArraySalesHistory history;

  RandomStore(long seed, int seriesCount, int dayCount, int extraCalendarDays, boolean withPrices) {
    Random random = new Random(seed);
    units = new int[seriesCount][dayCount];
    attributeValues = new String[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      int item = s / 3;
      int store = s % 3;
      attributeValues[s] = new String[] {"item_" + item + "_store_" + store, "item_" + item, "dept_" + (item % 2),
          "store_" + store, store < 2 ? "north" : "south"};
      int launch;
      double kind = random.nextDouble();
      if (kind < 0.4) {
        launch = 0;
      } else if (kind < 0.75) {
        launch = random.nextInt(dayCount);
      } else if (kind < 0.9) {
        launch = Math.max(0, dayCount - 1 - random.nextInt(10));
      } else {
        launch = Integer.MAX_VALUE;
      }
      double zeroShare = random.nextDouble() * 0.7;
      for (int d = 0; d < dayCount; d++) {
        if (random.nextDouble() < 0.05) {
          units[s][d] = SalesHistory.UNKNOWN_UNITS;
        } else if (d < launch) {
          units[s][d] = 0;
        } else {
          units[s][d] = random.nextDouble() < zeroShare ? 0 : 1 + random.nextInt(random.nextBoolean() ? 5 : 40);
        }
      }
    }
    int priceDays = dayCount + extraCalendarDays;
    changeDays = new int[seriesCount][];
    changePrices = new float[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      List<int[]> days = new ArrayList<>();
      List<Float> prices = new ArrayList<>();
      if (random.nextDouble() > 0.1) {
        float base = 1 + random.nextInt(900) / 100f;
        for (int d = random.nextInt(Math.max(1, dayCount / 3)); d < priceDays; d += 1 + random.nextInt(40)) {
          days.add(new int[] {d});
          double r = random.nextDouble();
          prices.add(r < 0.1 ? Float.NaN : r < 0.4 ? base * (0.6f + random.nextInt(40) / 100f) : base);
        }
      }
      changeDays[s] = days.stream().mapToInt(a -> a[0]).toArray();
      changePrices[s] = new float[prices.size()];
      for (int k = 0; k < prices.size(); k++) {
        changePrices[s][k] = prices.get(k);
      }
    }
    calendarDayCount = dayCount + extraCalendarDays;
    eventFlag = new float[calendarDayCount];
    eventType = new float[calendarDayCount];
    payday = new float[2][calendarDayCount];
    for (int d = 0; d < calendarDayCount; d++) {
      eventFlag[d] = random.nextDouble() < 0.1 ? 1 : 0;
      eventType[d] = random.nextDouble() < 0.05 ? Float.NaN : random.nextInt(3);
      payday[0][d] = random.nextDouble() < 0.2 ? 1 : 0;
      payday[1][d] = random.nextDouble() < 0.2 ? 1 : 0;
    }
    ArraySeriesAttributes attributes = ArraySeriesAttributes.of(ATTRIBUTES, attributeValues);
    List<ArrayDayCalendar.Column> columns = List.of(
        new ArrayDayCalendar.Column("event", DayCalendar.ColumnKind.NUMERIC, null, null, new float[][] {eventFlag}),
        new ArrayDayCalendar.Column("event_type", DayCalendar.ColumnKind.CATEGORICAL, List.of("none", "sport", "feast"),
            null, new float[][] {eventType}),
        new ArrayDayCalendar.Column("payday", DayCalendar.ColumnKind.NUMERIC, null, "region", payday));
    int[][] unitsCopy = Arrays.stream(units).map(int[]::clone).toArray(int[][]::new);
    history = new ArraySalesHistory(FIRST_DATE, unitsCopy, attributes,
        withPrices ? new ArrayPriceTable(changeDays, changePrices) : org.lagmill.store.PriceTable.EMPTY,
        new ArrayDayCalendar(calendarDayCount, columns));
  }

  /** Region code of a series as the history's attributes number it. */
  int regionCode(int seriesIndex) {
    return history.attributes().code(seriesIndex, 4);
  }
}
