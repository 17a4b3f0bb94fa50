package org.lagmill.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Locale;
import java.util.Random;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreDirectories;
import org.lagmill.store.StoreSummary;

/**
 * Ingest throughput harness: ingests a wide CSV into a temporary store and prints item-days per second and bytes per
 * item-day. Usage: {@code IngestThroughput FILE [REPEATS]}, or {@code IngestThroughput --generate FILE SERIES DAYS}
 * to write an invented retail-like wide file first (seeded; many zeros, a few large sellers, some unknown days).
 */
public final class IngestThroughput {
  private IngestThroughput() {}

  public static void main(String[] args) throws IOException {
    if (args.length >= 4 && args[0].equals("--generate")) {
      generate(Path.of(args[1]), Integer.parseInt(args[2]), Integer.parseInt(args[3]));
      return;
    }
    if (args.length < 1) {
      System.err.println("usage: IngestThroughput FILE [REPEATS] | --generate FILE SERIES DAYS");
      System.exit(2);
    }
    Path file = Path.of(args[0]);
    int repeats = args.length > 1 ? Integer.parseInt(args[1]) : 5;
    Path work = Files.createTempDirectory("ingest-throughput");
    try {
      for (int r = 0; r < repeats; r++) {
        Path store = work.resolve("store");
        long start = System.nanoTime();
        try (MemoryBudget budget = MemoryBudget.unlimited("bench")) {
          StoreIngest.ingest(IngestOptions.of(file, store), budget).manifest();
          long elapsedNanos = System.nanoTime() - start;
          try (SalesStore opened = SalesStore.open(store, budget)) {
            StoreSummary summary = StoreSummary.of(opened);
            long itemDays = (long) summary.seriesCount() * summary.dayCount();
            System.out.printf(Locale.ROOT, "run %d: %,d item-days in %.3f s = %,.0f item-days/s; units %.3f B/item-day,"
                + " store %.3f B/item-day, source %.3f B/item-day, heap used %d MB%n", r + 1, itemDays,
                elapsedNanos / 1e9, itemDays / (elapsedNanos / 1e9), summary.unitsBytesPerItemDay(),
                summary.storeBytesPerItemDay(), (double) Files.size(file) / itemDays,
                (Runtime.getRuntime().totalMemory() - Runtime.getRuntime().freeMemory()) >> 20);
          }
        }
      }
    } finally {
      StoreDirectories.deleteRecursively(work);
    }
  }

  private static void generate(Path file, int seriesCount, int dayCount) throws IOException {
    Random random = new Random(2024);
    LocalDate first = LocalDate.of(2021, 1, 1);
    try (BufferedWriter out = Files.newBufferedWriter(file)) {
      out.write("series_id,item,store,region");
      for (int d = 0; d < dayCount; d++) {
        out.write(',');
        out.write(first.plusDays(d).toString());
      }
      out.write('\n');
      for (int s = 0; s < seriesCount; s++) {
        int store = s % 10;
        out.write(
            "item-" + s / 10 + "@store-" + store + ",item-" + s / 10 + ",store-" + store + ",region-" + store / 4);
        double rate = random.nextInt(50) == 0 ? 200 * random.nextDouble() : 3 * random.nextDouble();
        int launch = random.nextInt(4) == 0 ? random.nextInt(dayCount) : 0;
        for (int d = 0; d < dayCount; d++) {
          out.write(',');
          if (random.nextInt(200) == 0) {
            continue;
          }
          int units = d < launch ? 0 : (int) Math.round(-rate * Math.log(1 - random.nextDouble()) * 0.7);
          out.write(Integer.toString(units));
        }
        out.write('\n');
      }
    }
  }
}
