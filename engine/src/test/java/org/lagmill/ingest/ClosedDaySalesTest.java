package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;

/**
 * Sales on declared closed days are counted and said: random wide stores with closures by shop, checked against a
 * count made straight from the generated units and closure ranges.
 */
class ClosedDaySalesTest {
  private static final long MASTER_SEED = TestSeeds.master(41_077L);
  private static final LocalDate FIRST = LocalDate.of(2024, 1, 1);

  @TempDir
  Path temp;

  @Test
  void shouldCountSalesOnClosedDaysAsASlowCountOfTheInputDoes() throws Exception {
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    for (int round = 0; round < 20; round++) {
      int skus = 1 + random.nextInt(6);
      int shops = 1 + random.nextInt(3);
      int days = 1 + random.nextInt(40);
      int[][] units = new int[skus * shops][days];
      StringBuilder sales = new StringBuilder("sku,shop");
      for (int d = 0; d < days; d++) {
        sales.append(',').append(FIRST.plusDays(d));
      }
      sales.append('\n');
      for (int k = 0; k < skus; k++) {
        for (int h = 0; h < shops; h++) {
          int[] row = units[k * shops + h];
          sales.append('k').append(k).append(",h").append(h);
          for (int d = 0; d < days; d++) {
            row[d] = random.nextInt(4) == 0 ? random.nextInt(5) : 0;
            sales.append(',').append(row[d]);
          }
          sales.append('\n');
        }
      }
      // Each shop gets up to two closed ranges, some reaching past the sales days.
      boolean[][] closed = new boolean[shops][days];
      StringBuilder closures = new StringBuilder("shop,from,until\n");
      for (int h = 0; h < shops; h++) {
        int ranges = random.nextInt(3);
        int start = 0;
        for (int r = 0; r < ranges && start < days; r++) {
          int from = start + random.nextInt(days - start);
          int until = from + random.nextInt(10);
          closures.append('h').append(h).append(',').append(FIRST.plusDays(from)).append(',')
              .append(FIRST.plusDays(until)).append('\n');
          for (int d = from; d <= Math.min(until, days - 1); d++) {
            closed[h][d] = true;
          }
          start = until + 2;
        }
      }
      long expected = 0;
      for (int s = 0; s < units.length; s++) {
        for (int d = 0; d < days; d++) {
          expected += closed[s % shops][d] && units[s][d] > 0 ? 1 : 0;
        }
      }
      Path dir = Files.createDirectories(temp.resolve("r" + round));
      Path salesFile = Files.writeString(dir.resolve("sales.csv"), sales);
      Path closuresFile = Files.writeString(dir.resolve("closures.csv"), closures);
      String context = "seed " + MASTER_SEED + " round " + round + "\n" + sales + closures;
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        IngestResult result = StoreIngest.ingest(IngestOptions.of(SalesInputs.of(salesFile)
            .with(SideFile.CLOSURES, closuresFile), dir.resolve("store")), budget);
        List<String> said = result.warnings().stream().filter(w -> w.contains("fall on days the closures declare"))
            .toList();
        if (expected == 0) {
          assertEquals(List.of(), said, context);
        } else {
          assertEquals(List.of(String.format(Locale.ROOT, "%,d item-days with sales above 0 fall on days the "
              + "closures declare closed: they count as closed (not trained on, not scored, forecast 0); check the "
              + "closures file if those stores did open", expected)), said, context);
        }
        assertEquals(0, budget.heldBytes(), context);
      }
    }
  }

  @Test
  void shouldCountAgainAfterAnAppendThatKeepsTheClosures() throws Exception {
    Path first = Files.writeString(temp.resolve("first.csv"), "sku,shop,2024-01-01,2024-01-02\na,n,1,2\nb,s,3,4\n");
    Path closures = Files.writeString(temp.resolve("closures.csv"), "shop,from,until\nn,2024-01-02,2024-01-03\n");
    Path next = Files.writeString(temp.resolve("next.csv"), "sku,shop,2024-01-03\na,n,5\nb,s,6\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Path store = temp.resolve("store");
      assertTrue(StoreIngest
          .ingest(IngestOptions.of(SalesInputs.of(first).with(SideFile.CLOSURES, closures), store), budget).warnings()
          .get(0).startsWith("1 item-days with sales above 0 fall on days the closures declare closed"));
      IngestResult appended = StoreAppend.append(AppendOptions.of(store, next), budget);
      assertTrue(appended.warnings().get(0).startsWith("2 item-days with sales above 0"), appended.warnings()
          .toString());
    }
  }
}
