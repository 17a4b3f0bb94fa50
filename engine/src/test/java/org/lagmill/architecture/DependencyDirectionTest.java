package org.lagmill.architecture;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Keeps the package layout honest: dependencies run one way along the data flow, and foreign libraries stay behind
 * the package that owns them (agrona in memory/store, LightGBM in learner).
 */
class DependencyDirectionTest {
  private static final Path SOURCES = Path.of("src/main/java/org/lagmill");

  /** For each package, the lagmill packages it must not import. */
  private static final Map<String, Set<String>> FORBIDDEN = Map.of(
      "io", Set.of("memory", "store", "ingest", "features", "learner", "eval", "forecast", "report", "scenario"),
      "memory", Set.of("store", "ingest", "features", "learner", "eval", "forecast", "report", "scenario"),
      "store", Set.of("ingest", "features", "learner", "eval", "forecast", "report", "scenario"),
      "ingest", Set.of("features", "learner", "eval", "forecast", "report"),
      "features", Set.of("ingest", "learner", "eval", "forecast", "report"),
      "learner", Set.of("ingest", "eval", "forecast", "report"),
      "eval", Set.of("ingest", "report"),
      "scenario", Set.of("store", "ingest", "features", "learner", "eval", "forecast", "report"));

  /** Foreign packages and the only lagmill packages allowed to import them. */
  private static final Map<String, Set<String>> FOREIGN_OWNERS = Map.of(
      "org.agrona", Set.of("memory", "store"),
      "com.microsoft.ml.lightgbm", Set.of("learner"),
      "io.github.metarank.lightgbm4j", Set.of("learner"),
      "net.openhft", Set.of("store"));

  @Test
  void shouldImportOnlyAlongTheDataFlow() throws IOException {
    List<String> violations = new ArrayList<>();
    try (Stream<Path> files = Files.walk(SOURCES)) {
      for (Path file : files.filter(p -> p.toString().endsWith(".java")).toList()) {
        String pkg = SOURCES.relativize(file).getName(0).toString();
        for (String line : Files.readAllLines(file)) {
          if (!line.startsWith("import ")) {
            continue;
          }
          for (String banned : FORBIDDEN.getOrDefault(pkg, Set.of())) {
            if (line.contains("org.lagmill." + banned + ".")) {
              violations.add(file + ": " + line);
            }
          }
          for (Map.Entry<String, Set<String>> foreign : FOREIGN_OWNERS.entrySet()) {
            if (line.contains(foreign.getKey() + ".") && !foreign.getValue().contains(pkg)) {
              violations.add(file + ": " + line);
            }
          }
        }
      }
    }
    assertEquals(List.of(), violations);
  }
}
