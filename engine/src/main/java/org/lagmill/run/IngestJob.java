package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.IngestResult;
import org.lagmill.ingest.SalesInputs;
import org.lagmill.ingest.ShardIngest;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.io.Setting;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreUpdate;

/**
 * The building of a store from input files, as the {@code ingest} command runs it: the whole input
 * ({@link StoreIngest}) or one shard of it ({@link ShardIngest}) in one stage, and {@code run.json} into the new store.
 */
public final class IngestJob {
  private IngestJob() {}

  /**
   * What to ingest.
   *
   * @param shard the shard as text {@code K/N} ({@link ShardIngest.Request#parse}), or null for every series
   * @param shardAttribute the attribute whose value picks each series' shard, or null without a shard
   * @param policy whether the store may be replaced, and whether to wait for another writer
   * @param memoryLimitBytes the run's off-heap limit, or {@link org.lagmill.memory.MemoryBudget#UNLIMITED_BYTES}
   */
  public record Request(IngestOptions options, String shard, String shardAttribute, StoreUpdate.Policy policy,
      long memoryLimitBytes) {}

  /**
   * What was ingested.
   *
   * @param result the published store's manifest, the warnings about the input (engine text with setting mentions)
   *     and the note on the period
   * @param peakOffHeapBytes the ingest stage's peak off-heap bytes
   */
  public record Outcome(IngestResult result, long peakOffHeapBytes) {}

  /**
   * Runs the ingest.
   *
   * @throws org.lagmill.io.InvalidRequestException for a malformed shard or an attribute without one, before anything
   *     is read
   */
  public static Outcome run(Request request) throws IOException {
    IngestOptions options = request.options();
    SalesInputs inputs = options.inputs();
    ShardIngest.Request shard = ShardIngest.Request.parse(request.shard(), request.shardAttribute());
    try (Run run = Run.start("ingest", request.memoryLimitBytes())) {
      run.record().configure("shard", request.shard()).configure("shardAttribute", request.shardAttribute())
          .configure("sales", inputs.salesFile().toString()).configure("calendar", pathText(inputs.calendarFile()))
          .configure("prices", pathText(inputs.pricesFile())).configure("store", options.storeDir().toString())
          .configure("plan", planText(inputs)).configure("missingRows", inputs.missingRows().optionValue());
      IngestResult result;
      long peakOffHeapBytes;
      try (Stage stage = run.stage("ingest")) {
        result = shard == null ? StoreIngest.ingest(options, request.policy(), stage.budget())
            : ShardIngest.ingest(options, shard, request.policy(), stage.budget());
        peakOffHeapBytes = stage.budget().peakBytes();
        stage.addRows(itemPeriods(result.manifest()));
      }
      StoreManifest ingested = result.manifest();
      run.record().result("seriesCount", ingested.seriesCount()).result("dayCount", ingested.dayCount())
          .result("storeBytes", ingested.binaryBytes()).result("fill", ingested.fill())
          .result("warnings", shown(result));
      run.record().write(options.storeDir());
      return new Outcome(result, peakOffHeapBytes);
    }
  }

  /** The store's series times its periods: the rows an ingest or an append stage went through. */
  static long itemPeriods(StoreManifest manifest) {
    return (long) manifest.seriesCount() * manifest.dayCount();
  }

  /** The warnings as run.json keeps them: with the mentions the front end shows. */
  static List<String> shown(IngestResult result) {
    return result.warnings().stream().map(Setting::shown).toList();
  }

  /** The plan file as run.json records it, or null. */
  static String planText(SalesInputs inputs) {
    return inputs.plan() == null ? null : inputs.plan().file().toString();
  }

  /** A path as run.json records it, or null. */
  static String pathText(Path path) {
    return path == null ? null : path.toString();
  }
}
