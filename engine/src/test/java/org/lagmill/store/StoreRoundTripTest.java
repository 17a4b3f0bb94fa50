package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;

class StoreRoundTripTest {
  private static final long MASTER_SEED = TestSeeds.master(0x5EED_2024L);

  @TempDir
  Path temp;

  @Test
  void shouldReadBackEverySeriesDayAttributePriceAndCalendarValue() throws Exception {
    Random seeds = new Random(MASTER_SEED);
    for (int round = 0; round < 6; round++) {
      long seed = seeds.nextLong();
      String where = "master seed " + MASTER_SEED + ", round " + round + ", seed " + seed;
      Random random = new Random(seed);
      RandomStoreData data = new RandomStoreData(seed, 1 + random.nextInt(80), 1 + random.nextInt(200));
      Path dir = temp.resolve("store-" + round);
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        data.write(dir, budget);
        assertEquals(0, budget.heldBytes(), where);
        // A tiny window forces many windows; the default maps one.
        for (long windowBytes : new long[] {1 + random.nextInt(700), SalesStore.DEFAULT_WINDOW_BYTES}) {
          try (SalesStore store = SalesStore.open(dir, budget, windowBytes)) {
            assertEquals(store.offHeapBytes(), budget.heldBytes(), where);
            StoreAssertions.assertSameHistory(data.reference(), store, random, where + ", window " + windowBytes);
          }
          assertEquals(0, budget.heldBytes(), where + ": every mapped byte released at close");
        }
      }
    }
  }

  @Test
  void shouldClampPriceChangesBeforeDayZeroToTheOneInForce() throws Exception {
    int[][] units = {{1, 2, 3, 4}};
    PriceTable prices = new ArrayPriceTable(new int[][] {{-9, -3, 2, 9}}, new float[][] {{1f, 2f, 3f, 4f}});
    Path dir = temp.resolve("prices");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      try (StoreWriter writer = new StoreWriter(dir, RandomStoreData.FIRST_DATE, 4, java.util.List.of("item"),
          budget)) {
        writer.addSeries(new String[] {"a"}, units[0]);
        writer.writePrices(prices);
        writer.finish(java.util.List.of());
      }
      try (SalesStore store = SalesStore.open(dir, budget)) {
        PriceTable stored = store.prices();
        assertEquals(3, stored.changeCount(0));
        assertArrayEquals(new int[] {0, 2, 9}, new int[] {stored.changeDayIndex(0, 0), stored.changeDayIndex(0, 1),
            stored.changeDayIndex(0, 2)});
        float[] read = new float[12];
        stored.readPrices(0, -1, read, 0, 12);
        assertArrayEquals(new float[] {Float.NaN, 2f, 2f, 3f, 3f, 3f, 3f, 3f, 3f, 3f, 4f, 4f}, read);
      }
    }
  }

  @Test
  void shouldFailEveryCallAfterClose() throws Exception {
    RandomStoreData data = new RandomStoreData(MASTER_SEED, 3, 10);
    Path dir = temp.resolve("closed");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      data.write(dir, budget);
      SalesStore store = SalesStore.open(dir, budget);
      SeriesAttributes attributes = store.attributes();
      PriceTable prices = store.prices();
      DayCalendar calendar = store.calendar();
      store.close();
      store.close();
      assertThrows(IllegalStateException.class, () -> store.units(0, 0));
      assertThrows(IllegalStateException.class, () -> store.readUnits(0, 0, new int[10], 0, 10));
      assertThrows(IllegalStateException.class, () -> store.maxUnits(0));
      assertThrows(IllegalStateException.class, () -> attributes.code(0, 0));
      assertThrows(IllegalStateException.class, () -> prices.changeCount(0));
      assertThrows(IllegalStateException.class, () -> calendar.value(0, 0, 0));
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldRejectDuplicateSeriesAndBadUnits() throws Exception {
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        StoreWriter writer = new StoreWriter(temp.resolve("dup"), RandomStoreData.FIRST_DATE, 2,
            java.util.List.of("item", "store"), budget)) {
      writer.addSeries(new String[] {"a", "s1"}, new int[] {1, 2});
      IllegalArgumentException duplicate = assertThrows(IllegalArgumentException.class,
          () -> writer.addSeries(new String[] {"a", "s1"}, new int[] {1, 2}));
      assertEquals("duplicate series \"a/s1\": each series may appear once", duplicate.getMessage());
      IllegalArgumentException negative = assertThrows(IllegalArgumentException.class,
          () -> writer.addSeries(new String[] {"b", "s1"}, new int[] {1, -2}));
      assertEquals("units must be >= 0 or UNKNOWN_UNITS (-1), got -2 on day 1", negative.getMessage());
      assertEquals(1, writer.seriesCount());
      assertTrue(writer.attributes().seriesIndexOf("a/s1") == 0);
    }
  }
}
