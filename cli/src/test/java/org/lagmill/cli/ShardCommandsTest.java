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
 * shard → forecast each shard → evaluate each shard's part → merge-scores, against one evaluate of the whole
 * store with the same forecasts, through {@link Main#run} with its exit codes.
 */
class ShardCommandsTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final int HORIZON = 28;
  private static final int PARTS = 3;

  @Test
  void shouldMergeShardScoresIntoTheWholeStoresScore(@TempDir Path dir) throws IOException {
    Path scenario = GeneratedScenario.generate(dir.resolve("scenario"), 36, 300, 5);
    Path shortSales = dir.resolve("sales-short.csv");
    List<String> wide = Files.readAllLines(scenario.resolve("sales.csv"));
    List<String> cut = new ArrayList<>();
    for (String line : wide) {
      int end = line.length();
      for (int i = 0; i < HORIZON; i++) {
        end = line.lastIndexOf(',', end - 1);
      }
      cut.add(line.substring(0, end));
    }
    Files.write(shortSales, cut);
    Path storeA = dir.resolve("A");
    Path storeB = dir.resolve("B");
    for (Path[] pair : new Path[][] {{shortSales, storeA}, {scenario.resolve("sales.csv"), storeB}}) {
      MainRun.of("ingest", "--sales", pair[0].toString(), "--calendar",
          scenario.resolve("calendar.csv").toString(), "--prices", scenario.resolve("prices.csv").toString(),
          "--store", pair[1].toString(), "--quiet").expectOk();
    }
    MainRun sharded = MainRun.of("shard", "--store", storeA.toString(), "--parts", "" + PARTS, "--by", "article",
        "--out", dir.resolve("A-shards").toString());
    sharded.expectOk();
    assertTrue(sharded.out().contains("split 36 series by article into 3 shards"), sharded.out());
    MainRun.of("shard", "--store", storeB.toString(), "--parts", "" + PARTS, "--by", "article", "--out",
        dir.resolve("B-shards").toString()).expectOk();

    Path model = dir.resolve("M");
    MainRun.of("train", "--store", storeA.toString(), "--model", model.toString(), "--rounds", "8",
        "--deterministic", "--threads", "1", "--quiet").expectOk();
    List<String> whole = new ArrayList<>();
    List<String> merge = new ArrayList<>(List.of("merge-scores", "--json"));
    String[] hierarchy = {"--hierarchy", "district>outlet", "--hierarchy", "section>family>article"};
    for (int part = 0; part < PARTS; part++) {
      Path forecast = dir.resolve("f-" + part + ".csv");
      MainRun.of("forecast", "--store", dir.resolve("A-shards/shard-" + part).toString(), "--model",
          model.toString(), "--out", forecast.toString(), "--intervals", "--quiet").expectOk();
      List<String> lines = Files.readAllLines(forecast);
      whole.addAll(part == 0 ? lines : lines.subList(1, lines.size()));
      Path scoring = dir.resolve("part-" + part + ".json");
      List<String> evaluate = new ArrayList<>(List.of("evaluate", "--store",
          dir.resolve("B-shards/shard-" + part).toString(), "--forecast", forecast.toString(), "--scoring-part",
          scoring.toString(), "--json"));
      evaluate.addAll(List.of(hierarchy));
      MainRun.of(evaluate.toArray(new String[0])).expectOk();
      merge.add(scoring.toString());
    }
    Path wholeForecast = dir.resolve("f-all.csv");
    Files.write(wholeForecast, whole);
    List<String> evaluateWhole = new ArrayList<>(List.of("evaluate", "--store", storeB.toString(), "--forecast",
        wholeForecast.toString(), "--json"));
    evaluateWhole.addAll(List.of(hierarchy));
    MainRun single = MainRun.of(evaluateWhole.toArray(new String[0]));
    single.expectOk();
    MainRun merged = MainRun.of(merge.toArray(new String[0]));
    merged.expectOk();
    JsonNode expected = JSON.readTree(single.out()).get("forecast");
    JsonNode actual = JSON.readTree(merged.out()).get("forecast");
    assertEquals(expected.get("wrmsse").asDouble(), actual.get("wrmsse").asDouble(), 1e-9, merged.out());
    assertEquals(expected.get("wspl").asDouble(), actual.get("wspl").asDouble(), 1e-9, merged.out());
    for (int l = 0; l < expected.get("levels").size(); l++) {
      JsonNode e = expected.get("levels").get(l);
      JsonNode a = actual.get("levels").get(l);
      assertEquals(e.get("name").asText(), a.get("name").asText());
      assertEquals(e.get("aggregateCount").asInt(), a.get("aggregateCount").asInt(), e.get("name").asText());
      assertEquals(e.get("weightedRmsse").asDouble(), a.get("weightedRmsse").asDouble(), 1e-9, e.get("name").asText());
      assertEquals(e.get("mae").asDouble(), a.get("mae").asDouble(), 1e-9, e.get("name").asText());
    }

    // two parts of three: refused with the missing shard named, exit 2
    MainRun missing = MainRun.of("merge-scores", merge.get(2), merge.get(3));
    assertEquals(2, missing.exitCode(), missing.err());
    assertTrue(missing.err().contains("missing the scoring parts of shards [2] of 3"), missing.err());
    // a shard split by an attribute with too few values: refused before anything is written
    MainRun tooMany = MainRun.of("shard", "--store", storeA.toString(), "--parts", "40", "--by", "district", "--out",
        dir.resolve("none").toString());
    assertEquals(2, tooMany.exitCode(), tooMany.err());
    assertTrue(tooMany.err().contains("would hold no series"), tooMany.err());
    assertTrue(Files.notExists(dir.resolve("none")));
  }
}
