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
 * generate → ingest (store A without the last 28 days, store B with them) → train → forecast → evaluate → backtest →
 * report, through {@link Main#run} with its exit codes, on a 40-series scenario.
 */
class PipelineCommandsTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final int SERIES = 40;
  private static final int DAYS = 420;
  private static final int HORIZON = 28;

  @Test
  void shouldRunTheWholePipeline(@TempDir Path dir) throws IOException {
    Path scenario = GeneratedScenario.generate(dir.resolve("scenario"), SERIES, DAYS, 11);
    Path shortSales = dir.resolve("sales-short.csv");
    Files.write(shortSales, dropLastColumns(Files.readAllLines(scenario.resolve("sales.csv")), HORIZON));
    Path storeA = dir.resolve("A");
    Path storeB = dir.resolve("B");
    MainRun.of("ingest", "--sales", shortSales.toString(), "--calendar",
        scenario.resolve("calendar.csv").toString(), "--prices", scenario.resolve("prices.csv").toString(), "--store",
        storeA.toString(), "--quiet").expectOk();
    GeneratedScenario.ingest(scenario, storeB, false);

    Path model = dir.resolve("M");
    MainRun.of("train", "--store", storeA.toString(), "--model", model.toString(), "--rounds", "10",
        "--deterministic", "--threads", "1", "--quiet").expectOk();
    for (String name : List.of("manifest.json", "model.txt", "run.json")) {
      assertTrue(Files.isRegularFile(model.resolve(name)), name);
    }

    Path forecast = dir.resolve("f.csv");
    Path report = dir.resolve("R");
    MainRun.of("forecast", "--store", storeA.toString(), "--model", model.toString(), "--out",
        forecast.toString(), "--intervals", "--report", report.toString(), "--quiet").expectOk();
    List<String> lines = Files.readAllLines(forecast);
    assertEquals(1 + SERIES * HORIZON, lines.size());
    String header = lines.get(0);
    assertTrue(header.endsWith(",date,forecast,q0.005,q0.025,q0.165,q0.25,q0.5,q0.75,q0.835,q0.975,q0.995"),
        header);
    assertTrue(Files.isRegularFile(report.resolve("report.html")));

    MainRun evaluated = MainRun.of("evaluate", "--store", storeB.toString(), "--forecast", forecast.toString(),
        "--json");
    evaluated.expectOk();
    double wrmsse = JSON.readTree(evaluated.out()).get("forecast").get("wrmsse").asDouble(Double.NaN);
    assertTrue(Double.isFinite(wrmsse) && wrmsse > 0, evaluated.out());

    Path backtest = dir.resolve("BT");
    MainRun backtested = MainRun.of("backtest", "--store", storeB.toString(), "--origins", "2", "--rounds", "5",
        "--deterministic", "--threads", "1", "--report", backtest.toString(), "--json", "--quiet");
    backtested.expectOk();
    JsonNode result = JSON.readTree(backtested.out());
    assertEquals(2, result.get("origins").size(), backtested.out());
    assertTrue(Double.isFinite(result.get("meanModelWrmsse").asDouble(Double.NaN)), backtested.out());
    Path html = backtest.resolve("report.html");
    Files.delete(html);
    MainRun.of("report", "--run", backtest.toString()).expectOk();
    assertTrue(Files.size(html) > 1000);

    // the forecast's report carries the backtest's accuracy, and says the backtest's store runs further
    Path withAccuracy = dir.resolve("RA");
    MainRun forecastWithBacktest = MainRun.of("forecast", "--store", storeA.toString(), "--model", model.toString(),
        "--out", dir.resolve("fa.csv").toString(), "--report", withAccuracy.toString(), "--backtest",
        backtest.toString());
    forecastWithBacktest.expectOk();
    assertTrue(forecastWithBacktest.err().contains("warning: the backtest's store ends "), forecastWithBacktest.err());
    JsonNode copied = JSON.readTree(withAccuracy.resolve("report.json").toFile()).get("report").get("accuracy");
    JsonNode original = JSON.readTree(backtest.resolve("report.json").toFile()).get("report").get("accuracy");
    assertEquals(original, copied);
    assertTrue(Files.readString(withAccuracy.resolve("report.html")).contains("the best simple method"));

    // evaluate writes a report of one scored forecast, whose numbers are the JSON evaluation's
    Path evaluation = dir.resolve("EV");
    MainRun evaluatedWithReport = MainRun.of("evaluate", "--store", storeB.toString(), "--forecast",
        forecast.toString(), "--json", "--report", evaluation.toString());
    evaluatedWithReport.expectOk();
    JsonNode scored = JSON.readTree(evaluatedWithReport.out()).get("forecast");
    JsonNode reported = JSON.readTree(evaluation.resolve("report.json").toFile()).get("report").get("accuracy");
    assertEquals(scored.get("wrmsse").asDouble(), reported.get("modelWrmsse").asDouble(), 0);
    for (int l = 0; l < scored.get("levels").size(); l++) {
      assertEquals(scored.get("levels").get(l).get("mae").asDouble(),
          reported.get("levels").get(l).get("modelMae").asDouble(), 0);
      assertEquals(scored.get("levels").get(l).get("bias").asDouble(),
          reported.get("levels").get(l).get("modelBias").asDouble(), 0);
    }
    assertEquals(1, reported.get("origins").size());
    assertTrue(Files.isRegularFile(evaluation.resolve("report.html")));

    // a combined model: two members and their average on the same origins, the chosen one named
    Path memberA = dir.resolve("member-a.yaml");
    Path memberB = dir.resolve("member-b.yaml");
    org.lagmill.features.FeatureSpecYaml.write(org.lagmill.features.FeatureSpec.defaults(), memberA);
    org.lagmill.features.FeatureSpecYaml.write(org.lagmill.features.FeatureSpec.defaults().toBuilder()
        .lagDays(28, 35).rollingWindowDays(7).build(), memberB);
    Path combinedDir = dir.resolve("combined");
    MainRun combined = MainRun.of("backtest", "--store", storeB.toString(), "--origins", "2", "--rounds", "5",
        "--deterministic", "--threads", "1", "--report", combinedDir.toString(), "--member", memberA.toString(),
        "--member", memberB.toString(), "--json", "--quiet");
    combined.expectOk();
    JsonNode members = JSON.readTree(combined.out());
    assertEquals(2, members.get("members").size(), combined.out());
    assertEquals(2, members.get("combination").get("origins").size(), combined.out());
    double average = members.get("combination").get("meanModelWrmsse").asDouble();
    double first = members.get("members").get(0).get("meanModelWrmsse").asDouble();
    double second = members.get("members").get(1).get("meanModelWrmsse").asDouble();
    String expected = first <= Math.min(second, average) ? memberA.toString()
        : second <= average ? memberB.toString() : "average of members";
    assertEquals(expected, members.get("chosenName").asText(), combined.out());

    // evaluate of a forecast naming a series the store does not have: bad input, file and line named
    Path bad = dir.resolve("bad.csv");
    List<String> badLines = new ArrayList<>(lines);
    int firstComma = badLines.get(5).indexOf(',');
    badLines.set(5, "no-such-series" + badLines.get(5).substring(firstComma));
    Files.write(bad, badLines);
    MainRun rejected = MainRun.of("evaluate", "--store", storeB.toString(), "--forecast", bad.toString());
    assertEquals(3, rejected.exitCode(), rejected.err());
    assertTrue(rejected.err().startsWith("lagmill: " + bad + ", line 6, column "), rejected.err());

    // a model directory that does not exist: "no such file" (exit 6, documented in Main's footer)
    Path missing = dir.resolve("no-model");
    MainRun noModel = MainRun.of("forecast", "--store", storeA.toString(), "--model", missing.toString(), "--out",
        dir.resolve("g.csv").toString(), "--quiet");
    assertEquals(6, noModel.exitCode(), noModel.err());
    assertEquals("lagmill: no such file: " + missing.resolve("manifest.json") + " (not a model directory: no "
        + "manifest.json)", noModel.err().strip());
  }

  @Test
  void shouldShowAnExampleInEveryHelp() {
    for (String command : List.of("train", "forecast", "evaluate", "backtest", "report", "demo")) {
      MainRun run = MainRun.of(command, "--help");
      assertEquals(0, run.exitCode(), command);
      assertTrue(run.out().contains("Example"), command + ": " + run.out());
      assertTrue(run.out().contains("lagmill " + command + " "), command + ": " + run.out());
    }
  }

  @Test
  void shouldExitWithAUsageErrorWithoutARequiredOption() {
    MainRun run = MainRun.of("train", "--model", "somewhere");
    assertEquals(2, run.exitCode());
    assertTrue(run.err().contains("Missing required option: '--store=DIR'"), run.err());
  }

  /** Drops the last {@code count} comma-separated fields of every line (the scenario's ids hold no commas). */
  private static List<String> dropLastColumns(List<String> lines, int count) {
    List<String> out = new ArrayList<>();
    for (String line : lines) {
      int end = line.length();
      for (int i = 0; i < count; i++) {
        end = line.lastIndexOf(',', end - 1);
      }
      out.add(line.substring(0, end));
    }
    return out;
  }
}
