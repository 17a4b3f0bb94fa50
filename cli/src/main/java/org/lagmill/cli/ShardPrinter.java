package org.lagmill.cli;

import java.io.PrintWriter;
import org.lagmill.run.ShardJob;

/** The console lines of {@code shard}: one per shard store, then the split. */
final class ShardPrinter {
  private ShardPrinter() {}

  static void print(PrintWriter out, ShardJob.Outcome outcome, String attribute) {
    int partCount = outcome.shards().size();
    for (ShardJob.Shard shard : outcome.shards()) {
      out.printf("shard %d of %d: %d series, %d bytes in %s%n", shard.manifest().shard().part(), partCount,
          shard.manifest().seriesCount(), shard.manifest().binaryBytes(), shard.dir());
    }
    out.printf("split %d series by %s into %d shards, peak off-heap %d bytes%n", outcome.sourceSeriesCount(),
        attribute, partCount, outcome.peakOffHeapBytes());
  }
}
