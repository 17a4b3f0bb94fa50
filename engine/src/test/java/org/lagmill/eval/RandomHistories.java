package org.lagmill.eval;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;

/** Seeded invented histories: 3 regions x 2 stores x 2 categories x 2 departments x 5 items = 120 series. */
final class RandomHistories {
  static final String[] ATTRIBUTE_NAMES = {"region", "store", "category", "department", "item"};
  private static final String[] REGIONS = {"Northvale", "Eastmere", "Southfold"};
  private static final String[] CATEGORIES = {"Pantry", "Garden"};

  private RandomHistories() {}

  static ArraySeriesAttributes attributes() {
    List<String[]> rows = new ArrayList<>();
    for (int r = 0; r < 3; r++) {
      for (int s = 0; s < 2; s++) {
        for (int c = 0; c < 2; c++) {
          for (int d = 0; d < 2; d++) {
            for (int i = 0; i < 5; i++) {
              String dept = CATEGORIES[c] + "-D" + d;
              rows.add(new String[] {REGIONS[r], REGIONS[r] + "-S" + s, CATEGORIES[c], dept, dept + "-I" + i});
            }
          }
        }
      }
    }
    return ArraySeriesAttributes.of(ATTRIBUTE_NAMES, rows.toArray(new String[0][]));
  }

  /**
   * Units with pre-launch zeros (some series launch in the last days), about 3% unknown days, intermittent series,
   * and a few series that never sell.
   */
  static int[][] units(SplittableRandom random, int seriesCount, int dayCount) {
    int[][] units = new int[seriesCount][dayCount];
    for (int s = 0; s < seriesCount; s++) {
      int launch = random.nextInt(4) == 0 ? random.nextInt(dayCount) : random.nextInt(10);
      boolean never = random.nextInt(30) == 0;
      double rate = random.nextInt(3) == 0 ? 0.3 : 1 + random.nextInt(8);
      for (int d = 0; d < dayCount; d++) {
        if (random.nextInt(33) == 0) {
          units[s][d] = SalesHistory.UNKNOWN_UNITS;
        } else if (d < launch || never) {
          units[s][d] = 0;
        } else {
          units[s][d] = random.nextDouble() < Math.min(0.9, rate / 2) ? 1 + random.nextInt((int) Math.ceil(rate) * 2)
              : 0;
        }
      }
    }
    return units;
  }

  /** Price change points; some series have none, others start late (NaN gap before the first price). */
  static ArrayPriceTable prices(SplittableRandom random, int seriesCount, int dayCount) {
    int[][] days = new int[seriesCount][];
    float[][] values = new float[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      int changes = random.nextInt(10) == 0 ? 0 : 1 + random.nextInt(4);
      days[s] = new int[changes];
      values[s] = new float[changes];
      int day = random.nextInt(Math.max(1, dayCount / 2));
      for (int k = 0; k < changes; k++) {
        days[s][k] = day;
        values[s][k] = 0.5f + random.nextInt(40) / 4f;
        day += 1 + random.nextInt(Math.max(1, dayCount / 3));
      }
    }
    return new ArrayPriceTable(days, values);
  }

  static ArraySalesHistory history(SplittableRandom random, int dayCount, boolean withPrices) {
    ArraySeriesAttributes attributes = attributes();
    int seriesCount = 120;
    int[][] units = units(random, seriesCount, dayCount);
    PriceTable prices = withPrices ? prices(random, seriesCount, dayCount) : PriceTable.EMPTY;
    return new ArraySalesHistory(LocalDate.of(2021, 3, 1), units, attributes, prices, DayCalendar.EMPTY);
  }
}
