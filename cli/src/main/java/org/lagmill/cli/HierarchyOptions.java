package org.lagmill.cli;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.eval.Hierarchy;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.SalesHistory;
import picocli.CommandLine.Option;

/** The {@code --hierarchy} option of the scoring commands, with a default read from how the store's data nest. */
final class HierarchyOptions {
  @Option(names = "--hierarchy", paramLabel = "A>B>…", description = {"an attribute hierarchy, repeatable; the error",
      "levels are the cross product of their prefixes. Quote it for the shell, which reads > as a redirection:",
      "--hierarchy 'region>store' --hierarchy 'category>department>item' (default: the chains of attributes",
      "that nest in the store's data)"})
  List<String> hierarchies;

  @Option(names = "--level", paramLabel = "A,B,…",
      description = {"an explicit aggregation level, repeatable, replacing",
          "the hierarchies' levels: attribute names joined by commas, or 'total' (e.g. --level total --level store",
          "--level store,item)"})
  List<String> levels;

  /** The declared levels, or else the levels derived from how the history's attributes nest. */
  Hierarchy hierarchy(SalesHistory history) {
    if (levels != null && !levels.isEmpty()) {
      if (hierarchies != null && !hierarchies.isEmpty()) {
        throw new InvalidRequestException("give either --hierarchy or --level, not both");
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
    return Hierarchy.detected(history.nesting());
  }
}
