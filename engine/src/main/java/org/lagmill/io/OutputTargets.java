package org.lagmill.io;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.Set;
import org.lagmill.io.PathNames;

/**
 * The one rule for output paths: lagmill replaces only what it wrote itself. A missing path or an empty folder may be
 * written; a path holding anything else is refused with {@link OutputRefusedException}, before anything is changed.
 */
public final class OutputTargets {
  private OutputTargets() {}

  /** Recognises an existing file or folder as one lagmill wrote (e.g. its manifest parses). */
  @FunctionalInterface
  public interface Recogniser {
    boolean isOurs(Path path) throws IOException;
  }

  /**
   * Checks a folder output (a store, a model, a report folder).
   *
   * @param what what lagmill writes there, for the message ("store", "model directory")
   * @param ignoredNames entries that do not make a folder non-empty (e.g. a store's lock file)
   * @return true when the folder holds one of ours, false when it is missing or empty
   * @throws OutputRefusedException when the path is a file, or a folder holding anything else
   */
  public static boolean checkFolder(Path dir, String what, Recogniser isOurs, Set<String> ignoredNames)
      throws IOException {
    if (!Files.exists(dir, LinkOption.NOFOLLOW_LINKS)) {
      return false;
    }
    if (!Files.isDirectory(dir)) {
      throw new OutputRefusedException(dir, OutputRefusedException.Reason.NOT_OURS, "it is a file, not a " + what
          + "; nothing was changed");
    }
    String example = null;
    try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir)) {
      for (Path entry : entries) {
        String name = PathNames.nameOf(entry);
        if (!ignoredNames.contains(name)) {
          example = name;
          break;
        }
      }
    }
    if (example == null) {
      return false;
    }
    if (isOurs.isOurs(dir)) {
      return true;
    }
    throw new OutputRefusedException(dir, OutputRefusedException.Reason.NOT_OURS, "the folder holds files that are "
        + "not a lagmill " + what + " (e.g. " + example + "); nothing was changed, choose a new or empty folder");
  }

  /**
   * Checks a single-file output (a forecast CSV, a report page).
   *
   * @return true when the file exists and is one of ours, false when it is missing
   * @throws OutputRefusedException when the path is a folder, or a file lagmill did not write
   */
  public static boolean checkFile(Path file, String what, Recogniser isOurs) throws IOException {
    if (!Files.exists(file, LinkOption.NOFOLLOW_LINKS)) {
      return false;
    }
    if (Files.isDirectory(file)) {
      throw new OutputRefusedException(file, OutputRefusedException.Reason.NOT_OURS, "it is a folder, not a "
          + what + "; nothing was changed");
    }
    if (isOurs.isOurs(file)) {
      return true;
    }
    throw new OutputRefusedException(file, OutputRefusedException.Reason.NOT_OURS, "the file exists and is not a "
        + what + " lagmill wrote; nothing was changed, choose another name or remove it yourself");
  }
}
