package org.lagmill.bench;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.lagmill.store.StoreDirectories;

/**
 * The training footprint harness: for each size, generates an invented scenario, ingests it, then measures in fresh
 * JVMs the streamed route, LightGBM's floor for the same rows and the whole-matrix route (see {@link FootprintProbe}),
 * plus {@code lagmill train} with and without {@code --partition-by outlet} at one size. Prints markdown tables.
 *
 * <p>Usage: {@code FootprintHarness [--sizes 1000x1000,10000x1000,20000x2500] [--rounds 10] [--threads 2]
 * [--xmx 1g] [--partition-size 10000x1000] [--matrix-limit-bytes 18000000000] [--work DIR] [--cli-jar PATH]
 * [--bench-jar PATH] [--out FILE]}. Sales, calendar and prices are ingested, as {@code lagmill generate} writes them.
 * Generated data is deleted after each size.
 */
public final class FootprintHarness {
  private static final long TIMEOUT_SECONDS = 3 * 3600;
  private static final Pattern DATASET_ROWS = Pattern.compile("Dataset ([0-9,]+) rows");
  private static final double MATRIX_OVERHEAD_FACTOR = 2.5;

  private final Path work;
  private final Path cliJar;
  private final Path benchJar;
  private final String xmx;
  private final int rounds;
  private final int threads;
  private int processCount;

  private FootprintHarness(Path work, Path cliJar, Path benchJar, String xmx, int rounds, int threads) {
    this.work = work;
    this.cliJar = cliJar;
    this.benchJar = benchJar;
    this.xmx = xmx;
    this.rounds = rounds;
    this.threads = threads;
  }

  public static void main(String[] args) throws Exception {
    String sizes = "1000x1000,10000x1000,20000x2500";
    String partitionSize = "10000x1000";
    int rounds = 10;
    int threads = 2;
    String xmx = "1g";
    long matrixLimitBytes = 18_000_000_000L;
    Path work = Path.of("target/footprint");
    Path cliJar = Path.of("cli/target/lagmill.jar");
    Path benchJar = Path.of("bench/target/lagmill-bench.jar");
    Path out = null;
    if (args.length % 2 != 0 || java.util.Arrays.asList(args).contains("--help")) {
      System.out.println("usage: FootprintHarness [--sizes 1000x1000,10000x1000,20000x2500] [--rounds 10] [--threads 2]"
          + " [--xmx 1g] [--partition-size 10000x1000|none] [--matrix-limit-bytes 18000000000] [--work DIR]"
          + " [--cli-jar PATH] [--bench-jar PATH] [--out FILE]");
      System.out.println("Runs generate, ingest and the stream, floor and matrix training routes in fresh JVMs per size"
          + " and prints their peak RSS as markdown tables (docs/benchmarks.md).");
      System.exit(args.length % 2 != 0 && !java.util.Arrays.asList(args).contains("--help") ? 2 : 0);
    }
    for (int i = 0; i + 1 < args.length; i += 2) {
      String value = args[i + 1];
      switch (args[i]) {
        case "--sizes" -> sizes = value;
        case "--partition-size" -> partitionSize = value;
        case "--rounds" -> rounds = Integer.parseInt(value);
        case "--threads" -> threads = Integer.parseInt(value);
        case "--xmx" -> xmx = value;
        case "--matrix-limit-bytes" -> matrixLimitBytes = Long.parseLong(value);
        case "--work" -> work = Path.of(value);
        case "--cli-jar" -> cliJar = Path.of(value);
        case "--bench-jar" -> benchJar = Path.of(value);
        case "--out" -> out = Path.of(value);
        default -> throw new IllegalArgumentException("unknown option " + args[i] + "; see the class Javadoc");
      }
    }
    Files.createDirectories(work.resolve("logs"));
    FootprintHarness harness = new FootprintHarness(work.toAbsolutePath(), cliJar.toAbsolutePath(),
        benchJar.toAbsolutePath(), xmx, rounds, threads);
    String loadBefore = loadAverage();
    ProbeResult baseline = harness.probe("baseline", List.of(), "baseline");
    List<FootprintTable.SizeResult> results = new ArrayList<>();
    for (String size : sizes.split(",")) {
      results.add(harness.measureSize(size.trim(), size.trim().equals(partitionSize), matrixLimitBytes));
      // tables so far, so a late failure still leaves the earlier sizes
      System.out.println(FootprintTable.markdown(baseline, results));
    }
    String report = String.format(Locale.ROOT, "Rounds %d, threads %d, -Xmx%s; load average %s before, %s after.%n%n",
        rounds, threads, xmx, loadBefore, loadAverage()) + FootprintTable.markdown(baseline, results);
    System.out.println(report);
    if (out != null) {
      Files.writeString(out, report, StandardCharsets.UTF_8);
    }
    StoreDirectories.deleteRecursively(work.resolve("jvm-tmp"));
  }

  private FootprintTable.SizeResult measureSize(String size, boolean partition, long matrixLimitBytes)
      throws IOException, InterruptedException {
    String[] parts = size.split("x");
    int seriesCount = Integer.parseInt(parts[0]);
    int dayCount = Integer.parseInt(parts[1]);
    Path folder = work.resolve("size-" + size);
    StoreDirectories.deleteRecursively(folder);
    Files.createDirectories(folder);
    try {
      Path generated = folder.resolve("gen");
      Path store = folder.resolve("store");
      Path dump = folder.resolve("dump");
      lagmill(size + "-generate", "generate", "--out", generated.toString(), "--series",
          Integer.toString(seriesCount), "--days", Integer.toString(dayCount));
      lagmill(size + "-ingest", "ingest", "--sales", generated.resolve("sales.csv").toString(), "--calendar",
          generated.resolve("calendar.csv").toString(), "--prices", generated.resolve("prices.csv").toString(),
          "--store", store.toString());
      StoreDirectories.deleteRecursively(generated);
      List<String> storeArgs = List.of("--store", store.toString(), "--dump", dump.toString());
      ProbeResult dumped = probe("dump", storeArgs, size + "-dump");
      ProbeResult stream = probe("stream", storeArgs, size + "-stream");
      ProbeResult floor = probe("floor", storeArgs, size + "-floor");
      StoreDirectories.deleteRecursively(dump);
      long matrixBytes = dumped.rowCount() * dumped.featureCount() * (long) Float.BYTES;
      ProbeResult matrix = null;
      String matrixNote = null;
      if (matrixBytes * MATRIX_OVERHEAD_FACTOR > matrixLimitBytes) {
        matrixNote = String.format(Locale.ROOT, "does not fit (%.1f GB matrix × %.1f > %.0f GB)", matrixBytes / 1e9,
            MATRIX_OVERHEAD_FACTOR, matrixLimitBytes / 1e9);
      } else {
        try {
          matrix = probe("matrix", storeArgs, size + "-matrix");
        } catch (IllegalStateException e) {
          matrixNote = "failed (see logs/" + size + "-matrix.log)";
          System.out.println(e.getMessage());
        }
      }
      FootprintTable.PartitionResult partitionResult = partition ? measurePartitions(size, store, folder) : null;
      return new FootprintTable.SizeResult(seriesCount, dayCount, stream, floor, matrix, matrixNote, partitionResult);
    } finally {
      StoreDirectories.deleteRecursively(folder);
    }
  }

  private FootprintTable.PartitionResult measurePartitions(String size, Path store, Path folder)
      throws IOException, InterruptedException {
    List<String> common = List.of("--rounds", Integer.toString(rounds), "--early-stopping", "0", "--threads",
        Integer.toString(threads));
    List<String> whole = new ArrayList<>(List.of("train", "--store", store.toString(), "--model",
        folder.resolve("model-all").toString()));
    whole.addAll(common);
    MeasuredProcess.Result unpartitioned = lagmill(size + "-train", whole.toArray(String[]::new));
    List<String> byOutlet = new ArrayList<>(List.of("train", "--store", store.toString(), "--model",
        folder.resolve("model-by-outlet").toString(), "--partition-by", "outlet"));
    byOutlet.addAll(common);
    MeasuredProcess.Result partitioned = lagmill(size + "-train-by-outlet", byOutlet.toArray(String[]::new));
    List<Long> allRows = datasetRows(unpartitioned.logFile());
    List<Long> partitionRows = datasetRows(partitioned.logFile());
    return new FootprintTable.PartitionResult(unpartitioned.peakResidentBytes(), partitioned.peakResidentBytes(),
        allRows.stream().mapToLong(Long::longValue).sum(),
        partitionRows.stream().mapToLong(Long::longValue).max().orElse(0), partitionRows.size());
  }

  /** Training rows of each model, from {@code lagmill train}'s summary lines ("Dataset N rows x F features"). */
  static List<Long> datasetRows(Path logFile) throws IOException {
    List<Long> rows = new ArrayList<>();
    for (String line : Files.readAllLines(logFile)) {
      Matcher matcher = DATASET_ROWS.matcher(line);
      if (line.startsWith("model ") && matcher.find()) {
        rows.add(Long.parseLong(matcher.group(1).replace(",", "")));
      }
    }
    return rows;
  }

  private ProbeResult probe(String mode, List<String> options, String name) throws IOException, InterruptedException {
    List<String> command = java();
    command.addAll(List.of("-cp", benchJar.toString(), FootprintProbe.class.getName(), mode, "--rounds",
        Integer.toString(rounds), "--threads", Integer.toString(threads)));
    command.addAll(options);
    MeasuredProcess.Result result = measure(name, command);
    ProbeResult probe = ProbeResult.findIn(Files.readAllLines(result.logFile()))
        .orElseThrow(() -> new IllegalStateException(
            "probe " + name + " exited with " + result.exitCode() + " and printed no result; "
                + "see " + result.logFile()));
    System.out.printf(Locale.ROOT, "%s: %.1f s, sampled peak %d MB, probe peak %d MB: %s%n", name, result.seconds(),
        result.peakResidentBytes() >> 20, probe.peakAfterTrainingBytes() >> 20, probe.toLine());
    return probe;
  }

  private MeasuredProcess.Result lagmill(String name, String... arguments) throws IOException, InterruptedException {
    List<String> command = java();
    command.addAll(List.of("-jar", cliJar.toString()));
    command.addAll(List.of(arguments));
    MeasuredProcess.Result result = measure(name, command);
    if (result.exitCode() != 0) {
      throw new IllegalStateException(name + " exited with " + result.exitCode() + "; see " + result.logFile());
    }
    System.out.printf(Locale.ROOT, "%s: %.1f s, peak %d MB%n", name, result.seconds(),
        result.peakResidentBytes() >> 20);
    return result;
  }

  private MeasuredProcess.Result measure(String name, List<String> command) throws IOException, InterruptedException {
    Path logFile = work.resolve("logs").resolve(name + ".log");
    // The same environment the lagmill launcher gives every run.
    return MeasuredProcess.run(command, Map.of("OMP_WAIT_POLICY", "PASSIVE", "MALLOC_ARENA_MAX", "2"), logFile,
        TIMEOUT_SECONDS);
  }

  /** java with the agrona flag, a modest heap and a private java.io.tmpdir (lightgbm4j's fixed extraction name). */
  private List<String> java() {
    Path tmp = work.resolve("jvm-tmp").resolve(Integer.toString(++processCount));
    return new ArrayList<>(List.of("java", "-Xmx" + xmx, "--add-exports", "java.base/jdk.internal.misc=ALL-UNNAMED",
        "--add-opens", "java.base/java.nio=ALL-UNNAMED", "--add-opens", "java.base/sun.nio.ch=ALL-UNNAMED",
        "-Djava.io.tmpdir=" + tmp));
  }

  private static String loadAverage() {
    try {
      String[] fields = Files.readString(Path.of("/proc/loadavg")).trim().split("\\s+");
      return fields[0] + " " + fields[1] + " " + fields[2];
    } catch (IOException e) {
      return "unavailable";
    }
  }
}
