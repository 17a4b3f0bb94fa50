package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySeriesAttributes;

class PriceFileReaderTest {
  private static final long MASTER_SEED = TestSeeds.master(0x9A1CE5L);
  private static final LocalDate STORE_START = LocalDate.of(2024, 3, 1);
  private static final ArraySeriesAttributes CHAIN = IngestFiles.chain();
  private static final int SERIES_COUNT = 9;
  private static final float NAN = Float.NaN;

  @TempDir
  Path dir;

  private PriceReadResult read(String name, String text) {
    return PriceFileReader.read(IngestFiles.write(dir, name, text), STORE_START, CHAIN, SERIES_COUNT, "from",
        "price");
  }

  private static float[] days(ArrayPriceTable prices, int seriesIndex, int dayCount) {
    float[] out = new float[dayCount];
    prices.readPrices(seriesIndex, 0, out, 0, dayCount);
    return out;
  }

  @Test
  void shouldApplyChangePointsWorkedOutByHand() {
    // Store starts 2024-03-01 (day 0). Worked out by hand, days 0..6 (03-01 .. 03-07):
    //   oat_bar/north_1 (series 0): the two pre-start rows collapse to the later one (2.10 from 02-25) clamped to
    //     day 0; 2.50 from 03-04 (day 3); 2.25 from 03-06 (day 5) -> 2.10 2.10 2.10 2.50 2.50 2.25 2.25
    //   tea_tin/south_1 (series 5): no price before 03-03 (day 2) -> NaN NaN 4 4 4 4 4
    //   every other series has no row -> NaN all week; gift_box is no item of the chain -> 2 rows skipped.
    PriceReadResult result = read("p.csv", "item,store,from,price\n"
        + "tea_tin,south_1,2024-03-03,4.00\n"
        + "oat_bar,north_1,2024-03-04,2.50\n"
        + "oat_bar,north_1,2024-02-20,2.00\n"
        + "oat_bar,north_1,2024-02-25,2.10\n"
        + "gift_box,north_1,2024-03-01,9.99\n"
        + "oat_bar,north_1,2024-03-06,2.25\n"
        + "gift_box,south_1,2024-03-01,9.99\n");
    ArrayPriceTable prices = result.prices();
    assertArrayEquals(new float[] {2.10f, 2.10f, 2.10f, 2.50f, 2.50f, 2.25f, 2.25f}, days(prices, 0, 7));
    assertArrayEquals(new float[] {NAN, NAN, 4f, 4f, 4f, 4f, 4f}, days(prices, 5, 7));
    assertArrayEquals(new float[] {NAN, NAN, NAN, NAN, NAN, NAN, NAN}, days(prices, 1, 7));
    assertEquals(3, prices.changeCount(0));
    assertEquals(0, prices.changeDayIndex(0, 0));
    assertEquals(2L, result.unknownKeyRowCount());
    assertEquals(List.of("2 price rows for unknown keys skipped (first: item=gift_box, store=north_1)"),
        result.warnings());
  }

  @Test
  void shouldApplyPerItemKeyToEveryStoreOfTheItem() {
    // Key "item" only: jam_jar's price holds for all three stores (series 6, 7, 8), read with custom column names.
    Path file = IngestFiles.write(dir, "p.csv.gz", "valid_from,shelf_price,item\n2024-03-02,1.5,jam_jar\n"
        + "2024-03-01,1.25,jam_jar\n");
    PriceReadResult result = PriceFileReader.read(file, STORE_START, CHAIN, SERIES_COUNT, "valid_from",
        "shelf_price");
    for (int s = 6; s < 9; s++) {
      assertArrayEquals(new float[] {1.25f, 1.5f, 1.5f}, days(result.prices(), s, 3));
    }
    assertEquals(0, result.prices().changeCount(0));
    assertEquals(List.of(), result.warnings());
  }

  @Test
  void shouldKeepPriceOnStartDayOverEarlierRows() {
    PriceReadResult result = read("p.csv", "item,from,price\noat_bar,2024-02-01,1\noat_bar,2024-03-01,2\n");
    assertEquals(1, result.prices().changeCount(0));
    assertEquals(2f, result.prices().changePrice(0, 0));
  }

  private String error(String text) {
    Path file = IngestFiles.write(dir, "bad.csv", text);
    return assertThrows(InputFormatException.class, () -> PriceFileReader.read(file, STORE_START, CHAIN,
        SERIES_COUNT, "from", "price")).getMessage().replace(file.toString(), "F");
  }

  @Test
  void shouldReportEveryErrorExactly() {
    assertEquals("F, line 4: duplicate price for item=oat_bar, store=north_1 from 2024-03-02: lines 2 and 4,"
        + " expected one",
        error("item,store,from,price\noat_bar,north_1,2024-03-02,1\n"
            + "oat_bar,north_2,2024-03-02,1\noat_bar,north_1,2024-03-02,2\n"));
    assertEquals("F, line 3: duplicate price for item=tea_tin from 2024-02-01: lines 2 and 3, expected one",
        error("item,from,price\ntea_tin,2024-02-01,1\ntea_tin,2024-02-01,2\n"));
    for (String price : new String[] {"0", "-1.5", "abc", "", "NaN", "Infinity"}) {
      assertEquals("F, line 2, column 3: price '" + price + "': expected a decimal number > 0",
          error("item,from,price\ntea_tin,2024-03-01," + price + "\n"));
    }
    assertEquals("F, line 2, column 3: price '1e39': expected a decimal number > 0 and at most 3.4028235E38",
        error("item,from,price\ntea_tin,2024-03-01,1e39\n"));
    // above 0, but float32 (the store's width) rounds it to 0: said in those words, not as "not > 0"
    assertEquals("F, line 2, column 3: price '1e-50': expected a decimal number of at least 1.4E-45 (the smallest"
        + " price the store holds)", error("item,from,price\ntea_tin,2024-03-01,1e-50\n"));
    assertEquals("F, line 1, column 1: price key column 'color' is not a series attribute: expected one of item,"
        + " store, region", error("color,from,price\nred,2024-03-01,1\n"));
    assertEquals("F, line 1: no key columns: expected at least one series attribute column (item, store, region)"
        + " besides 'from' and 'price'", error("from,price\n2024-03-01,1\n"));
    assertEquals("F, line 1: no column 'from' in header item,start,price: expected one (or name it with"
        + " ‹prices-from-column›)", error("item,start,price\n"));
    assertEquals("F, line 1: no column 'price' in header item,from: expected one (or name it with"
        + " ‹prices-price-column›)", error("item,from\n"));
    assertEquals("F, line 2, column 2: from '2024-3-1': expected an ISO date like 2024-03-05",
        error("item,from,price\ntea_tin,2024-3-1,1\n"));
    assertEquals("F: empty file: expected a header line", error(""));
  }

  @Test
  void shouldMatchReferenceOnRandomPriceFiles() {
    Random master = new Random(MASTER_SEED);
    String[] items = {"oat_bar", "tea_tin", "jam_jar", "gift_box"};
    String[] stores = {"north_1", "north_2", "south_1", "west_9"};
    for (int round = 0; round < 50; round++) {
      long seed = master.nextLong();
      Random random = new Random(seed);
      String message = "master seed " + MASTER_SEED + ", round " + round + ", seed " + seed;
      boolean perStore = random.nextBoolean();
      // Reference: key text -> (from day -> price), looked up per series and day by scanning for the latest from.
      Map<String, Map<Integer, Float>> byKey = new HashMap<>();
      List<String> lines = new ArrayList<>();
      int rowCount = random.nextInt(60);
      int unknown = 0;
      for (int r = 0; r < rowCount; r++) {
        String item = items[random.nextInt(items.length)];
        String store = stores[random.nextInt(stores.length)];
        String key = perStore ? item + "," + store : item;
        int day = random.nextInt(50) - 10;
        Map<Integer, Float> rows = byKey.computeIfAbsent(key, k -> new HashMap<>());
        if (rows.containsKey(day)) {
          continue;
        }
        String price = (1 + random.nextInt(900)) / 100.0 + "";
        rows.put(day, Float.parseFloat(price));
        lines.add(key + "," + STORE_START.plusDays(day) + "," + price);
        if (item.equals("gift_box") || (perStore && store.equals("west_9"))) {
          unknown++;
        }
      }
      StringBuilder text = new StringBuilder(perStore ? "item,store,from,price\n" : "item,from,price\n");
      lines.forEach(l -> text.append(l).append('\n'));
      PriceReadResult result = read("r" + round + (round % 3 == 0 ? ".csv.gz" : ".csv"), text.toString());
      assertEquals(unknown, result.unknownKeyRowCount(), message);
      assertEquals(unknown == 0 ? 0 : 1, result.warnings().size(), message);
      for (int s = 0; s < SERIES_COUNT; s++) {
        String item = CHAIN.value(0, CHAIN.code(s, 0));
        String key = perStore ? item + "," + CHAIN.value(1, CHAIN.code(s, 1)) : item;
        Map<Integer, Float> rows = byKey.getOrDefault(key, Map.of());
        for (int d = 0; d < 45; d++) {
          int best = Integer.MIN_VALUE;
          for (int from : rows.keySet()) {
            if (from <= d && from > best) {
              best = from;
            }
          }
          float expected = best == Integer.MIN_VALUE ? NAN : rows.get(best);
          assertEquals(expected, result.prices().priceAt(s, d), message + ", series " + s + ", day " + d);
        }
        for (int k = 0; k < result.prices().changeCount(s); k++) {
          assertTrue(result.prices().changeDayIndex(s, k) >= (k == 0 ? 0 : 1 + result.prices().changeDayIndex(s,
              k - 1)), message);
        }
      }
    }
  }
}
