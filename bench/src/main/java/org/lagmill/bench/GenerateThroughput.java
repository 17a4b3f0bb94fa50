package org.lagmill.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.lagmill.scenario.ScenarioGenerator;
import org.lagmill.scenario.ScenarioSpec;
import org.lagmill.scenario.ScenarioSummary;

/**
 * Throughput of the scenario generator, end to end (generation, formatting, file writes), in a fresh temporary folder
 * that is deleted afterwards. A plain main rather than JMH: one run writes tens of millions of cells, so a single
 * wall-clock measurement after one small warm-up is representative.
 *
 * <p>Usage: {@code java -cp bench/target/lagmill-bench.jar org.lagmill.bench.GenerateThroughput SERIES DAYS [--gzip]
 * [--week]}; {@code --week} writes weekly files (DAYS a multiple of 7).
 */
public final class GenerateThroughput {
  private GenerateThroughput() {}

  public static void main(String[] args) throws IOException {
    if (args.length < 2) {
      System.err.println("usage: GenerateThroughput SERIES DAYS [--gzip] [--week]   e.g. 20000 2500 for 50M item-days");
      System.exit(2);
    }
    int seriesCount = Integer.parseInt(args[0]);
    int dayCount = Integer.parseInt(args[1]);
    List<String> flags = List.of(args).subList(2, args.length);
    boolean gzip = flags.contains("--gzip");
    int periodDays = flags.contains("--week") ? ScenarioSpec.WEEKLY : ScenarioSpec.DAILY;
    Path dir = Files.createTempDirectory("lagmill-generate-");
    try {
      ScenarioGenerator.write(new ScenarioSpec(2_000, 365, ScenarioSpec.DEFAULT_START_DATE, 1, 28, gzip),
          dir.resolve("warm-up"));
      ScenarioSpec spec = new ScenarioSpec(seriesCount, dayCount, ScenarioSpec.DEFAULT_START_DATE,
          ScenarioSpec.DEFAULT_SEED, ScenarioSpec.DEFAULT_FUTURE_DAY_COUNT, gzip, periodDays);
      long startNanos = System.nanoTime();
      ScenarioSummary summary = ScenarioGenerator.write(spec, dir.resolve("run"));
      double seconds = (System.nanoTime() - startNanos) / 1e9;
      System.out.printf(Locale.ROOT, "%d series x %d days = %d item-days%s%s: %.2f s, %.1f MB written, "
          + "%.1f M item-days/s, %.1f MB/s, max heap %d MB%n",
          seriesCount, dayCount, summary.itemDayCount(), gzip ? " (gzip)" : "", periodDays == 7 ? " (weekly)" : "",
          seconds, summary.fileBytes() / 1e6,
          summary.itemDayCount() / seconds / 1e6, summary.fileBytes() / 1e6 / seconds,
          Runtime.getRuntime().maxMemory() >> 20);
    } finally {
      try (Stream<Path> paths = Files.walk(dir)) {
        for (Path path : paths.sorted(Comparator.reverseOrder()).toList()) {
          Files.delete(path);
        }
      }
    }
  }
}
