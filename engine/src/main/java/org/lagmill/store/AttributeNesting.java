package org.lagmill.store;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * How a store's attributes nest, read from the data alone (never from their names): attribute A lies under attribute B
 * when every value of A occurs with exactly one value of B (each item in one department, each store in one region).
 *
 * <p>The nesting is kept as a forest, {@link #parents()}: each attribute maps to the attribute it lies directly under,
 * or to null for a root. Rules, in this order:
 * <ul>
 *   <li>An attribute whose values each name one series (the {@code series_id}, or an item sold in one store only) is
 *       an <em>identity</em>: everything lies under it, so it is never a parent.
 *   <li>Two attributes that determine each other (a department code and its name) are one level: the one later in
 *       attribute order lies under the earlier, not the other way round.
 *   <li>Of the attributes A lies under, its parent is the one nearest to it: the one no other of them lies under. When
 *       several qualify (a store under a region and, crosswise, under a store format), the one with the most values
 *       is taken, then the earliest in attribute order.
 * </ul>
 * Holds on to the attributes it was detected from (for {@link #namesEachSeries}); safe to share while they are open.
 * Computed in {@code attributeCount² × seriesCount} steps with one int array per attribute pair.
 */
public final class AttributeNesting {
  /** The attribute a store keeps for a series-id column: the bottom level when nothing else names each series. */

  private final SeriesAttributes attributes;
  private final int seriesCount;
  private final List<String> names;
  private final int[] cardinalities;
  private final boolean[][] liesUnder;
  private final boolean[] identity;
  private final int[] parentIndexes;

  private AttributeNesting(SeriesAttributes attributes, int seriesCount, List<String> names, int[] cardinalities,
      boolean[][] liesUnder, boolean[] identity, int[] parentIndexes) {
    this.attributes = attributes;
    this.seriesCount = seriesCount;
    this.names = names;
    this.cardinalities = cardinalities;
    this.liesUnder = liesUnder;
    this.identity = identity;
    this.parentIndexes = parentIndexes;
  }

  /**
   * Detects the nesting of every attribute pair.
   *
   * @param seriesCount number of series in {@code attributes}, at least 1
   */
  public static AttributeNesting detect(SeriesAttributes attributes, int seriesCount) {
    int count = attributes.attributeCount();
    List<String> names = new ArrayList<>();
    int[] cardinalities = new int[count];
    boolean[] identity = new boolean[count];
    for (int a = 0; a < count; a++) {
      names.add(attributes.attributeName(a));
      // Values the series take, not the dictionary's size: a shard keeps its whole store's dictionaries.
      cardinalities[a] = usedValueCount(attributes, seriesCount, a);
      identity[a] = cardinalities[a] >= seriesCount;
    }
    boolean[][] under = new boolean[count][count];
    for (int a = 0; a < count; a++) {
      int[] parentCodeByCode = new int[attributes.cardinality(a)];
      for (int b = 0; b < count; b++) {
        if (a != b) {
          under[a][b] = determines(attributes, seriesCount, a, b, parentCodeByCode);
        }
      }
    }
    int[] parents = new int[count];
    for (int a = 0; a < count; a++) {
      parents[a] = parentOf(a, under, identity, cardinalities);
    }
    return new AttributeNesting(attributes, seriesCount, List.copyOf(names), cardinalities, under, identity, parents);
  }

  private static int usedValueCount(SeriesAttributes attributes, int seriesCount, int a) {
    boolean[] used = new boolean[attributes.cardinality(a)];
    int count = 0;
    for (int s = 0; s < seriesCount; s++) {
      int code = attributes.code(s, a);
      if (!used[code]) {
        used[code] = true;
        count++;
      }
    }
    return count;
  }

  /** True when every value of {@code a} occurs with exactly one value of {@code b}. */
  private static boolean determines(SeriesAttributes attributes, int seriesCount, int a, int b,
      int[] parentCodeByCode) {
    Arrays.fill(parentCodeByCode, -1);
    for (int s = 0; s < seriesCount; s++) {
      int code = attributes.code(s, a);
      int parentCode = attributes.code(s, b);
      if (parentCodeByCode[code] < 0) {
        parentCodeByCode[code] = parentCode;
      } else if (parentCodeByCode[code] != parentCode) {
        return false;
      }
    }
    return true;
  }

  private static int parentOf(int a, boolean[][] under, boolean[] identity, int[] cardinalities) {
    int count = under.length;
    int best = -1;
    for (int b = 0; b < count; b++) {
      if (!isCandidate(a, b, under, identity)) {
        continue;
      }
      boolean nearest = true;
      for (int c = 0; c < count && nearest; c++) {
        // c lies between a and b: a candidate that itself lies under b.
        nearest = c == b || !isCandidate(a, c, under, identity) || !isCandidate(c, b, under, identity);
      }
      if (nearest && (best < 0 || cardinalities[b] > cardinalities[best])) {
        best = b;
      }
    }
    return best;
  }

  /** Whether b may be a parent (or an ancestor) of a: a lies under b, b is no identity, ties broken by order. */
  private static boolean isCandidate(int a, int b, boolean[][] under, boolean[] identity) {
    return a != b && under[a][b] && !identity[b] && (!under[b][a] || b < a);
  }

  /** Attribute names in store order. */
  public List<String> attributeNames() {
    return names;
  }

  /** Each attribute name (in store order) to the name it lies directly under, or null for a root. */
  public Map<String, String> parents() {
    Map<String, String> map = new LinkedHashMap<>();
    for (int a = 0; a < names.size(); a++) {
      map.put(names.get(a), parentIndexes[a] < 0 ? null : names.get(parentIndexes[a]));
    }
    return Collections.unmodifiableMap(map);
  }

  /** True when every value of attribute {@code a} occurs with exactly one value of {@code b} ({@code a != b}). */
  public boolean liesUnder(int a, int b) {
    return liesUnder[a][b];
  }

  /** True when each value of the attribute names exactly one series. */
  public boolean isIdentity(int attributeIndex) {
    return identity[attributeIndex];
  }

  /** Distinct values of an attribute. */
  public int cardinality(int attributeIndex) {
    return cardinalities[attributeIndex];
  }

  /**
   * True when the named attributes together tell every series apart; unknown names make it false.
   */
  public boolean namesEachSeries(List<String> attributeNames) {
    int[] indexes = new int[attributeNames.size()];
    for (int k = 0; k < indexes.length; k++) {
      indexes[k] = names.indexOf(attributeNames.get(k));
      if (indexes[k] < 0) {
        return false;
      }
    }
    Set<IntArrayList> seen = new HashSet<>();
    for (int s = 0; s < seriesCount; s++) {
      IntArrayList key = new IntArrayList(indexes.length);
      for (int a : indexes) {
        key.add(attributes.code(s, a));
      }
      if (!seen.add(key)) {
        return false;
      }
    }
    return true;
  }

  /**
   * The attributes of a level that tell its aggregates apart: drops each attribute with a single value and each one
   * another attribute of the level lies under (the department beside the item); of two that determine each other,
   * the earlier stays. Order is kept.
   */
  public List<String> distinguishing(List<String> level) {
    List<String> kept = new ArrayList<>();
    for (String name : level) {
      int b = names.indexOf(name);
      boolean redundant = cardinalities[b] <= 1;
      for (String other : level) {
        int a = names.indexOf(other);
        redundant |= a != b && liesUnder[a][b] && (!liesUnder[b][a] || a < b);
      }
      if (!redundant) {
        kept.add(name);
      }
    }
    return List.copyOf(kept);
  }

  /**
   * The attributes naming single series: the chains' leaves when together they tell every series apart, else the
   * {@code series_id} attribute, else the first attribute naming each series, else every attribute (a series is then
   * named by all its values).
   */
  public List<String> bottomAttributes() {
    List<String> leaves = new ArrayList<>();
    for (List<String> chain : chains()) {
      leaves.add(chain.get(chain.size() - 1));
    }
    if (!leaves.isEmpty() && namesEachSeries(leaves)) {
      return distinguishing(leaves);
    }
    int seriesId = names.indexOf(SeriesIdentity.SERIES_ID);
    if (seriesId >= 0 && identity[seriesId]) {
      return List.of(SeriesIdentity.SERIES_ID);
    }
    for (int a = 0; a < names.size(); a++) {
      if (identity[a]) {
        return List.of(names.get(a));
      }
    }
    return names;
  }

  /**
   * The default price group: the series sharing every bottom attribute but the one with the most values, which is
   * replaced by its parent (the item's department in the same store); empty when that attribute has no parent and
   * is the only one.
   */
  public List<String> siblingGroupAttributes() {
    List<String> bottom = bottomAttributes();
    int finest = -1;
    for (String name : bottom) {
      int a = names.indexOf(name);
      if (finest < 0 || cardinalities[a] > cardinalities[finest]) {
        finest = a;
      }
    }
    List<String> group = new ArrayList<>();
    for (String name : bottom) {
      int a = names.indexOf(name);
      String replacement = a != finest ? name : parentIndexes[a] < 0 ? null : names.get(parentIndexes[a]);
      if (replacement != null && !group.contains(replacement)) {
        group.add(replacement);
      }
    }
    return List.copyOf(group);
  }

  /** The attribute's parent index, or -1 for a root. */
  public int parentIndex(int attributeIndex) {
    return parentIndexes[attributeIndex];
  }

  /**
   * The forest as one line per chain from a root to a leaf, identities left out: e.g. {@code [dept > sku, shop]}.
   * An attribute under no other and over none is a chain of its own.
   */
  public List<List<String>> chains() {
    List<List<String>> chains = new ArrayList<>();
    for (int leaf = 0; leaf < names.size(); leaf++) {
      if (identity[leaf] || hasChild(leaf)) {
        continue;
      }
      List<String> chain = new ArrayList<>();
      for (int a = leaf; a >= 0; a = parentIndexes[a]) {
        chain.add(0, names.get(a));
      }
      chains.add(List.copyOf(chain));
    }
    return List.copyOf(chains);
  }

  private boolean hasChild(int a) {
    for (int c = 0; c < names.size(); c++) {
      if (!identity[c] && parentIndexes[c] == a) {
        return true;
      }
    }
    return false;
  }
}
