package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.memory.MemoryBudget;

/** Shards against their source store: the union of the shards is the store, series by series. */
class StoreShardingTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);
  // Shaped unlike the generator on purpose: other attribute names, a department holding several shops' skus,
  // weekly periods, a calendar keyed by shop, closures past the last sales period.
  private static final List<String> NAMES = List.of("dept", "sku", "shop");

  @TempDir
  Path temp;

  @Test
  void shouldHoldEverySeriesOfTheStoreExactlyOnceWithItsUnitsPricesCalendarAndClosures() throws IOException {
    for (int round = 0; round < 4; round++) {
      long seed = MASTER_SEED + 31L * round;
      Random random = new Random(seed);
      int partCount = 1 + random.nextInt(4);
      Path source = temp.resolve("source-" + round);
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        writeRandomStore(source, random, 40 + random.nextInt(60), 10 + random.nextInt(40), budget);
        List<StoreManifest> manifests = StoreSharding.shard(source, partCount, "sku", temp.resolve("out-" + round),
            budget);
        assertEquals(partCount, manifests.size(), "seed " + seed);
        checkUnion(source, temp.resolve("out-" + round), partCount, "sku", budget, "seed " + seed);
      }
    }
  }

  @Test
  void shouldAssignTheSameShardsInEveryRun() throws IOException {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Path source = temp.resolve("source");
      writeRandomStore(source, new Random(MASTER_SEED), 60, 20, budget);
      List<StoreManifest> first = StoreSharding.shard(source, 3, "sku", temp.resolve("a"), budget);
      List<StoreManifest> second = StoreSharding.shard(source, 3, "sku", temp.resolve("b"), budget);
      for (int part = 0; part < 3; part++) {
        assertEquals(first.get(part).fingerprint(), second.get(part).fingerprint(), "seed " + MASTER_SEED);
        assertEquals(first.get(part).shard(), second.get(part).shard());
      }
    }
  }

  @Test
  void shouldHashLikeThePublishedFnv1aTestVectors() {
    // 64-bit FNV-1a test vectors, from memory of the reference test suite published with the algorithm
    // (Fowler/Noll/Vo, "FNV test vectors"; also in the IETF draft draft-eastlake-fnv).
    assertEquals(0xcbf29ce484222325L, ShardAssignment.hash(""));
    assertEquals(0xaf63dc4c8601ec8cL, ShardAssignment.hash("a"));
    assertEquals(0x85944171f73967e8L, ShardAssignment.hash("foobar"));
    // Hand-worked: the part is the hash read as unsigned, modulo the part count.
    assertEquals((int) Long.remainderUnsigned(0xaf63dc4c8601ec8cL, 7), new ShardAssignment(7).partOf("a"));
  }

  @Test
  void shouldRefuseAShardWithNoSeriesAndWriteNothing() throws IOException {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Path source = temp.resolve("tiny");
      writeStore(source, new String[][] {{"d1", "s1", "north"}, {"d1", "s2", "north"}, {"d1", "s3", "south"}},
          new int[][] {{1, 2}, {0, 3}, {4, 4}}, null, null, budget);
      Path out = temp.resolve("tiny-out");
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
          () -> StoreSharding.shard(source, 3, "shop", out, budget));
      int emptyPart = 0;
      ShardAssignment three = new ShardAssignment(3);
      while (three.partOf("north") == emptyPart || three.partOf("south") == emptyPart) {
        emptyPart++;
      }
      assertEquals("shard " + emptyPart + " of 3 would hold no series: the 3 series take 2 values of 'shop' and none "
          + "of them hashes to shard " + emptyPart + "; nothing was written (hint: use fewer parts, or shard by an "
          + "attribute with more values such as 'sku' (3 values))", e.getMessage());
      assertFalse(Files.exists(out));
    }
  }

  @Test
  void shouldRefuseAnUnknownAttribute() throws IOException {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Path source = temp.resolve("small");
      writeStore(source, new String[][] {{"d1", "s1", "north"}}, new int[][] {{1}}, null, null, budget);
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
          () -> StoreSharding.shard(source, 1, "item", temp.resolve("x"), budget));
      assertEquals("unknown attribute 'item' for ‹by›; allowed: [dept, sku, shop]", e.getMessage());
    }
  }

  /** Every shard opens as a store; each source series is in exactly the shard its value hashes to, unchanged. */
  static void checkUnion(Path source, Path outDir, int partCount, String attribute, MemoryBudget budget,
      String context) throws IOException {
    try (SalesStore whole = SalesStore.open(source, budget)) {
      Map<String, Integer> partById = new HashMap<>();
      int total = 0;
      ShardAssignment assignment = new ShardAssignment(partCount);
      for (int part = 0; part < partCount; part++) {
        try (SalesStore shard = SalesStore.open(outDir.resolve(StoreSharding.shardDirectoryName(part)), budget)) {
          StoreManifest.Shard record = shard.manifest().shard();
          assertEquals(new StoreManifest.Shard(part, partCount, attribute, ShardAssignment.HASH_NAME,
              "store " + whole.fingerprint(), whole.seriesCount()), record, context);
          assertEquals(whole.firstDate(), shard.firstDate());
          assertEquals(whole.periodDays(), shard.periodDays());
          assertEquals(whole.dayCount(), shard.dayCount());
          int a = shard.attributes().attributeIndex(attribute);
          for (int s = 0; s < shard.seriesCount(); s++) {
            String id = shard.attributes().seriesId(s);
            assertEquals(null, partById.put(id, part), context + ": series " + id + " in two shards");
            int w = whole.attributes().seriesIndexOf(id);
            assertTrue(w >= 0, context + ": " + id);
            assertEquals(part, assignment.partOf(shard.attributes().value(a, shard.attributes().code(s, a))));
            checkSameSeries(whole, w, shard, s, context + " series " + id);
          }
          total += shard.seriesCount();
        }
      }
      assertEquals(whole.seriesCount(), total, context);
    }
  }

  private static void checkSameSeries(SalesStore whole, int w, SalesStore shard, int s, String context) {
    int dayCount = whole.dayCount();
    int[] expected = new int[dayCount];
    int[] actual = new int[dayCount];
    whole.readUnits(w, 0, expected, 0, dayCount);
    shard.readUnits(s, 0, actual, 0, dayCount);
    assertArrayEquals(expected, actual, context);
    whole.readStoredUnits(w, 0, expected, 0, dayCount);
    shard.readStoredUnits(s, 0, actual, 0, dayCount);
    assertArrayEquals(expected, actual, context);
    assertEquals(whole.firstSaleDayIndex(w), shard.firstSaleDayIndex(s), context);
    SeriesAttributes wa = whole.attributes();
    SeriesAttributes sa = shard.attributes();
    for (int a = 0; a < wa.attributeCount(); a++) {
      // the same code, not only the same text: categorical features and calendar rows agree across shards
      assertEquals(wa.code(w, a), sa.code(s, a), context);
      assertEquals(wa.value(a, wa.code(w, a)), sa.value(a, sa.code(s, a)), context);
    }
    int span = dayCount + 12;
    float[] expectedPrices = new float[span];
    float[] actualPrices = new float[span];
    whole.prices().readPrices(w, -6, expectedPrices, 0, span);
    shard.prices().readPrices(s, -6, actualPrices, 0, span);
    assertArrayEquals(expectedPrices, actualPrices, context);
    for (int d = -2; d < dayCount + 10; d++) {
      assertEquals(whole.isClosed(w, d), shard.isClosed(s, d), context + " day " + d);
    }
    for (int c = 0; c < whole.plan().columnCount(); c++) {
      for (int d = 0; d < dayCount + 6; d++) {
        assertEquals(whole.plan().valueAt(w, c, d), shard.plan().valueAt(s, c, d), context + " plan day " + d);
      }
    }
    assertEquals(whole.plan().columnNames(), shard.plan().columnNames());
    assertEquals(whole.plan().reachDayIndex(), shard.plan().reachDayIndex());
    DayCalendar wc = whole.calendar();
    DayCalendar sc = shard.calendar();
    assertEquals(wc.columnCount(), sc.columnCount());
    for (int c = 0; c < wc.columnCount(); c++) {
      String key = wc.keyAttribute(c);
      int wk = key == null ? 0 : wa.code(w, wa.attributeIndex(key));
      int sk = key == null ? 0 : sa.code(s, sa.attributeIndex(key));
      for (int d = 0; d < wc.dayCount(); d++) {
        assertEquals(Float.floatToIntBits(wc.value(c, wk, d)), Float.floatToIntBits(sc.value(c, sk, d)),
            context + " calendar " + wc.columnName(c) + " day " + d);
      }
    }
  }

  /** A weekly store of random skus under departments, sold in several shops, with prices, closures and calendar. */
  static void writeRandomStore(Path dir, Random random, int seriesCount, int dayCount, MemoryBudget budget)
      throws IOException {
    List<String[]> values = new ArrayList<>();
    List<int[]> units = new ArrayList<>();
    java.util.Set<String> seen = new java.util.HashSet<>();
    int skuCount = Math.max(2, seriesCount / 3);
    while (values.size() < seriesCount) {
      int sku = random.nextInt(skuCount);
      String shop = "shop " + (char) ('A' + random.nextInt(5));
      String[] row = {"dept-" + (sku % 4), "sku/" + sku + "-é", shop};
      if (!seen.add(row[1] + "|" + row[2])) {
        continue;
      }
      int[] u = new int[dayCount];
      int launch = random.nextInt(3) == 0 ? random.nextInt(dayCount) : 0;
      for (int d = 0; d < dayCount; d++) {
        u[d] = random.nextInt(9) == 0 ? SalesHistory.UNKNOWN_UNITS : d < launch ? 0 : random.nextInt(random.nextInt(
            3) == 0 ? 70_000 : 12);
      }
      values.add(row);
      units.add(u);
    }
    int[][] changeDays = new int[seriesCount][];
    float[][] changePrices = new float[seriesCount][];
    int[][] closedFirst = new int[seriesCount][];
    int[][] closedLast = new int[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      int n = random.nextInt(4);
      changeDays[s] = new int[n];
      changePrices[s] = new float[n];
      int day = random.nextInt(5) - 3;
      for (int k = 0; k < n; k++) {
        day += 1 + random.nextInt(dayCount);
        changeDays[s][k] = Math.max(0, day);
        changePrices[s][k] = 0.25f + random.nextInt(900) / 100f;
        day = changeDays[s][k];
      }
      boolean closed = random.nextInt(3) == 0;
      int first = random.nextInt(dayCount);
      closedFirst[s] = closed ? new int[] {first} : new int[0];
      closedLast[s] = closed ? new int[] {first + random.nextInt(dayCount)} : new int[0];
    }
    writeStore(dir, values.toArray(new String[0][]), units.toArray(new int[0][]),
        new ArrayPriceTable(changeDays, changePrices), new ArrayClosureTable(closedFirst, closedLast), budget);
  }

  static void writeStore(Path dir, String[][] values, int[][] units, PriceTable prices, ClosureTable closures,
      MemoryBudget budget) throws IOException {
    int dayCount = units[0].length;
    try (StoreUpdate update = StoreUpdate.begin(dir, StoreUpdate.Policy.REPLACE_WAITING);
        StoreWriter writer = new StoreWriter(update.buildingDir(), LocalDate.of(2024, 1, 1), 7, dayCount, NAMES,
            budget)) {
      for (int s = 0; s < values.length; s++) {
        writer.addSeries(values[s], units[s]);
      }
      if (prices != null) {
        writer.writePrices(prices);
      }
      int shopIndex = writer.attributes().attributeIndex("shop");
      int shopCount = writer.attributes().cardinality(shopIndex);
      float[][] byShop = new float[shopCount][dayCount + 5];
      for (int k = 0; k < shopCount; k++) {
        for (int d = 0; d < dayCount + 5; d++) {
          byShop[k][d] = (k * 31 + d * 7) % 3;
        }
      }
      writer.writeCalendar(new ArrayDayCalendar(dayCount + 5, List.of(new ArrayDayCalendar.Column("market day",
          DayCalendar.ColumnKind.CATEGORICAL, List.of("no", "yes", "half"), "shop", byShop))));
      if (closures != null) {
        writer.writeClosures(closures);
        // a plan keyed by department: two keys, a promotion flag and a discount depth, reaching past the sales
        int deptIndex = writer.attributes().attributeIndex("dept");
        int[] keyBySeries = new int[values.length];
        for (int s = 0; s < values.length; s++) {
          int code = writer.attributes().code(s, deptIndex);
          keyBySeries[s] = code < 2 ? code : PlanTable.NO_KEY;
        }
        writer.writePlan(new ArrayPlanTable(List.of("dept"), List.of("promo", "depth"), keyBySeries,
            new int[][] {{0, 3, dayCount + 2}, {1}}, new float[][] {{1, 0.2f, 0, 0, 1, 0.5f}, {1, 0.1f}},
            dayCount + 4));
      }
      writer.finish(List.of(new StoreManifest.SourceFile("weekly.csv", 99)));
      update.commit();
    }
  }
}
