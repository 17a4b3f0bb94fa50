package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A sparse till export with its own column names, through the command line as a user would run it. */
class TillExportCommandsTest {
  /** Two skus in one shop; no rows for days without a sale. sku A: days 1, 4; sku B: days 2, 4. */
  private static final String SPARSE = "sku,shop,dept,date,units\n"
      + "A,s1,D1,2025-01-01,2\nA,s1,D1,2025-01-04,1\nB,s1,D1,2025-01-02,3\nB,s1,D1,2025-01-04,5\n";

  @TempDir
  Path temp;

  @Test
  void shouldShowTheNestingFoundInTheData() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), "sku,shop,dept,date,units\n"
        + "A,s1,D1,2025-01-01,2\nA,s2,D1,2025-01-01,1\nB,s1,D1,2025-01-02,3\nC,s2,D2,2025-01-02,5\n");
    Path store = temp.resolve("store");
    assertEquals(0, MainRun.of("ingest", "--sales", sales.toString(), "--store", store.toString()).exitCode());
    MainRun text = MainRun.of("inspect", "--store", store.toString());
    assertTrue(text.out().contains("nesting sku           under dept\nnesting shop          (root)\n"
        + "nesting dept          (root)\ndefault levels from   dept > sku; shop, with the total and single series\n"),
        text.out());
    MainRun json = MainRun.of("inspect", "--store", store.toString(), "--json");
    assertEquals("dept", new ObjectMapper().readTree(json.out()).get("nesting").get("sku").asText());
  }

  @Test
  void shouldSayHowManyDaysItFilledOnTheConsoleInRunJsonAndInInspect() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), SPARSE);
    Path store = temp.resolve("store");
    MainRun ingest = MainRun.of("ingest", "--sales", sales.toString(), "--store", store.toString());
    assertEquals(0, ingest.exitCode(), ingest.err());
    // A: days 2, 3 zero; B: day 3 zero, day 1 (before its first row) unknown.
    assertEquals("warning: read 3 item-days with no row in the long sales as zero sales (--missing-rows zero, the "
        + "default: till exports leave out days with no sale); give --missing-rows unknown if a missing row means "
        + "not known\n", ingest.err());
    assertTrue(ingest.out().contains("item-days filled with zero 3, unknown 1, closed 0\n"), ingest.out());
    JsonNode run = new ObjectMapper().readTree(store.resolve("run.json").toFile());
    assertEquals("zero", run.get("configuration").get("missingRows").asText());
    assertEquals(3, run.get("results").get("fill").get("zeroFilledItemDays").asLong());
    assertEquals(1, run.get("results").get("fill").get("unknownItemDays").asLong());

    MainRun json = MainRun.of("inspect", "--store", store.toString(), "--json");
    assertEquals(0, json.exitCode(), json.err());
    assertEquals(3, new ObjectMapper().readTree(json.out()).get("fill").get("zeroFilledItemDays").asLong());
    MainRun text = MainRun.of("inspect", "--store", store.toString());
    assertTrue(text.out().contains("filled                3 item-days with zero (no row in long sales), 1 unknown, "
        + "0 closed\n"), text.out());

    MainRun unknown = MainRun.of("ingest", "--sales", sales.toString(), "--store", temp.resolve("u").toString(),
        "--missing-rows", "unknown");
    assertEquals(0, unknown.exitCode(), unknown.err());
    assertEquals("warning: 4 of 8 item-days (50.0 %) are unknown and are left out of training and scores; if they "
        + "are days with no sale, give long sales with --missing-rows zero (the default) or write 0 in wide sales\n",
        unknown.err());
    MainRun bad = MainRun.of("ingest", "--sales", sales.toString(), "--store", temp.resolve("b").toString(),
        "--missing-rows", "none");
    assertEquals(ExitCodes.USAGE_ERROR, bad.exitCode());
    assertTrue(bad.err().contains("--missing-rows must be one of zero, unknown, got 'none'"), bad.err());
  }

  /** Closures and prices with their own date column names, given per file; a missing one named in the error. */
  @Test
  void shouldReadClosuresAndPricesWithTheirOwnDateColumns() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), SPARSE.replace(",date,", ",day,"));
    Path closures = Files.writeString(temp.resolve("shut.csv"), "shop,first_day,last_day\ns1,2025-01-02,2025-01-03\n");
    Path prices = Files.writeString(temp.resolve("prices.csv"), "sku,valid_from,eur\nA,2025-01-01,2.5\n");
    Path store = temp.resolve("store");
    MainRun ingest = MainRun.of("ingest", "--sales", sales.toString(), "--sales-date-column", "day", "--closures",
        closures.toString(), "--closures-from-column", "first_day", "--closures-until-column", "last_day",
        "--prices", prices.toString(), "--prices-from-column", "valid_from", "--prices-price-column", "eur",
        "--store", store.toString());
    assertEquals(0, ingest.exitCode(), ingest.err());
    // A: days 2, 3 closed (no rows); B: day 2 closed (its row of 3 units is dropped as closed), day 3 closed.
    assertTrue(ingest.out().contains("item-days filled with zero 0, unknown 1, closed 4\n"), ingest.out());
    MainRun missing = MainRun.of("ingest", "--sales", sales.toString(), "--sales-date-column", "day", "--closures",
        closures.toString(), "--store", temp.resolve("m").toString());
    assertEquals(ExitCodes.BAD_INPUT, missing.exitCode(), missing.err());
    assertTrue(missing.err().contains(closures + ", line 1: no column 'from' in header shop,first_day,last_day: "
        + "expected one (or name it with --closures-from-column)"), missing.err());
  }

  /** A week of a sparse till export appended as it comes: the same policy and counts as ingest. */
  @Test
  void shouldAppendASparseLongWeek() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), SPARSE);
    Path store = temp.resolve("store");
    assertEquals(0, MainRun.of("ingest", "--sales", sales.toString(), "--store", store.toString(), "--quiet")
        .exitCode());
    // 01-05 .. 01-07: A sold on 01-06 only, B nothing, a new sku C from 01-07.
    Path week = Files.writeString(temp.resolve("week.csv"), "sku,shop,dept,day,qty\nA,s1,D1,2025-01-06,4\n"
        + "C,s1,D1,2025-01-07,2\n");
    MainRun append = MainRun.of("append", "--store", store.toString(), "--sales", week.toString(),
        "--sales-date-column", "day", "--units-column", "qty");
    assertEquals(0, append.exitCode(), append.err());
    // A: 01-05, 01-07; B: 01-05 .. 01-07; C: none after its first row (01-05, 01-06 unknown, not a listed series).
    assertEquals("warning: read 5 item-days with no row in the long sales as zero sales (--missing-rows zero, the "
        + "default: till exports leave out days with no sale); give --missing-rows unknown if a missing row means "
        + "not known\nwarning: 7 of 21 item-days (33.3 %) are unknown and are left out of training and scores; if they "
        + "are days with no sale, give long sales with --missing-rows zero (the default) or write 0 in wide sales\n",
        append.err());
    // Ingest's 3 zero and 1 unknown, then 5 zero; C is unknown on the 4 old days and 01-05, 01-06.
    assertTrue(append.out().contains("store " + store + " now holds 3 series x 7 days (2025-01-01 .. 2025-01-07)\n"
        + "item-days filled with zero 8, unknown 7, closed 0\n"), append.out());
    JsonNode run = new ObjectMapper().readTree(store.resolve("run.json").toFile());
    assertEquals("zero", run.get("configuration").get("missingRows").asText());
    assertEquals(8, run.get("results").get("fill").get("zeroFilledItemDays").asLong());
    MainRun overlap = MainRun.of("append", "--store", store.toString(), "--sales", week.toString(),
        "--sales-date-column", "day", "--units-column", "qty");
    assertEquals(ExitCodes.BAD_INPUT, overlap.exitCode());
    assertTrue(overlap.err().contains(week + ", line 2, column 4: day '2025-01-06' is before 2025-01-08: expected "
        + "dates from 2025-01-08 on (the period after the store's last)"), overlap.err());
  }

  /** The console says which period the store got and from what; --period overrides detection. */
  @Test
  void shouldSayWhichPeriodAndTakeAGivenOne() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), SPARSE);
    MainRun detected = MainRun.of("ingest", "--sales", sales.toString(), "--store", temp.resolve("a").toString());
    assertEquals(0, detected.exitCode(), detected.err());
    // Dates 01-01, 01-02, 01-04: gaps 1 and 2, the smaller wins the tie.
    assertTrue(detected.out().contains("\nperiod daily: detected from the sales dates, the most common gap between "
        + "consecutive dates (1 of 2 gaps)\n"), detected.out());
    MainRun given = MainRun.of("ingest", "--sales", sales.toString(), "--store", temp.resolve("b").toString(),
        "--period", "day");
    assertTrue(given.out().contains("\nperiod daily: given with --period\n"), given.out());
    MainRun bad = MainRun.of("ingest", "--sales", sales.toString(), "--store", temp.resolve("c").toString(),
        "--period", "fortnight");
    assertEquals(ExitCodes.USAGE_ERROR, bad.exitCode());
    assertTrue(bad.err().contains("--period must be day, week or a number of days 1 to 366, got 'fortnight'"),
        bad.err());
  }
}
