package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.SalesStore;

/** Calendar and prices files through ingest and append: values, warnings, errors and atomicity. */
class CalendarPricesWiringTest {
  private static final String SALES = """
      item,store,region,2024-03-01,2024-03-02,2024-03-03
      oat_bar,north_1,Northvale,3,0,
      tea_tin,south_1,Southmoor,0,0,2
      """;
  private static final String CALENDAR = """
      date,event,payday[region=Northvale],payday[region=Southmoor]
      2024-02-29,,0,0
      2024-03-01,,1,0
      2024-03-02,spring_fair,0,0
      2024-03-03,spring_fair,0,1
      """;
  private static final String PRICES = """
      item,store,from,price
      oat_bar,north_1,2024-02-25,2.10
      oat_bar,north_1,2024-03-04,2.50
      tea_tin,south_1,2024-03-03,4.00
      gift_box,north_1,2024-03-01,9.00
      """;

  @TempDir
  Path temp;

  private Path write(String name, String text) throws IOException {
    return Files.writeString(temp.resolve(name), text);
  }

  private IngestResult ingestGood(MemoryBudget budget) throws IOException {
    return StoreIngest.ingest(IngestOptions.of(SalesInputs.of(write("sales.csv", SALES))
        .with(SideFile.CALENDAR, write("calendar.csv", CALENDAR)).with(SideFile.PRICES, write("prices.csv", PRICES)),
        temp.resolve("store")), budget);
  }

  /** The docs/formats/prices.md example: 2.10 on 03-01 .. 03-03 and 2.50 from 03-04; tea_tin no price until 03-03. */
  @Test
  void shouldIngestCalendarAndPricesAndReportTheirWarnings() throws Exception {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = ingestGood(budget);
      assertEquals(List.of("1 price rows for unknown keys skipped (first: item=gift_box, store=north_1)"),
          result.warnings());
      assertEquals(List.of("sales.csv", "calendar.csv", "prices.csv"),
          result.manifest().sources().stream().map(f -> f.name()).toList());
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        int oat = store.attributes().seriesIndexOf("oat_bar/north_1/Northvale");
        int tea = store.attributes().seriesIndexOf("tea_tin/south_1/Southmoor");
        float[] prices = new float[5];
        store.prices().readPrices(oat, 0, prices, 0, 5);
        assertArrayEquals(new float[] {2.10f, 2.10f, 2.10f, 2.50f, 2.50f}, prices);
        store.prices().readPrices(tea, 0, prices, 0, 5);
        assertArrayEquals(new float[] {Float.NaN, Float.NaN, 4.00f, 4.00f, 4.00f}, prices);
        DayCalendar calendar = store.calendar();
        assertEquals(3, calendar.dayCount(), "the row before the first sales day is dropped");
        assertEquals(List.of("event", "payday"), List.of(calendar.columnName(0), calendar.columnName(1)));
        int southmoor = store.attributes().codeOf(store.attributes().attributeIndex("region"), "Southmoor");
        assertEquals(1f, calendar.value(1, southmoor, 2));
        assertEquals(0f, calendar.value(1, southmoor, 0));
      }
    }
  }

  @Test
  void shouldFailOnABadCalendarOrPricesFileAndLeaveTheStoreUntouched() throws Exception {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      ingestGood(budget);
      Map<String, byte[]> before = contents(temp.resolve("store"));
      Path sales = temp.resolve("sales.csv");
      Path gap = write("gap.csv", CALENDAR.replace("2024-03-02,", "2024-03-04,"));
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).with(SideFile.CALENDAR, gap), temp.resolve("store")), budget));
      assertEquals(gap + ", line 4, column 1: calendar gap: expected 2024-03-02, found 2024-03-04", e.getMessage());
      assertEquals(4, e.lineNumber());
      Path zero = write("zero.csv", PRICES.replace("4.00", "0"));
      e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).with(SideFile.PRICES, zero), temp.resolve("store")), budget));
      assertEquals(zero + ", line 4, column 4: price '0': expected a decimal number > 0", e.getMessage());
      Path renamed = temp.resolve("prices.csv");
      e = assertThrows(InputFormatException.class,
          () -> StoreIngest.ingest(
              IngestOptions.of(
                  SalesInputs.of(sales).with(SideFile.PRICES, renamed)
                      .withColumns(ColumnNames.DEFAULTS.with(Column.PRICES_FROM, "start")),
                  temp.resolve("store")),
              budget));
      assertEquals(renamed + ", line 1: no column 'start' in header item,store,from,price: expected one (or name it "
          + "with ‹prices-from-column›)", e.getMessage());
      assertSameContents(before, contents(temp.resolve("store")));
      assertEquals(List.of("calendar.csv", "gap.csv", "prices.csv", "sales.csv", "store", "zero.csv"),
          StoreIngestTest.listing(temp), "no temporary directory is left behind");
      assertEquals(0, budget.heldBytes());
    }
  }

  /** A weekly refresh: two new days, one new series, a calendar and prices running further. */
  @Test
  void shouldReplaceCalendarAndPricesOnAppend() throws Exception {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      ingestGood(budget);
      Path next = write("next.csv", """
          item,store,region,2024-03-04,2024-03-05
          oat_bar,north_1,Northvale,1,2
          jam_jar,north_1,Northvale,4,
          """);
      Path calendar = write("calendar-next.csv", CALENDAR + """
          2024-03-04,,0,0
          2024-03-05,,0,0
          2024-03-06,harvest_fair,1,0
          """);
      Path prices = write("prices-next.csv", """
          item,store,start,price
          oat_bar,north_1,2024-02-25,2.20
          jam_jar,north_1,2024-03-04,3.10
          jam_jar,north_1,2024-03-06,2.90
          fig_pot,south_1,2024-03-04,5.00
          fig_pot,south_1,2024-03-05,5.50
          """);
      IngestResult result = StoreAppend.append(new AppendOptions(temp.resolve("store"), SalesInputs.of(next)
          .with(SideFile.CALENDAR, calendar).with(SideFile.PRICES, prices)
          .withColumns(ColumnNames.DEFAULTS.with(Column.PRICES_FROM, "start"))), budget);
      // Unknown: oat_bar 03-03; tea_tin, not in the file, its 2 new days; jam_jar, new, its 3 earlier days and 03-05.
      assertEquals(List.of("2 price rows for unknown keys skipped (first: item=fig_pot, store=south_1)",
          "7 of 15 item-days (46.7 %) are unknown and are left out of training and scores; if they are days with no "
              + "sale, give long sales with ‹missing-rows› zero (the default) or write 0 in wide sales"),
          result.warnings());
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        assertEquals(3, store.seriesCount());
        assertEquals(5, store.dayCount());
        int oat = store.attributes().seriesIndexOf("oat_bar/north_1/Northvale");
        int tea = store.attributes().seriesIndexOf("tea_tin/south_1/Southmoor");
        int jam = store.attributes().seriesIndexOf("jam_jar/north_1/Northvale");
        float[] day = new float[6];
        store.prices().readPrices(oat, 0, day, 0, 6);
        assertArrayEquals(new float[] {2.20f, 2.20f, 2.20f, 2.20f, 2.20f, 2.20f}, day, "replaced, not merged");
        store.prices().readPrices(tea, 0, day, 0, 6);
        assertTrue(Float.isNaN(day[2]) && Float.isNaN(day[5]), "tea_tin has no row in the new prices file");
        store.prices().readPrices(jam, 0, day, 0, 6);
        assertArrayEquals(new float[] {Float.NaN, Float.NaN, Float.NaN, 3.10f, 3.10f, 2.90f}, day);
        assertEquals(6, store.calendar().dayCount());
        int northvale = store.attributes().codeOf(store.attributes().attributeIndex("region"), "Northvale");
        assertEquals(1f, store.calendar().value(1, northvale, 5));
      }
      // Without files the stored calendar and prices stay as they were.
      Path third = write("third.csv", "item,store,region,2024-03-06\noat_bar,north_1,Northvale,5\n");
      // The 7 unknown item-days above plus tea_tin's and jam_jar's 03-06: 9 of 18.
      assertEquals(List.of("9 of 18 item-days (50.0 %) are unknown and are left out of training and scores; if they "
          + "are days with no sale, give long sales with ‹missing-rows› zero (the default) or write 0 in wide sales"),
          StoreAppend.append(AppendOptions.of(temp.resolve("store"), third), budget).warnings());
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        int jam = store.attributes().seriesIndexOf("jam_jar/north_1/Northvale");
        assertEquals(2.90f, store.prices().priceAt(jam, 5));
        assertEquals(6, store.calendar().dayCount());
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldLeaveTheStoreByteIdenticalWhenAnAppendedFileIsBad() throws Exception {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      ingestGood(budget);
      Map<String, byte[]> before = contents(temp.resolve("store"));
      Path next = write("next.csv", "item,store,region,2024-03-04\noat_bar,north_1,Northvale,1\n");
      Path prices = write("prices-bad.csv", PRICES + "tea_tin,south_1,2024-03-03,4.20\n");
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreAppend.append(
          new AppendOptions(temp.resolve("store"), SalesInputs.of(next).with(SideFile.PRICES, prices)), budget));
      assertEquals(prices + ", line 6: duplicate price for item=tea_tin, store=south_1 from 2024-03-03: lines 4 and 6,"
          + " expected one", e.getMessage());
      Path calendar = write("calendar-bad.csv", CALENDAR.replace("2024-02-29", "2024-03-02"));
      e = assertThrows(InputFormatException.class, () -> StoreAppend.append(
          new AppendOptions(temp.resolve("store"), SalesInputs.of(next).with(SideFile.CALENDAR, calendar)), budget));
      assertEquals(calendar + ", line 3, column 1: calendar dates not ascending: expected 2024-03-03, found "
          + "2024-03-01", e.getMessage());
      assertSameContents(before, contents(temp.resolve("store")));
      assertEquals(List.of("calendar-bad.csv", "calendar.csv", "next.csv", "prices-bad.csv", "prices.csv",
          "sales.csv", "store"), StoreIngestTest.listing(temp), "no temporary directory is left behind");
      assertEquals(0, budget.heldBytes());
    }
  }

  private static void assertSameContents(Map<String, byte[]> before, Map<String, byte[]> after) {
    assertEquals(before.keySet(), after.keySet());
    for (String name : before.keySet()) {
      assertArrayEquals(before.get(name), after.get(name), name);
    }
  }

  /** Every file under the store folder (pointer, lock, generations) by relative path. */
  private static Map<String, byte[]> contents(Path dir) throws IOException {
    Map<String, byte[]> map = new TreeMap<>();
    try (var paths = Files.walk(dir)) {
      for (Path file : paths.filter(Files::isRegularFile).toList()) {
        map.put(dir.relativize(file).toString(), Files.readAllBytes(file));
      }
    }
    return map;
  }
}
