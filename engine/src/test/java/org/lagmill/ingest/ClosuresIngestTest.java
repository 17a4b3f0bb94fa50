package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;

/** Closures declared in a file read as unknown for every consumer and are told apart by isClosed. */
class ClosuresIngestTest {
  private static final int U = SalesHistory.UNKNOWN_UNITS;
  /** Two skus in two shops over six days, every day written (zeros included). */
  private static final String SALES = "sku,shop,date,units\n"
      + "A,s1,2025-03-01,1\nA,s1,2025-03-02,0\nA,s1,2025-03-03,2\nA,s1,2025-03-04,0\nA,s1,2025-03-05,3\nA,s1,2025-03-06,1\n"
      + "A,s2,2025-03-01,2\nA,s2,2025-03-02,2\nA,s2,2025-03-03,0\nA,s2,2025-03-04,0\nA,s2,2025-03-05,1\nA,s2,2025-03-06,4\n"
      + "B,s1,2025-03-01,0\nB,s1,2025-03-02,5\nB,s1,2025-03-03,1\nB,s1,2025-03-04,0\nB,s1,2025-03-05,0\nB,s1,2025-03-06,2\n";

  @TempDir
  Path temp;

  /**
   * Hand-worked: shop s1 closed 03-04 (a holiday, both skus), the whole chain closed 03-02 .. 03-02, sku A in s2 from
   * 03-05 to a day past the sales (delisted). Overlapping rows merge; rows for an unknown shop are counted.
   */
  @Test
  void shouldReadClosedDaysAsUnknownAndCountThem() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path closures = Files.writeString(temp.resolve("closures.csv"), "shop,sku,from,until,reason\n"
        + "s1,,2025-03-04,2025-03-04,holiday\n".replace("s1,,", "s1,A,")
        + "s1,B,2025-03-04,2025-03-04,holiday\n"
        + "s2,A,2025-03-05,2025-03-09,delisted\n"
        + "s9,A,2025-03-01,2025-03-02,unknown shop\n");
    Path chain = Files.writeString(temp.resolve("chain.csv"), "from,until\n2025-03-02,2025-03-02\n"
        + "2025-02-20,2025-02-21\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales)
          .with(SideFile.CLOSURES, closures), temp.resolve("store")), budget);
      // s1: 2 item-days on 03-04; A/s2: 03-05, 03-06 within the sales days (03-07 .. 03-09 lie after them).
      assertEquals(new StoreManifest.Fill(0, 0, 4), result.manifest().fill());
      // A/s2 sold 1 on 03-05 and 4 on 03-06, both declared closed (delisted): 2 item-days said.
      assertEquals(List.of("1 closure rows for unknown keys skipped (first: shop=s9, sku=A)", "2 item-days with "
          + "sales above 0 fall on days the closures declare closed: they count as closed (not trained on, not "
          + "scored, forecast 0); check the closures file if those stores did open"), result.warnings());
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        int a1 = store.attributes().seriesIndexOf("A/s1");
        int a2 = store.attributes().seriesIndexOf("A/s2");
        int b1 = store.attributes().seriesIndexOf("B/s1");
        int[] row = new int[6];
        store.readUnits(a1, 0, row, 0, 6);
        assertArrayEquals(new int[] {1, 0, 2, U, 3, 1}, row);
        store.readUnits(a2, 0, row, 0, 6);
        assertArrayEquals(new int[] {2, 2, 0, 0, U, U}, row);
        store.readUnits(b1, 2, row, 0, 3);
        assertArrayEquals(new int[] {1, U, 0}, java.util.Arrays.copyOf(row, 3));
        assertEquals(U, store.units(b1, 3));
        assertTrue(store.isClosed(a2, 8), "a closure may reach past the last sales day");
        double[][] point = new double[3][4];
        for (double[] row4 : point) {
          java.util.Arrays.fill(row4, 1.5);
        }
        org.lagmill.forecast.ForecastTable table = new org.lagmill.forecast.ForecastTable(6, point, new double[0],
            new double[0][][]);
        // A/s2 is closed 03-07 .. 03-09, horizon days 0 .. 2.
        assertEquals(3, table.zeroClosedDays(store));
        assertArrayEquals(new double[] {0, 0, 0, 1.5}, point[a2]);
        assertArrayEquals(new double[] {1.5, 1.5, 1.5, 1.5}, point[a1]);
        assertFalse(store.isClosed(a2, 9));
        assertFalse(store.isClosed(a1, 2));
      }
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales).with(SideFile.CLOSURES, chain), temp.resolve("chain")),
          budget);
      try (SalesStore store = SalesStore.open(temp.resolve("chain"), budget)) {
        assertEquals(3, store.manifest().fill().closedItemDays(), "no key column closes every series");
        for (int s = 0; s < 3; s++) {
          assertEquals(U, store.units(s, 1));
          assertTrue(store.isClosed(s, 1));
        }
        // A later append keeps the closures.
        Path next = Files.writeString(temp.resolve("next.csv"), "sku,shop,2025-03-07\nA,s1,1\nA,s2,1\nB,s1,1\n");
        store.close();
        StoreAppend.append(AppendOptions.of(temp.resolve("chain"), next), budget);
      }
      try (SalesStore store = SalesStore.open(temp.resolve("chain"), budget)) {
        assertEquals(U, store.units(0, 1));
        assertEquals(3, store.manifest().fill().closedItemDays());
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  /** A refresh of closures alone: no sales file, the days stay as they are. */
  @Test
  void shouldAppendClosuresAloneAndRefuseAnEmptyAppend() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path closures = Files.writeString(temp.resolve("closures.csv"), "shop,from,until\ns2,2025-03-06,2025-03-08\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(sales, temp.resolve("store")), budget);
      IngestResult result = StoreAppend.append(new AppendOptions(temp.resolve("store"),
          SalesInputs.of(null).with(SideFile.CLOSURES, closures)), budget);
      assertEquals(6, result.manifest().dayCount());
      assertEquals(1, result.manifest().fill().closedItemDays());
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        int a2 = store.attributes().seriesIndexOf("A/s2");
        assertEquals(U, store.units(a2, 5));
        assertEquals(1, store.units(a2, 4));
        assertTrue(store.isClosed(a2, 7));
      }
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> StoreAppend.append(
          AppendOptions.of(temp.resolve("store"), null), budget));
      assertEquals("nothing to append: give ‹sales›, ‹calendar›, ‹prices›, ‹closures› or ‹plan›", e.getMessage());
      assertEquals(0, budget.heldBytes());
    }
  }

  /**
   * A till export writes no row on a day a shop is shut, so under {@code ‹missing-rows› zero} those days would be
   * counted as zero-filled and as closed at once. Hand-worked: without closures A/s1 has 3 days with no row
   * (03-02 .. 03-04), B/s1 3 (03-02, 03-04, 03-05), A/s2 2 (03-03, 03-04; 03-01 lies before its first row). Shop s1
   * shut 03-03 .. 03-04 takes 2 of A/s1's and 1 of B/s1's (B/s1 has a row on 03-03): 8 - 3 = 5 zero-filled. Shop s2
   * shut on 03-01, before A/s2's first row: that unknown day counts as closed only. Closed: 4 + 1 = 5, unknown 0.
   */
  @Test
  void shouldNotCountClosedDaysWithNoRowAsZeroFilled() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), """
        sku,shop,day,qty
        A,s1,2025-03-01,2
        A,s1,2025-03-05,1
        B,s1,2025-03-01,1
        B,s1,2025-03-03,4
        A,s2,2025-03-02,3
        A,s2,2025-03-05,2
        """);
    Path closures = Files.writeString(temp.resolve("shut.csv"), "shop,from,until\ns1,2025-03-03,2025-03-04\n"
        + "s2,2025-03-01,2025-03-01\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales).with(SideFile.CLOSURES, closures)
          .withColumns(ColumnNames.DEFAULTS.with(Column.SALES_DATE, "day").with(Column.UNITS, "qty")),
          temp.resolve("store")), budget);
      assertEquals(new StoreManifest.Fill(5, 0, 5), result.manifest().fill());
      assertTrue(result.warnings().get(0).startsWith("read 5 item-days with no row in the long sales as zero sales"),
          result.warnings().toString());
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldRefuseARangeEndingBeforeItStarts() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path closures = Files.writeString(temp.resolve("closures.csv"), "shop,from,until\ns1,2025-03-04,2025-03-02\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).with(SideFile.CLOSURES, closures), temp.resolve("store")), budget));
      assertEquals(closures + ", line 2, column 3: until '2025-03-02' is before from '2025-03-04': expected a date "
          + "on or after it", e.getMessage());
    }
    assertFalse(Files.exists(temp.resolve("store")));
  }
}
