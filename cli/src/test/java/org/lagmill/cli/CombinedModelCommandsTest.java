package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.run.RunRecord;

/**
 * A combined model end to end: a backtest scores two specs and their average, {@code train --from-backtest} trains
 * what it chose, {@code train --member} trains both into one directory, and its forecast is the plain mean of the
 * forecasts of each member trained alone (the slow obvious reference: two ordinary model directories, averaged here).
 */
class CombinedModelCommandsTest {
  private static final String[] QUICK = {"--rounds", "8", "--deterministic", "--threads", "1", "--quiet"};

  @TempDir
  static Path dir;
  static Path store;
  static Path direct;
  static Path recursive;

  @BeforeAll
  static void ingest() throws Exception {
    store = GeneratedScenario.generateAndIngest(dir.resolve("data"), dir.resolve("store"), 10, 420, 5, true);
    direct = Files.writeString(dir.resolve("direct.yaml"), "strategy: direct\nhorizonDays: 14\nlagDays: [14, 21]\n"
        + "rollingWindowDays: [7, 28]\n");
    recursive = Files.writeString(dir.resolve("recursive.yaml"), "horizonDays: 14\nlagDays: [1, 2, 7, 14]\n"
        + "rollingWindowDays: [7, 28]\n");
  }

  @Test
  void shouldForecastTheMeanOfItsMembersTrainedAlone() throws Exception {
    Path combined = dir.resolve("combined");
    MainRun.of(args("train", "--store", store.toString(), "--model", combined.toString(), "--member",
        direct.toString(), "--member", recursive.toString())).expectOk();
    assertTrue(Files.isRegularFile(combined.resolve("combination.json")));
    List<double[]> forecasts = new ArrayList<>();
    for (Path spec : List.of(direct, recursive)) {
      Path alone = dir.resolve("alone-" + spec.getFileName());
      MainRun.of(args("train", "--store", store.toString(), "--model", alone.toString(), "--config",
          spec.toString())).expectOk();
      forecasts.add(forecastColumn(alone, "alone"));
    }
    double[] mean = forecastColumn(combined, "combined");
    assertEquals(10 * 14, mean.length);
    int differing = 0;
    for (int row = 0; row < mean.length; row++) {
      // The forecast file keeps 4 decimals: the mean of two rounded values is within 1e-4 of the rounded mean.
      assertEquals((forecasts.get(0)[row] + forecasts.get(1)[row]) / 2, mean[row], 1.01e-4, "row " + row);
      differing += Math.abs(forecasts.get(0)[row] - forecasts.get(1)[row]) > 1e-3 ? 1 : 0;
    }
    assertTrue(differing > mean.length / 2, "the members must differ for the check to mean anything: " + differing);
    MainRun explain = MainRun.of("model", "--model", combined.toString());
    assertEquals(ExitCodes.USAGE_ERROR, explain.exitCode(), explain.err());
    assertTrue(explain.err().contains("holds a combination of models") && explain.err().contains("member-1"),
        explain.err());
  }

  @Test
  void shouldTrainWhatTheBacktestChose() throws Exception {
    Path report = dir.resolve("bt");
    MainRun.of(args("backtest", "--store", store.toString(), "--origins", "2", "--report", report.toString(),
        "--member", direct.toString(), "--member", recursive.toString())).expectOk();
    JsonNode backtest = RunRecord.JSON.readTree(report.resolve("backtest.json").toFile());
    String chosen = backtest.path("chosenName").asText();
    Path model = dir.resolve("chosen");
    MainRun trained = MainRun.of("train", "--store", store.toString(), "--model", model.toString(),
        "--from-backtest", report.toString(), "--rounds", "8", "--deterministic", "--threads", "1");
    trained.expectOk();
    assertTrue(trained.out().contains("the backtest in " + report + " chose " + chosen), trained.out());
    boolean average = chosen.equals("average of members");
    assertEquals(average, Files.isRegularFile(model.resolve("combination.json")), chosen);
    assertEquals(!average, Files.isRegularFile(model.resolve("manifest.json")), chosen);

    Path single = dir.resolve("single-bt");
    MainRun.of(args("backtest", "--store", store.toString(), "--origins", "2", "--report",
        single.toString())).expectOk();
    MainRun refused = MainRun.of("train", "--store", store.toString(), "--model", dir.resolve("never").toString(),
        "--from-backtest", single.toString());
    assertEquals(ExitCodes.USAGE_ERROR, refused.exitCode(), refused.err());
    assertTrue(refused.err().contains("holds a backtest of one spec") && refused.err().contains("--member SPEC"),
        refused.err());
    assertTrue(!Files.exists(dir.resolve("never")));
  }

  private static String[] args(String... first) {
    String[] all = new String[first.length + QUICK.length];
    System.arraycopy(first, 0, all, 0, first.length);
    System.arraycopy(QUICK, 0, all, first.length, QUICK.length);
    return all;
  }

  /** The forecast column of the long forecast file a model writes for the store, row by row. */
  private static double[] forecastColumn(Path model, String name) throws Exception {
    Path out = dir.resolve(name + "-" + model.getFileName() + ".csv");
    MainRun.of("forecast", "--store", store.toString(), "--model", model.toString(), "--out",
        out.toString(), "--quiet").expectOk();
    List<String> lines = Files.readAllLines(out);
    int column = List.of(lines.get(0).split(",")).indexOf("forecast");
    return lines.stream().skip(1).mapToDouble(line -> Double.parseDouble(line.split(",")[column])).toArray();
  }
}
