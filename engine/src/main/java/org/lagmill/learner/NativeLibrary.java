package org.lagmill.learner;

import io.github.metarank.lightgbm4j.LGBMBooster;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Loads LightGBM's native libraries once per process.
 *
 * <p>Pitfall: lightgbm4j extracts its {@code .so} files at every load to a fixed file name in
 * {@code ${java.io.tmpdir}}. A second JVM starting with the same tmpdir overwrites the file under a running one, which
 * then dies with SIGBUS. Give every process its own {@code -Djava.io.tmpdir} (the launcher and the test forks do), or
 * point {@code LIGHTGBM_NATIVE_LIB_PATH} at a folder holding already extracted libraries. The tmpdir folder is
 * created when missing.
 *
 * <p>Thread-safe and idempotent.
 */
public final class NativeLibrary {
  private static volatile boolean loaded;

  private NativeLibrary() {
  }

  /**
   * Loads the native libraries if this process has not done so yet.
   *
   * @throws UncheckedIOException when the libraries cannot be extracted to {@code java.io.tmpdir}
   */
  public static void load() {
    if (loaded) {
      return;
    }
    synchronized (NativeLibrary.class) {
      if (loaded) {
        return;
      }
      try {
        // a per-process tmpdir given on the command line may not exist yet; lightgbm4j does not create it
        Files.createDirectories(Path.of(System.getProperty("java.io.tmpdir")));
        LGBMBooster.loadNative();
      } catch (IOException e) {
        throw new UncheckedIOException("cannot extract LightGBM's native libraries to java.io.tmpdir="
            + System.getProperty("java.io.tmpdir") + "; check that folder is writable", e);
      }
      loaded = true;
    }
  }
}
