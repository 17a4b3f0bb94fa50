package org.lagmill.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermissions;

/** Writes a whole file through a temporary file beside it and a rename, so readers never see half a file. */
final class AtomicFiles {
  private AtomicFiles() {}

  static void writeString(Path file, String text) throws IOException {
    Path target = file.toAbsolutePath();
    Path dir = target.getParent();
    Files.createDirectories(dir);
    Path tmp = Files.createTempFile(dir, "." + target.getFileName(), ".tmp");
    try {
      Files.writeString(tmp, text, StandardCharsets.UTF_8);
      // a temporary file is private (rw-------); a report is meant to be shared like any file the user writes
      if (Files.getFileAttributeView(tmp, PosixFileAttributeView.class) != null) {
        Files.setPosixFilePermissions(tmp, PosixFilePermissions.fromString("rw-r--r--"));
      }
      try {
        Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
      }
    } finally {
      Files.deleteIfExists(tmp);
    }
  }
}
