package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The per-file key column options on the command line: a mapped export ingests, a wrong mapping names the flag. */
class KeyColumnOptionsTest {
  @TempDir
  Path dir;

  @Test
  void shouldIngestPricesAndClosuresWhoseKeyColumnsAreNamedOtherwise() throws Exception {
    Path sales = Files.writeString(dir.resolve("sales.csv"), "sku,shop,2024-01-01,2024-01-02\na,n,1,2\nb,s,0,3\n");
    Path prices = Files.writeString(dir.resolve("prices.csv"), "article_code,store_no,from,price\n"
        + "a,n,2024-01-01,2.5\nb,s,2024-01-01,1.5\n");
    Path closures = Files.writeString(dir.resolve("closures.csv"), "branch,from,until\nn,2024-01-02,2024-01-02\n");
    MainRun ok = MainRun.of("ingest", "--sales", sales.toString(), "--prices", prices.toString(), "--closures",
        closures.toString(), "--prices-key-column", "sku=article_code", "--prices-key-column", "shop=store_no",
        "--closures-key-column", "shop=branch", "--store", dir.resolve("store").toString());
    assertEquals(ExitCodes.OK, ok.exitCode(), ok.err());
    assertTrue(ok.out().contains("closed 1"), ok.out());

    MainRun wrong = MainRun.of("ingest", "--sales", sales.toString(), "--prices", prices.toString(),
        "--prices-key-column", "sku=item_no", "--store", dir.resolve("other").toString());
    assertEquals(ExitCodes.BAD_INPUT, wrong.exitCode(), wrong.err());
    assertTrue(wrong.err().contains("--prices-key-column sku=item_no names no column of the file"), wrong.err());
  }
}
