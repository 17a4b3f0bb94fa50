package org.lagmill.bench;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The planner's weekly job end to end, each step a fresh {@code lagmill} process measured for wall time and peak
 * resident memory: generate a scenario, ingest it (calendar, prices, plan, closures), a 3-origin backtest, the final
 * fit and a forecast with intervals. Prints one markdown row per stage with the boosting rounds each trained (from
 * the run records) and the backtest's mean WRMSSE, for docs/benchmarks.md.
 *
 * <p>Run: {@code java -cp bench/target/lagmill-bench.jar org.lagmill.bench.WeeklyJobHarness SERIES DAYS WORK_DIR
 * [CLI_JAR] [--route continued] [extra training options…]}; CLI_JAR defaults to {@code cli/target/lagmill.jar}.
 * Extra options (e.g. {@code --learning-rate 0.1}) go to both backtest and train, to measure a lever against the
 * default route. {@code --route continued} (the harness's own option) runs the continued route: each backtest origin
 * after the first continues from the previous origin's model, the backtest saves its last origin's model, and the
 * final fit continues from it, so the final fit only adds rounds for the newest days.
 */
public final class WeeklyJobHarness {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final long TIMEOUT_SECONDS = 6 * 3600;

  private WeeklyJobHarness() {}

  /** One measured stage: what ran, how long, its peak RSS, and the boosting rounds it trained (0 for none). */
  record StageFigures(String name, double seconds, long peakResidentBytes, String rounds) {}

  public static void main(String[] args) throws Exception {
    int seriesCount = Integer.parseInt(args[0]);
    int dayCount = Integer.parseInt(args[1]);
    Path work = Path.of(args[2]);
    Path jar = Path.of(args.length > 3 ? args[3] : "cli/target/lagmill.jar");
    List<String> extra = new ArrayList<>(args.length > 4 ? List.of(args).subList(4, args.length) : List.of());
    boolean continued = false;
    int route = extra.indexOf("--route");
    if (route >= 0) {
      if (route + 1 >= extra.size() || !List.of("scratch", "continued").contains(extra.get(route + 1))) {
        throw new IllegalArgumentException("--route takes scratch or continued, got " + extra.subList(route + 1,
            extra.size()));
      }
      continued = extra.get(route + 1).equals("continued");
      extra.subList(route, route + 2).clear();
    }
    Path lastOrigin = work.resolve("last-origin");
    Files.createDirectories(work);
    List<StageFigures> stages = new ArrayList<>();
    Path data = work.resolve("data");
    Path store = work.resolve("store");
    stages.add(measure(jar, work, "generate", List.of("generate", "--out", data.toString(), "--series",
        Integer.toString(seriesCount), "--days", Integer.toString(dayCount), "--seed", "7"), ""));
    stages.add(measure(jar, work, "ingest", List.of("ingest", "--sales", data.resolve("sales.csv").toString(),
        "--calendar", data.resolve("calendar.csv").toString(), "--prices", data.resolve("prices.csv").toString(),
        "--plan", data.resolve("plan.csv").toString(), "--closures", data.resolve("closures.csv").toString(),
        "--store", store.toString(), "--quiet"), ""));
    List<String> backtest = new ArrayList<>(List.of("backtest", "--store", store.toString(), "--origins", "3",
        "--report", work.resolve("backtest").toString(), "--quiet"));
    backtest.addAll(extra);
    if (continued) {
      backtest.addAll(List.of("--continue-origins", "--save-last-model", lastOrigin.toString()));
    }
    StageFigures backtestStage = measure(jar, work, "backtest (3 origins)", backtest, "");
    JsonNode backtestResult = JSON.readTree(work.resolve("backtest").resolve("backtest.json").toFile());
    stages.add(new StageFigures(backtestStage.name(), backtestStage.seconds(), backtestStage.peakResidentBytes(),
        roundsOfBacktest(backtestResult)));
    List<String> train = new ArrayList<>(List.of("train", "--store", store.toString(), "--model",
        work.resolve("model").toString(), "--quiet"));
    train.addAll(extra);
    if (continued) {
      train.addAll(List.of("--continue-from", lastOrigin.toString()));
    }
    StageFigures trainStage = measure(jar, work, "final fit", train, "");
    JsonNode trainRecord = JSON.readTree(work.resolve("model").resolve("run.json").toFile());
    stages.add(new StageFigures(trainStage.name(), trainStage.seconds(), trainStage.peakResidentBytes(),
        rounds(trainRecord.path("results").path("partitions"))));
    stages.add(measure(jar, work, "forecast with intervals", List.of("forecast", "--store", store.toString(),
        "--model", work.resolve("model").toString(), "--intervals", "--out", work.resolve("forecast.csv").toString(),
        "--quiet"), ""));
    double total = stages.stream().mapToDouble(StageFigures::seconds).sum();
    System.out.printf(Locale.ROOT, "%d series x %d days = %.1f M item-days, %s route, options %s%n", seriesCount,
        dayCount, seriesCount * (double) dayCount / 1e6, continued ? "continued" : "from-scratch",
        extra.isEmpty() ? "(defaults)" : String.join(" ", extra));
    System.out.println("| stage | wall s | peak RSS MB | boosting rounds (best / refit; continued: start + added) |");
    System.out.println("|---|---|---|---|");
    for (StageFigures s : stages) {
      System.out.printf(Locale.ROOT, "| %s | %.1f | %d | %s |%n", s.name(), s.seconds(), s.peakResidentBytes() >> 20,
          s.rounds());
    }
    System.out.printf(Locale.ROOT, "| whole job | %.1f | | |%n", total);
    System.out.printf(Locale.ROOT, "backtest mean WRMSSE %.4f (± %.4f over %d origins)%n",
        backtestResult.path("meanModelWrmsse").asDouble(), backtestResult.path("stdModelWrmsse").asDouble(),
        backtestResult.path("origins").size());
  }

  private static StageFigures measure(Path jar, Path work, String name, List<String> lagmillArgs, String rounds)
      throws IOException, InterruptedException {
    Path tmp = Files.createDirectories(work.resolve("jvm-tmp"));
    // the launcher's flags (./lagmill): a 1 GiB heap, and the JVM's cap on direct buffers lifted to the machine's
    // memory so that lagmill's own off-heap budget is the one limit
    long machineBytes = ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean())
        .getTotalMemorySize();
    List<String> command = new ArrayList<>(List.of("java", "-Xmx1g", "-XX:MaxDirectMemorySize=" + machineBytes,
        "--add-exports", "java.base/jdk.internal.misc=ALL-UNNAMED", "--add-opens", "java.base/java.nio=ALL-UNNAMED",
        "--add-opens", "java.base/sun.nio.ch=ALL-UNNAMED", "-Djava.io.tmpdir=" + tmp, "-jar", jar.toString()));
    command.addAll(lagmillArgs);
    Path log = work.resolve(name.replaceAll("[^a-z0-9]+", "-") + ".log");
    // the launcher's environment (./lagmill): passive OpenMP waits and few malloc arenas
    MeasuredProcess.Result result = MeasuredProcess.run(command, Map.of("OMP_WAIT_POLICY", "PASSIVE",
        "MALLOC_ARENA_MAX", "2"), log, TIMEOUT_SECONDS);
    if (result.exitCode() != 0) {
      throw new IllegalStateException(name + " exited with " + result.exitCode() + "; see " + log);
    }
    return new StageFigures(name, result.seconds(), result.peakResidentBytes(), rounds);
  }

  /**
   * "best / refit" rounds of every origin's partitions, e.g. "412/433, 380/401, 510/536"; a continued partition shows
   * its starting rounds plus the rounds it added, e.g. "315+140".
   */
  private static String roundsOfBacktest(JsonNode backtestResult) {
    List<String> perOrigin = new ArrayList<>();
    for (JsonNode origin : backtestResult.path("origins")) {
      perOrigin.add(rounds(origin.path("partitions")));
    }
    return String.join(", ", perOrigin);
  }

  private static String rounds(JsonNode partitions) {
    List<String> parts = new ArrayList<>();
    for (JsonNode p : partitions) {
      parts.add(p.path("continuedFrom").isTextual() ? p.path("startingRounds").asInt() + "+" + p.path("addedRounds")
          .asInt() : p.path("bestIteration").asInt() + "/" + p.path("refitRounds").asInt());
    }
    return String.join(" + ", parts);
  }
}
