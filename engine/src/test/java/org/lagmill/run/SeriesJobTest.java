package org.lagmill.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.StoreUpdate;

/** The series listing against the sales file it was ingested from, read the obvious way. */
class SeriesJobTest {
  private static final long MASTER_SEED = TestSeeds.master(20_261_202L);
  private static final String[] WORDS = {"Oat", "rye", "SPELT", "barley", "corn", "millet"};

  @TempDir
  Path temp;

  @ParameterizedTest(name = "round {0}")
  @ValueSource(ints = {0, 1, 2, 3, 4})
  void shouldListEverySeriesOrThoseMatchingAsTheFileNamesThem(int round) throws Exception {
    Random random = new Random(MASTER_SEED + round);
    String where = "master seed " + MASTER_SEED + ", round " + round;
    // Distinct (item, outlet) pairs in a random order: the rows of a wide sales file.
    Set<List<String>> keys = new LinkedHashSet<>();
    int wanted = 1 + random.nextInt(30);
    while (keys.size() < wanted) {
      keys.add(List.of(WORDS[random.nextInt(WORDS.length)] + random.nextInt(4), "o" + random.nextInt(9)));
    }
    StringBuilder csv = new StringBuilder("item,outlet,2024-03-01,2024-03-02\n");
    for (List<String> key : keys) {
      csv.append(key.get(0)).append(',').append(key.get(1)).append(',').append(random.nextInt(5)).append(",1\n");
    }
    Path sales = Files.writeString(temp.resolve("sales-" + round + ".csv"), csv);
    Path store = temp.resolve("store-" + round);
    IngestJob.run(new IngestJob.Request(IngestOptions.of(sales, store), null, null,
        StoreUpdate.Policy.REPLACE_WAITING, MemoryBudget.UNLIMITED_BYTES));

    String match = random.nextBoolean() ? null
        : WORDS[random.nextInt(WORDS.length)].substring(1, 3).toUpperCase(Locale.ROOT);
    SeriesJob.Listing listing = SeriesJob.run(store, match);

    List<SeriesJob.Series> expected = new ArrayList<>();
    for (List<String> key : keys) {
      String id = key.get(0) + "/" + key.get(1);
      String needle = match == null ? "" : match.toLowerCase(Locale.ROOT);
      boolean hit = (id + "\n" + String.join("\n", key)).toLowerCase(Locale.ROOT).contains(needle);
      if (hit) {
        expected.add(new SeriesJob.Series(id, key));
      }
    }
    assertEquals(List.of("item", "outlet"), listing.attributeNames(), where);
    assertEquals(expected, listing.series(), where + ", match " + match);
    assertEquals(keys.size(), listing.storeSeriesCount(), where);
  }
}
