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
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.PlanTable;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;

/** A plan file through ingest and append into plan.bin, hand-worked, and its validation messages. */
class PlanIngestTest {
  /** Two skus in two shops, weekly: four Mondays from 2025-03-03. */
  private static final String WEEKLY_SALES = "sku,shop,date,units\n"
      + "A,s1,2025-03-03,5\nA,s1,2025-03-10,4\nA,s1,2025-03-17,9\nA,s1,2025-03-24,3\n"
      + "A,s2,2025-03-03,2\nA,s2,2025-03-10,2\nA,s2,2025-03-17,6\nA,s2,2025-03-24,1\n"
      + "B,s1,2025-03-03,7\nB,s1,2025-03-10,8\nB,s1,2025-03-17,7\nB,s1,2025-03-24,9\n";

  @TempDir
  Path temp;

  /**
   * Hand-worked, weekly: a from-plan keyed by sku only. A is on promotion from Wednesday 03-12 (the week of 03-10,
   * counted as off the week's first day) until 03-24, and again from 04-07, past the last sales week; B never has a
   * row. Reach: the week of 04-07 = index 5.
   */
  @Test
  void shouldStoreAFromPlanPerKeyAndReadItPerSeries() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), WEEKLY_SALES);
    Path plan = Files.writeString(temp.resolve("plan.csv"), "valid_from,sku,deal,end_cap\n"
        + "2025-03-24,A,0,0\n2025-03-12,A,0.2,1\n2025-04-07,A,0.3,0\n2025-01-06,A,0,0\n2025-03-10,Q,1,1\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales)
          .withPlan(new PlanSource(plan, "date", "valid_from")), temp.resolve("store")), budget);
      assertEquals(List.of("1 plan rows for unknown keys skipped (first: sku=Q)",
          "1 plan dates are not the first day of a week: each holds for the week containing it",
          "1 of 3 series match no plan row: their plan features read 0 (nothing planned)"), result.warnings());
      assertTrue(result.manifest().file("plan.bin") != null, "plan.bin is listed with its checksum");
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        PlanTable stored = store.plan();
        assertEquals(List.of("deal", "end_cap"), stored.columnNames());
        assertEquals(List.of("sku"), stored.keyAttributeNames());
        assertEquals(5, stored.reachDayIndex());
        int a1 = store.attributes().seriesIndexOf("A/s1");
        int a2 = store.attributes().seriesIndexOf("A/s2");
        int b1 = store.attributes().seriesIndexOf("B/s1");
        assertEquals(stored.keyOf(a1), stored.keyOf(a2), "both shops share sku A's one copy");
        assertEquals(PlanTable.NO_KEY, stored.keyOf(b1));
        // A's change points: week 1 (0.2, 1), week 3 (0, 0), week 5 (0.3, 0); the leading zero row adds nothing.
        assertEquals(3, stored.changeCount(stored.keyOf(a1)));
        float[] deal = new float[8];
        float[] endCap = new float[8];
        for (int week = 0; week < 8; week++) {
          deal[week] = stored.valueAt(a2, 0, week);
          endCap[week] = stored.valueAt(a2, 1, week);
        }
        assertArrayEquals(new float[] {0, 0.2f, 0.2f, 0, 0, 0.3f, 0.3f, 0.3f}, deal);
        assertArrayEquals(new float[] {0, 1, 1, 0, 0, 0, 0, 0}, endCap);
        assertEquals(0f, stored.valueAt(b1, 0, 1));
        assertEquals("sku=A", stored.describeKey(store.attributes(), a1));
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  /**
   * Hand-worked, daily: a date-plan with no key column (the whole chain). A row holds for its day only; the day
   * without a row reads 0; the last row, at the reach, holds on (what carrying forward reads).
   */
  @Test
  void shouldHoldADateRowForItsPeriodOnly() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), "shop,2025-03-01,2025-03-02,2025-03-03\n"
        + "s1,1,2,3\ns2,4,5,6\n");
    Path plan = Files.writeString(temp.resolve("plan.csv"), "date,leaflet\n2025-03-02,1\n2025-03-04,1\n"
        + "2025-03-05,2\n2025-02-27,5\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales)
          .withPlan(PlanSource.of(plan)), temp.resolve("store")), budget);
      assertEquals(List.of(), result.warnings());
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        float[] leaflet = new float[7];
        for (int day = 0; day < 7; day++) {
          leaflet[day] = store.plan().valueAt(1, 0, day);
        }
        assertArrayEquals(new float[] {0, 1, 0, 1, 2, 2, 2}, leaflet);
        assertEquals(4, store.plan().reachDayIndex());
        assertEquals("all series", store.plan().describeKey(store.attributes(), 0));
      }
    }
  }

  /** A plan alone replaces the stored plan; a sales append keeps it, and a series new to the store has no key. */
  @Test
  void shouldAppendAPlanAloneAndKeepItOnASalesAppend() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), WEEKLY_SALES);
    Path store = temp.resolve("store");
    Path plan = Files.writeString(temp.resolve("plan.csv"), "shop,from,display\ns1,2025-03-10,1\ns2,2025-03-17,1\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreManifest ingested = StoreIngest.ingest(IngestOptions.of(sales, store), budget).manifest();
      assertEquals(null, ingested.file("plan.bin"), "a store without a plan has no plan.bin");
      IngestResult appended = StoreAppend.append(
          new AppendOptions(store, SalesInputs.of(null).withPlan(PlanSource.of(plan))),
          budget);
      assertEquals(4, appended.manifest().dayCount());
      try (SalesStore opened = SalesStore.open(store, budget)) {
        assertEquals(1f, opened.plan().valueAt(opened.attributes().seriesIndexOf("B/s1"), 0, 1));
        assertEquals(0f, opened.plan().valueAt(opened.attributes().seriesIndexOf("A/s2"), 0, 1));
        assertEquals(1f, opened.plan().valueAt(opened.attributes().seriesIndexOf("A/s2"), 0, 2));
      }
      Path next = Files.writeString(temp.resolve("next.csv"), "sku,shop,2025-03-31\nA,s1,1\nC,s3,2\n");
      StoreAppend.append(AppendOptions.of(store, next), budget);
      try (SalesStore opened = SalesStore.open(store, budget)) {
        assertEquals(List.of("display"), opened.plan().columnNames());
        assertEquals(1f, opened.plan().valueAt(opened.attributes().seriesIndexOf("A/s1"), 0, 4));
        assertEquals(PlanTable.NO_KEY, opened.plan().keyOf(opened.attributes().seriesIndexOf("C/s3")));
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  /** A bad plan stops the append and leaves the store byte-identical. */
  @Test
  void shouldLeaveTheStoreUntouchedWhenThePlanIsBad() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), WEEKLY_SALES);
    Path store = temp.resolve("store");
    Path plan = Files.writeString(temp.resolve("plan.csv"), "sku,date,promo\nA,2025-03-10,1\nB,2025-03-10,yes\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(sales, store), budget);
      byte[] before = StoreSnapshot.bytes(store);
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreAppend.append(
          new AppendOptions(store, SalesInputs.of(null).withPlan(PlanSource.of(plan))), budget));
      assertEquals(plan + ", line 3, column 3: plan column 'promo' holds 'yes': expected a number such as 1, 0 or "
          + "0.25", e.getMessage());
      assertArrayEquals(before, StoreSnapshot.bytes(store));
      assertEquals(0, budget.heldBytes());
    }
    assertFalse(Files.exists(temp.resolve("never")));
  }

  @Test
  void shouldNameEveryFormatErrorExactly() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), WEEKLY_SALES);
    assertError(sales, "sku,date,from,promo\nA,2025-03-03,2025-03-03,1\n", "line 1, column 3: both a 'date' column "
        + "(a row holds for its period) and a 'from' column (a row holds until the next): expected one of them");
    assertError(sales, "sku,week,promo\nA,2025-03-03,1\n", "line 1: no column 'date' or 'from' in header "
        + "sku,week,promo: expected one (or name it with ‹plan-date-column› or ‹plan-from-column›)");
    assertError(sales, "sku,shop,from\nA,s1,2025-03-03\n", "line 1: no plan value columns: expected at least one "
        + "numeric column besides the key columns (series attributes: sku, shop) and 'from'");
    assertError(sales, "sku,from,promo\nA,2025-03-03,\n", "line 2, column 3: plan column 'promo' holds '': expected "
        + "a number such as 1, 0 or 0.25");
    assertError(sales, "sku,from,promo\nA,2025-03-03,1\nA,2025-03-10,0\nA,2025-03-03,0\n", "line 4: duplicate plan "
        + "row for sku=A on 2025-03-03: lines 2 and 4, expected one");
    assertError(sales, "sku,date,promo\nA,2025-03-04,1\nA,2025-03-06,0\n", "line 3: two plan rows for sku=A in the "
        + "week of 2025-03-03: lines 2 and 3, expected one row per key and week (a dated row holds for its whole "
        + "week)");
    assertError(sales, "sku,date,promo\nA,2025-13-01,1\n", "line 2, column 2: date '2025-13-01': expected an ISO "
        + "date like 2024-03-05");
    assertError(sales, "sku,date,promo\nA,2025-03-03,1e39\n", "line 2, column 3: plan column 'promo' holds '1e39': "
        + "expected a number within float range (magnitude below 3.4e38)");
  }

  private void assertError(Path sales, String planText, String expected) throws Exception {
    Path plan = Files.writeString(temp.resolve("bad.csv"), planText);
    Path store = temp.resolve("bad-store");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).withPlan(PlanSource.of(plan)), store), budget));
      assertEquals(plan + ", " + expected, e.getMessage());
      assertEquals(0, budget.heldBytes());
    }
    assertFalse(Files.exists(store), "a failed ingest leaves no store");
  }

  @Test
  void shouldRefuseOneNameForBothTimeColumns() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new PlanSource(Path.of("plan.csv"), "when", "when"));
    assertEquals("‹plan-date-column› and ‹plan-from-column› both name 'when'; they must differ, since the column's "
        + "name tells how long a row holds", e.getMessage());
  }
}
