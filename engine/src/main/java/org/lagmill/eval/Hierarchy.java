package org.lagmill.eval;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.store.AttributeNesting;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * The aggregation levels an evaluation reports on, declared by attribute names and bound to a history's attributes
 * later with {@link #bind(SalesHistory)}.
 *
 * <p>{@link #parse(List)} takes one or more hierarchies such as {@code region>store} and {@code category>department>item}
 * and builds the cross product of their prefixes, each including the empty "all" prefix: for those two,
 * 3 × 4 = 12 levels from {@code total} down to {@code region x store x category x department x item}. Levels are
 * ordered by attribute count (coarsest first); levels naming the same attribute set twice are kept once. Binding a
 * parsed hierarchy checks it against the data: each value of a child attribute must lie under one parent value.
 * {@link #ofLevels(List)} takes an explicit list instead. {@link #detected(AttributeNesting)} derives the levels from
 * how the data nest, with no regard to attribute names. Immutable.
 */
public final class Hierarchy {
  /** Where the levels came from, as the report and {@code --json} say it. */
  public enum Source {
    /** From the attribute nesting found in the data. */
    DETECTED,
    /** From {@code --hierarchy} or {@code --level}. */
    DECLARED;

    public String label() {
      return name().toLowerCase(java.util.Locale.ROOT);
    }
  }

  private final List<List<String>> levelAttributeNames;
  private final List<List<String>> declaredChains;
  private final Source source;
  private final String basis;

  private Hierarchy(List<List<String>> levelAttributeNames, List<List<String>> declaredChains, Source source,
      String basis) {
    this.levelAttributeNames = levelAttributeNames;
    this.declaredChains = declaredChains;
    this.source = source;
    this.basis = basis;
  }

  /** Chains as the report and {@code --json} show them: {@code dept > grp > sku; shop}. */
  static String chainsText(List<List<String>> chains) {
    List<String> parts = new ArrayList<>();
    for (List<String> chain : chains) {
      parts.add(String.join(" > ", chain));
    }
    return String.join("; ", parts);
  }

  /**
   * @param hierarchies each a chain of attribute names joined by '>', outermost first, e.g. {@code "region>store"}; an
   *     empty list gives the total level only
   */
  public static Hierarchy parse(List<String> hierarchies) {
    List<List<String>> chains = new ArrayList<>();
    for (String text : hierarchies) {
      String[] parts = text.split(">", -1);
      List<String> chain = new ArrayList<>();
      for (String part : parts) {
        String name = part.trim();
        if (name.isEmpty()) {
          throw new InvalidRequestException("hierarchy '" + text + "' has an empty attribute name; expected names "
              + "joined by '>', e.g. 'region>store'");
        }
        if (chain.contains(name)) {
          throw new InvalidRequestException("hierarchy '" + text + "' names attribute '" + name + "' twice");
        }
        chain.add(name);
      }
      chains.add(List.copyOf(chain));
    }
    return new Hierarchy(crossProduct(chains), List.copyOf(chains), Source.DECLARED,
        Setting.HIERARCHY + " " + chainsText(chains));
  }

  /**
   * The cross product of the chains' prefixes, each including the empty prefix, ordered by attribute count; a set of
   * attributes named twice is kept once, in its first order.
   */
  private static List<List<String>> crossProduct(List<List<String>> chains) {
    List<List<List<String>>> prefixesByHierarchy = new ArrayList<>();
    for (List<String> chain : chains) {
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
    return List.copyOf(unique);
  }

  /** @param levels each a list of attribute names ({@code []} is the total), kept in the given order */
  public static Hierarchy ofLevels(List<List<String>> levels) {
    if (levels.isEmpty()) {
      throw new InvalidRequestException("need at least one level, got none; hint: [] is the total level");
    }
    List<List<String>> copy = new ArrayList<>();
    for (List<String> level : levels) {
      if (new HashSet<>(level).size() != level.size()) {
        throw new InvalidRequestException("level " + level + " names an attribute twice");
      }
      copy.add(List.copyOf(level));
    }
    return new Hierarchy(List.copyOf(copy), List.of(), Source.DECLARED,
        Setting.LEVELS + " " + String.join("; ", copy.stream().map(Level::nameOf).toList()));
  }

  /**
   * The default levels, from how the data nest: the cross product of the prefixes of the nesting's chains
   * ({@link AttributeNesting#chains()}), always with the total and the bottom level of single series.
   *
   * <p>Each level keeps only the attributes that tell its aggregates apart
   * ({@link AttributeNesting#distinguishing}), so no grouping is scored twice under two names. The bottom level is
   * {@link AttributeNesting#bottomAttributes()}.
   */
  public static Hierarchy detected(AttributeNesting nesting) {
    List<List<String>> levels = new ArrayList<>();
    Set<Set<String>> seen = new HashSet<>();
    for (List<String> level : crossProduct(nesting.chains())) {
      List<String> reduced = nesting.distinguishing(level);
      if (seen.add(new HashSet<>(reduced))) {
        levels.add(reduced);
      }
    }
    List<String> bottom = nesting.bottomAttributes();
    if (seen.add(new HashSet<>(bottom))) {
      levels.add(bottom);
    }
    levels.sort(Comparator.comparingInt(List::size));
    List<List<String>> chains = nesting.chains();
    return new Hierarchy(List.copyOf(levels), List.of(), Source.DETECTED,
        chains.isEmpty() ? "no attributes" : chainsText(chains));
  }

  /** Where the levels came from. */
  public Source source() {
    return source;
  }

  /**
   * What the levels were built from, for the report and {@code --json}: the detected chains
   * ({@code dept > grp > sku; shop}: each chain outermost first, chains apart by ';'), or the option as given
   * ({@code --hierarchy region > store}, {@code --level total; store}).
   */
  public String basis() {
    return basis;
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
    for (List<String> chain : declaredChains) {
      for (int k = 1; k < chain.size(); k++) {
        checkNested(chain, chain.get(k - 1), chain.get(k), attributes, seriesCount);
      }
    }
    List<Level> levels = new ArrayList<>();
    for (List<String> names : levelAttributeNames) {
      int[] indexes = new int[names.size()];
      for (int a = 0; a < indexes.length; a++) {
        indexes[a] = attributes.attributeIndex(names.get(a));
        if (indexes[a] < 0) {
          throw new InvalidRequestException("unknown attribute '" + names.get(a) + "' in level '"
              + Level.nameOf(names) + "'; allowed: " + attributes.attributeNames());
        }
      }
      levels.add(Level.build(names, indexes, attributes, seriesCount));
    }
    return List.copyOf(levels);
  }

  /** A declared chain's child must lie under one value of its parent in every series. */
  private static void checkNested(List<String> chain, String parent, String child, SeriesAttributes attributes,
      int seriesCount) {
    int p = attributes.attributeIndex(parent);
    int c = attributes.attributeIndex(child);
    if (p < 0 || c < 0) {
      return;
    }
    int[] parentCodeByChildCode = new int[attributes.cardinality(c)];
    java.util.Arrays.fill(parentCodeByChildCode, -1);
    for (int s = 0; s < seriesCount; s++) {
      int childCode = attributes.code(s, c);
      int parentCode = attributes.code(s, p);
      int seen = parentCodeByChildCode[childCode];
      if (seen < 0) {
        parentCodeByChildCode[childCode] = parentCode;
      } else if (seen != parentCode) {
        throw new InvalidRequestException("hierarchy '" + String.join(">", chain) + "': " + child + " '"
            + attributes.value(c, childCode) + "' lies under two " + parent + " values, '"
            + attributes.value(p, seen) + "' and '" + attributes.value(p, parentCode) + "'; expected each " + child
            + " under exactly one " + parent + " (drop the hierarchy to use the nesting found in the data)");
      }
    }
  }
}
