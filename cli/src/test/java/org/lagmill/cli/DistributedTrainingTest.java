package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Three ranks on loopback, each a JVM of its own on one shard, train one model with LightGBM's data-parallel learner:
 * every rank ends with the same model, the validation loss is within 1 % of one process on the unsplit store, the
 * shards' forecasts cover every series; a killed rank and a rank that never comes end the others with exit 9 and a
 * message naming the cause, within a bounded time. Every process started here is killed in a finally block.
 */
class DistributedTrainingTest {
  private static final Pattern SHA = Pattern.compile("model SHA-256 ([0-9a-f]{64})");
  private static final Pattern RANK_LOSS = Pattern.compile("validation tweedie over all ranks ([0-9.]+), model");
  private static final Pattern SINGLE_LOSS = Pattern.compile("validation tweedie ([0-9.]+)");
  private static final int SERIES = 48;

  @TempDir
  static Path dir;

  @BeforeAll
  static void shardAStore() throws IOException {
    Path store = GeneratedScenario.generateAndIngest(dir.resolve("data"), dir.resolve("store"), SERIES, 330, 21, false);
    MainRun.of("shard", "--store", store.toString(), "--parts", "3", "--by", "article", "--out",
        dir.resolve("shards").toString()).expectOk();
  }

  @Test
  void shouldTrainOneModelOnThreeShardsAsOneProcessDoesOnTheWholeStore() throws Exception {
    Path model = dir.resolve("model");
    MainRun cluster = MainRun.of("cluster-local", "--workers", "3", "--", "train", "--store",
        dir.resolve("shards").toString() + "/shard-{rank}", "--model", model.toString(), "--rounds", "40",
        "--threads", "1", "--deterministic", "--rank-timeout", "60");
    assertEquals(0, cluster.exitCode(), cluster.out() + cluster.err());
    Set<String> checksums = new HashSet<>();
    List<Double> losses = new ArrayList<>();
    for (String line : cluster.out().split("\n")) {
      Matcher sha = SHA.matcher(line);
      if (sha.find()) {
        checksums.add(sha.group(1));
        Matcher loss = RANK_LOSS.matcher(line);
        assertTrue(loss.find(), line);
        losses.add(Double.parseDouble(loss.group(1)));
      }
    }
    assertEquals(3, losses.size(), cluster.out());
    assertEquals(1, checksums.size(), "every rank must hold the same model: " + cluster.out());
    assertEquals(losses.get(0), losses.get(2), 0, "every rank sees the same validation loss");
    // the model text rank 0 wrote is the one every rank checked
    String written = java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256")
        .digest(Files.readAllBytes(model.resolve("model.txt"))));
    assertEquals(checksums.iterator().next(), written);

    MainRun single = MainRun.of("train", "--store", dir.resolve("store").toString(), "--model",
        dir.resolve("single").toString(), "--rounds", "40", "--threads", "1", "--deterministic");
    single.expectOk();
    Matcher singleLoss = SINGLE_LOSS.matcher(single.out());
    assertTrue(singleLoss.find(), single.out());
    double expected = Double.parseDouble(singleLoss.group(1));
    // LightGBM bins from each rank's own sample and averages the ranks' starting scores, so the models differ a
    // little; 1 % is the tolerance the issue sets (common practice, no source).
    assertEquals(expected, losses.get(0), 0.01 * expected, "distributed " + losses.get(0) + " vs one process "
        + expected);

    Set<String> forecastSeries = new HashSet<>();
    for (int part = 0; part < 3; part++) {
      Path forecast = dir.resolve("f-" + part + ".csv");
      MainRun forecastRun = MainRun.of("forecast", "--store", dir.resolve("shards/shard-" + part).toString(),
          "--model", model.toString(), "--out", forecast.toString(), "--intervals");
      forecastRun.expectOk();
      assertTrue(!forecastRun.err().contains("another version of the store"), forecastRun.err());
      List<String> lines = Files.readAllLines(forecast);
      for (String line : lines.subList(1, lines.size())) {
        forecastSeries.add(line.substring(0, line.indexOf(',')));
      }
    }
    assertEquals(SERIES, forecastSeries.size());
    assertEquals(1 + SERIES, Files.readAllLines(model.resolve("dispersion.csv")).size());
  }

  @Test
  void shouldTellLightGbmTheRanksSumOfSampledRows() throws Exception {
    Path model = dir.resolve("sampled");
    MainRun cluster = MainRun.of("cluster-local", "--workers", "3", "--", "train", "--store",
        dir.resolve("shards").toString() + "/shard-{rank}", "--model", model.toString(), "--rounds", "5",
        "--threads", "1", "--deterministic", "--rank-timeout", "60", "--zero-rows-kept", "0.4");
    assertEquals(0, cluster.exitCode(), cluster.out() + cluster.err());
    Pattern rows = Pattern.compile("rank \\d of 3: ([0-9,]+) of ([0-9,]+) training rows here");
    Pattern dropped = Pattern.compile("over all ranks dropped ([0-9,]+) of ([0-9,]+) training rows with zero sales");
    long localSum = 0;
    Set<Long> totals = new HashSet<>();
    Set<Long> droppedCounts = new HashSet<>();
    Set<String> checksums = new HashSet<>();
    for (String line : cluster.out().split("\n")) {
      Matcher m = rows.matcher(line);
      if (m.find()) {
        localSum += Long.parseLong(m.group(1).replace(",", ""));
        totals.add(Long.parseLong(m.group(2).replace(",", "")));
      }
      Matcher d = dropped.matcher(line);
      if (d.find()) {
        droppedCounts.add(Long.parseLong(d.group(1).replace(",", "")));
      }
      Matcher sha = SHA.matcher(line);
      if (sha.find()) {
        checksums.add(sha.group(1));
      }
    }
    assertEquals(1, totals.size(), cluster.out());
    assertEquals(1, droppedCounts.size(), "every rank reports the same drop: " + cluster.out());
    assertEquals(1, checksums.size(), "every rank must hold the same model: " + cluster.out());
    long total = totals.iterator().next();
    assertEquals(total, localSum, "LightGBM's row count is the sum of the rows each rank keeps: " + cluster.out());
    MainRun whole = MainRun.of("train", "--store", dir.resolve("store").toString(), "--model",
        dir.resolve("whole").toString(), "--rounds", "1", "--threads", "1", "--quiet");
    whole.expectOk();
    long unsampled = com.fasterxml.jackson.databind.json.JsonMapper.builder().build().readTree(dir.resolve("whole")
        .resolve("manifest.json").toFile()).get("partitions").get(0).get("trainingRowCount").asLong();
    assertEquals(unsampled, total + droppedCounts.iterator().next(), cluster.out());
  }

  @Test
  void shouldEndEveryRankWithAClearErrorWhenOneIsKilled() throws Exception {
    String machines = ClusterLocalCommand.freeLoopbackMachines(3);
    List<Process> ranks = new ArrayList<>();
    List<List<String>> outputs = new ArrayList<>();
    try {
      for (int rank = 0; rank < 3; rank++) {
        ranks.add(startRank(rank, machines, "30", outputs));
      }
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
      while (outputs.get(2).stream().noneMatch(l -> l.contains("iteration 1,")) && System.nanoTime() < deadline) {
        Thread.sleep(50);
      }
      assertTrue(System.nanoTime() < deadline, "rank 2 never started training: " + outputs);
      ranks.get(1).destroyForcibly();
      for (int rank : new int[] {0, 2}) {
        assertTrue(ranks.get(rank).waitFor(30, TimeUnit.SECONDS), "rank " + rank + " still runs: " + outputs);
        assertEquals(ExitCodes.RANK_FAILED, ranks.get(rank).exitValue(), outputs.get(rank).toString());
      }
      // the cause reaches each survivor through lagmill's channel (rank 1's connection closed), or, when LightGBM's
      // socket noticed first, as rank 0's report of that error: either way the message names the dead rank
      for (int rank : new int[] {0, 2}) {
        String output = String.join("\n", outputs.get(rank));
        assertTrue(output.contains("lagmill: rank " + rank + " stops: rank 1 closed its connection without finishing")
            || output.contains("lagmill: rank " + rank + " stops: rank 0 failed: "), output);
      }
    } finally {
      for (Process process : ranks) {
        process.destroyForcibly();
        process.waitFor(10, TimeUnit.SECONDS);
      }
    }
  }

  @Test
  void shouldStopWithinTheTimeOutWhenARankNeverComes() throws Exception {
    String machines = ClusterLocalCommand.freeLoopbackMachines(3);
    List<Process> ranks = new ArrayList<>();
    List<List<String>> outputs = new ArrayList<>();
    try {
      // 10 s, not less: on a loaded machine the second JVM can take several seconds to start and connect, and the
      // test is about the rank that never comes, not about a slow one (it failed once at 5 s under load 7-8)
      ranks.add(startRank(0, machines, "10", outputs));
      ranks.add(startRank(1, machines, "10", outputs));
      for (int rank = 0; rank < 2; rank++) {
        assertTrue(ranks.get(rank).waitFor(60, TimeUnit.SECONDS), "rank " + rank + " still runs: " + outputs);
        assertEquals(ExitCodes.RANK_FAILED, ranks.get(rank).exitValue(), outputs.get(rank).toString());
      }
      assertTrue(String.join("\n", outputs.get(0)).contains("lagmill: ranks [2] of 3 did not connect to rank 0"),
          outputs.get(0).toString());
      assertTrue(String.join("\n", outputs.get(1)).contains("lagmill: rank 0 closed the connection before training "
          + "started"), outputs.get(1).toString());
    } finally {
      for (Process process : ranks) {
        process.destroyForcibly();
        process.waitFor(10, TimeUnit.SECONDS);
      }
    }
  }

  /** One rank in a JVM of its own, its stdout and stderr lines collected (both) into {@code outputs}. */
  private static Process startRank(int rank, String machines, String timeoutSeconds, List<List<String>> outputs)
      throws IOException {
    Path temp = Files.createDirectories(dir.resolve("tmp-" + System.nanoTime() + "-" + rank));
    ProcessBuilder builder = new ProcessBuilder(ClusterLocalCommand.childJvm(temp, List.of("train", "--store",
        dir.resolve("shards/shard-" + rank).toString(), "--model", dir.resolve("killed-model").toString(),
        "--rounds", "100000", "--early-stopping", "0", "--threads", "1", "--machines", machines, "--rank", "" + rank,
        "--rank-timeout", timeoutSeconds)));
    builder.redirectErrorStream(true);
    Process process = builder.start();
    List<String> lines = new CopyOnWriteArrayList<>();
    outputs.add(lines);
    Thread reader = new Thread(() -> {
      try (BufferedReader in = new BufferedReader(new InputStreamReader(process.getInputStream(),
          StandardCharsets.UTF_8))) {
        String line;
        while ((line = in.readLine()) != null) {
          lines.add(line);
        }
      } catch (IOException ignored) {
        // the process was killed
      }
    });
    reader.setDaemon(true);
    reader.start();
    return process;
  }
}
