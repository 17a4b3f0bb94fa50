package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A daily till export shaped unlike the demo chain on purpose, through every command as a user would run them: a
 * sparse long file (no row on a day with no sale, rows shuffled) with its own column names ({@code sku, shop, dept,
 * grp, day, qty}), a department holding two groups (so the nesting found is dept > grp > sku, and shop apart), one sku
 * launched part-way, closures keyed by shop alone (a two-day holiday, a twenty-day refit, one day in the forecast
 * horizon), prices keyed by sku alone. Every count the commands print is checked against a count made here from the
 * rows written, the obvious way.
 */
class RetailExportPipelineTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);
  private static final LocalDate FIRST = LocalDate.of(2024, 1, 1);
  private static final int DAYS = 420;
  private static final int HORIZON = 14;
  private static final int CUT = DAYS - HORIZON;
  private static final String[] SHOPS = {"north", "south", "east"};
  /** sku k00 .. k11: four per group; groups G1, G2 in dept D1, G3 in dept D2. */
  private static final int SKUS = 12;
  private static final int LAUNCHED_SKU = 5;
  private static final int LAUNCH_DAY = 150;
  private static final List<String> LEVELS = List.of("total", "dept", "shop", "grp", "sku", "dept x shop",
      "grp x shop", "sku x shop");
  /** Aggregates per level, from the structure written: 2 depts, 3 shops, 3 groups, 12 skus. */
  private static final List<Integer> AGGREGATES = List.of(1, 2, 3, 3, 12, 6, 9, 36);

  @TempDir
  Path dir;

  private static String group(int sku) {
    return "G" + (sku / 4 + 1);
  }

  private static String dept(int sku) {
    return sku < 8 ? "D1" : "D2";
  }

  /** Shop closures by day index: south 100..101 (holiday), east 200..219 (refit), north CUT + 3 (stock count). */
  private static boolean closed(int shop, int day) {
    return switch (shop) {
      case 0 -> day == CUT + 3;
      case 1 -> day == 100 || day == 101;
      default -> day >= 200 && day <= 219;
    };
  }

  /** Counts made from the rows written: the reference every printed count is checked against. */
  private record Counts(long zeroFilled, long unknown, long closed, long closedAfterFirstRow) {}

  @Test
  void shouldRunATillExportWithOtherNamesNestingAndClosuresThroughEveryCommand() throws Exception {
    String where = "seed " + MASTER_SEED + " (replay with -Dlagmill.seed=" + MASTER_SEED + ")";
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    List<String> rowsShort = new ArrayList<>();
    List<String> rowsFull = new ArrayList<>();
    int[][] firstRowDay = new int[SKUS][SHOPS.length];
    boolean[][][] hasRow = new boolean[SKUS][SHOPS.length][DAYS];
    for (int sku = 0; sku < SKUS; sku++) {
      for (int shop = 0; shop < SHOPS.length; shop++) {
        double mean = 0.4 + 3 * random.nextDouble();
        firstRowDay[sku][shop] = -1;
        for (int day = sku == LAUNCHED_SKU ? LAUNCH_DAY : 0; day < DAYS; day++) {
          if (closed(shop, day)) {
            continue;
          }
          int qty = poisson(random, mean * (FIRST.plusDays(day).getDayOfWeek().getValue() >= 6 ? 1.4 : 1.0));
          if (qty == 0) {
            continue;
          }
          String row = String.join(",", String.format(Locale.ROOT, "k%02d", sku), SHOPS[shop], dept(sku),
              group(sku), FIRST.plusDays(day).toString(), Integer.toString(qty));
          rowsFull.add(row);
          if (day < CUT) {
            rowsShort.add(row);
            hasRow[sku][shop][day] = true;
            if (firstRowDay[sku][shop] < 0) {
              firstRowDay[sku][shop] = day;
            }
          }
        }
      }
    }
    Collections.shuffle(rowsShort, new java.util.Random(MASTER_SEED));
    Collections.shuffle(rowsFull, new java.util.Random(MASTER_SEED + 1));
    String header = "sku,shop,dept,grp,day,qty\n";
    Path salesShort = Files.writeString(dir.resolve("till.csv"), header + String.join("\n", rowsShort) + "\n");
    Path salesFull = Files.writeString(dir.resolve("till-full.csv"), header + String.join("\n", rowsFull) + "\n");
    Path closures = Files.writeString(dir.resolve("shut.csv"), "shop,from,until,reason\n"
        + "south," + FIRST.plusDays(100) + "," + FIRST.plusDays(101) + ",holiday\n"
        + "east," + FIRST.plusDays(200) + "," + FIRST.plusDays(219) + ",refit\n"
        + "north," + FIRST.plusDays(CUT + 3) + "," + FIRST.plusDays(CUT + 3) + ",stock count\n");
    StringBuilder prices = new StringBuilder("sku,from,price\n");
    for (int sku = 0; sku < SKUS; sku++) {
      prices.append(String.format(Locale.ROOT, "k%02d,2023-12-01,%.2f%n", sku, 2 + sku * 0.5));
      prices.append(String.format(Locale.ROOT, "k%02d,2024-09-01,%.2f%n", sku, 1.8 + sku * 0.5));
    }
    Path pricesFile = Files.writeString(dir.resolve("prices.csv"), prices.toString());
    Counts counts = countShort(firstRowDay, hasRow);

    // Ingest: the fill counts on the console, in run.json and in inspect.
    Path store = dir.resolve("store");
    MainRun ingest = MainRun.of("ingest", "--sales", salesShort.toString(), "--sales-date-column", "day",
        "--units-column", "qty", "--closures", closures.toString(), "--prices", pricesFile.toString(), "--store",
        store.toString());
    assertEquals(0, ingest.exitCode(), ingest.err());
    assertEquals(String.format(Locale.ROOT, "warning: read %,d item-days with no row in the long sales as zero sales "
        + "(--missing-rows zero, the default: till exports leave out days with no sale); give --missing-rows unknown "
        + "if a missing row means not known%n", counts.zeroFilled()), ingest.err(), where);
    assertTrue(ingest.out().contains(String.format(Locale.ROOT, "item-days filled with zero %,d, unknown %,d, closed "
        + "%,d%n", counts.zeroFilled(), counts.unknown(), counts.closed())), where + ": " + ingest.out());
    JsonNode ingestRun = JSON.readTree(store.resolve("run.json").toFile()).get("results").get("fill");
    assertEquals(counts.zeroFilled(), ingestRun.get("zeroFilledItemDays").asLong(), where);
    assertEquals(counts.unknown(), ingestRun.get("unknownItemDays").asLong(), where);
    assertEquals(counts.closed(), ingestRun.get("closedItemDays").asLong(), where);
    MainRun inspect = MainRun.of("inspect", "--store", store.toString());
    assertTrue(inspect.out().contains("nesting sku           under grp\nnesting shop          (root)\n"
        + "nesting dept          (root)\nnesting grp           under dept\n"), inspect.out());

    // Backtest on the whole export: the levels from the nesting, the source said on the console, in JSON, run.json
    // and the report.
    Path full = dir.resolve("full");
    assertEquals(0, MainRun.of("ingest", "--sales", salesFull.toString(), "--sales-date-column", "day",
        "--units-column", "qty", "--closures", closures.toString(), "--prices", pricesFile.toString(), "--store",
        full.toString(), "--quiet").exitCode());
    Path config = Files.writeString(dir.resolve("spec.yaml"), """
        horizonDays: 14
        strategy: direct
        lagDays: [14, 21, 28]
        rollingWindowDays: [7, 28]
        rollingStats: [mean]
        """);
    Path backtestDir = dir.resolve("bt");
    MainRun backtest = MainRun.of("backtest", "--store", full.toString(), "--config", config.toString(), "--origins",
        "2", "--rounds", "10", "--deterministic", "--threads", "1", "--report", backtestDir.toString());
    assertEquals(0, backtest.exitCode(), backtest.err());
    String levelsLine = "levels scored (8): " + String.join(", ", LEVELS) + "; detected from how the attributes nest "
        + "(the default): dept > grp > sku; shop";
    assertTrue(backtest.out().contains(levelsLine + "\n"), backtest.out());
    JsonNode fullFill = JSON.readTree(backtestDir.resolve("run.json").toFile()).get("results").get("fill");
    assertTrue(backtest.out().contains(String.format(Locale.ROOT, "item-days filled with zero %,d, unknown %,d, "
        + "closed %,d%n", fullFill.get("zeroFilledItemDays").asLong(), fullFill.get("unknownItemDays").asLong(),
        fullFill.get("closedItemDays").asLong())), backtest.out());
    // The whole export adds the horizon's 14 days, of which north's stock count closes 12 item-days.
    assertEquals(counts.closed() + SKUS, fullFill.get("closedItemDays").asLong(), where);
    JsonNode model = JSON.readTree(backtestDir.resolve("backtest.json").toFile()).get("origins").get(0).get("model");
    assertEquals("detected", model.get("levelSource").asText());
    assertEquals("dept > grp > sku; shop", model.get("levelBasis").asText());
    for (int level = 0; level < LEVELS.size(); level++) {
      assertEquals(LEVELS.get(level), model.get("levels").get(level).get("name").asText());
      assertEquals((int) AGGREGATES.get(level), model.get("levels").get(level).get("aggregateCount").asInt(),
          LEVELS.get(level));
    }
    assertEquals(levelsLine, JSON.readTree(backtestDir.resolve("run.json").toFile()).get("results")
        .get("levelsScored").asText());
    String htmlLevels = "Levels scored (8): " + String.join(", ", LEVELS) + "; from how the attributes nest in the "
        + "data (the default): dept &gt; grp &gt; sku; shop.";
    String backtestHtml = Files.readString(backtestDir.resolve("report.html"));
    assertTrue(backtestHtml.contains(htmlLevels), "report names the levels and their source");
    assertTrue(backtestHtml.contains(String.format(Locale.ROOT, "Data: %,d item-days with no row in long sales read "
        + "as zero sales; %,d item-days unknown and %,d closed, both left out of training and scores.",
        fullFill.get("zeroFilledItemDays").asLong(), fullFill.get("unknownItemDays").asLong(),
        fullFill.get("closedItemDays").asLong())), "report shows the fill counts");
    JsonNode reportJson = JSON.readTree(backtestDir.resolve("report.json").toFile()).get("report");
    assertEquals("detected", reportJson.get("accuracy").get("levelSource").asText());
    assertEquals(fullFill, reportJson.get("data").get("fill"));

    // Train: closed days give no training rows. The same export without closures trains on exactly the closed
    // item-days after each series' first row more (all of them lie inside the training window).
    Path open = dir.resolve("open");
    assertEquals(0, MainRun.of("ingest", "--sales", salesShort.toString(), "--sales-date-column", "day",
        "--units-column", "qty", "--prices", pricesFile.toString(), "--store", open.toString(), "--quiet")
        .exitCode());
    Path modelDir = dir.resolve("model");
    Path openModel = dir.resolve("open-model");
    for (String[] pair : new String[][] {{store.toString(), modelDir.toString()}, {open.toString(),
        openModel.toString()}}) {
      MainRun train = MainRun.of("train", "--store", pair[0], "--config", config.toString(), "--model", pair[1],
          "--rounds", "10", "--deterministic", "--threads", "1", "--quiet");
      assertEquals(0, train.exitCode(), train.err());
    }
    assertEquals(counts.closedAfterFirstRow(), trainingRows(openModel) - trainingRows(modelDir), where);

    // Forecast: north's stock count day is 0 and marked closed for each of its 12 series.
    Path forecast = dir.resolve("forecast.csv");
    Path reportDir = dir.resolve("report");
    MainRun forecasted = MainRun.of("forecast", "--store", store.toString(), "--model", modelDir.toString(), "--out",
        forecast.toString(), "--intervals", "--report", reportDir.toString());
    assertEquals(0, forecasted.exitCode(), forecasted.err());
    assertTrue(forecasted.err().contains("warning: forecast 0 for 12 series-days declared closed"), forecasted.err());
    List<String> lines = Files.readAllLines(forecast);
    List<String> columns = List.of(lines.get(0).split(","));
    int shopColumn = columns.indexOf("shop");
    int dateColumn = columns.indexOf("date");
    int forecastColumn = columns.indexOf("forecast");
    int closedColumn = columns.indexOf("closed");
    Set<String> closedRows = new HashSet<>();
    for (String line : lines.subList(1, lines.size())) {
      String[] cells = line.split(",");
      boolean shut = cells[shopColumn].equals("north") && cells[dateColumn].equals(FIRST.plusDays(CUT + 3).toString());
      assertEquals(shut ? "1" : "0", cells[closedColumn], line);
      if (shut) {
        assertEquals(0.0, Double.parseDouble(cells[forecastColumn]), line);
        closedRows.add(cells[0]);
      }
    }
    assertEquals(SKUS, closedRows.size());
    JsonNode forecastRun = JSON.readTree(reportDir.resolve("run.json").toFile()).get("results");
    assertEquals(SKUS, forecastRun.get("closedSeriesDays").asInt());
    assertEquals(counts.zeroFilled(), forecastRun.get("fill").get("zeroFilledItemDays").asLong());
    assertTrue(Files.readString(reportDir.resolve("report.html")).contains(String.format(Locale.ROOT, "Data: %,d "
        + "item-days with no row in long sales read as zero sales; %,d item-days unknown and %,d closed",
        counts.zeroFilled(), counts.unknown(), counts.closed())), "forecast report shows the fill counts");

    // Evaluate against the whole export: the closed horizon day leaves the scores; levels and fill said again.
    MainRun evaluated = MainRun.of("evaluate", "--store", full.toString(), "--forecast", forecast.toString(),
        "--json");
    assertEquals(0, evaluated.exitCode(), evaluated.err());
    JsonNode scores = JSON.readTree(evaluated.out());
    assertEquals("detected", scores.get("forecast").get("levelSource").asText());
    assertEquals(fullFill, scores.get("fill"));
    assertEquals(SKUS, scores.get("forecast").get("unknownActualCount").asLong(), "closed actuals are not scored");
    MainRun text = MainRun.of("evaluate", "--store", full.toString(), "--forecast", forecast.toString());
    assertTrue(text.out().contains(levelsLine + "\n"), text.out());

    // Report re-rendered from the backtest folder keeps both notes.
    Files.delete(backtestDir.resolve("report.html"));
    assertEquals(0, MainRun.of("report", "--run", backtestDir.toString()).exitCode());
    assertTrue(Files.readString(backtestDir.resolve("report.html")).contains(htmlLevels));
  }

  /**
   * The short export's fill, the obvious way: from each series' first row to the file's last date, a day
   * with no row is zero-filled unless closed; days before the first row are unknown unless closed; closed days are
   * counted once, as closed.
   */
  private static Counts countShort(int[][] firstRowDay, boolean[][][] hasRow) {
    int lastDay = 0;
    for (boolean[][] bySku : hasRow) {
      for (boolean[] byShop : bySku) {
        for (int day = 0; day < byShop.length; day++) {
          lastDay = byShop[day] ? Math.max(lastDay, day) : lastDay;
        }
      }
    }
    long zero = 0;
    long unknown = 0;
    long closedCount = 0;
    long closedAfterFirst = 0;
    for (int sku = 0; sku < SKUS; sku++) {
      for (int shop = 0; shop < SHOPS.length; shop++) {
        for (int day = 0; day <= lastDay; day++) {
          if (closed(shop, day)) {
            closedCount++;
            closedAfterFirst += day >= firstRowDay[sku][shop] ? 1 : 0;
          } else if (day < firstRowDay[sku][shop]) {
            unknown++;
          } else if (!hasRow[sku][shop][day]) {
            zero++;
          }
        }
      }
    }
    return new Counts(zero, unknown, closedCount, closedAfterFirst);
  }

  private static long trainingRows(Path model) throws Exception {
    for (JsonNode stage : JSON.readTree(model.resolve("run.json").toFile()).get("stages")) {
      if (stage.get("name").asText().equals("train")) {
        return stage.get("rowCount").asLong();
      }
    }
    throw new AssertionError("no train stage in " + model.resolve("run.json"));
  }

  private static int poisson(SplittableRandom random, double mean) {
    // Knuth's multiplication method; means here stay below 6, far from underflow of exp(-mean).
    double limit = Math.exp(-mean);
    double product = random.nextDouble();
    int count = 0;
    while (product > limit) {
      count++;
      product *= random.nextDouble();
    }
    return count;
  }
}
