package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Real separate {@code lagmill} processes on one store, so the operating system's file lock is what keeps them apart
 * (inside one JVM a semaphore would take its place): two appends started together both land in order or the second
 * is refused, never lost and never mixed; a forecast started while appends run reads one whole store, old or new,
 * and writes exactly the forecast that store gives when nothing else runs. Part of the reliability suite.
 */
@Tag("reliability")
class ConcurrentProcessesTest {
  private static final LocalDate FIRST = LocalDate.of(2025, 3, 3);
  private static final int SERIES = 30;
  private static final int BASE_DAYS = 60;
  private static final long TIMEOUT_SECONDS = 120;

  @TempDir
  Path temp;

  /** Units of series s on day d, plus a bias that tells two files for the same day apart. */
  private static int unitsOf(int s, int d, int bias) {
    return (s * 7 + d * 3) % 11 + (d % 7 == 5 ? 4 : 0) + bias;
  }

  private Path salesFile(String name, int fromDay, int toDay, int bias) throws IOException {
    StringBuilder csv = new StringBuilder("sku,shop");
    for (int d = fromDay; d < toDay; d++) {
      csv.append(',').append(FIRST.plusDays(d));
    }
    csv.append('\n');
    for (int s = 0; s < SERIES; s++) {
      csv.append("k").append(s).append(",s").append(s % 3);
      for (int d = fromDay; d < toDay; d++) {
        csv.append(',').append(unitsOf(s, d, bias));
      }
      csv.append('\n');
    }
    return Files.writeString(temp.resolve(name), csv);
  }

  /** Starts {@code lagmill ARGS} in its own JVM with its own temporary folder (LightGBM extracts a fixed name). */
  private Process start(String name, String... args) throws IOException {
    Path tmp = Files.createDirectories(temp.resolve("tmp-" + name));
    List<String> command = new ArrayList<>();
    command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    for (String flag : ManagementFactory.getRuntimeMXBean().getInputArguments()) {
      if (flag.startsWith("--add-") || flag.startsWith("-Duser.timezone")) {
        command.add(flag);
      }
    }
    command.add("-Xmx256m");
    command.add("-Djava.io.tmpdir=" + tmp);
    command.add("-cp");
    command.add(System.getProperty("java.class.path"));
    command.add(Main.class.getName());
    command.addAll(List.of(args));
    return new ProcessBuilder(command).redirectOutput(temp.resolve(name + ".out").toFile())
        .redirectError(temp.resolve(name + ".err").toFile()).start();
  }

  private int finish(String name, Process process) throws Exception {
    assertTrue(process.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS), name + " did not finish");
    return process.exitValue();
  }

  private String err(String name) throws IOException {
    return Files.readString(temp.resolve(name + ".err"));
  }

  private static void run(String... args) {
    MainRun run = MainRun.of(args);
    assertEquals(0, run.exitCode(), String.join(" ", args) + "\n" + run.err());
  }

  /** Each series' units on every day of the store, through {@code lagmill series}-free engine reads. */
  private static int[][] units(Path store) throws IOException {
    try (org.lagmill.memory.MemoryBudget budget = org.lagmill.memory.MemoryBudget.unlimited("test");
        org.lagmill.store.SalesStore opened = org.lagmill.store.SalesStore.open(store, budget)) {
      int[][] units = new int[SERIES][opened.dayCount()];
      for (int s = 0; s < SERIES; s++) {
        opened.readUnits(opened.attributes().seriesIndexOf("k" + s + "/s" + s % 3), 0, units[s], 0,
            opened.dayCount());
      }
      return units;
    }
  }

  @Test
  void shouldLandTwoConcurrentAppendsInOrderOrRefuseTheSecondNeverLoseOrMix() throws Exception {
    Path store = temp.resolve("store");
    run("ingest", "--sales", salesFile("base.csv", 0, BASE_DAYS, 0).toString(), "--store", store.toString(),
        "--quiet");
    int day = BASE_DAYS;
    for (int round = 0; round < 3; round++) {
      // round 0: both append the same next day (one must be refused); later rounds: the next day and the one after
      // it, started together (both land when the first wins, the later one is refused when it runs first)
      boolean sameDay = round == 0;
      Path a = salesFile("a" + round + ".csv", day, day + 1, 0);
      Path b = sameDay ? salesFile("b" + round + ".csv", day, day + 1, 100)
          : salesFile("b" + round + ".csv", day + 1, day + 2, 0);
      Process pa = start("a" + round, "append", "--store", store.toString(), "--sales", a.toString(), "--quiet");
      Process pb = start("b" + round, "append", "--store", store.toString(), "--sales", b.toString(), "--quiet");
      int exitA = finish("a" + round, pa);
      int exitB = finish("b" + round, pb);
      String outcome = "round " + round + ": exit codes " + exitA + " and " + exitB + "\n" + err("a" + round)
          + err("b" + round);
      assertTrue(exitA == 0 || exitA == ExitCodes.BAD_INPUT, outcome);
      assertTrue(exitB == 0 || exitB == ExitCodes.BAD_INPUT, outcome);
      int[][] units = units(store);
      int dayCount = units[0].length;
      if (sameDay) {
        assertEquals(1, (exitA == 0 ? 1 : 0) + (exitB == 0 ? 1 : 0), "exactly one of two appends of a day: "
            + outcome);
        assertEquals(day + 1, dayCount, outcome);
        int bias = exitA == 0 ? 0 : 100;
        for (int s = 0; s < SERIES; s++) {
          assertEquals(unitsOf(s, day, bias), units[s][day], "series " + s + " holds the winner's day, whole");
        }
        day += 1;
      } else {
        assertEquals(0, exitA, "the next day always lands: " + outcome);
        assertEquals(exitB == 0 ? day + 2 : day + 1, dayCount, outcome);
        day = dayCount;
      }
      for (int s = 0; s < SERIES; s++) {
        for (int d = BASE_DAYS; d < dayCount; d++) {
          int expected = unitsOf(s, d, 0);
          assertTrue(units[s][d] == expected || units[s][d] == expected + 100, "series " + s + " day " + d
              + " is one file's value, not a mix: " + units[s][d]);
        }
      }
      if (exitB != 0) {
        assertTrue(err("b" + round).contains("expected the first date column to be"), outcome);
      }
    }
  }

  @Test
  void shouldForecastFromTheOldOrTheNewStoreWhileAnAppendRuns() throws Exception {
    Path store = temp.resolve("store");
    Path model = temp.resolve("model");
    int appends = 3;
    run("ingest", "--sales", salesFile("base.csv", 0, BASE_DAYS, 0).toString(), "--store", store.toString(),
        "--quiet");
    run("train", "--store", store.toString(), "--model", model.toString(), "--horizon", "7", "--lags", "7,14",
        "--windows", "7", "--rounds", "10", "--quiet");
    // the forecast of every store state the appends pass through, each computed with nothing else running
    Path scratch = temp.resolve("scratch");
    run("ingest", "--sales", temp.resolve("base.csv").toString(), "--store", scratch.toString(), "--quiet");
    Map<String, String> forecastByFirstDate = new HashMap<>();
    for (int k = 0; k <= appends; k++) {
      if (k > 0) {
        run("append", "--store", scratch.toString(), "--sales", salesFile("d" + k + ".csv", BASE_DAYS + k - 1,
            BASE_DAYS + k, 0).toString(), "--quiet");
      }
      Path out = temp.resolve("reference-" + k + ".csv");
      run("forecast", "--store", scratch.toString(), "--model", model.toString(), "--out", out.toString(), "--quiet");
      forecastByFirstDate.put(FIRST.plusDays(BASE_DAYS + k).toString(), Files.readString(out));
    }
    List<String> seen = new ArrayList<>();
    for (int k = 1; k <= appends; k++) {
      Process append = start("append" + k, "append", "--store", store.toString(), "--sales",
          temp.resolve("d" + k + ".csv").toString(), "--quiet");
      Process forecast = start("forecast" + k, "forecast", "--store", store.toString(), "--model", model.toString(),
          "--out", temp.resolve("live-" + k + ".csv").toString(), "--quiet");
      assertEquals(0, finish("append" + k, append), err("append" + k));
      assertEquals(0, finish("forecast" + k, forecast), err("forecast" + k));
      String live = Files.readString(temp.resolve("live-" + k + ".csv"));
      int dateColumn = List.of(live.lines().findFirst().orElseThrow().split(",")).indexOf("date");
      String firstDate = live.lines().skip(1).findFirst().orElseThrow().split(",")[dateColumn];
      assertTrue(firstDate.equals(FIRST.plusDays(BASE_DAYS + k - 1).toString())
          || firstDate.equals(FIRST.plusDays(BASE_DAYS + k).toString()), "old or new store: " + firstDate);
      assertEquals(forecastByFirstDate.get(firstDate), live, "the forecast of one whole store, from " + firstDate);
      seen.add(firstDate);
    }
    assertEquals(appends, seen.size());
  }
}
