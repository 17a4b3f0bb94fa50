package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSharding;

/**
 * The splitting of a store into shard stores, as the {@code shard} command runs it: {@link StoreSharding} in one stage
 * under the run's memory limit. Writes no {@code run.json}: each shard store is a store like any other.
 */
public final class ShardJob {
  private ShardJob() {}

  /**
   * What to split.
   *
   * @param partCount number of shards, 1 to {@link org.lagmill.store.ShardAssignment#MAX_PART_COUNT}
   * @param attribute the attribute whose value picks each series' shard
   * @param outDir the folder the shard stores go into, one folder each
   * @param memoryLimitBytes the run's off-heap limit, or {@link org.lagmill.memory.MemoryBudget#UNLIMITED_BYTES}
   */
  public record Request(Path storeDir, int partCount, String attribute, Path outDir, long memoryLimitBytes) {}

  /**
   * What was written.
   *
   * @param shards one per shard, by part
   * @param sourceSeriesCount the series of the store that was split
   * @param peakOffHeapBytes the shard stage's peak off-heap bytes
   */
  public record Outcome(List<Shard> shards, int sourceSeriesCount, long peakOffHeapBytes) {}

  /** One shard store: its manifest and its folder. */
  public record Shard(StoreManifest manifest, Path dir) {}

  public static Outcome run(Request request) throws IOException {
    try (Run run = Run.start("shard", request.memoryLimitBytes());
        Stage stage = run.stage("shard")) {
      List<StoreManifest> manifests = StoreSharding.shard(request.storeDir(), request.partCount(),
          request.attribute(), request.outDir(), stage.budget());
      List<Shard> shards = manifests.stream().map(m -> new Shard(m,
          request.outDir().resolve(StoreSharding.shardDirectoryName(m.shard().part())))).toList();
      return new Outcome(shards, manifests.get(0).shard().sourceSeriesCount(), stage.budget().peakBytes());
    }
  }
}
