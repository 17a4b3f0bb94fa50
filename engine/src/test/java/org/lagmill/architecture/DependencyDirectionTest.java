package org.lagmill.architecture;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Keeps the package layout honest: dependencies run one way along the data flow
 * ({@code memory <- store <- ingest}, {@code store <- features <- learner <- training <- forecast <- eval <- report},
 * {@code run} on top of the engine), and foreign libraries stay behind the package that owns them (agrona in
 * memory/store, chronicle-map in store, LightGBM in learner). Both import lines and fully-qualified references in code
 * count; comments and string literals do not.
 */
class DependencyDirectionTest {
  private static final Path SOURCES = Path.of("src/main/java/org/lagmill");

  /** For each package, the lagmill packages it may use. A package without an entry fails the test. */
  private static final Map<String, Set<String>> ALLOWED = Map.ofEntries(
      Map.entry("io", Set.of()),
      Map.entry("memory", Set.of("io")),
      Map.entry("progress", Set.of()),
      Map.entry("scenario", Set.of("io")),
      Map.entry("store", Set.of("io", "memory")),
      Map.entry("ingest", Set.of("io", "memory", "store")),
      Map.entry("features", Set.of("io", "memory", "store")),
      Map.entry("learner", Set.of("io", "memory", "store", "features")),
      Map.entry("training", Set.of("io", "memory", "store", "features", "learner", "progress")),
      // The forecast file reader shares the CSV source and the input-format error of ingest.
      Map.entry("forecast", Set.of("io", "memory", "store", "ingest", "features", "learner", "training", "progress")),
      Map.entry("eval", Set.of("io", "memory", "store", "features", "learner", "training", "forecast", "progress")),
      Map.entry("report", Set.of("io", "memory", "store", "features", "learner", "training", "forecast", "eval",
          "progress")),
      Map.entry("run", Set.of("io", "memory", "store", "ingest", "features", "learner", "training", "forecast", "eval",
          "report", "scenario", "progress")));

  /** Foreign packages and the only lagmill packages allowed to use them. */
  private static final Map<String, Set<String>> FOREIGN_OWNERS = Map.of(
      "org.agrona", Set.of("memory", "store"),
      "com.microsoft.ml.lightgbm", Set.of("learner"),
      "io.github.metarank.lightgbm4j", Set.of("learner"),
      "net.openhft", Set.of("store"));

  private static final Pattern LAGMILL_REFERENCE = Pattern.compile("\\borg\\.lagmill\\.([a-z]+)\\.");

  @Test
  void shouldHaveARuleForEveryPackage() throws IOException {
    Set<String> packages = new TreeSet<>();
    try (Stream<Path> dirs = Files.list(SOURCES)) {
      dirs.filter(Files::isDirectory).forEach(dir -> packages.add(dir.getFileName().toString()));
    }
    packages.removeAll(ALLOWED.keySet());
    assertEquals(Set.of(), packages, "packages without a rule in DependencyDirectionTest.ALLOWED");
  }

  @Test
  void shouldReferenceOnlyAlongTheDataFlow() throws IOException {
    List<String> violations = new ArrayList<>();
    try (Stream<Path> files = Files.walk(SOURCES)) {
      for (Path file : files.filter(p -> p.toString().endsWith(".java")).sorted().toList()) {
        String pkg = SOURCES.relativize(file).getName(0).toString();
        violations.addAll(violations(pkg, file.toString(), Files.readString(file)));
      }
    }
    assertEquals(List.of(), violations);
  }

  @ParameterizedTest(name = "{0}: {1}")
  @CsvSource(delimiter = '|', textBlock = """
      store    | import org.lagmill.ingest.CsvSource;                            | 1
      store    | var x = new org.lagmill.report.ReportData();                    | 1
      learner  | org.lagmill.training.ModelSet models = null;                    | 1
      ingest   | private org.agrona.DirectBuffer buffer;                         | 1
      report   | import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;               | 1
      store    | // see org.lagmill.ingest.CsvSource for the reader              | 0
      store    | /** {@link org.lagmill.ingest.CsvSource} */ int x;              | 0
      store    | String s = "org.lagmill.ingest.CsvSource";                      | 0
      forecast | import org.lagmill.training.ModelSet;                           | 0
      training | import org.lagmill.forecast.Forecaster;                         | 1
      """)
  void shouldFindForbiddenReferencesInCodeOnly(String pkg, String code, int expectedViolations) {
    assertEquals(expectedViolations, violations(pkg, "Example.java", code).size(), code);
  }

  private static List<String> violations(String pkg, String fileName, String source) {
    List<String> violations = new ArrayList<>();
    String code = withoutCommentsAndStrings(source);
    Set<String> allowed = ALLOWED.getOrDefault(pkg, Set.of());
    Matcher matcher = LAGMILL_REFERENCE.matcher(code);
    while (matcher.find()) {
      String target = matcher.group(1);
      if (!target.equals(pkg) && !allowed.contains(target)) {
        violations.add(fileName + ": " + pkg + " uses org.lagmill." + target);
      }
    }
    for (Map.Entry<String, Set<String>> foreign : FOREIGN_OWNERS.entrySet()) {
      if (code.contains(foreign.getKey() + ".") && !foreign.getValue().contains(pkg)) {
        violations.add(fileName + ": " + pkg + " uses " + foreign.getKey());
      }
    }
    return violations;
  }

  /** The source with comments, string and character literals blanked out (text blocks count as strings). */
  static String withoutCommentsAndStrings(String source) {
    StringBuilder out = new StringBuilder(source.length());
    int i = 0;
    while (i < source.length()) {
      char c = source.charAt(i);
      if (source.startsWith("//", i)) {
        int end = source.indexOf('\n', i);
        i = end < 0 ? source.length() : end;
      } else if (source.startsWith("/*", i)) {
        int end = source.indexOf("*/", i + 2);
        i = end < 0 ? source.length() : end + 2;
        out.append(' ');
      } else if (source.startsWith("\"\"\"", i)) {
        int end = source.indexOf("\"\"\"", i + 3);
        i = end < 0 ? source.length() : end + 3;
        out.append("\"\"");
      } else if (c == '"' || c == '\'') {
        int j = i + 1;
        while (j < source.length() && source.charAt(j) != c && source.charAt(j) != '\n') {
          j += source.charAt(j) == '\\' ? 2 : 1;
        }
        i = j + 1;
        out.append(c).append(c);
      } else {
        out.append(c);
        i++;
      }
    }
    return out.toString();
  }
}
