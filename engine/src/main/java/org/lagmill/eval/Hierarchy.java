package org.lagmill.eval;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * The aggregation levels an evaluation reports on, declared by attribute names and bound to a history's attributes
 * later with {@link #bind(SalesHistory)}.
 *
 * <p>{@link #parse(List)} takes one or more hierarchies such as {@code region>store} and {@code category>department>item}
 * and builds the cross product of their prefixes, each including the empty "all" prefix: for those two,
 * 3 × 4 = 12 levels from {@code total} down to {@code region x store x category x department x item}. Levels are
 * ordered by attribute count (coarsest first); levels naming the same attribute set twice are kept once.
 * {@link #ofLevels(List)} takes an explicit list instead. Immutable.
 */
public final class Hierarchy {
  private final List<List<String>> levelAttributeNames;

  private Hierarchy(List<List<String>> levelAttributeNames) {
    this.levelAttributeNames = levelAttributeNames;
  }

  /**
   * @param hierarchies each a chain of attribute names joined by '>', outermost first, e.g. {@code "region>store"}; an
   *     empty list gives the total level only
   */
  public static Hierarchy parse(List<String> hierarchies) {
    List<List<List<String>>> prefixesByHierarchy = new ArrayList<>();
    for (String text : hierarchies) {
      String[] parts = text.split(">", -1);
      List<String> chain = new ArrayList<>();
      for (String part : parts) {
        String name = part.trim();
        if (name.isEmpty()) {
          throw new IllegalArgumentException("hierarchy '" + text + "' has an empty attribute name; expected names "
              + "joined by '>', e.g. 'region>store'");
        }
        if (chain.contains(name)) {
          throw new IllegalArgumentException("hierarchy '" + text + "' names attribute '" + name + "' twice");
        }
        chain.add(name);
      }
      List<List<String>> prefixes = new ArrayList<>();
      for (int length = 0; length <= chain.size(); length++) {
        prefixes.add(List.copyOf(chain.subList(0, length)));
      }
      prefixesByHierarchy.add(prefixes);
    }
    // Cross product with the last hierarchy outermost, so that within one attribute count the first hierarchy's
    // levels come first (region before category).
    List<List<String>> levels = new ArrayList<>();
    levels.add(List.of());
    for (List<List<String>> prefixes : prefixesByHierarchy) {
      List<List<String>> next = new ArrayList<>();
      for (List<String> prefix : prefixes) {
        for (List<String> level : levels) {
          List<String> joined = new ArrayList<>(level);
          joined.addAll(prefix);
          next.add(joined);
        }
      }
      levels = next;
    }
    levels.sort(Comparator.comparingInt(List::size));
    List<List<String>> unique = new ArrayList<>();
    Set<Set<String>> seen = new HashSet<>();
    for (List<String> level : levels) {
      if (seen.add(new LinkedHashSet<>(level))) {
        unique.add(List.copyOf(new LinkedHashSet<>(level)));
      }
    }
    return new Hierarchy(List.copyOf(unique));
  }

  /** @param levels each a list of attribute names ({@code []} is the total), kept in the given order */
  public static Hierarchy ofLevels(List<List<String>> levels) {
    if (levels.isEmpty()) {
      throw new IllegalArgumentException("need at least one level, got none; hint: [] is the total level");
    }
    List<List<String>> copy = new ArrayList<>();
    for (List<String> level : levels) {
      if (new HashSet<>(level).size() != level.size()) {
        throw new IllegalArgumentException("level " + level + " names an attribute twice");
      }
      copy.add(List.copyOf(level));
    }
    return new Hierarchy(List.copyOf(copy));
  }

  public int levelCount() {
    return levelAttributeNames.size();
  }

  /** Attribute names of each level, in level order. */
  public List<List<String>> levelAttributeNames() {
    return levelAttributeNames;
  }

  /** Level names, e.g. {@code [total, region, category, …]}. */
  public List<String> levelNames() {
    return levelAttributeNames.stream().map(Level::nameOf).toList();
  }

  /** Binds the levels to a history's attributes; see {@link #bind(SeriesAttributes, int)}. */
  public List<Level> bind(SalesHistory history) {
    return bind(history.attributes(), history.seriesCount());
  }

  /**
   * Maps every series to its aggregate in every level.
   *
   * @throws IllegalArgumentException when a level names an attribute the history does not have
   */
  public List<Level> bind(SeriesAttributes attributes, int seriesCount) {
    List<Level> levels = new ArrayList<>();
    for (List<String> names : levelAttributeNames) {
      int[] indexes = new int[names.size()];
      for (int a = 0; a < indexes.length; a++) {
        indexes[a] = attributes.attributeIndex(names.get(a));
        if (indexes[a] < 0) {
          List<String> allowed = new ArrayList<>();
          for (int k = 0; k < attributes.attributeCount(); k++) {
            allowed.add(attributes.attributeName(k));
          }
          throw new IllegalArgumentException("unknown attribute '" + names.get(a) + "' in level '"
              + Level.nameOf(names) + "'; allowed: " + allowed);
        }
      }
      levels.add(Level.build(names, indexes, attributes, seriesCount));
    }
    return List.copyOf(levels);
  }
}
