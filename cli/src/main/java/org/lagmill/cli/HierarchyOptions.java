package org.lagmill.cli;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.eval.Hierarchy;
import org.lagmill.store.SeriesAttributes;
import picocli.CommandLine.Option;

/** The {@code --hierarchy} option of the scoring commands, with a default read from the store's attributes. */
final class HierarchyOptions {
  @Option(names = "--hierarchy", paramLabel = "A>B>…", description = {"an attribute hierarchy, repeatable; the error",
      "levels are the cross product of their prefixes. Quote it for the shell, which reads > as a redirection:",
      "--hierarchy 'region>store' --hierarchy 'category>department>item' (default: those two when the store has",
      "those attributes, else total and single series)"})
  List<String> hierarchies;

  @Option(names = "--level", paramLabel = "A,B,…", description = {"an explicit aggregation level, repeatable, replacing",
      "the hierarchies' levels: attribute names joined by commas, or 'total' (e.g. --level total --level store",
      "--level store,item)"})
  List<String> levels;

  Hierarchy hierarchy(SeriesAttributes attributes) {
    if (levels != null && !levels.isEmpty()) {
      if (hierarchies != null && !hierarchies.isEmpty()) {
        throw new IllegalArgumentException("give either --hierarchy or --level, not both");
      }
      List<List<String>> explicit = new ArrayList<>();
      for (String level : levels) {
        explicit.add(level.equals("total") ? List.of() : List.of(level.split(",")));
      }
      return Hierarchy.ofLevels(explicit);
    }
    if (hierarchies != null && !hierarchies.isEmpty()) {
      return Hierarchy.parse(hierarchies);
    }
    List<String> defaults = new ArrayList<>();
    if (has(attributes, "region", "store")) {
      defaults.add("region>store");
    } else if (has(attributes, "store")) {
      defaults.add("store");
    }
    if (has(attributes, "category", "department", "item")) {
      defaults.add("category>department>item");
    } else if (has(attributes, "item")) {
      defaults.add("item");
    }
    if (defaults.isEmpty() || !coversSeries(attributes, defaults)) {
      return Hierarchy.ofLevels(List.of(List.of(), List.of(attributes.attributeName(0))));
    }
    return Hierarchy.parse(defaults);
  }

  private static boolean has(SeriesAttributes attributes, String... names) {
    for (String name : names) {
      if (attributes.attributeIndex(name) < 0) {
        return false;
      }
    }
    return true;
  }

  /** The default levels end in single series only when store and item together name a series. */
  private static boolean coversSeries(SeriesAttributes attributes, List<String> hierarchies) {
    return String.join(">", hierarchies).contains("store") && String.join(">", hierarchies).contains("item");
  }
}
