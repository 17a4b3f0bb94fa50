package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreGenerations;

/**
 * Stores of other periods: the step detected from wide headers and long dates, calendar and prices read against it,
 * append at the store's step, and the errors naming the line of a date off the step. Inputs use other column names
 * (sku, shop) than the demo chain.
 */
class WeeklyStoreTest {
  private static final LocalDate MONDAY = LocalDate.of(2024, 1, 1);

  @TempDir
  Path temp;

  private Path write(String name, String text) throws Exception {
    return Files.writeString(temp.resolve(name), text);
  }

  @Test
  void shouldIngestWeeklyWideSalesWithAWeeklyCalendarAndMidWeekPrices() throws Exception {
    Path sales = write("sales.csv", """
        sku,shop,2024-01-01,2024-01-08,2024-01-15,2024-01-22
        tea,s1,5,,7,2
        jam,s1,0,1,0,3
        """);
    // One calendar row per week, dated on the week's first day; the row before the first week is dropped.
    Path calendar = write("calendar.csv", """
        date,school_break
        2023-12-25,1
        2024-01-01,1
        2024-01-08,0
        2024-01-15,0
        2024-01-22,1
        2024-01-29,0
        """);
    // Worked out by hand: tea's 2.50 from Wednesday 01-10 holds for the week of 01-08 (period 1); jam's two rows in
    // the week of 01-15 (Tue 1.20, Fri 1.10) leave the later one for that week (period 2).
    Path prices = write("prices.csv", """
        sku,shop,from,price
        tea,s1,2023-12-20,2.00
        tea,s1,2024-01-10,2.50
        jam,s1,2024-01-16,1.20
        jam,s1,2024-01-19,1.10
        """);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales).with(SideFile.CALENDAR, calendar)
          .with(SideFile.PRICES, prices), temp.resolve("store")), budget);
      Path weeklyManifest = StoreGenerations.readableDir(temp.resolve("store")).resolve("manifest.json");
      assertTrue(Files.readString(weeklyManifest).contains("\"periodDays\" : 7"));
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        assertEquals(7, store.periodDays());
        assertEquals(52, store.seasonLength());
        assertEquals(4, store.dayCount());
        assertEquals(LocalDate.of(2024, 1, 22), store.dateOf(3));
        assertEquals(LocalDate.of(2024, 1, 29), store.dateOf(4));
        int tea = store.attributes().seriesIndexOf("tea/s1");
        int jam = store.attributes().seriesIndexOf("jam/s1");
        int[] units = new int[4];
        store.readUnits(tea, 0, units, 0, 4);
        assertArrayEquals(new int[] {5, -1, 7, 2}, units);
        float[] week = new float[5];
        store.prices().readPrices(tea, 0, week, 0, 5);
        assertArrayEquals(new float[] {2.00f, 2.50f, 2.50f, 2.50f, 2.50f}, week);
        store.prices().readPrices(jam, 0, week, 0, 5);
        assertArrayEquals(new float[] {Float.NaN, Float.NaN, 1.10f, 1.10f, 1.10f}, week);
        assertEquals(5, store.calendar().dayCount());
        assertEquals(1f, store.calendar().value(0, 0, 0));
        assertEquals(0f, store.calendar().value(0, 0, 1));
        assertEquals(1f, store.calendar().value(0, 0, 3));
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldKeepADailyManifestFreeOfAPeriod() throws Exception {
    Path sales = write("daily.csv", "sku,2024-01-01,2024-01-02\ntea,1,2\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(sales, temp.resolve("daily")), budget);
      Path dailyManifest = StoreGenerations.readableDir(temp.resolve("daily")).resolve("manifest.json");
      assertTrue(!Files.readString(dailyManifest).contains("periodDays"));
      try (SalesStore store = SalesStore.open(temp.resolve("daily"), budget)) {
        assertEquals(1, store.periodDays());
        assertEquals(7, store.seasonLength());
      }
    }
  }

  /**
   * A long export without zero rows and with a week missing everywhere: the step is still 7 (its most common gap),
   * and the weeks with no row after a series' first row read zero (the default missing-rows policy), before it
   * unknown.
   */
  @Test
  void shouldDetectTheWeeklyStepOfASparseLongFile() throws Exception {
    Path sales = write("long.csv", """
        shop,sku,week,qty
        s1,tea,2024-01-22,4
        s1,tea,2024-01-01,2
        s2,tea,2024-01-08,1
        s1,jam,2024-01-15,3
        s1,jam,2024-01-08,
        """);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales)
          .withColumns(ColumnNames.DEFAULTS.withDateColumn("week").with(Column.UNITS, "qty")), temp.resolve("store")),
          budget);
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        assertEquals(7, store.periodDays());
        assertEquals(4, store.dayCount());
        int[] units = new int[4];
        store.readUnits(store.attributes().seriesIndexOf("s1/tea"), 0, units, 0, 4);
        assertArrayEquals(new int[] {2, 0, 0, 4}, units);
        store.readUnits(store.attributes().seriesIndexOf("s1/jam"), 0, units, 0, 4);
        assertArrayEquals(new int[] {-1, -1, 3, 0}, units);
      }
    }
  }

  @Test
  void shouldNameTheLineOfALongDateOffTheStep() throws Exception {
    Path sales = write("long.csv", """
        sku,date,units
        tea,2024-01-01,1
        tea,2024-01-08,1
        jam,2024-01-10,2
        jam,2024-01-15,1
        jam,2024-01-22,1
        """);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreIngest.ingest(IngestOptions.of(sales, temp.resolve("store")), budget));
      assertEquals(sales + ", line 4, column 2: date '2024-01-10' is off the file's step of 7 days (the most common gap"
          + " between its dates, from 2024-01-01): expected 2024-01-08 or 2024-01-15", e.getMessage());
      assertTrue(Files.notExists(temp.resolve("store")));
    }
  }

  @Test
  void shouldRejectACalendarOffTheStoreStep() throws Exception {
    Path sales = write("sales.csv", "sku,2024-01-01,2024-01-08\ntea,1,2\n");
    Path shifted = write("calendar.csv", "date,fair\n2023-12-27,1\n2024-01-03,0\n2024-01-10,1\n");
    Path gap = write("gap.csv", "date,fair\n2024-01-01,1\n2024-01-15,0\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).with(SideFile.CALENDAR, shifted), temp.resolve("store")), budget));
      assertEquals(shifted + ", line 2, column 1: calendar date 2023-12-27 is off the store's step of 7 days from its"
          + " first date 2024-01-01: expected 2023-12-25 or 2024-01-01", e.getMessage());
      e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).with(SideFile.CALENDAR, gap), temp.resolve("store")), budget));
      assertEquals(gap + ", line 3, column 1: calendar gap: expected 2024-01-08, found 2024-01-15", e.getMessage());
    }
  }

  @Test
  void shouldAppendTheNextWeeksAndRefuseAnotherStep() throws Exception {
    Path sales = write("sales.csv", "sku,2024-01-01,2024-01-08\ntea,1,2\n");
    Path next = write("next.csv", "sku,2024-01-15,2024-01-22\ntea,3,4\n");
    Path daily = write("daily.csv", "sku,2024-01-29,2024-01-30\ntea,3,4\n");
    Path late = write("late.csv", "sku,2024-01-30\ntea,3\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(sales, temp.resolve("store")), budget);
      StoreAppend.append(AppendOptions.of(temp.resolve("store"), next), budget);
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        assertEquals(7, store.periodDays());
        int[] units = new int[4];
        store.readUnits(0, 0, units, 0, 4);
        assertArrayEquals(new int[] {1, 2, 3, 4}, units);
      }
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreAppend.append(AppendOptions.of(temp.resolve("store"), daily), budget));
      assertEquals(daily + ", line 1: date columns 1 days apart: expected the store's step of 7 days (weekly)",
          e.getMessage());
      e = assertThrows(InputFormatException.class,
          () -> StoreAppend.append(AppendOptions.of(temp.resolve("store"), late), budget));
      assertEquals(late + ", line 1: expected the first date column to be 2024-01-29 (the period after the store's "
          + "last period, from 2024-01-22), found 2024-01-30", e.getMessage());
    }
  }
}
