package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
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
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;

/**
 * Closures on stores whose period is longer than a day: closed dates map to the periods holding them, a period is
 * closed only when every one of its days is, and periods closed in part stay open and are counted. Closures are keyed
 * unlike the demo's (by shop alone, by a group, by nothing), with rows split inside a week and reaching outside the
 * sales on both sides.
 */
class PeriodClosuresTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);
  private static final int U = SalesHistory.UNKNOWN_UNITS;

  @TempDir
  Path temp;

  /**
   * Hand-worked on a weekly store of four weeks from Monday 2024-01-01 (week k starts 2024-01-01 + 7k). Shop s1 is
   * closed Tue 01-09 .. Wed 01-10 (part of week 1) and Thu 2023-12-28 .. Mon 01-01 (of week 0 only its Monday): both
   * its series are partly closed in weeks 0 and 1, 4 item-weeks, and stay open. Shop s2 is closed Mon 01-15 .. Wed
   * 01-17 and Thu 01-18 .. Sun 01-21: the two rows cover all of week 2, which is closed. Its week 4 (01-29 .. 02-04)
   * lies after the sales and is closed too (a closure in the forecast horizon).
   */
  @Test
  void shouldCloseAWeekOnlyWhenEveryDayOfItIsClosed() throws Exception {
    Path sales = Files.writeString(temp.resolve("weekly.csv"), """
        sku,shop,2024-01-01,2024-01-08,2024-01-15,2024-01-22
        tea,s1,5,4,7,2
        jam,s1,0,1,0,3
        tea,s2,6,6,5,4
        """);
    Path closures = Files.writeString(temp.resolve("shut.csv"), """
        shop,from,until,reason
        s1,2024-01-09,2024-01-10,refit
        s2,2024-01-15,2024-01-17,flood
        s2,2024-01-18,2024-01-21,flood
        s2,2024-01-29,2024-02-04,
        s1,2023-12-28,2024-01-01,stock count
        """);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales)
          .with(SideFile.CLOSURES, closures), temp.resolve("store")), budget);
      assertEquals(List.of("4 item-weeks partly closed (the closures cover some of their days, not all) are kept "
          + "open: their sales are those of the open days, and a forecast for one is not reduced; a week counts as "
          + "closed only when every day of it is closed",
          "1 item-weeks with sales above 0 fall on weeks the "
              + "closures declare closed: they count as closed (not trained on, not scored, forecast 0); check the "
              + "closures file if those stores did open"),
          result.warnings());
      assertEquals(1, result.manifest().fill().closedItemDays());
      assertEquals(4, result.manifest().fill().partlyClosedItemDays());
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        int tea1 = store.attributes().seriesIndexOf("tea/s1");
        int jam1 = store.attributes().seriesIndexOf("jam/s1");
        int tea2 = store.attributes().seriesIndexOf("tea/s2");
        int[] row = new int[4];
        store.readUnits(tea1, 0, row, 0, 4);
        assertEquals(List.of(5, 4, 7, 2), boxed(row));
        store.readUnits(jam1, 0, row, 0, 4);
        assertEquals(List.of(0, 1, 0, 3), boxed(row));
        store.readUnits(tea2, 0, row, 0, 4);
        assertEquals(List.of(6, 6, U, 4), boxed(row));
        for (int week = 0; week < 6; week++) {
          assertEquals(week == 2 || week == 4, store.isClosed(tea2, week), "tea/s2 week " + week);
          assertEquals(false, store.isClosed(tea1, week), "tea/s1 week " + week);
        }
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  /** Random stores of 2, 7 and 14 days per period and random closures, against a day-by-day reference. */
  @Test
  void shouldMatchADayByDayReferenceOnRandomClosures() throws Exception {
    for (int round = 0; round < 24; round++) {
      long seed = MASTER_SEED + round;
      String where = "seed " + seed + " (replay with -Dlagmill.seed=" + MASTER_SEED + ")";
      Random random = new Random(seed);
      int periodDays = new int[] {2, 7, 14}[round % 3];
      LocalDate first = LocalDate.of(2024, 1, 1).plusDays(random.nextInt(7));
      int periodCount = 2 + random.nextInt(8);
      int skuCount = 1 + random.nextInt(4);
      int shopCount = 1 + random.nextInt(3);
      List<String[]> series = new ArrayList<>();
      StringBuilder csv = new StringBuilder("sku,shop,grp");
      for (int p = 0; p < periodCount; p++) {
        csv.append(',').append(first.plusDays((long) p * periodDays));
      }
      csv.append('\n');
      for (int k = 0; k < skuCount; k++) {
        for (int h = 0; h < shopCount; h++) {
          if (random.nextInt(5) == 0 && !(k == 0 && h == 0)) {
            continue;
          }
          String[] values = {"k" + k, "h" + h, "g" + (k % 2)};
          series.add(values);
          csv.append(String.join(",", values));
          for (int p = 0; p < periodCount; p++) {
            csv.append(',').append(random.nextInt(9));
          }
          csv.append('\n');
        }
      }
      // Key columns: none (the whole chain), a shop, a group holding skus, or one series.
      List<List<Integer>> keySets = List.of(List.of(), List.of(1), List.of(2), List.of(0, 1));
      List<Integer> keys = keySets.get(random.nextInt(keySets.size()));
      int rowCount = random.nextInt(12);
      int spanDays = periodCount * periodDays;
      StringBuilder closuresCsv = new StringBuilder();
      for (int key : keys) {
        closuresCsv.append(new String[] {"sku", "shop", "grp"}[key]).append(',');
      }
      closuresCsv.append("from,until\n");
      int maxUntilDay = 0;
      List<int[]> rows = new ArrayList<>();
      List<String[]> rowKeys = new ArrayList<>();
      for (int r = 0; r < rowCount; r++) {
        String[] keyValues = new String[3];
        for (int key : keys) {
          keyValues[key] = key == 0 ? "k" + random.nextInt(skuCount) : key == 1 ? "h" + random.nextInt(shopCount)
              : "g" + random.nextInt(2);
          closuresCsv.append(keyValues[key]).append(',');
        }
        int fromDay = random.nextInt(spanDays + 2 * periodDays) - periodDays;
        int untilDay = fromDay + random.nextInt(3 * periodDays);
        maxUntilDay = Math.max(maxUntilDay, untilDay);
        closuresCsv.append(first.plusDays(fromDay)).append(',').append(first.plusDays(untilDay)).append('\n');
        rows.add(new int[] {fromDay, untilDay});
        rowKeys.add(keyValues);
      }
      // Slow reference: each series' closed days, then each period: closed when all its days are, partly when some.
      int referencePeriods = maxUntilDay / periodDays + 2;
      boolean[][] closedDay = new boolean[series.size()][referencePeriods * periodDays];
      for (int r = 0; r < rows.size(); r++) {
        for (int s = 0; s < series.size(); s++) {
          boolean matches = true;
          for (int key : keys) {
            matches &= series.get(s)[key].equals(rowKeys.get(r)[key]);
          }
          for (int d = Math.max(0, rows.get(r)[0]); matches && d <= rows.get(r)[1]; d++) {
            closedDay[s][d] = true;
          }
        }
      }
      Path sales = Files.writeString(temp.resolve("sales" + round + ".csv"), csv.toString());
      Path closures = Files.writeString(temp.resolve("closures" + round + ".csv"), closuresCsv.toString());
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales)
            .with(SideFile.CLOSURES, closures), temp.resolve("store" + round)), budget);
        long partial = 0;
        long closedInSales = 0;
        try (SalesStore store = SalesStore.open(temp.resolve("store" + round), budget)) {
          assertEquals(periodDays, store.periodDays(), where);
          for (int s = 0; s < series.size(); s++) {
            int index = store.attributes().seriesIndexOf(String.join("/", series.get(s)));
            for (int p = 0; p < referencePeriods; p++) {
              int closedDays = 0;
              for (int d = p * periodDays; d < (p + 1) * periodDays; d++) {
                closedDays += closedDay[s][d] ? 1 : 0;
              }
              boolean closed = closedDays == periodDays;
              partial += closedDays > 0 && !closed ? 1 : 0;
              assertEquals(closed, store.isClosed(index, p), where + ", series " + s + ", period " + p);
              if (p < periodCount) {
                closedInSales += closed ? 1 : 0;
                assertEquals(closed, store.units(index, p) == U, where + ", series " + s + ", period " + p);
              }
            }
          }
        }
        assertEquals(closedInSales, result.manifest().fill().closedItemDays(), where);
        assertEquals(partial, result.manifest().fill().partlyClosedItemDays(), where);
        assertEquals(partial > 0, result.warnings().stream().anyMatch(w -> w.contains("partly closed")), where);
        assertEquals(0, budget.heldBytes(), where);
      }
    }
  }

  private static List<Integer> boxed(int[] values) {
    List<Integer> list = new ArrayList<>();
    for (int v : values) {
      list.add(v);
    }
    return list;
  }
}
