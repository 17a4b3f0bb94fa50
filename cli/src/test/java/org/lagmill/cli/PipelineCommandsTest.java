package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
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

  @BeforeAll
  static void createTempRoot() throws IOException {
    Files.createDirectories(Path.of(System.getProperty("java.io.tmpdir")));
  }

  @Test
  void shouldRunTheWholePipeline(@TempDir Path dir) throws IOException {
    Path scenario = dir.resolve("scenario");
    expectOk(run("generate", "--out", scenario.toString(), "--series", "" + SERIES, "--days", "" + DAYS, "--seed",
        "11"));
    Path shortSales = dir.resolve("sales-short.csv");
    Files.write(shortSales, dropLastColumns(Files.readAllLines(scenario.resolve("sales.csv")), HORIZON));
    Path storeA = dir.resolve("A");
    Path storeB = dir.resolve("B");
    expectOk(run("ingest", "--sales", shortSales.toString(), "--calendar", scenario.resolve("calendar.csv").toString(),
        "--prices", scenario.resolve("prices.csv").toString(), "--store", storeA.toString(), "--quiet"));
    expectOk(run("ingest", "--sales", scenario.resolve("sales.csv").toString(), "--calendar",
        scenario.resolve("calendar.csv").toString(), "--prices", scenario.resolve("prices.csv").toString(),
        "--store", storeB.toString(), "--quiet"));

    Path model = dir.resolve("M");
    expectOk(run("train", "--store", storeA.toString(), "--model", model.toString(), "--rounds", "10",
        "--deterministic", "--threads", "1", "--quiet"));
    for (String name : List.of("manifest.json", "model.txt", "run.json")) {
      assertTrue(Files.isRegularFile(model.resolve(name)), name);
    }

    Path forecast = dir.resolve("f.csv");
    Path report = dir.resolve("R");
    expectOk(run("forecast", "--store", storeA.toString(), "--model", model.toString(), "--out", forecast.toString(),
        "--intervals", "--report", report.toString(), "--quiet"));
    List<String> lines = Files.readAllLines(forecast);
    assertEquals(1 + SERIES * HORIZON, lines.size());
    String header = lines.get(0);
    assertTrue(header.endsWith(",date,forecast,q0.005,q0.025,q0.165,q0.25,q0.5,q0.75,q0.835,q0.975,q0.995"),
        header);
    assertTrue(Files.isRegularFile(report.resolve("report.html")));

    String[] evaluated = run("evaluate", "--store", storeB.toString(), "--forecast", forecast.toString(), "--json");
    expectOk(evaluated);
    double wrmsse = JSON.readTree(evaluated[0]).get("forecast").get("wrmsse").asDouble(Double.NaN);
    assertTrue(Double.isFinite(wrmsse) && wrmsse > 0, evaluated[0]);

    Path backtest = dir.resolve("BT");
    String[] backtested = run("backtest", "--store", storeB.toString(), "--origins", "2", "--rounds", "5",
        "--deterministic", "--threads", "1", "--report", backtest.toString(), "--json", "--quiet");
    expectOk(backtested);
    JsonNode result = JSON.readTree(backtested[0]);
    assertEquals(2, result.get("origins").size(), backtested[0]);
    assertTrue(Double.isFinite(result.get("meanModelWrmsse").asDouble(Double.NaN)), backtested[0]);
    Path html = backtest.resolve("report.html");
    Files.delete(html);
    expectOk(run("report", "--run", backtest.toString()));
    assertTrue(Files.size(html) > 1000);

    // evaluate of a forecast naming a series the store does not have: bad input, file and line named
    Path bad = dir.resolve("bad.csv");
    List<String> badLines = new ArrayList<>(lines);
    int firstComma = badLines.get(5).indexOf(',');
    badLines.set(5, "no-such-series" + badLines.get(5).substring(firstComma));
    Files.write(bad, badLines);
    String[] rejected = run("evaluate", "--store", storeB.toString(), "--forecast", bad.toString());
    assertEquals("3", rejected[2], rejected[1]);
    assertTrue(rejected[1].startsWith("lagmill: " + bad + ", line 6, column "), rejected[1]);

    // a model directory that does not exist: "no such file" (exit 6, documented in Main's footer)
    Path missing = dir.resolve("no-model");
    String[] noModel = run("forecast", "--store", storeA.toString(), "--model", missing.toString(), "--out",
        dir.resolve("g.csv").toString(), "--quiet");
    assertEquals("6", noModel[2], noModel[1]);
    assertEquals("lagmill: no such file: " + missing.resolve("manifest.json") + " (not a model directory: no "
        + "manifest.json)", noModel[1].strip());
  }

  @Test
  void shouldShowAnExampleInEveryHelp() {
    for (String command : List.of("train", "forecast", "evaluate", "backtest", "report", "demo")) {
      String[] streams = run(command, "--help");
      assertEquals("0", streams[2], command);
      assertTrue(streams[0].contains("Example"), command + ": " + streams[0]);
      assertTrue(streams[0].contains("lagmill " + command + " "), command + ": " + streams[0]);
    }
  }

  @Test
  void shouldExitWithAUsageErrorWithoutARequiredOption() {
    String[] streams = run("train", "--model", "somewhere");
    assertEquals("2", streams[2]);
    assertTrue(streams[1].contains("Missing required option: '--store=DIR'"), streams[1]);
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

  private static void expectOk(String[] streams) {
    assertEquals("0", streams[2], "stderr: " + streams[1]);
  }

  /** Runs the command line with captured streams: stdout, stderr, exit code. */
  private static String[] run(String... args) {
    PrintStream stdout = System.out;
    PrintStream stderr = System.err;
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    try {
      System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
      System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
      int exitCode = Main.run(args);
      return new String[] {out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8),
          Integer.toString(exitCode)};
    } finally {
      System.setOut(stdout);
      System.setErr(stderr);
    }
  }
}
