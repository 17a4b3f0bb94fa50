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
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;

/**
 * A till export writes a row only when something sold. Read with the default {@code ‹missing-rows› zero}, it must give
 * the same store as the same sales written densely (a row for every day from each series' first row), whatever the
 * column names. Shaped unlike our generator on purpose: columns sku, shop, dept, no series_id, series launching on
 * different days, some rows with an empty units cell.
 */
class MissingRowsIngestTest {
  private static final long MASTER_SEED = TestSeeds.master(20_261_202L);
  private static final LocalDate FIRST_DATE = LocalDate.of(2025, 11, 3);
  private static final int U = SalesHistory.UNKNOWN_UNITS;
  /** Marks a day written with an empty units cell in both files. */
  private static final int EMPTY_CELL = -2;

  @TempDir
  Path temp;

  @Test
  void shouldReadASparseTillExportAsTheSameSalesWrittenDensely() throws Exception {
    Random seeds = new Random(MASTER_SEED);
    for (int round = 0; round < 6; round++) {
      long seed = seeds.nextLong();
      String where = "master seed " + MASTER_SEED + " (-Dlagmill.seed), round " + round;
      Table table = Table.random(new Random(seed));
      Path sparse = temp.resolve("sparse-" + round + ".csv");
      Path dense = temp.resolve("dense-" + round + ".csv");
      Files.writeString(sparse, table.csv(false, new Random(seed + 1)));
      Files.writeString(dense, table.csv(true, new Random(seed + 2)));
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        IngestResult s = StoreIngest.ingest(IngestOptions.of(sparse, temp.resolve("s" + round)), budget);
        IngestResult d = StoreIngest.ingest(IngestOptions.of(dense, temp.resolve("d" + round)), budget);
        assertEquals(new StoreManifest.Fill(table.zeroRowCount(), table.unknownItemDays(), 0), s.manifest().fill(),
            where);
        assertEquals(new StoreManifest.Fill(0, table.unknownItemDays(), 0), d.manifest().fill(), where);
        try (SalesStore a = SalesStore.open(temp.resolve("s" + round), budget);
            SalesStore b = SalesStore.open(temp.resolve("d" + round), budget)) {
          assertEquals(List.of("sku", "shop", "dept"), a.manifest().attributeNames(), where);
          assertEquals(FIRST_DATE, a.firstDate(), where);
          assertEquals(table.dayCount, a.dayCount(), where);
          int[] row = new int[table.dayCount];
          for (int k = 0; k < table.seriesCount(); k++) {
            String id = table.seriesId(k);
            a.readUnits(a.attributes().seriesIndexOf(id), 0, row, 0, row.length);
            assertArrayEquals(table.expectedUnits(k), row, where + ", sparse, series " + id);
            b.readUnits(b.attributes().seriesIndexOf(id), 0, row, 0, row.length);
            assertArrayEquals(table.expectedUnits(k), row, where + ", dense, series " + id);
          }
        }
        if (table.zeroRowCount() > 0) {
          assertEquals(String.format("read %,d item-days with no row in the long sales as zero sales "
              + "(‹missing-rows› zero, the default: till exports leave out days with no sale); give ‹missing-rows› "
              + "unknown if a missing row means not known", table.zeroRowCount()), s.warnings().get(0), where);
        }
      }
    }
  }

  @Test
  void shouldWarnNamingTheOptionWhenMostDaysAreUnknown() throws Exception {
    Path sparse = temp.resolve("sparse.csv");
    // B's row sits next to A's first day so that the file's step reads as one day (with rows only on 01-01, 01-03
    // and 01-05 the most common gap, and so the store's period, would be two days).
    Files.writeString(sparse, "sku,shop,date,units\nA,s1,2025-01-01,1\nA,s1,2025-01-05,2\nB,s1,2025-01-02,1\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sparse)
          .withMissingRows(MissingRows.UNKNOWN), temp.resolve("u")), budget);
      // A: days 2..4 unknown (3); B: days 1, 3, 4, 5 unknown (4): 7 of 10.
      assertEquals(new StoreManifest.Fill(0, 7, 0), result.manifest().fill());
      assertEquals(List.of("7 of 10 item-days (70.0 %) are unknown and are left out of training and scores; if "
          + "they are days with no sale, give long sales with ‹missing-rows› zero (the default) or write 0 in wide "
          + "sales"), result.warnings());
      IngestResult zero = StoreIngest.ingest(IngestOptions.of(sparse, temp.resolve("z")), budget);
      // A: days 2..4 zero (3); B: days 3..5 zero (3), day 1 before its first row stays unknown.
      assertEquals(new StoreManifest.Fill(6, 1, 0), zero.manifest().fill());
      assertEquals(1, zero.warnings().size());
    }
  }

  /** A till export's 'day' beside a calendar's 'date': one date column option per file. */
  @Test
  void shouldTakeOneDateColumnNamePerFile() throws Exception {
    Path sales = temp.resolve("till.csv");
    Files.writeString(sales, "sku,shop,day,units\nA,s1,2025-01-01,1\nB,s1,2025-01-02,4\nA,s1,2025-01-03,2\n");
    Path calendar = temp.resolve("calendar.csv");
    Files.writeString(calendar, "date,holiday\n2025-01-01,1\n2025-01-02,0\n2025-01-03,0\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales)
          .withColumns(ColumnNames.DEFAULTS.with(Column.SALES_DATE, "day")).with(SideFile.CALENDAR, calendar),
          temp.resolve("s")), budget);
      // B has no row before its first one (unknown) and none on 01-03 (zero); A none on 01-02 (zero).
      assertEquals(new StoreManifest.Fill(2, 1, 0), result.manifest().fill());
      try (SalesStore store = SalesStore.open(temp.resolve("s"), budget)) {
        assertEquals(3, store.calendar().dayCount());
      }
      assertEquals("day", ColumnNames.DEFAULTS.withDateColumn("day").calendarDateColumn(),
          "‹date-column› still names both");
    }
  }

  /** Series sku × shop; each has a launch day before which it has no row, and a units value per day after. */
  private static final class Table {
    final String[] skus;
    final String[] shops;
    final int dayCount;
    final int[] launchDay;
    final int[][] units;

    private Table(String[] skus, String[] shops, int dayCount, int[] launchDay, int[][] units) {
      this.skus = skus;
      this.shops = shops;
      this.dayCount = dayCount;
      this.launchDay = launchDay;
      this.units = units;
    }

    static Table random(Random random) {
      int skuCount = 1 + random.nextInt(6);
      int shopCount = 1 + random.nextInt(4);
      int dayCount = 1 + random.nextInt(50);
      String[] skus = new String[skuCount];
      for (int i = 0; i < skuCount; i++) {
        skus[i] = "K" + (100 + i);
      }
      String[] shops = new String[shopCount];
      for (int i = 0; i < shopCount; i++) {
        shops[i] = "shop-" + (char) ('a' + i);
      }
      int seriesCount = skuCount * shopCount;
      int[] launch = new int[seriesCount];
      int[][] units = new int[seriesCount][dayCount];
      for (int k = 0; k < seriesCount; k++) {
        launch[k] = k == 0 ? 0 : random.nextInt(dayCount);
        for (int d = 0; d < dayCount; d++) {
          double p = random.nextDouble();
          units[k][d] = p < 0.6 ? 0 : p < 0.95 ? 1 + random.nextInt(9) : EMPTY_CELL;
        }
        // The launch day carries a sale (the first row of the sparse export), and so does series 0's last day, so
        // both files span the same dates.
        units[k][launch[k]] = 1 + random.nextInt(5);
        if (k == 0) {
          units[k][dayCount - 1] = 1 + random.nextInt(5);
        }
      }
      return new Table(skus, shops, dayCount, launch, units);
    }

    int seriesCount() {
      return units.length;
    }

    String sku(int k) {
      return skus[k / shops.length];
    }

    String shop(int k) {
      return shops[k % shops.length];
    }

    /** The department is a function of the sku (a department holds several skus). */
    String dept(int k) {
      return "D" + ((k / shops.length) % 2);
    }

    String seriesId(int k) {
      return sku(k) + "/" + shop(k) + "/" + dept(k);
    }

    /** Rows in random order; the sparse file leaves out every zero row. */
    String csv(boolean dense, Random random) {
      List<String> rows = new ArrayList<>();
      for (int k = 0; k < seriesCount(); k++) {
        for (int d = launchDay[k]; d < dayCount; d++) {
          int u = units[k][d];
          if (u == 0 && !dense) {
            continue;
          }
          rows.add(sku(k) + "," + shop(k) + "," + dept(k) + "," + FIRST_DATE.plusDays(d) + ","
              + (u == EMPTY_CELL ? "" : Integer.toString(u)));
        }
      }
      Collections.shuffle(rows, random);
      return "sku,shop,dept,date,units\n" + String.join("\n", rows) + "\n";
    }

    long zeroRowCount() {
      long count = 0;
      for (int k = 0; k < seriesCount(); k++) {
        for (int d = launchDay[k]; d < dayCount; d++) {
          count += units[k][d] == 0 ? 1 : 0;
        }
      }
      return count;
    }

    long unknownItemDays() {
      long count = 0;
      for (int k = 0; k < seriesCount(); k++) {
        for (int u : expectedUnits(k)) {
          count += u == U ? 1 : 0;
        }
      }
      return count;
    }

    int[] expectedUnits(int k) {
      int[] expected = new int[dayCount];
      for (int d = 0; d < dayCount; d++) {
        expected[d] = d < launchDay[k] || units[k][d] == EMPTY_CELL ? U : units[k][d];
      }
      return expected;
    }
  }
}
