package org.lagmill.store;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudget;

/**
 * Splits a store into {@code partCount} complete stores by a hash of one attribute's value ({@link ShardAssignment}):
 * every series goes, whole and unchanged, to the shard its value hashes to, with its prices and closures; the calendar
 * and the plan go to every shard (each series keeps its plan key). Each shard is written by {@link StoreWriter}
 * into its own store directory {@code outDir/shard-K} through {@link StoreUpdate} (lock, generation, commit), so it is
 * a store like any other, with its own checksums, plus a manifest {@code shard} record.
 *
 * <p>A shard keeps the whole store's attribute dictionaries ({@link StoreWriter#seedAttributeValues}), so a value has
 * the same code in every shard, and records the whole store's nesting. Memory: the source store mapped, one row of
 * units on the heap, the writer's dictionaries. Shards are written one after another; each is committed on its own,
 * so a failure part-way leaves the shards already written complete and the others as they were.
 */
public final class StoreSharding {
  /** Folder name of shard {@code part} under the output folder. */
  public static String shardDirectoryName(int part) {
    return "shard-" + part;
  }

  private StoreSharding() {}

  /**
   * @param attribute the attribute whose value picks each series' shard (an item keeps all its stores together)
   * @param budget charged for the mapped source store and the writers' buffers; a child budget is taken and closed
   * @return the manifest of each shard written, by part
   * @throws IllegalArgumentException for an unknown attribute, or when a shard would hold no series (fewer distinct
   *     values than parts, or an unlucky hash): nothing is written then
   */
  public static List<StoreManifest> shard(Path storeDir, int partCount, String attribute, Path outDir,
      MemoryBudget budget) throws IOException {
    ShardAssignment assignment = new ShardAssignment(partCount);
    Path source = storeDir.toAbsolutePath().normalize();
    Path out = outDir.toAbsolutePath().normalize();
    if (out.startsWith(source) || source.startsWith(out)) {
      throw new InvalidRequestException("output folder " + outDir + " overlaps the store " + storeDir
          + "; write the shards to a folder outside the store");
    }
    try (MemoryBudget stage = budget.child("shard"); SalesStore store = SalesStore.open(storeDir, stage)) {
      SeriesAttributes attributes = store.attributes();
      int attributeIndex = attributes.attributeIndex(attribute);
      if (attributeIndex < 0) {
        throw new InvalidRequestException("unknown attribute '" + attribute + "' for " + Setting.SHARD_ATTRIBUTE
            + "; allowed: "
            + attributeNames(attributes));
      }
      int[] partByCode = new int[attributes.cardinality(attributeIndex)];
      for (int code = 0; code < partByCode.length; code++) {
        partByCode[code] = assignment.partOf(attributes.value(attributeIndex, code));
      }
      List<IntArrayList> seriesByPart = new ArrayList<>();
      for (int part = 0; part < partCount; part++) {
        seriesByPart.add(new IntArrayList());
      }
      for (int s = 0; s < store.seriesCount(); s++) {
        seriesByPart.get(partByCode[attributes.code(s, attributeIndex)]).add(s);
      }
      checkNoEmptyPart(seriesByPart, attribute, attributes, attributeIndex, store);
      List<StoreManifest> manifests = new ArrayList<>();
      for (int part = 0; part < partCount; part++) {
        StoreManifest.Shard record = new StoreManifest.Shard(part, partCount, attribute, ShardAssignment.HASH_NAME,
            StoreManifest.Shard.STORE_SOURCE_PREFIX + store.fingerprint(), store.seriesCount());
        manifests.add(writeShard(store, seriesByPart.get(part).toIntArray(), record,
            out.resolve(shardDirectoryName(part)), stage));
      }
      return manifests;
    }
  }

  private static void checkNoEmptyPart(List<IntArrayList> seriesByPart, String attribute,
      SeriesAttributes attributes, int attributeIndex, SalesStore store) {
    for (int part = 0; part < seriesByPart.size(); part++) {
      if (seriesByPart.get(part).isEmpty()) {
        throw new InvalidRequestException("shard " + part + " of " + seriesByPart.size() + " would hold no series: "
            + "the " + store.seriesCount() + " series take " + store.nesting().cardinality(attributeIndex)
            + " values of '" + attribute + "' and none of them hashes to shard " + part + "; nothing was written"
            + " (hint: use fewer parts, or shard by an attribute with more values such as "
            + finest(attributes, store) + ")");
      }
    }
  }

  /** Copies the listed series of {@code store}, in store order, into a new store at {@code dir}. */
  private static StoreManifest writeShard(SalesStore store, int[] sourceIndexes, StoreManifest.Shard record, Path dir,
      MemoryBudget budget) throws IOException {
    SeriesAttributes attributes = store.attributes();
    List<String> names = attributeNames(attributes);
    try (StoreUpdate update = StoreUpdate.begin(dir, StoreUpdate.Policy.REPLACE_WAITING);
        StoreWriter writer = new StoreWriter(update.buildingDir(), store.firstDate(), store.periodDays(),
            store.dayCount(), names, budget)) {
      writer.seedAttributeValues(attributes);
      writer.recordShard(record, store.manifest().nesting() != null ? store.manifest().nesting()
          : store.nesting().parents());
      int[] units = new int[store.dayCount()];
      String[] values = new String[names.size()];
      for (int source : sourceIndexes) {
        store.readStoredUnits(source, 0, units, 0, units.length);
        for (int a = 0; a < values.length; a++) {
          values[a] = attributes.value(a, attributes.code(source, a));
        }
        writer.addSeries(values, units);
      }
      writer.writePrices(selectedPrices(store.prices(), sourceIndexes));
      writer.writeCalendar(store.calendar());
      // The source's count of partly closed item-periods cannot be split by series; the source manifest keeps it.
      writer.writeClosures(selectedClosures(store.closures(), sourceIndexes));
      writer.writePlan(selectedPlan(store.plan(), sourceIndexes));
      StoreManifest manifest = writer.finish(store.manifest().sources());
      update.commit();
      return manifest;
    }
  }

  /**
   * The prices of the series {@code sourceIndexes} of a whole store, as a shard keeps them (shard series {@code s} is
   * source series {@code sourceIndexes[s]}).
   */
  public static PriceTable selectedPrices(PriceTable prices, int[] sourceIndexes) {
    return new PriceTable() {
      @Override
      public boolean isEmpty() { return prices.isEmpty(); }
      @Override
      public int changeCount(int s) { return prices.changeCount(sourceIndexes[s]); }
      @Override
      public int changeDayIndex(int s, int k) { return prices.changeDayIndex(sourceIndexes[s], k); }
      @Override
      public float changePrice(int s, int k) { return prices.changePrice(sourceIndexes[s], k); }
    };
  }

  /** The closures of the series {@code sourceIndexes} of a whole store, as a shard keeps them. */
  public static ClosureTable selectedClosures(ClosureTable closures, int[] sourceIndexes) {
    return new ClosureTable() {
      @Override
      public boolean isEmpty() { return closures.isEmpty(); }
      @Override
      public int rangeCount(int s) { return closures.rangeCount(sourceIndexes[s]); }
      @Override
      public int firstDayIndex(int s, int k) { return closures.firstDayIndex(sourceIndexes[s], k); }
      @Override
      public int lastDayIndex(int s, int k) { return closures.lastDayIndex(sourceIndexes[s], k); }
    };
  }

  /** The plan with every key kept (keys are few) and each shard series pointing at its source series' key. */
  public static PlanTable selectedPlan(PlanTable plan, int[] sourceIndexes) {
    return PlanTable.withSeriesKeys(plan, s -> plan.keyOf(sourceIndexes[s]));
  }

  private static String finest(SeriesAttributes attributes, SalesStore store) {
    AttributeNesting nesting = store.nesting();
    int best = 0;
    for (int a = 1; a < attributes.attributeCount(); a++) {
      if (nesting.cardinality(a) > nesting.cardinality(best)) {
        best = a;
      }
    }
    return "'" + attributes.attributeName(best) + "' (" + nesting.cardinality(best) + " values)";
  }

  private static List<String> attributeNames(SeriesAttributes attributes) {
    List<String> names = new ArrayList<>();
    for (int a = 0; a < attributes.attributeCount(); a++) {
      names.add(attributes.attributeName(a));
    }
    return names;
  }
}
