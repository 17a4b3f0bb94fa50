package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine.TypeConversionException;

/**
 * series, forecast of a subset, config, model and --memory-limit sizes, on a store shaped unlike the demo: columns
 * sku, shop and dept (no series_id), six series, 84 days.
 */
class SmallCommandsTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final long SEED = Long.getLong("lagmill.seed", 20240611L);
  private static final String[][] SERIES = {{"k1", "north", "fresh"}, {"k2", "north", "dry"},
      {"k3", "south", "fresh"}, {"k4", "south", "dry"}, {"k5", "east", "fresh"}, {"k6", "east", "frozen"}};

  @TempDir
  static Path dir;
  static Path store;
  static Path model;

  @BeforeAll
  static void buildStoreAndModel() throws IOException {
    SplittableRandom random = new SplittableRandom(SEED);
    StringBuilder csv = new StringBuilder("sku,shop,dept");
    LocalDate first = LocalDate.of(2025, 2, 3);
    for (int d = 0; d < 84; d++) {
      csv.append(',').append(first.plusDays(d));
    }
    for (String[] s : SERIES) {
      csv.append('\n').append(String.join(",", s));
      for (int d = 0; d < 84; d++) {
        csv.append(',').append(random.nextInt(2 + 3 * (d % 7 == 5 ? 2 : 1)));
      }
    }
    Path sales = dir.resolve("sales.csv");
    Files.writeString(sales, csv.append('\n'));
    store = dir.resolve("store");
    MainRun.of("ingest", "--sales", sales.toString(), "--store", store.toString(), "--quiet").expectOk();
    model = dir.resolve("model");
    MainRun.of("train", "--store", store.toString(), "--model", model.toString(), "--horizon", "7",
        "--lags", "7,14", "--windows", "7,14", "--rounds", "5", "--deterministic", "--threads", "1",
        "--memory-limit", "512m", "--quiet").expectOk();
  }

  @Test
  void shouldListSeriesWithTheirAttributes() throws IOException {
    MainRun all = MainRun.of("series", "--store", store.toString());
    all.expectOk();
    assertEquals("series\tsku\tshop\tdept", all.out().lines().findFirst().orElseThrow());
    assertEquals(1 + SERIES.length, all.out().lines().count());
    MainRun south = MainRun.of("series", "--store", store.toString(), "--match", "SOUTH");
    south.expectOk();
    assertEquals(List.of("series\tsku\tshop\tdept", "k3/south/fresh\tk3\tsouth\tfresh", "k4/south/dry\tk4\tsouth\tdry"),
        south.out().lines().toList());
    assertEquals("2 of 6 series contain \"SOUTH\"", south.err().strip());
    MainRun json = MainRun.of("series", "--store", store.toString(), "--match", "frozen", "--json");
    json.expectOk();
    JsonNode rows = JSON.readTree(json.out());
    assertEquals(1, rows.size());
    assertEquals("k6/east/frozen", rows.get(0).get("series").asText());
    assertEquals("east", rows.get(0).get("attributes").get("shop").asText());
  }

  @Test
  void shouldForecastOnlyTheChosenSeriesWithTheSameNumbers() throws IOException {
    Path full = dir.resolve("full.csv");
    MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        full.toString(), "--quiet").expectOk();
    Map<String, String> fullRows = new HashMap<>();
    for (String line : Files.readAllLines(full).subList(1, 1 + SERIES.length * 7)) {
      fullRows.put(line.substring(0, line.lastIndexOf(',')), line);
    }
    Path part = dir.resolve("part.csv");
    MainRun run = MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        part.toString(), "--series", "k2/north/dry", "--where", "dept=fresh", "--where", "shop=south", "--where",
        "shop=east");
    run.expectOk();
    assertTrue(run.out().contains("forecast 3 series x 7 days"), run.out());
    List<String> lines = Files.readAllLines(part);
    assertEquals("sku,shop,dept,date,forecast", lines.get(0));
    List<String> seen = new ArrayList<>();
    for (String line : lines.subList(1, lines.size())) {
      String key = line.substring(0, line.lastIndexOf(','));
      assertEquals(fullRows.get(key), line, "a subset forecast must equal the full forecast's row");
      String id = String.join("/", List.of(line.split(",")).subList(0, 3));
      if (!seen.contains(id)) {
        seen.add(id);
      }
    }
    assertEquals(List.of("k2/north/dry", "k3/south/fresh", "k5/east/fresh"), seen);
    assertEquals(1 + 3 * 7, lines.size());
    JsonNode record = JSON.readTree(dir.resolve("part.csv.run.json").toFile());
    assertEquals(3, record.get("results").get("seriesCount").asInt());
  }

  @Test
  void shouldRefuseABadSubset() {
    MainRun bad = MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        dir.resolve("x.csv").toString(), "--where", "region=west");
    assertEquals(ExitCodes.USAGE_ERROR, bad.exitCode());
    assertEquals("lagmill: --where 'region=west': the store has no attribute 'region'; its attributes: sku, shop, "
        + "dept", bad.err().strip());
    MainRun none = MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        dir.resolve("x.csv").toString(), "--where", "shop=east", "--where", "dept=dry");
    assertEquals(ExitCodes.USAGE_ERROR, none.exitCode());
    assertEquals("lagmill: no series meets every --where condition [shop=east, dept=dry]; list the store's series "
        + "with lagmill series --store " + store, none.err().strip());
    MainRun report = MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        dir.resolve("x.csv").toString(), "--series", "k1/north/fresh", "--report", dir.resolve("r").toString());
    assertEquals(ExitCodes.USAGE_ERROR, report.exitCode());
    assertTrue(report.err().contains("--report charts the aggregates of every level"), report.err());
  }

  @Test
  void shouldPrintATemplateThatChecksAsTheDefaults() throws IOException {
    MainRun template = MainRun.of("config", "--template");
    template.expectOk();
    Path file = dir.resolve("features.yaml");
    Files.writeString(file, template.out());
    MainRun check = MainRun.of("config", "--check", file.toString());
    check.expectOk();
    assertTrue(check.out().contains("lagDays:"), check.out());
    MainRun neither = MainRun.of("config");
    assertEquals(ExitCodes.USAGE_ERROR, neither.exitCode());
    assertEquals("lagmill: give either --template or --check FILE; e.g. lagmill config --template > features.yaml",
        neither.err().strip());
  }

  @Test
  void shouldShowTheModelsFeaturesWindowsAndImportance() throws IOException {
    MainRun text = MainRun.of("model", "--model", model.toString());
    text.expectOk();
    assertTrue(text.out().contains("lags                 [7, 14]"), text.out());
    assertTrue(text.out().contains("rolling windows      [7, 14], ending 1 period before the row"), text.out());
    assertTrue(text.out().contains("learned from         2025-02-03 .. "), text.out());
    assertTrue(text.out().contains("features by share of gain"), text.out());
    MainRun json = MainRun.of("model", "--model", model.toString(), "--json");
    json.expectOk();
    JsonNode importance = JSON.readTree(json.out()).get("importance");
    double shares = 0;
    for (JsonNode row : importance) {
      shares += row.get("gainShare").asDouble();
      assertTrue(!row.get("label").asText().isBlank() && !row.get("family").asText().isBlank(), row.toString());
    }
    assertEquals(1.0, shares, 1e-9);
  }

  @Test
  void shouldExplainAForecastInPartsThatAddUpToIt() throws IOException {
    Path full = dir.resolve("explained.csv");
    MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        full.toString(), "--series", "k4/south/dry", "--quiet").expectOk();
    List<String> rows = Files.readAllLines(full);
    MainRun json = MainRun.of("explain", "--store", store.toString(), "--model", model.toString(), "--series",
        "k4/south/dry", "--level", "total", "--level", "shop", "--json");
    json.expectOk();
    JsonNode charts = JSON.readTree(json.out());
    assertEquals(List.of("total", "shop: south", "series k4/south/dry"), List.of(charts.get(0).get("title").asText(),
        charts.get(1).get("title").asText(), charts.get(2).get("title").asText()));
    assertEquals(SERIES.length, charts.get(0).get("seriesCount").asInt());
    for (JsonNode chart : charts) {
      for (int d = 0; d < 7; d++) {
        double parts = 0;
        for (JsonNode part : chart.get("parts")) {
          parts += part.get(d).asDouble();
        }
        assertEquals(chart.get("forecast").get(d).asDouble(), parts, 1e-9, chart.get("title").asText());
      }
    }
    JsonNode series = charts.get(2);
    for (int d = 0; d < 7; d++) {
      String[] cells = rows.get(1 + d).split(",");
      assertEquals(series.get("dates").get(d).asText(), cells[3]);
      // the forecast file keeps 4 decimals
      assertEquals(Double.parseDouble(cells[4]), series.get("forecast").get(d).asDouble(), 5e-5);
    }
    MainRun text = MainRun.of("explain", "--store", store.toString(), "--model", model.toString(), "--level",
        "total");
    text.expectOk();
    assertTrue(text.out().startsWith("total (6 series), "), text.out());
    assertTrue(text.out().contains("  base level "), text.out());
    Path report = dir.resolve("report");
    MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        dir.resolve("r.csv").toString(), "--report", report.toString(), "--level", "total", "--level", "shop",
        "--show", "k1/north/fresh", "--quiet").expectOk();
    JsonNode drivers = JSON.readTree(report.resolve("report.json").toFile()).get("report").get("drivers");
    assertEquals(3, drivers.size());
    assertEquals("series k1/north/fresh", drivers.get(2).get("title").asText());
    assertTrue(Files.readString(report.resolve("report.html")).contains("id=\"drivers\""));
  }

  @Test
  void shouldReadMemoryLimitsWithUnits() {
    assertEquals(2L << 30, ByteSizeConverter.parse("2g"));
    assertEquals(512L << 20, ByteSizeConverter.parse("512M"));
    assertEquals(512L << 20, ByteSizeConverter.parse("512mb"));
    assertEquals(1L << 40, ByteSizeConverter.parse("1t"));
    assertEquals(3L << 10, ByteSizeConverter.parse("3k"));
    assertEquals(2000000000L, ByteSizeConverter.parse("2000000000"));
    for (String bad : List.of("", "g", "1.5g", "-1", "2x", "99999999999t")) {
      assertThrows(TypeConversionException.class, () -> ByteSizeConverter.parse(bad), bad);
    }
    MainRun run = MainRun.of("train", "--store", store.toString(), "--model", dir.resolve("m2").toString(),
        "--memory-limit", "2x");
    assertEquals(ExitCodes.USAGE_ERROR, run.exitCode());
    assertTrue(run.err().contains("'2x' is not a size in bytes; write a whole number, optionally followed by k, m, "
        + "g or t (1024-based, as java -Xmx), e.g. 512m or 2g"), run.err());
  }
}
