package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.RandomStoreData;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreAssertions;

class StoreAppendTest {
  private static final long MASTER_SEED = TestSeeds.master(99_173L);

  @TempDir
  Path temp;

  /**
   * Append equals ingesting the concatenated file: the old series keep their order, then the series new in the
   * appended file (unknown before it), and a series missing from the appended file is unknown on the new days.
   */
  @Test
  void shouldEqualIngestingTheConcatenatedFile() throws Exception {
    Random seeds = new Random(MASTER_SEED);
    for (int round = 0; round < 3; round++) {
      long seed = seeds.nextLong();
      String where = "master seed " + MASTER_SEED + ", round " + round;
      RandomStoreData data = new RandomStoreData(seed, 30, 60);
      int oldDays = 40;
      int oldSeries = 25;
      int missing = 3;
      int[][] expected = new int[data.seriesCount()][];
      for (int s = 0; s < data.seriesCount(); s++) {
        expected[s] = data.units[s].clone();
        if (s >= oldSeries) {
          Arrays.fill(expected[s], 0, oldDays, SalesHistory.UNKNOWN_UNITS);
        }
        if (s == missing) {
          Arrays.fill(expected[s], oldDays, data.dayCount, SalesHistory.UNKNOWN_UNITS);
        }
      }
      List<String> names = RandomStoreData.ATTRIBUTE_NAMES;
      Path first = temp.resolve("first-" + round + ".csv");
      Files.writeString(first, WideCsv.of(names, Arrays.copyOf(data.attributeValues, oldSeries),
          RandomStoreData.FIRST_DATE, Arrays.copyOf(data.units, oldSeries), 0, oldDays));
      // The appended file lists series in another order, attributes in another order, one old series missing.
      List<String> reordered = List.of("region", "store", "item", "series_id");
      int[] order = {7, 30 - 1, 0, 26, 12, 25, 1, 2, 4, 5, 6, 8, 9, 10, 11, 13, 14, 15, 16, 17, 18, 19, 20, 21, 22, 23,
          24, 27, 28};
      String[][] values = new String[order.length][];
      int[][] units = new int[order.length][];
      for (int i = 0; i < order.length; i++) {
        String[] v = data.attributeValues[order[i]];
        values[i] = new String[] {v[3], v[2], v[1], v[0]};
        units[i] = data.units[order[i]];
      }
      Path next = temp.resolve("next-" + round + ".csv");
      Files.writeString(next, WideCsv.of(reordered, values, RandomStoreData.FIRST_DATE, units, oldDays, data.dayCount));
      // New series enter in the appended file's order: 29, 26, 25, 27, 28.
      int[] storeOrder = new int[data.seriesCount()];
      for (int s = 0; s < oldSeries; s++) {
        storeOrder[s] = s;
      }
      int[] added = {29, 26, 25, 27, 28};
      System.arraycopy(added, 0, storeOrder, oldSeries, added.length);
      int[][] expectedUnits = new int[data.seriesCount()][];
      String[][] expectedValues = new String[data.seriesCount()][];
      for (int s = 0; s < storeOrder.length; s++) {
        expectedUnits[s] = expected[storeOrder[s]];
        expectedValues[s] = data.attributeValues[storeOrder[s]];
      }
      Path concatenated = temp.resolve("all-" + round + ".csv");
      Files.writeString(concatenated, WideCsv.of(names, expectedValues, RandomStoreData.FIRST_DATE, expectedUnits, 0,
          data.dayCount));

      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        Path appended = temp.resolve("appended-" + round);
        StoreIngest.ingest(IngestOptions.of(first, appended), budget);
        StoreAppend.append(appended, next, "series_id", budget);
        Path whole = temp.resolve("whole-" + round);
        StoreIngest.ingest(IngestOptions.of(concatenated, whole), budget);
        try (SalesStore a = SalesStore.open(appended, budget); SalesStore b = SalesStore.open(whole, budget)) {
          StoreAssertions.assertSameHistory(b, a, new Random(seed), where);
          StoreAssertions.assertSameHistory(new ArraySalesHistory(RandomStoreData.FIRST_DATE, expectedUnits,
              b.attributes(), b.prices(), b.calendar()), a, new Random(seed), where);
          assertArrayEquals(b.seriesCountByWidth(), a.seriesCountByWidth(), where);
          assertEquals(2, a.manifest().sources().size());
        }
        assertEquals(0, budget.heldBytes());
      }
    }
  }

  @Test
  void shouldRejectAFileThatDoesNotStartTheDayAfterTheStore() throws Exception {
    Path first = temp.resolve("first.csv");
    Files.writeString(first, "item,2024-01-01,2024-01-02\na,1,2\n");
    Path gap = temp.resolve("gap.csv");
    Files.writeString(gap, "item,2024-01-04\na,1\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(first, temp.resolve("store")), budget);
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreAppend.append(temp.resolve("store"), gap, "series_id", budget));
      assertEquals(gap + ", line 1: expected the first date column to be 2024-01-03 (the day after the store's last "
          + "day 2024-01-02), found 2024-01-04", e.getMessage());
      assertEquals(0, budget.heldBytes());
    }
    assertEquals(List.of("first.csv", "gap.csv", "store"), StoreIngestTest.listing(temp));
  }

  @Test
  void shouldRefuseAKnownSeriesWhoseAttributesChanged() throws Exception {
    Path first = temp.resolve("first.csv");
    Files.writeString(first, "series_id,sku,dept,2024-01-01,2024-01-02\nk1,A,frozen,1,2\nk2,B,dry,3,4\n");
    Path moved = temp.resolve("moved.csv");
    Files.writeString(moved, "dept,series_id,sku,2024-01-03\ndry,k2,B,5\nchilled,k1,A,6\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(first, temp.resolve("store")), budget);
      List<String> before = StoreIngestTest.listing(temp.resolve("store"));
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreAppend.append(temp.resolve("store"), moved, "series_id", budget));
      assertEquals(moved + ", line 3, column 1: series 'k1' has dept=chilled: expected dept=frozen as in the store"
          + " (a series keeps its attributes; give a changed one a new series id)", e.getMessage());
      assertEquals(before, StoreIngestTest.listing(temp.resolve("store")));
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldSayWhichStoredTablesDoNotCoverSeriesNewToTheStore() throws Exception {
    // Closures by shop, resolved to series at ingest: a sku new to shop 'n' after the append has none of them
    // unless the closures file comes again.
    Path first = temp.resolve("first.csv");
    Files.writeString(first, "sku,shop,2024-01-01,2024-01-02\na,n,1,2\nb,s,3,4\n");
    Path closures = temp.resolve("closures.csv");
    Files.writeString(closures, "shop,from,until\nn,2024-01-04,2024-01-04\n");
    Path next = temp.resolve("next.csv");
    Files.writeString(next, "sku,shop,2024-01-03,2024-01-04\na,n,5,0\nb,s,6,7\nc,n,1,0\nd,s,2,2\n");
    Path again = temp.resolve("again.csv");
    Files.writeString(again, "sku,shop,2024-01-05\na,n,1\nb,s,1\nc,n,1\nd,s,1\ne,n,1\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Path store = temp.resolve("store");
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(first).with(SideFile.CLOSURES, closures), store), budget);
      IngestResult kept = StoreAppend.append(AppendOptions.of(store, next), budget);
      // (The new series' unknown first days raise the store's unknown-share warning after it.)
      assertEquals("2 series new to the store have no closures from the stored files, which were matched to "
          + "series when they were read; append them again (‹closures› FILE) to cover the new series",
          kept.warnings().get(0));
      try (SalesStore opened = SalesStore.open(store, budget.child("read"))) {
        int c = opened.attributes().seriesIndexOf("c/n");
        assertTrue(opened.isClosed(opened.attributes().seriesIndexOf("a/n"), 3));
        assertTrue(!opened.isClosed(c, 3), "the stored closures do not reach the new series");
      }
      IngestResult covered = StoreAppend
          .append(new AppendOptions(store, SalesInputs.of(again).with(SideFile.CLOSURES, closures)), budget);
      assertTrue(covered.warnings().stream().noneMatch(w -> w.contains("new to the store")), covered.warnings()
          .toString());
      try (SalesStore opened = SalesStore.open(store, budget.child("read"))) {
        assertTrue(opened.isClosed(opened.attributes().seriesIndexOf("c/n"), 3));
        assertTrue(opened.isClosed(opened.attributes().seriesIndexOf("e/n"), 3));
      }
      assertEquals(0, budget.heldBytes());
    }
  }
}
