package org.lagmill.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.StoreUpdate;
import org.lagmill.training.SmallHistories;

/**
 * The checks of a rank's request that come before any rank is joined: each refusal names the settings as mentions,
 * touches no network and writes no model directory.
 */
class DistributedTrainJobTest {
  private static final String TWO_RANKS = "127.0.0.1:12400,127.0.0.1:12410";

  @TempDir
  static Path temp;

  private static Path whole;

  private static Path shards;

  @BeforeAll
  static void ingestAndSplitAStore() throws Exception {
    StringBuilder csv = new StringBuilder("item,outlet");
    LocalDate first = LocalDate.of(2024, 3, 1);
    for (int d = 0; d < 40; d++) {
      csv.append(',').append(first.plusDays(d));
    }
    csv.append('\n');
    for (int item = 0; item < 8; item++) {
      csv.append("i").append(item).append(",o1");
      for (int d = 0; d < 40; d++) {
        csv.append(',').append((item + d) % 4);
      }
      csv.append('\n');
    }
    Path sales = Files.writeString(temp.resolve("sales.csv"), csv);
    whole = temp.resolve("store");
    IngestJob.run(new IngestJob.Request(IngestOptions.of(sales, whole), null, null,
        StoreUpdate.Policy.REPLACE_WAITING, MemoryBudget.UNLIMITED_BYTES));
    shards = temp.resolve("shards");
    ShardJob.run(new ShardJob.Request(whole, 2, "item", shards, MemoryBudget.UNLIMITED_BYTES));
  }

  private static String refusal(Path store, String machines, Integer rank, String treeLearner, int timeoutSeconds) {
    Path model = temp.resolve("model-" + System.nanoTime());
    TrainJob.Request train = new TrainJob.Request(store, model, null, MemoryBudget.UNLIMITED_BYTES,
        (periodDays, cut) -> List.of(new MemberPlans.Member(null, SmallHistories.plan(SmallHistories.spec(7), 5,
            cut, 7, null))));
    InvalidRequestException e = assertThrows(InvalidRequestException.class, () -> DistributedTrainJob.run(
        new DistributedTrainJob.Request(train, machines, rank, treeLearner, timeoutSeconds), ProgressListener.SILENT,
        message -> {
          throw new AssertionError("no rank was joined, yet a peer was lost: " + message);
        }));
    assertFalse(Files.exists(model), "a refused rank writes no model directory");
    return e.getMessage();
  }

  @Test
  void shouldRefuseMachinesWithoutRankAndRankWithoutMachines() {
    String expected = "\u2039machines\u203a and \u2039rank\u203a go together: give every rank the same "
        + "\u2039machines\u203a list and its own \u2039rank\u203a";
    assertEquals(expected, refusal(shards.resolve("shard-0"), TWO_RANKS, null, "data", 600));
    assertEquals(expected, refusal(shards.resolve("shard-0"), null, 0, "data", 600));
  }

  @Test
  void shouldRefuseTheSerialLearner() {
    assertEquals("\u2039tree-learner\u203a serial trains on one machine; use data or voting with \u2039machines\u203a",
        refusal(shards.resolve("shard-0"), TWO_RANKS, 0, "serial", 600));
  }

  @Test
  void shouldRefuseARankTimeOutOutsideFiveSecondsToADay() {
    assertEquals("\u2039rank-timeout\u203a 4 is outside 5..86400 seconds",
        refusal(shards.resolve("shard-0"), TWO_RANKS, 0, "data", 4));
    assertEquals("\u2039rank-timeout\u203a 86401 is outside 5..86400 seconds",
        refusal(shards.resolve("shard-0"), TWO_RANKS, 0, "data", 86_401));
  }

  @Test
  void shouldRefuseAStoreThatIsNotThisRanksShard() {
    assertEquals("rank 0 of 2 needs shard 0 of a store split in 2 (\u2039shard command\u203a \u2039parts\u203a 2); "
        + "\u2039store\u203a " + whole + " is a whole store", refusal(whole, TWO_RANKS, 0, "data", 600));
    assertEquals("rank 0 of 2 needs shard 0 of a store split in 2 (\u2039shard command\u203a \u2039parts\u203a 2); "
        + "\u2039store\u203a " + shards.resolve("shard-1") + " is shard 1 of 2",
        refusal(shards.resolve("shard-1"), TWO_RANKS, 0, "data", 600));
    assertEquals("rank 1 of 3 needs shard 1 of a store split in 3 (\u2039shard command\u203a \u2039parts\u203a 3); "
        + "\u2039store\u203a " + shards.resolve("shard-1") + " is shard 1 of 2",
        refusal(shards.resolve("shard-1"), TWO_RANKS + ",127.0.0.1:12420", 1, "data", 600));
  }
}
