package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;

/**
 * Prices, plan and closures exported with their own key column names (article_code, store_no, branch) read the same
 * as the files written with the sales' attribute names, once each file's key columns are mapped; a mapping that
 * names no column of its file is refused with the file's header.
 */
class KeyColumnsIngestTest {
  private static final String SALES = "sku,shop,2024-01-01,2024-01-02,2024-01-03,2024-01-04\n"
      + "a,n,1,2,0,3\nb,n,0,1,1,0\na,s,4,0,2,2\n";

  @TempDir
  Path temp;

  @Test
  void shouldReadRenamedKeyColumnsAsTheAttributesTheyHold() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path ownPrices = Files.writeString(temp.resolve("p1.csv"), "sku,shop,from,price\na,n,2024-01-01,2.5\n"
        + "a,s,2024-01-02,3.0\nb,n,2024-01-01,1.25\n");
    Path exportedPrices = Files.writeString(temp.resolve("p2.csv"), "from,price,store_no,article_code\n"
        + "2024-01-01,2.5,n,a\n2024-01-02,3.0,s,a\n2024-01-01,1.25,n,b\n");
    Path ownPlan = Files.writeString(temp.resolve("l1.csv"), "shop,date,promo\nn,2024-01-03,1\ns,2024-01-05,1\n");
    Path exportedPlan = Files.writeString(temp.resolve("l2.csv"), "branch,date,promo\nn,2024-01-03,1\n"
        + "s,2024-01-05,1\n");
    Path ownClosures = Files.writeString(temp.resolve("c1.csv"), "shop,from,until\ns,2024-01-02,2024-01-03\n");
    Path exportedClosures = Files.writeString(temp.resolve("c2.csv"), "branch,from,until\ns,2024-01-02,2024-01-03\n");
    ColumnNames mapped = ColumnNames.DEFAULTS.withKeyColumns(new KeyColumns(Map.of("sku", "article_code", "shop",
        "store_no"), Map.of("shop", "branch"), Map.of("shop", "branch")));
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales).with(SideFile.PRICES, ownPrices)
          .withPlan(PlanSource.of(ownPlan)).with(SideFile.CLOSURES, ownClosures), temp.resolve("own")), budget);
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(sales).with(SideFile.PRICES, exportedPrices)
          .withPlan(PlanSource.of(exportedPlan)).with(SideFile.CLOSURES, exportedClosures).withColumns(mapped),
          temp.resolve("exported")), budget);
      try (SalesStore own = SalesStore.open(temp.resolve("own"), budget.child("own"));
          SalesStore exported = SalesStore.open(temp.resolve("exported"), budget.child("exported"))) {
        int checked = 0;
        for (int s = 0; s < own.seriesCount(); s++) {
          assertEquals(own.attributes().seriesId(s), exported.attributes().seriesId(s));
          for (int d = 0; d < own.dayCount() + 2; d++) {
            assertEquals(own.prices().priceAt(s, d), exported.prices().priceAt(s, d), 0f, "price " + s + "/" + d);
            assertEquals(own.plan().valueAt(s, 0, d), exported.plan().valueAt(s, 0, d), 0f, "plan " + s + "/" + d);
            assertEquals(own.isClosed(s, d), exported.isClosed(s, d), "closed " + s + "/" + d);
            checked += own.isClosed(s, d) || own.plan().valueAt(s, 0, d) > 0 ? 1 : 0;
          }
        }
        assertTrue(checked >= 4, "the files must close and plan something for the comparison to mean anything");
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldRefuseAMappingThatNamesNoColumnOfItsFile() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path prices = Files.writeString(temp.resolve("prices.csv"), "from,price,shop,sku\n2024-01-01,2.5,n,a\n");
    ColumnNames mapped = ColumnNames.DEFAULTS.withKeyColumns(new KeyColumns(Map.of("sku", "article_code"), Map.of(),
        Map.of()));
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).with(SideFile.PRICES, prices).withColumns(mapped),
              temp.resolve("store")),
          budget));
      assertEquals(prices + ", line 1: ‹prices-key-column› sku=article_code names no column of the file: expected "
          + "'article_code' among [from, price, shop, sku]", e.getMessage());
      assertTrue(!Files.exists(temp.resolve("store")));
    }
  }
}
