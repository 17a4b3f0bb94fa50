package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * backtest --scoring-part on every shard, then merge-scores: one merged score per origin and their mean, through
 * {@link Main#run} (the merge's equality with one store's scores of the same forecasts is checked in the engine's
 * BacktestScoringPartTest).
 */
class BacktestScoringPartCommandsTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  @Test
  void shouldMergeEveryShardsBacktestPartOriginByOrigin(@TempDir Path dir) throws IOException {
    Path store = GeneratedScenario.generateAndIngest(dir.resolve("scenario"), dir.resolve("store"), 36, 160, 5, false);
    MainRun.of("shard", "--store", store.toString(), "--parts", "2", "--by", "article", "--out",
        dir.resolve("shards").toString()).expectOk();
    Path config = Files.writeString(dir.resolve("spec.yaml"), """
        horizonDays: 7
        strategy: direct
        lagDays: [7, 14, 21]
        rollingWindowDays: [7, 14]
        rollingStats: [mean]
        """);
    List<String> merge = new ArrayList<>(List.of("merge-scores"));
    for (int part = 0; part < 2; part++) {
      Path partFile = dir.resolve("part-" + part + ".json");
      MainRun.of("backtest", "--store", dir.resolve("shards/shard-" + part).toString(), "--config",
          config.toString(), "--origins", "2", "--rounds", "5", "--deterministic", "--threads", "1", "--report",
          dir.resolve("bt-" + part).toString(), "--hierarchy", "district>outlet", "--hierarchy",
          "section>family>article", "--scoring-part", partFile.toString(), "--quiet").expectOk();
      assertEquals("lagmill-backtest-scoring-part", JSON.readTree(partFile.toFile()).get("kind").asText());
      merge.add(partFile.toString());
    }
    MainRun text = MainRun.of(merge.toArray(new String[0]));
    text.expectOk();
    assertTrue(text.out().startsWith("2 backtest scoring parts, 2 origins, horizon 7\n"), text.out());
    merge.add("--json");
    MainRun json = MainRun.of(merge.toArray(new String[0]));
    json.expectOk();
    JsonNode merged = JSON.readTree(json.out());
    JsonNode origins = merged.get("origins");
    assertEquals(2, origins.size());
    double first = origins.get(0).get("forecast").get("wrmsse").asDouble();
    double second = origins.get(1).get("forecast").get("wrmsse").asDouble();
    assertTrue(origins.get(0).get("originDay").asInt() < origins.get(1).get("originDay").asInt());
    assertEquals((first + second) / 2, merged.get("meanModelWrmsse").asDouble(), 1e-12);
    assertTrue(text.out().contains(String.format(java.util.Locale.ROOT, "mean WRMSSE over origins %.4f",
        (first + second) / 2)), text.out());

    MainRun members = MainRun.of("backtest", "--store", dir.resolve("shards/shard-0").toString(), "--member",
        config.toString(), "--member", config.toString() + "@outlet", "--origins", "2", "--report",
        dir.resolve("bt-members").toString(), "--scoring-part", dir.resolve("members.json").toString());
    assertEquals(2, members.exitCode(), members.out() + members.err());
    assertTrue(members.err().contains("--scoring-part scores one plan: leave out the members"), members.err());
  }
}
