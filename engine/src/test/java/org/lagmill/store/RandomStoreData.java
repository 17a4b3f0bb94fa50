package org.lagmill.store;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.lagmill.memory.MemoryBudget;

/** Seeded random store contents held in plain arrays: the reference a written and reopened store is compared to. */
public final class RandomStoreData {
  public static final List<String> ATTRIBUTE_NAMES = List.of("series_id", "item", "store", "region");
  public static final LocalDate FIRST_DATE = LocalDate.of(2021, 3, 1);

  public final int dayCount;
  public final int[][] units;
  public final String[][] attributeValues;
  public final int[][] priceDays;
  public final float[][] priceValues;
  public final ArrayDayCalendar calendar;

  public RandomStoreData(long seed, int seriesCount, int dayCount) {
    Random random = new Random(seed);
    this.dayCount = dayCount;
    units = new int[seriesCount][dayCount];
    attributeValues = new String[seriesCount][];
    priceDays = new int[seriesCount][];
    priceValues = new float[seriesCount][];
    int[] maxChoices = {0, 1, 7, 254, 255, 256, 763, 65_534, 65_535, 65_536, 1_000_000, Integer.MAX_VALUE - 1};
    for (int s = 0; s < seriesCount; s++) {
      int max = maxChoices[random.nextInt(maxChoices.length)];
      int launchDay = random.nextInt(3) == 0 ? random.nextInt(dayCount) : 0;
      double unknownShare = random.nextInt(4) == 0 ? 0.2 : 0.0;
      for (int d = 0; d < dayCount; d++) {
        if (random.nextDouble() < unknownShare) {
          units[s][d] = SalesHistory.UNKNOWN_UNITS;
        } else if (d < launchDay || max == 0) {
          units[s][d] = 0;
        } else {
          units[s][d] = random.nextInt(3) == 0 ? 0 : (int) (random.nextDouble() * max);
        }
      }
      if (max > 0) {
        units[s][random.nextInt(dayCount)] = max;
      }
      String item = "item-" + random.nextInt(Math.max(1, seriesCount / 3));
      String store = "store-" + random.nextInt(4) + (random.nextInt(5) == 0 ? "-ü" : "");
      attributeValues[s] = new String[] {item + "@" + store + "#" + s, item, store, "region-" + store.charAt(6)};
      int changeCount = random.nextInt(5);
      int[] days = new int[changeCount];
      float[] prices = new float[changeCount];
      int day = -20 + random.nextInt(10);
      for (int k = 0; k < changeCount; k++) {
        day += 1 + random.nextInt(Math.max(1, dayCount / 2));
        days[k] = day;
        prices[k] = 0.5f + random.nextInt(2000) / 100f;
      }
      priceDays[s] = days;
      priceValues[s] = prices;
    }
    int calendarDayCount = dayCount + random.nextInt(30);
    float[][] global = new float[1][calendarDayCount];
    for (int d = 0; d < calendarDayCount; d++) {
      global[0][d] = random.nextInt(10) == 0 ? Float.NaN : random.nextFloat();
    }
    int regionCount = (int) Arrays.stream(attributeValues).map(v -> v[3]).distinct().count();
    float[][] byRegion = new float[regionCount][calendarDayCount];
    for (float[] row : byRegion) {
      for (int d = 0; d < calendarDayCount; d++) {
        row[d] = random.nextInt(3);
      }
    }
    calendar = new ArrayDayCalendar(calendarDayCount, List.of(
        new ArrayDayCalendar.Column("temperature", DayCalendar.ColumnKind.NUMERIC, List.of(), null, global),
        new ArrayDayCalendar.Column("event", DayCalendar.ColumnKind.CATEGORICAL, List.of("none", "payday", "fête"),
            "region", byRegion)));
  }

  public int seriesCount() {
    return units.length;
  }

  public ArrayPriceTable prices() {
    return new ArrayPriceTable(priceDays, priceValues);
  }

  public ArraySalesHistory reference() {
    return new ArraySalesHistory(FIRST_DATE, units,
        ArraySeriesAttributes.of(ATTRIBUTE_NAMES.toArray(new String[0]), attributeValues), prices(), calendar);
  }

  /** Writes these contents as a store into {@code dir}. */
  public StoreManifest write(Path dir, MemoryBudget budget) throws IOException {
    try (StoreWriter writer = new StoreWriter(dir, FIRST_DATE, dayCount, ATTRIBUTE_NAMES, budget)) {
      for (int s = 0; s < seriesCount(); s++) {
        writer.addSeries(attributeValues[s], units[s]);
      }
      writer.writePrices(prices());
      writer.writeCalendar(calendar);
      return writer.finish(new ArrayList<>(List.of(new StoreManifest.SourceFile("sales.csv", 1234))));
    }
  }
}
