package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesStore;

/**
 * Unchanged consecutive prices collapse to one change point in the store. Checked against a slow reference that reads
 * the price file row by row for every day and keeps the days on which the price differs from the day before.
 */
class PriceCollapsingTest {
  private static final long MASTER_SEED = TestSeeds.master(0x5EED_9A1CL);
  private static final LocalDate FIRST = LocalDate.of(2025, 1, 6);
  private static final float[] PRICE_LEVELS = {1.49f, 1.99f, 2.49f};

  @TempDir
  Path temp;

  /**
   * A hand-worked case: weekly rows 1.99, 1.99, 1.49, 1.49, 1.99, 1.99 from day 0 keep the days 0, 14 and 28, and the
   * last row (day 35), which records how far the file reaches.
   */
  @Test
  void shouldKeepOnlyTheDaysOnWhichThePriceChanges() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), "sku,shop,2025-01-06,2025-01-07\nA,s1,1,2\n");
    Path prices = Files.writeString(temp.resolve("prices.csv"), """
        sku,shop,from,price
        A,s1,2024-12-30,1.99
        A,s1,2025-01-06,1.99
        A,s1,2025-01-13,1.99
        A,s1,2025-01-20,1.49
        A,s1,2025-01-27,1.49
        A,s1,2025-02-03,1.99
        A,s1,2025-02-10,1.99
        """);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales).with(SideFile.PRICES, prices), temp.resolve("store")),
          budget);
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        PriceTable table = store.prices();
        assertEquals(4, table.changeCount(0));
        assertArrayEquals(new int[] {0, 14, 28, 35}, new int[] {table.changeDayIndex(0, 0), table.changeDayIndex(0, 1),
            table.changeDayIndex(0, 2), table.changeDayIndex(0, 3)});
        assertArrayEquals(new float[] {1.99f, 1.49f, 1.99f, 1.99f}, new float[] {table.changePrice(0, 0),
            table.changePrice(0, 1), table.changePrice(0, 2), table.changePrice(0, 3)});
      }
    }
  }

  @Test
  void shouldMatchTheSlowReferenceOnRandomPriceFiles() throws Exception {
    for (int round = 0; round < 20; round++) {
      long seed = MASTER_SEED + round;
      checkRandomFile(seed, temp.resolve("round" + round));
    }
  }

  private void checkRandomFile(long seed, Path dir) throws Exception {
    Files.createDirectories(dir);
    Random random = new Random(seed);
    int itemCount = 1 + random.nextInt(4);
    int shopCount = 1 + random.nextInt(3);
    int dayCount = 5 + random.nextInt(60);
    StringBuilder sales = new StringBuilder("sku,shop");
    for (int d = 0; d < dayCount; d++) {
      sales.append(',').append(FIRST.plusDays(d));
    }
    sales.append('\n');
    for (int i = 0; i < itemCount; i++) {
      for (int s = 0; s < shopCount; s++) {
        sales.append("k").append(i).append(",shop").append(s);
        for (int d = 0; d < dayCount; d++) {
          sales.append(',').append(random.nextInt(3));
        }
        sales.append('\n');
      }
    }
    // Rows per key: a weekly run (one row every 7 days, as retailers deliver) or scattered days, both with prices
    // drawn from three levels so that repeats are common; some dates lie before the first and after the last day.
    int seriesCount = itemCount * shopCount;
    int[][] rowDays = new int[seriesCount][];
    float[][] rowPrices = new float[seriesCount][];
    List<String> lines = new ArrayList<>();
    for (int k = 0; k < seriesCount; k++) {
      List<Integer> days = new ArrayList<>();
      if (random.nextBoolean()) {
        for (int d = -7 * random.nextInt(3); d < dayCount + 14; d += 7) {
          days.add(d);
        }
      } else {
        for (int d = -10; d < dayCount + 10; d++) {
          if (random.nextInt(5) == 0) {
            days.add(d);
          }
        }
      }
      rowDays[k] = days.stream().mapToInt(Integer::intValue).toArray();
      rowPrices[k] = new float[rowDays[k].length];
      for (int r = 0; r < rowDays[k].length; r++) {
        rowPrices[k][r] = PRICE_LEVELS[random.nextInt(random.nextBoolean() ? 1 : PRICE_LEVELS.length)];
        lines.add("k" + (k / shopCount) + ",shop" + (k % shopCount) + "," + FIRST.plusDays(rowDays[k][r]) + ","
            + rowPrices[k][r]);
      }
    }
    Collections.shuffle(lines, random);
    Path salesFile = Files.writeString(dir.resolve("sales.csv"), sales);
    Path pricesFile = Files.writeString(dir.resolve("prices.csv"), "sku,shop,from,price\n" + String.join("\n", lines)
        + "\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(salesFile).with(SideFile.PRICES, pricesFile), dir.resolve("store")), budget);
      try (SalesStore store = SalesStore.open(dir.resolve("store"), budget)) {
        for (int k = 0; k < seriesCount; k++) {
          int s = store.attributes().seriesIndexOf("k" + (k / shopCount) + "/shop" + (k % shopCount));
          List<Integer> expectedDays = new ArrayList<>();
          List<Float> expectedPrices = new ArrayList<>();
          slowChangePoints(rowDays[k], rowPrices[k], dayCount + 20, expectedDays, expectedPrices);
          List<Integer> actualDays = new ArrayList<>();
          List<Float> actualPrices = new ArrayList<>();
          for (int c = 0; c < store.prices().changeCount(s); c++) {
            actualDays.add(store.prices().changeDayIndex(s, c));
            actualPrices.add(store.prices().changePrice(s, c));
          }
          String context = "seed " + seed + " (replay with -Dlagmill.seed=" + MASTER_SEED + "), series " + k;
          assertEquals(expectedDays, actualDays, context);
          assertEquals(expectedPrices, actualPrices, context);
        }
      }
    }
  }

  /**
   * Day by day: the price of the latest row on or before the day; a change point wherever it differs; and the last
   * row's day (day 0 when it lies before) when that is no change point already.
   */
  private static void slowChangePoints(int[] days, float[] prices, int endDay, List<Integer> changeDays,
      List<Float> changePrices) {
    int lastRowDay = Integer.MIN_VALUE;
    float lastRowPrice = Float.NaN;
    for (int r = 0; r < days.length; r++) {
      if (days[r] > lastRowDay) {
        lastRowDay = days[r];
        lastRowPrice = prices[r];
      }
    }
    Float previous = null;
    for (int d = 0; d < endDay; d++) {
      Float price = null;
      int latest = Integer.MIN_VALUE;
      for (int r = 0; r < days.length; r++) {
        if (days[r] <= d && days[r] > latest) {
          latest = days[r];
          price = prices[r];
        }
      }
      if (price != null && !price.equals(previous)) {
        changeDays.add(d);
        changePrices.add(price);
      }
      previous = price;
    }
    if (days.length > 0 && changeDays.get(changeDays.size() - 1) != Math.max(0, lastRowDay)) {
      changeDays.add(Math.max(0, lastRowDay));
      changePrices.add(lastRowPrice);
    }
  }
}
