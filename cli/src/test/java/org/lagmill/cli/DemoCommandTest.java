package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.run.DemoJob;
import org.lagmill.run.RunRecord;

/** The README's first command, at its small size: every artefact it promises, and a model that beats the baselines. */
class DemoCommandTest {
  private static final Pattern SKILL = Pattern.compile("skill vs seasonal naive ([0-9.]+)");

  @Test
  void shouldRunTheWholeJobOnTheSmallScenario(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("demo");
    MainRun run = MainRun.of("demo", "--out", out.toString(), "--size", "small", "--quiet");
    assertEquals(ExitCodes.OK, run.exitCode(), run.err());
    for (String file : List.of("forecast.csv", "run.json", "features.yaml", "report/report.html",
        "report/report.json", "model/manifest.json", "model/model.txt", "store/current", "store/lock")) {
      assertTrue(Files.isRegularFile(out.resolve(file)), "missing " + file);
    }
    List<String> forecast = Files.readAllLines(out.resolve("forecast.csv"));
    assertEquals(1 + DemoJob.Size.SMALL.seriesCount * DemoJob.HORIZON_DAYS, forecast.size());
    assertTrue(forecast.get(0).endsWith(",date,forecast,q0.005,q0.025,q0.165,q0.25,q0.5,q0.75,q0.835,q0.975,q0.995"
        + ",closed"),
        forecast.get(0));
    Matcher skill = SKILL.matcher(run.out());
    assertTrue(skill.find(), run.out());
    // The invented chain has promotions, events and paydays the model can see and seasonal naive cannot.
    assertTrue(Double.parseDouble(skill.group(1)) < 0.9, run.out());
    assertTrue(run.out().contains("never automatic orders"), run.out());
    JsonNode record = RunRecord.JSON.readTree(out.resolve("run.json").toFile());
    assertEquals(DemoJob.BACKTEST_ORIGINS + 1, record.path("results").path("backtest").path("origins").size());
    // Every stage in order, each measured by its own Stage: ingest maps and buffers off-heap, the generator does not.
    List<String> stageNames = new ArrayList<>();
    record.path("stages").forEach(stage -> stageNames.add(stage.path("name").asText()));
    assertEquals(List.of("generate", "ingest", "backtest", "train", "forecast", "explain"), stageNames);
    assertEquals(0, record.path("stages").path(0).path("offHeapBytes").asLong());
    assertTrue(record.path("stages").path(1).path("offHeapBytes").asLong() > 0, record.toString());
    // The closures file is ingested: closed outlet days are counted, never scored as zero sales.
    Matcher closed = Pattern.compile("closed ([0-9,]+)").matcher(run.out());
    assertTrue(closed.find() && Long.parseLong(closed.group(1).replace(",", "")) > 0, run.out());
    // A closed horizon day is forecast 0 and marked.
    List<String> header = List.of(forecast.get(0).split(","));
    int forecastColumn = header.indexOf("forecast");
    int closedColumn = header.indexOf("closed");
    long closedRows = forecast.stream().skip(1).map(line -> line.split(","))
        .filter(cells -> cells[closedColumn].equals("1")).peek(cells -> assertEquals(0.0,
            Double.parseDouble(cells[forecastColumn]), String.join(",", cells)))
        .count();
    assertTrue(closedRows > 0 && run.err().contains("forecast 0 for " + closedRows + " series-days declared closed"),
        closedRows + " closed rows; " + run.err());
    // The promotion plan is ingested and read: the model records its plan columns.
    assertTrue(!run.err().contains("plan.csv"), run.err());
    JsonNode modelManifest = RunRecord.JSON.readTree(out.resolve("model/manifest.json").toFile());
    assertEquals(List.of("promo", "discount", "display", "leaflet"), FeatureSpecYaml.parse(modelManifest
        .get("featureSpecYaml").asText(), "manifest").planColumns());
    String html = Files.readString(out.resolve("report/report.html"));
    assertTrue(html.contains("id=\"accuracy\"") && html.contains("id=\"series\""), "report sections");
  }
}
