package org.lagmill.report;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Surefire points java.io.tmpdir at a per-fork folder under target/ but does not create it; JUnit's {@code @TempDir}
 * then fails. Tests that need temporary files call {@link #ensureJavaTmpdir()} from {@code @BeforeAll}.
 */
final class TempDirs {
  private TempDirs() {}

  static void ensureJavaTmpdir() {
    try {
      Files.createDirectories(Path.of(System.getProperty("java.io.tmpdir")));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
