package org.lagmill.eval;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.store.SeriesAttributes;

/**
 * One aggregation level of a {@link Hierarchy}: a tuple of series attributes (empty for the grand total) and, for every
 * bottom series, the index of the aggregate it adds into. Aggregates are numbered {@code 0 .. aggregateCount()-1} in
 * order of their first series.
 *
 * <p>Immutable and safe to share between threads.
 */
public final class Level {
  /** Name of the level with no attributes, and of its single aggregate. */
  public static final String TOTAL_NAME = "total";

  private final String name;
  private final List<String> attributeNames;
  private final int[] attributeIndexes;
  private final int[] aggregateIndexBySeries;
  private final String[] aggregateNames;

  private Level(String name, List<String> attributeNames, int[] attributeIndexes, int[] aggregateIndexBySeries,
      String[] aggregateNames) {
    this.name = name;
    this.attributeNames = attributeNames;
    this.attributeIndexes = attributeIndexes;
    this.aggregateIndexBySeries = aggregateIndexBySeries;
    this.aggregateNames = aggregateNames;
  }

  /** Level name from its attribute names: {@code total}, {@code store}, {@code store x category}. */
  public static String nameOf(List<String> attributeNames) {
    return attributeNames.isEmpty() ? TOTAL_NAME : String.join(" x ", attributeNames);
  }

  /**
   * Maps every series to its aggregate, grouping by the tuple of attribute codes.
   *
   * @param attributeIndexes indexes into {@code attributes}, each checked by the caller
   */
  static Level build(List<String> attributeNames, int[] attributeIndexes, SeriesAttributes attributes,
      int seriesCount) {
    int[] aggregateIndexBySeries = new int[seriesCount];
    List<int[]> firstCodes = new ArrayList<>();
    long[] radix = packingRadix(attributeIndexes, attributes);
    if (radix != null) {
      Long2IntOpenHashMap indexByKey = new Long2IntOpenHashMap();
      indexByKey.defaultReturnValue(-1);
      for (int s = 0; s < seriesCount; s++) {
        long key = 0;
        for (int a = 0; a < attributeIndexes.length; a++) {
          key += attributes.code(s, attributeIndexes[a]) * radix[a];
        }
        int index = indexByKey.get(key);
        if (index < 0) {
          index = firstCodes.size();
          indexByKey.put(key, index);
          firstCodes.add(codesOf(s, attributeIndexes, attributes));
        }
        aggregateIndexBySeries[s] = index;
      }
    } else {
      // Cardinalities whose product overflows a long: key by the code list itself (built once per series).
      Object2IntOpenHashMap<IntArrayList> indexByKey = new Object2IntOpenHashMap<>();
      indexByKey.defaultReturnValue(-1);
      for (int s = 0; s < seriesCount; s++) {
        IntArrayList key = IntArrayList.wrap(codesOf(s, attributeIndexes, attributes));
        int index = indexByKey.getInt(key);
        if (index < 0) {
          index = firstCodes.size();
          indexByKey.put(key, index);
          firstCodes.add(key.elements());
        }
        aggregateIndexBySeries[s] = index;
      }
    }
    String[] aggregateNames = new String[firstCodes.size()];
    for (int g = 0; g < aggregateNames.length; g++) {
      if (attributeIndexes.length == 0) {
        aggregateNames[g] = TOTAL_NAME;
        continue;
      }
      StringBuilder text = new StringBuilder();
      int[] codes = firstCodes.get(g);
      for (int a = 0; a < attributeIndexes.length; a++) {
        text.append(a == 0 ? "" : " / ").append(attributes.value(attributeIndexes[a], codes[a]));
      }
      aggregateNames[g] = text.toString();
    }
    return new Level(nameOf(attributeNames), List.copyOf(attributeNames), attributeIndexes.clone(),
        aggregateIndexBySeries, aggregateNames);
  }

  /**
   * A level known only by its aggregates' names, with no bottom series bound to it: the shape of a level merged from
   * shards' scoring parts, which the scoring rules need (name, aggregate count, aggregate names) and nothing more.
   */
  static Level named(List<String> attributeNames, String[] aggregateNames) {
    return new Level(nameOf(attributeNames), List.copyOf(attributeNames), new int[0], new int[0],
        aggregateNames.clone());
  }

  private static int[] codesOf(int seriesIndex, int[] attributeIndexes, SeriesAttributes attributes) {
    int[] codes = new int[attributeIndexes.length];
    for (int a = 0; a < codes.length; a++) {
      codes[a] = attributes.code(seriesIndex, attributeIndexes[a]);
    }
    return codes;
  }

  /** Mixed-radix multipliers packing a code tuple into one long, or null when the tuple does not fit. */
  private static long[] packingRadix(int[] attributeIndexes, SeriesAttributes attributes) {
    long[] radix = new long[attributeIndexes.length];
    long multiplier = 1;
    try {
      for (int a = 0; a < attributeIndexes.length; a++) {
        radix[a] = multiplier;
        multiplier = Math.multiplyExact(multiplier, Math.max(1, attributes.cardinality(attributeIndexes[a])));
      }
    } catch (ArithmeticException overflow) {
      return null;
    }
    return radix;
  }

  public String name() {
    return name;
  }

  /** Attribute names of the level, outermost first; empty for the total. */
  public List<String> attributeNames() {
    return attributeNames;
  }

  /** Attribute indexes into the history's {@link SeriesAttributes}; a copy. */
  public int[] attributeIndexes() {
    return attributeIndexes.clone();
  }

  public int seriesCount() {
    return aggregateIndexBySeries.length;
  }

  public int aggregateCount() {
    return aggregateNames.length;
  }

  /** Aggregate a bottom series adds into, {@code 0 .. aggregateCount()-1}. */
  public int aggregateIndexOf(int seriesIndex) {
    return aggregateIndexBySeries[seriesIndex];
  }

  /** Attribute values of an aggregate joined by " / " (e.g. "Northvale / Pantry"), or "total". */
  public String aggregateName(int aggregateIndex) {
    return aggregateNames[aggregateIndex];
  }

  /** True when each aggregate holds exactly one series (the attribute tuple identifies a series). */
  public boolean isBottom() {
    return aggregateNames.length == aggregateIndexBySeries.length;
  }

  @Override
  public String toString() {
    return name + " (" + aggregateNames.length + " aggregates)";
  }
}
