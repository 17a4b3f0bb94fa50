package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.eval.BaselineForecaster;
import org.lagmill.eval.BaselineKind;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.TruncatedHistory;

/**
 * A weekly data set shaped here on purpose unlike the demo chain (columns sku, shop, banner; week-start headers; a
 * weekly holiday calendar; a price file of one row per sku-shop-week with promotion weeks; a yearly demand cycle; a
 * plan of end-cap displays and flyers per banner and week, dated Mondays in one banner and Wednesdays in the other)
 * goes ingest → backtest → train → forecast → evaluate → report, and the season length is checked by hand against
 * seasonal naive on the ingested store. The plan's coverage of the horizon is checked: a plan appended alone that
 * ends early stops the forecast unless carried forward, and a store without the model's plan columns is refused.
 */
class WeeklyPipelineTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 0x7EE_C1A1L);
  private static final LocalDate FIRST_WEEK = LocalDate.of(2022, 1, 3);
  private static final int SKUS = 8;
  private static final int SHOPS = 3;
  private static final int WEEKS = 150;
  private static final int HORIZON = 8;
  private static final int FUTURE_WEEKS = 12;

  @TempDir
  Path dir;

  @Test
  void shouldRunAWeeklyDataSetThroughEveryCommand() throws Exception {
    String context = "seed " + MASTER_SEED + " (replay with -Dlagmill.seed=" + MASTER_SEED + ")";
    int[][] units = new int[SKUS * SHOPS][WEEKS];
    Path full = dir.resolve("sales.csv");
    Path shortSales = dir.resolve("sales-short.csv");
    Path calendar = dir.resolve("calendar.csv");
    Path prices = dir.resolve("prices.csv");
    Path plan = dir.resolve("plan.csv");
    writeData(units, full, shortSales, calendar, prices, plan);
    Path config = Files.writeString(dir.resolve("weekly.yaml"), """
        horizonDays: 8
        strategy: direct
        lagDays: [8, 9, 12, 52]
        rollingWindowDays: [4, 13]
        rollingStats: [mean]
        """);

    Path storeA = dir.resolve("A");
    Path storeB = dir.resolve("B");
    MainRun ingested = MainRun.of("ingest", "--sales", shortSales.toString(), "--calendar", calendar.toString(),
        "--date-column", "week_start", "--prices", prices.toString(), "--plan", plan.toString(),
        "--plan-date-column", "week_of", "--store", storeA.toString());
    ingested.expectOk();
    assertTrue(ingested.out().startsWith("ingested 24 series x 142 weeks (2022-01-03 .. 2024-09-16, weekly)"),
        ingested.out());
    assertTrue(ingested.err().contains("warning: " + (WEEKS + FUTURE_WEEKS) + " plan dates are not the first day of a "
        + "week: each holds for the week containing it"), ingested.err());
    MainRun.of("ingest", "--sales", full.toString(), "--calendar", calendar.toString(), "--date-column",
        "week_start", "--prices", prices.toString(), "--plan", plan.toString(), "--plan-date-column", "week_of",
        "--store", storeB.toString(), "--quiet").expectOk();

    Path backtest = dir.resolve("BT");
    MainRun backtested = MainRun.of("backtest", "--store", storeB.toString(), "--config", config.toString(),
        "--origins", "2", "--rounds", "10", "--deterministic", "--threads", "1", "--report", backtest.toString(),
        "--json", "--quiet");
    backtested.expectOk();
    JsonNode result = JSON.readTree(backtested.out());
    assertEquals(2, result.get("origins").size(), backtested.out());
    assertEquals("2024-07-29", result.get("origins").get(0).get("originDate").asText(), backtested.out());
    assertEquals("2024-09-23", result.get("origins").get(1).get("originDate").asText(), backtested.out());

    Path model = dir.resolve("M");
    MainRun.of("train", "--store", storeA.toString(), "--config", config.toString(), "--model",
        model.toString(), "--rounds", "20", "--deterministic", "--threads", "1", "--quiet").expectOk();
    String specYaml = JSON.readTree(model.resolve("manifest.json").toFile()).get("featureSpecYaml").asText();
    assertEquals(List.of("end_cap", "flyer"), FeatureSpecYaml.parse(specYaml, "manifest").planColumns(),
        "the model records its plan columns: " + specYaml);
    Path forecast = dir.resolve("forecast.csv");
    Path report = dir.resolve("R");
    MainRun forecasted = MainRun.of("forecast", "--store", storeA.toString(), "--model", model.toString(), "--out",
        forecast.toString(), "--intervals", "--report", report.toString());
    forecasted.expectOk();
    assertTrue(forecasted.out().contains("forecast 24 series x 8 weeks (2024-09-23 .. 2024-11-11)"),
        forecasted.out());
    List<String> lines = Files.readAllLines(forecast);
    assertEquals(1 + SKUS * SHOPS * HORIZON, lines.size());
    for (int k = 0; k < HORIZON; k++) {
      String week = FIRST_WEEK.plusWeeks(WEEKS - HORIZON + k).toString();
      assertTrue(lines.get(1 + k).contains("," + week + ","), "week " + k + " dated " + week + ": " + lines.get(1 + k));
    }
    String html = Files.readString(report.resolve("report.html"));
    assertTrue(html.contains("Weeks per series"), "the report counts weeks");

    MainRun evaluated = MainRun.of("evaluate", "--store", storeB.toString(), "--forecast", forecast.toString(),
        "--json");
    evaluated.expectOk();
    JsonNode scores = JSON.readTree(evaluated.out());
    double model0 = scores.get("forecast").get("wrmsse").asDouble(Double.NaN);
    double seasonal = scores.get("baselineWrmsse").get("seasonal naive").asDouble(Double.NaN);
    double naive = scores.get("baselineWrmsse").get("naive").asDouble(Double.NaN);
    assertTrue(Double.isFinite(model0) && model0 > 0, evaluated.out());
    // The data have a strong yearly cycle, so last year's week (season 52) beats last week's value.
    assertTrue(seasonal < naive, context + ": seasonal naive " + seasonal + " vs naive " + naive);
    MainRun text = MainRun.of("evaluate", "--store", storeB.toString(), "--forecast", forecast.toString());
    text.expectOk();
    assertTrue(text.out().contains("2024-09-23 .. 2024-11-11, 8 weeks"), text.out());

    // A plan appended alone that ends with the horizon's second week stops the forecast; carried forward, it runs.
    Path shortPlan = Files.writeString(dir.resolve("plan-short.csv"), "banner,week_of,end_cap,flyer\n"
        + "market," + FIRST_WEEK.plusWeeks(WEEKS - HORIZON) + ",1,0\n"
        + "market," + FIRST_WEEK.plusWeeks(WEEKS - HORIZON + 1) + ",0,1\n");
    MainRun appended = MainRun.of("append", "--store", storeA.toString(), "--plan", shortPlan.toString(),
        "--plan-date-column", "week_of");
    appended.expectOk();
    assertTrue(appended.err().contains("warning: 8 of 24 series match no plan row: their plan features read 0 "
        + "(nothing planned)"), appended.err());
    MainRun uncovered = MainRun.of("forecast", "--store", storeA.toString(), "--model", model.toString(), "--out",
        dir.resolve("uncovered.csv").toString());
    assertEquals(2, uncovered.exitCode(), uncovered.err());
    assertTrue(uncovered.err().contains("the plan ends with the week of 2024-09-30 but the forecast needs it through "
        + "2024-11-11: banner=market has no plan from 2024-10-07 (nor has any other series with plan rows); append a "
        + "plan that reaches the horizon's end (lagmill append --store DIR --plan FILE) or forecast with "
        + "--plan-carry-forward to carry each key's last values forward"), uncovered.err());
    Path carriedOut = dir.resolve("carried.csv");
    MainRun carried = MainRun.of("forecast", "--store", storeA.toString(), "--model", model.toString(), "--out",
        carriedOut.toString(), "--plan-carry-forward");
    carried.expectOk();
    assertTrue(carried.err().contains("warning: plan values carried forward for 96 series-weeks: the plan ends with "
        + "the week of 2024-09-30, so 16 series with plan rows read their last plan values over the last 6 weeks of "
        + "the horizon"), carried.err());
    JsonNode carriedRun = JSON.readTree(dir.resolve("carried.csv.run.json").toFile());
    assertEquals(96, carriedRun.get("results").get("planCarriedSeriesPeriods").asLong(), carriedRun.toString());
    Path storeC = dir.resolve("C");
    MainRun.of("ingest", "--sales", shortSales.toString(), "--calendar", calendar.toString(),
        "--date-column", "week_start", "--store", storeC.toString(), "--quiet").expectOk();
    MainRun noPlan = MainRun.of("forecast", "--store", storeC.toString(), "--model", model.toString(), "--out",
        dir.resolve("no-plan.csv").toString());
    assertEquals(2, noPlan.exitCode(), noPlan.err());
    assertTrue(noPlan.err().contains("the features read plan columns end_cap, flyer but the store holds no plan; "
        + "ingest or append one with those columns (lagmill append --store DIR --plan FILE)"), noPlan.err());

    Files.delete(backtest.resolve("report.html"));
    MainRun.of("report", "--run", backtest.toString()).expectOk();
    assertTrue(Files.size(backtest.resolve("report.html")) > 1000);

    // By hand: with 52 weeks to a season, seasonal naive forecasts week 142 + k with the units of week 90 + k, read
    // straight from the generated array (every week there is known and after each series' first sale).
    try (MemoryBudget budget = MemoryBudget.unlimited("test"); SalesStore store = SalesStore.open(storeB, budget)) {
      assertEquals(52, store.seasonLength());
      int origin = WEEKS - HORIZON;
      double[][] baseline = BaselineForecaster.forecastAll(new TruncatedHistory(store, origin), origin, HORIZON,
          BaselineKind.SEASONAL_NAIVE);
      for (int sku = 0; sku < SKUS; sku++) {
        for (int shop = 0; shop < SHOPS; shop++) {
          int s = store.attributes().seriesIndexOf("k" + sku + "/shop" + shop + "/" + banner(shop));
          double[] expected = new double[HORIZON];
          for (int k = 0; k < HORIZON; k++) {
            expected[k] = units[sku * SHOPS + shop][origin + k - 52];
          }
          assertArrayEquals(expected, baseline[s], context + ", series " + s);
        }
      }
    }
  }

  private static String banner(int shop) {
    return shop == 2 ? "corner" : "market";
  }

  /** Weekly Poisson demand with a yearly cycle, promotion weeks and holiday weeks; every sku sells from week 0. */
  private static void writeData(int[][] units, Path full, Path shortSales, Path calendar, Path prices, Path plan)
      throws Exception {
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    StringBuilder header = new StringBuilder("sku,shop,banner");
    for (int w = 0; w < WEEKS; w++) {
      header.append(',').append(FIRST_WEEK.plusWeeks(w));
    }
    boolean[] holiday = new boolean[WEEKS + FUTURE_WEEKS];
    StringBuilder cal = new StringBuilder("week_start,holiday_week\n");
    for (int w = 0; w < holiday.length; w++) {
      int weekOfYear = w % 52;
      holiday[w] = weekOfYear == 51 || weekOfYear == 0 || weekOfYear == 14;
      cal.append(FIRST_WEEK.plusWeeks(w)).append(',').append(holiday[w] ? 1 : 0).append('\n');
    }
    // End caps and flyers per banner and week, known ahead: a dense weekly grid, the corner banner's dated Wednesdays.
    boolean[][] endCap = new boolean[2][WEEKS + FUTURE_WEEKS];
    StringBuilder planFile = new StringBuilder("banner,week_of,end_cap,flyer\n");
    for (int b = 0; b < 2; b++) {
      for (int w = 0; w < WEEKS + FUTURE_WEEKS; w++) {
        endCap[b][w] = random.nextInt(6) == 0;
        boolean flyer = random.nextInt(8) == 0;
        planFile.append(b == 0 ? "market" : "corner").append(',').append(FIRST_WEEK.plusWeeks(w).plusDays(2L * b))
            .append(',').append(endCap[b][w] ? 1 : 0).append(',').append(flyer ? 1 : 0).append('\n');
      }
    }
    StringBuilder priceFile = new StringBuilder("sku,shop,from,price\n");
    StringBuilder rowsFull = new StringBuilder();
    StringBuilder rowsShort = new StringBuilder();
    for (int sku = 0; sku < SKUS; sku++) {
      double regular = 1.5 + sku * 0.7;
      for (int shop = 0; shop < SHOPS; shop++) {
        int s = sku * SHOPS + shop;
        double level = 10 + 6 * sku + 4 * shop;
        StringBuilder row = new StringBuilder("k" + sku + ",shop" + shop + "," + banner(shop));
        for (int w = 0; w < WEEKS + FUTURE_WEEKS; w++) {
          boolean promo = random.nextInt(9) == 0;
          double price = promo ? regular * 0.75 : regular;
          priceFile.append("k").append(sku).append(",shop").append(shop).append(',')
              .append(FIRST_WEEK.plusWeeks(w)).append(',').append(String.format(Locale.ROOT, "%.2f", price))
              .append('\n');
          if (w >= WEEKS) {
            continue;
          }
          double season = 1 + 0.8 * Math.sin(2 * Math.PI * (w % 52) / 52.0);
          double mean = level * season * (promo ? 1.6 : 1.0) * (holiday[w] ? 1.4 : 1.0)
              * (endCap[shop == 2 ? 1 : 0][w] ? 1.5 : 1.0);
          units[s][w] = poisson(random, mean);
          row.append(',').append(units[s][w]);
          if (w == WEEKS - HORIZON - 1) {
            rowsShort.append(row).append('\n');
          }
        }
        rowsFull.append(row).append('\n');
      }
    }
    Files.writeString(full, header + "\n" + rowsFull);
    int cut = header.length();
    for (int k = 0; k < HORIZON; k++) {
      cut = header.lastIndexOf(",", cut - 1);
    }
    Files.writeString(shortSales, header.substring(0, cut) + "\n" + rowsShort);
    Files.writeString(calendar, cal);
    Files.writeString(prices, priceFile);
    Files.writeString(plan, planFile);
  }

  private static int poisson(SplittableRandom random, double mean) {
    // Knuth's multiplication method; means here stay below 80, where exp(-mean) is far from underflow.
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
