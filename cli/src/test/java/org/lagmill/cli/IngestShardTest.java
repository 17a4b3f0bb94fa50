package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code ingest --shard K/N --by ATTR} writes, for every K, the very store {@code shard --parts N --by ATTR} writes as
 * shard K from a whole ingest of the same files: every binary file of the store (series, units, attribute
 * dictionaries, prices, calendar, closures, plan) is byte for byte the same, and the manifests agree on the series,
 * the nesting and the shard record but the source's name. Wide and long sales alike.
 */
class IngestShardTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final int PARTS = 3;

  @TempDir
  static Path dir;

  @Test
  void shouldWriteEachShardAsShardWritesItFromTheWholeStore() throws IOException {
    Path scenario = GeneratedScenario.generate(dir.resolve("scenario"), 72, 120, 17);
    Path longSales = dir.resolve("sales-long.csv");
    Files.write(longSales, toLong(Files.readAllLines(scenario.resolve("sales.csv"))), StandardCharsets.UTF_8);
    for (Path sales : new Path[] {scenario.resolve("sales.csv"), longSales}) {
      String name = sales.getFileName().toString().replace(".csv", "");
      Path whole = dir.resolve(name + "-whole");
      MainRun.of(ingest(scenario, sales, whole).toArray(new String[0])).expectOk();
      MainRun.of("shard", "--store", whole.toString(), "--parts", "" + PARTS, "--by", "article", "--out",
          dir.resolve(name + "-shards").toString()).expectOk();
      int seriesOverShards = 0;
      for (int part = 0; part < PARTS; part++) {
        Path direct = dir.resolve(name + "-direct-" + part);
        List<String> args = new ArrayList<>(ingest(scenario, sales, direct));
        args.remove("--quiet");
        args.addAll(List.of("--shard", part + "/" + PARTS, "--by", "article"));
        MainRun run = MainRun.of(args.toArray(new String[0]));
        run.expectOk();
        Path split = dir.resolve(name + "-shards/shard-" + part);
        Path splitGeneration = generation(split);
        Path directGeneration = generation(direct);
        List<String> files = binaryFiles(splitGeneration);
        assertEquals(files, binaryFiles(directGeneration), name + " shard " + part);
        assertTrue(files.containsAll(List.of("attributes.bin", "units.bin", "prices.bin", "calendar.bin",
            "closures.bin", "plan.bin")), files.toString());
        for (String file : files) {
          assertArrayEquals(Files.readAllBytes(splitGeneration.resolve(file)),
              Files.readAllBytes(directGeneration.resolve(file)), name + " shard " + part + ": " + file);
        }
        JsonNode a = JSON.readTree(splitGeneration.resolve("manifest.json").toFile());
        JsonNode b = JSON.readTree(directGeneration.resolve("manifest.json").toFile());
        for (String field : new String[] {"seriesCount", "dayCount", "firstDate", "attributeNames", "nesting"}) {
          assertEquals(a.get(field), b.get(field), name + " shard " + part + ": " + field);
        }
        for (String field : new String[] {"part", "partCount", "attribute", "hash", "sourceSeriesCount"}) {
          assertEquals(a.get("shard").get(field), b.get("shard").get(field), name + " shard " + part + ": " + field);
        }
        assertTrue(b.get("shard").get("sourceName").asText().startsWith("input " + sales.getFileName()
            + " crc32c "), b.toString());
        assertTrue(run.out().contains("shard " + part + " of 3 by article: " + a.get("seriesCount").asInt()
            + " of the input's 72 series"), run.out());
        seriesOverShards += a.get("seriesCount").asInt();
      }
      assertEquals(72, seriesOverShards);
    }
  }

  @Test
  void shouldRefuseAShardRequestThatCannotBeMet() throws IOException {
    Path scenario = GeneratedScenario.generate(dir.resolve("small"), 12, 30, 3);
    Path sales = scenario.resolve("sales.csv");
    MainRun unknown = MainRun.of("ingest", "--sales", sales.toString(), "--store", dir.resolve("x1").toString(),
        "--shard", "0/2", "--by", "colour");
    assertEquals(2, unknown.exitCode(), unknown.err());
    assertTrue(unknown.err().contains("unknown attribute 'colour' for --by; allowed: [series_id, article,"),
        unknown.err());
    MainRun outside = MainRun.of("ingest", "--sales", sales.toString(), "--store", dir.resolve("x2").toString(),
        "--shard", "2/2", "--by", "article");
    assertEquals(2, outside.exitCode(), outside.err());
    assertTrue(outside.err().contains("--shard part 2 is outside 0..1 for 2 parts"), outside.err());
    MainRun noBy = MainRun.of("ingest", "--sales", sales.toString(), "--store", dir.resolve("x3").toString(),
        "--shard", "0/2");
    assertEquals(2, noBy.exitCode(), noBy.err());
    assertTrue(noBy.err().contains("--shard needs --by"), noBy.err());
    MainRun malformed = MainRun.of("ingest", "--sales", sales.toString(), "--store", dir.resolve("x4").toString(),
        "--shard", "1-2", "--by", "article");
    assertEquals(2, malformed.exitCode(), malformed.err());
    assertTrue(malformed.err().contains("--shard '1-2': expected K/N"), malformed.err());
    for (String store : new String[] {"x1", "x2", "x3", "x4"}) {
      assertTrue(!Files.exists(dir.resolve(store)) || isEmpty(dir.resolve(store)), store + " was written");
    }
  }

  private static List<String> ingest(Path scenario, Path sales, Path store) {
    return List.of("ingest", "--sales", sales.toString(), "--calendar", scenario.resolve("calendar.csv").toString(),
        "--prices", scenario.resolve("prices.csv").toString(), "--closures",
        scenario.resolve("closures.csv").toString(), "--plan", scenario.resolve("plan.csv").toString(), "--store",
        store.toString(), "--quiet");
  }

  /** The wide file as long rows: the attribute columns, date, units; one row per series and day. */
  private static List<String> toLong(List<String> wide) {
    String[] header = wide.get(0).split(",", -1);
    int firstDate = 0;
    while (!header[firstDate].matches("\\d{4}-\\d{2}-\\d{2}")) {
      firstDate++;
    }
    List<String> rows = new ArrayList<>();
    rows.add(String.join(",", java.util.Arrays.copyOf(header, firstDate)) + ",date,units");
    for (String line : wide.subList(1, wide.size())) {
      String[] cells = line.split(",", -1);
      String attributes = String.join(",", java.util.Arrays.copyOf(cells, firstDate));
      for (int c = firstDate; c < cells.length; c++) {
        rows.add(attributes + "," + header[c] + "," + cells[c]);
      }
    }
    return rows;
  }

  private static Path generation(Path store) throws IOException {
    return store.resolve(Files.readString(store.resolve("current")).trim());
  }

  private static List<String> binaryFiles(Path generation) throws IOException {
    try (Stream<Path> files = Files.list(generation)) {
      return files.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".bin")).sorted().toList();
    }
  }

  private static boolean isEmpty(Path folder) throws IOException {
    try (Stream<Path> files = Files.list(folder)) {
      return files.findAny().isEmpty();
    }
  }
}
