package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The command line on testdata/tiny, through {@link Main#run} as a user would call it. */
class TinyFixtureCommandsTest {
  /** Surefire runs in the cli module's folder; the fixtures live in the sibling testdata module. */
  private static final Path TINY = Path.of("..", "testdata", "tiny");

  @TempDir
  Path temp;

  @Test
  void shouldIngestWithCalendarAndPricesPrintTheWarningAndInspect() throws Exception {
    Path store = temp.resolve("store");
    MainRun ingest = MainRun.of("ingest", "--sales", TINY.resolve("sales.csv").toString(), "--calendar",
        TINY.resolve("calendar.csv").toString(), "--prices", TINY.resolve("prices.csv").toString(), "--store",
        store.toString());
    assertEquals(0, ingest.exitCode(), ingest.err());
    assertEquals("warning: 1 price rows for unknown keys skipped (first: item=ZZZ-D9-0999, store=NV-01)\n",
        ingest.err());
    assertTrue(ingest.out().startsWith("ingested 4 series x 14 days (2026-01-05 .. 2026-01-18)"), ingest.out());

    MainRun quiet = MainRun.of("ingest", "--sales", TINY.resolve("sales.csv").toString(), "--prices",
        TINY.resolve("prices.csv").toString(), "--store", store.toString(), "--replace", "--quiet");
    assertEquals(0, quiet.exitCode(), quiet.err());
    assertEquals("", quiet.err() + quiet.out(), "--quiet prints no warning either");

    MainRun inspect = MainRun.of("inspect", "--store", store.toString(), "--json");
    assertEquals(0, inspect.exitCode(), inspect.err());
    JsonNode json = new ObjectMapper().readTree(inspect.out());
    assertEquals(4, json.get("seriesCount").asInt());
    assertEquals("2026-01-18", json.get("lastDate").asText());
  }

  @Test
  void shouldRejectAnUnknownSalesFormatAndReportABadPricesFile() throws Exception {
    MainRun format = MainRun.of("ingest", "--sales", TINY.resolve("sales.csv").toString(),
        "--sales-format", "tall", "--store", temp.resolve("s").toString());
    assertEquals(ExitCodes.USAGE_ERROR, format.exitCode());
    assertTrue(format.err().contains("--sales-format must be one of wide, long, auto, got 'tall'"), format.err());
    MainRun column = MainRun.of("ingest", "--sales", TINY.resolve("sales.csv").toString(), "--prices",
        TINY.resolve("prices.csv").toString(), "--price-column", "amount", "--store", temp.resolve("s").toString());
    assertEquals(ExitCodes.BAD_INPUT, column.exitCode());
    assertEquals("lagmill: " + TINY.resolve("prices.csv") + ", line 1: no column 'amount' in header "
        + "item,store,from,price: expected one (or name it with --prices-price-column)\n", column.err());
    try (Stream<Path> left = Files.list(temp)) {
      assertEquals(List.of(), left.toList(), "no store and no temporary directory");
    }
  }

  @Test
  void shouldNameTheFlagsWhenARanksRequestIsRefused() {
    Path store = temp.resolve("store");
    assertEquals(0, MainRun.of("ingest", "--sales", TINY.resolve("sales.csv").toString(), "--store",
        store.toString(), "--quiet").exitCode());
    String machines = "127.0.0.1:12400,127.0.0.1:12410";
    MainRun noRank = MainRun.of("train", "--store", store.toString(), "--model", temp.resolve("m").toString(),
        "--machines", machines);
    assertEquals(ExitCodes.USAGE_ERROR, noRank.exitCode(), noRank.err());
    assertEquals("lagmill: --machines and --rank go together: give every rank the same --machines list and its own "
        + "--rank\n", noRank.err());
    MainRun whole = MainRun.of("train", "--store", store.toString(), "--model", temp.resolve("m").toString(),
        "--machines", machines, "--rank", "0", "--tree-learner", "voting");
    assertEquals(ExitCodes.USAGE_ERROR, whole.exitCode(), whole.err());
    assertEquals("lagmill: rank 0 of 2 needs shard 0 of a store split in 2 (lagmill shard --parts 2); --store "
        + store + " is a whole store\n", whole.err());
    assertTrue(!Files.exists(temp.resolve("m")), "no model directory");
  }
}
