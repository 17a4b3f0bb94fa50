package org.lagmill.io;

import java.nio.file.Path;

/**
 * A path's last name and parent, for paths that always have both (files inside a directory). {@link Path#getFileName()}
 * and {@link Path#getParent()} return null for a root or an empty path; here that is a clear error instead of a
 * null pointer further on.
 */
public final class PathNames {
  private PathNames() {}

  /** The last name element of {@code path} as text, e.g. {@code units.bin}. */
  public static String nameOf(Path path) {
    Path name = path.getFileName();
    if (name == null) {
      throw new IllegalArgumentException("the path " + path + " has no file name (a root or empty path)");
    }
    return name.toString();
  }

  /** The parent of an absolute, normalised {@code path}. */
  public static Path parentOf(Path path) {
    Path parent = path.getParent();
    if (parent == null) {
      throw new IllegalArgumentException("the path " + path + " has no parent folder (a root path)");
    }
    return parent;
  }
}
