package org.lagmill.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.AppendOptions;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.IngestResult;
import org.lagmill.ingest.SalesInputs;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.ingest.ShardIngest;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.StoreUpdate;

/** Ingest and append as one run each: the store, and run.json holding what was asked, found and measured. */
class IngestJobTest {
  private static final String SALES = "item,store,2024-01-01,2024-01-02,2024-01-03\n"
      + "a,n,1,0,2\nb,n,0,5,\nc,s,3,3,3\n";

  @TempDir
  Path temp;

  private IngestJob.Request request(IngestOptions options, String shard, String attribute) {
    return new IngestJob.Request(options, shard, attribute, StoreUpdate.Policy.REPLACE_WAITING,
        MemoryBudget.UNLIMITED_BYTES);
  }

  @Test
  void shouldRecordTheRequestTheStoreAndTheWarningsInRunJson() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path prices = Files.writeString(temp.resolve("prices.csv"), "item,store,from,price\na,n,2024-01-01,2.5\n"
        + "z,n,2024-01-01,1.0\n");
    Path store = temp.resolve("store");
    IngestJob.Outcome outcome = IngestJob
        .run(request(IngestOptions.of(SalesInputs.of(sales).with(SideFile.PRICES, prices), store), null,
            null));

    IngestResult result = outcome.result();
    assertEquals(3, result.manifest().seriesCount());
    assertEquals(1, result.warnings().size(), result.warnings().toString());
    JsonNode run = RunRecord.JSON.readTree(store.resolve(RunRecord.FILE_NAME).toFile());
    assertEquals("ingest", run.get("command").asText());
    JsonNode configuration = run.get("configuration");
    assertEquals(List.of("shard", "shardAttribute", "sales", "calendar", "prices", "store", "plan", "missingRows"),
        fieldNames(configuration));
    assertEquals(sales.toString(), configuration.get("sales").asText());
    assertEquals(prices.toString(), configuration.get("prices").asText());
    assertEquals(store.toString(), configuration.get("store").asText());
    assertEquals("zero", configuration.get("missingRows").asText());
    assertNullNode(configuration.get("calendar"));
    assertNullNode(configuration.get("shard"));
    JsonNode results = run.get("results");
    assertEquals(3, results.get("seriesCount").asInt());
    assertEquals(3, results.get("dayCount").asInt());
    assertEquals(result.manifest().binaryBytes(), results.get("storeBytes").asLong());
    assertEquals(result.warnings().get(0), results.get("warnings").get(0).asText());
    JsonNode stage = run.get("stages").get(0);
    assertEquals("ingest", stage.get("name").asText());
    assertEquals(3 * 3, stage.get("rowCount").asLong());
    assertEquals(outcome.peakOffHeapBytes(), stage.get("offHeapBytes").asLong());
  }

  @Test
  void shouldIngestOneShardAndRecordIt() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path store = temp.resolve("shard");
    IngestJob.Outcome outcome = IngestJob.run(request(IngestOptions.of(sales, store), "0/1", "store"));
    assertEquals(0, outcome.result().manifest().shard().part());
    assertEquals(3, outcome.result().manifest().seriesCount());
    JsonNode configuration = RunRecord.JSON.readTree(store.resolve(RunRecord.FILE_NAME).toFile())
        .get("configuration");
    assertEquals("0/1", configuration.get("shard").asText());
    assertEquals("store", configuration.get("shardAttribute").asText());
  }

  @Test
  void shouldRefuseAMalformedShardBeforeWritingAnything() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path store = temp.resolve("store");
    InvalidRequestException malformed = assertThrows(InvalidRequestException.class,
        () -> IngestJob.run(request(IngestOptions.of(sales, store), "1-2", "item")));
    assertEquals("\u2039shard\u203a '1-2': expected K/N, shard K (from 0) of N, e.g. 0/3", malformed.getMessage());
    InvalidRequestException alone = assertThrows(InvalidRequestException.class,
        () -> IngestJob.run(request(IngestOptions.of(sales, store), null, "item")));
    assertEquals("\u2039by\u203a item picks the shard of each series for \u2039shard\u203a K/N; give \u2039shard\u203a"
        + " too, or leave both out to ingest every series", alone.getMessage());
    assertFalse(Files.exists(store));
  }

  @Test
  void shouldParseAShardAsPartOfCount() {
    assertEquals(new ShardIngest.Request(2, 5, "item"), ShardIngest.Request.parse("2/5", "item"));
    assertEquals(new ShardIngest.Request(0, 1, "item"), ShardIngest.Request.parse("000/1", "item"));
    assertNull(ShardIngest.Request.parse(null, null));
    for (String text : new String[] {"", "2", "2/", "/5", "-1/5", "2/5/7", " 2/5", "1234567890/5", "a/b"}) {
      assertThrows(InvalidRequestException.class, () -> ShardIngest.Request.parse(text, "item"), text);
    }
    InvalidRequestException outside = assertThrows(InvalidRequestException.class,
        () -> ShardIngest.Request.parse("5/5", "item"));
    assertEquals("\u2039shard\u203a part 5 is outside 0..4 for 5 parts", outside.getMessage());
  }

  @Test
  void shouldRecordTheAppendInTheStoresRunJson() throws Exception {
    Path sales = Files.writeString(temp.resolve("sales.csv"), SALES);
    Path store = temp.resolve("store");
    IngestJob.run(request(IngestOptions.of(sales, store), null, null));
    Path next = Files.writeString(temp.resolve("next.csv"), "item,store,2024-01-04,2024-01-05\na,n,4,4\nd,s,1,\n");

    IngestResult appended = AppendJob.run(AppendOptions.of(store, next), true);

    assertEquals(4, appended.manifest().seriesCount());
    assertEquals(5, appended.manifest().dayCount());
    JsonNode run = RunRecord.JSON.readTree(store.resolve(RunRecord.FILE_NAME).toFile());
    assertEquals("append", run.get("command").asText());
    assertEquals(List.of("store", "sales", "missingRows", "plan"), fieldNames(run.get("configuration")));
    assertEquals(next.toString(), run.get("configuration").get("sales").asText());
    assertEquals(5, run.get("results").get("dayCount").asInt());
    assertEquals(List.of("seriesCount", "dayCount", "fill", "warnings"), fieldNames(run.get("results")));
    JsonNode stage = run.get("stages").get(0);
    assertEquals("append", stage.get("name").asText());
    assertEquals(4 * 5, stage.get("rowCount").asLong());
  }

  private static List<String> fieldNames(JsonNode node) {
    List<String> names = new ArrayList<>();
    node.fieldNames().forEachRemaining(names::add);
    return names;
  }

  private static void assertNullNode(JsonNode node) {
    assertTrue(node == null || node.isNull(), String.valueOf(node));
  }
}
