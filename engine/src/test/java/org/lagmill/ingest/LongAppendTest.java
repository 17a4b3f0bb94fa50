package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;

/**
 * Append takes long sales, sparse till exports included: ingesting the first part of an export and appending the
 * rest gives the store that ingesting the whole export gives (units, fill counts, closures), for daily and weekly
 * stores, series that appear or fall silent in the second part, and closed days with no row.
 */
class LongAppendTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);

  @TempDir
  Path temp;

  @Test
  void shouldGiveTheStoreThatIngestingTheWholeExportGives() throws Exception {
    for (int round = 0; round < 16; round++) {
      long seed = MASTER_SEED + round;
      String where = "seed " + seed + " (replay with -Dlagmill.seed=" + MASTER_SEED + ")";
      Random random = new Random(seed);
      int periodDays = round % 2 == 0 ? 1 : 7;
      LocalDate first = LocalDate.of(2025, 3, 3);
      int periodCount = 6 + random.nextInt(20);
      int split = 2 + random.nextInt(periodCount - 3);
      boolean zero = random.nextInt(4) != 0;
      List<String> part1 = new ArrayList<>();
      List<String> part2 = new ArrayList<>();
      for (int sku = 0; sku < 1 + random.nextInt(5); sku++) {
        for (int shop = 0; shop < 1 + random.nextInt(3); shop++) {
          // A series may start late (even after the split) or stop early (a silent second part).
          int start = random.nextInt(3) == 0 ? random.nextInt(periodCount) : 0;
          int end = random.nextInt(3) == 0 ? start + random.nextInt(periodCount - start) : periodCount - 1;
          boolean written = false;
          for (int p = start; p <= end; p++) {
            int qty = random.nextInt(4) == 0 ? 0 : random.nextInt(3);
            // Sparse: no row for most zero days; an empty cell now and then.
            if (qty == 0 && random.nextInt(5) != 0 && (written || p < end)) {
              continue;
            }
            String cell = random.nextInt(25) == 0 ? "" : Integer.toString(qty);
            String row = "k" + sku + ",h" + shop + ",g" + (sku % 2) + "," + first.plusDays((long) p * periodDays)
                + "," + cell;
            (p < split ? part1 : part2).add(row);
            written = true;
          }
        }
      }
      if (part1.isEmpty() || part2.isEmpty()) {
        continue;
      }
      String header = "sku,shop,grp,day,qty\n";
      Path whole = Files.writeString(temp.resolve("whole" + round + ".csv"), header + String.join("\n", part1) + "\n"
          + String.join("\n", part2) + "\n");
      Path first1 = Files.writeString(temp.resolve("first" + round + ".csv"), header + String.join("\n", part1) + "\n");
      Path rest = Files.writeString(temp.resolve("rest" + round + ".csv"), header + String.join("\n", part2) + "\n");
      int closedPeriod = random.nextInt(periodCount);
      Path closures = Files.writeString(temp.resolve("shut" + round + ".csv"), "shop,from,until\nh0,"
          + first.plusDays((long) closedPeriod * periodDays) + "," + first.plusDays((long) closedPeriod * periodDays
              + periodDays - 1)
          + "\n");
      ColumnNames columns = ColumnNames.DEFAULTS.with(Column.SALES_DATE, "day").with(Column.UNITS, "qty");
      MissingRows policy = zero ? MissingRows.ZERO : MissingRows.UNKNOWN;
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        IngestResult reference = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(whole)
            .withColumns(columns).withMissingRows(policy).with(SideFile.CLOSURES, closures),
            temp.resolve("whole" + round)), budget);
        StoreIngest.ingest(IngestOptions.of(SalesInputs.of(first1).withColumns(columns)
            .withMissingRows(policy).with(SideFile.CLOSURES, closures), temp.resolve("parts" + round)), budget);
        // Closures are kept per series: a series new in the second part is closed only when the closures file
        // comes again with the append (docs/formats/closures.md).
        IngestResult appended = StoreAppend.append(new AppendOptions(temp.resolve("parts" + round), SalesInputs.of(rest)
            .withColumns(columns).withMissingRows(policy).with(SideFile.CLOSURES, closures)), budget);
        StoreManifest expected = reference.manifest();
        assertEquals(expected.dayCount(), appended.manifest().dayCount(), where);
        assertEquals(expected.fill(), appended.manifest().fill(), where);
        try (SalesStore a = SalesStore.open(temp.resolve("whole" + round), budget);
            SalesStore b = SalesStore.open(temp.resolve("parts" + round), budget)) {
          assertEquals(a.seriesCount(), b.seriesCount(), where);
          int[] rowA = new int[a.dayCount()];
          int[] rowB = new int[a.dayCount()];
          for (int s = 0; s < a.seriesCount(); s++) {
            String id = a.attributes().seriesId(s);
            int t = b.attributes().seriesIndexOf(id);
            a.readUnits(s, 0, rowA, 0, a.dayCount());
            b.readUnits(t, 0, rowB, 0, a.dayCount());
            assertArrayEquals(rowA, rowB, where + ", series " + id);
          }
        }
        assertEquals(0, budget.heldBytes(), where);
      }
    }
  }

  @Test
  void shouldRefuseDatesTheStoreAlreadyHoldsAndOtherAttributes() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), "sku,shop,day,qty\nA,s1,2025-03-01,2\n"
        + "A,s1,2025-03-02,1\nB,s1,2025-03-03,1\n");
    Path overlap = Files.writeString(temp.resolve("next.csv"), "sku,shop,day,qty\nA,s1,2025-03-05,2\n"
        + "B,s1,2025-03-03,4\n");
    Path other = Files.writeString(temp.resolve("other.csv"), "sku,store,day,qty\nA,s1,2025-03-05,2\n");
    ColumnNames columns = ColumnNames.DEFAULTS.with(Column.SALES_DATE, "day").with(Column.UNITS, "qty");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales).withColumns(columns), temp.resolve("store")), budget);
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreAppend.append(
          new AppendOptions(temp.resolve("store"), SalesInputs.of(overlap).withColumns(columns)), budget));
      assertEquals(overlap + ", line 3, column 3: day '2025-03-03' is before 2025-03-04: expected dates from "
          + "2025-03-04 on (the period after the store's last)", e.getMessage());
      e = assertThrows(InputFormatException.class, () -> StoreAppend.append(
          new AppendOptions(temp.resolve("store"), SalesInputs.of(other).withColumns(columns)), budget));
      assertEquals(other + ", line 1: expected the attribute columns of the store [sku, shop], found [sku, store]",
          e.getMessage());
      // A sparse week: B sold nothing, A sold on 03-06 only. Zero-filled: A 03-04, 03-05; B 03-04 .. 03-06.
      Path week = Files.writeString(temp.resolve("week.csv"), "sku,shop,day,qty\nA,s1,2025-03-06,3\n");
      IngestResult result = StoreAppend.append(
          new AppendOptions(temp.resolve("store"), SalesInputs.of(week).withColumns(columns)),
          budget);
      assertTrue(result.warnings().get(0).startsWith("read 5 item-days with no row in the long sales as zero"),
          result.warnings().toString());
      // Ingest: A 03-03 zero, B 03-01 and 03-02 unknown (before its first row); then 5.
      assertEquals(new StoreManifest.Fill(6, 2, 0), result.manifest().fill());
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldRefuseAKnownSeriesWhoseAttributesChangedAsTheWideAppendDoes() throws Exception {
    Path first = Files.writeString(temp.resolve("first.csv"), "series_id,sku,dept,2024-01-01,2024-01-02\n"
        + "k1,A,frozen,1,2\nk2,B,dry,3,4\n");
    Path moved = Files.writeString(temp.resolve("moved.csv"), "dept,series_id,date,sku,units\ndry,k2,2024-01-03,B,5\n"
        + "chilled,k1,2024-01-03,A,6\nchilled,k1,2024-01-04,A,1\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(first, temp.resolve("store")), budget);
      List<String> before = StoreIngestTest.listing(temp.resolve("store"));
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreAppend.append(AppendOptions.of(temp.resolve("store"), moved), budget));
      assertEquals(moved + ", line 3, column 1: series 'k1' has dept=chilled: expected dept=frozen as in the store"
          + " (a series keeps its attributes; give a changed one a new series id)", e.getMessage());
      assertEquals(before, StoreIngestTest.listing(temp.resolve("store")));
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldWarnWhenOneAppendedDateStretchesTheStoreTenfold() throws Exception {
    StringBuilder history = new StringBuilder("sku,date,units\n");
    for (int d = 1; d <= 20; d++) {
      history.append("A,2024-03-").append(String.format("%02d", d)).append(",1\n");
    }
    Path first = Files.writeString(temp.resolve("first.csv"), history);
    Path week = Files.writeString(temp.resolve("week.csv"), "sku,date,units\nA,2024-03-21,1\nA,2024-03-27,2\n");
    Path typo = Files.writeString(temp.resolve("typo.csv"), "sku,date,units\nA,2024-03-28,1\nB,2042-03-28,2\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(first, temp.resolve("store")), budget);
      // a week after 20 days: the store grows from 20 to 27 days, no warning
      assertEquals(List.of(), StoreAppend.append(AppendOptions.of(temp.resolve("store"), week), budget).warnings()
          .stream().filter(w -> w.contains("stretches")).toList());
      // the store's 27 days count as the other rows' dates: 2042 stretches them to 6,602 days
      List<String> warnings = StoreAppend.append(AppendOptions.of(temp.resolve("store"), typo), budget).warnings()
          .stream().filter(w -> w.contains("stretches")).toList();
      assertEquals(List.of(typo + ", line 3: date 2042-03-28 stretches the dates to 6602 days, more than 10 times"
          + " the 28 days of the store and the other rows (1 row on that date); the store holds every day in between:"
          + " check it for a typo, or narrow ‹date-window› to refuse such dates"), warnings);
      assertEquals(0, budget.heldBytes());
    }
  }
}
