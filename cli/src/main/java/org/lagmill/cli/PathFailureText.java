package org.lagmill.cli;

import java.nio.file.AccessDeniedException;
import java.nio.file.DirectoryNotEmptyException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import org.lagmill.io.AtomicFiles;

/**
 * The words for a file-system failure the JDK reports with a path and no reason (a denied permission, a file where a
 * folder must be created): the path and the reason, and for a temporary file lagmill was creating beside an output,
 * the folder it could not write in rather than the temporary name the user never chose.
 */
final class PathFailureText {
  private PathFailureText() {}

  /** "path: reason" for a failure whose reason the JDK left empty; {@code f.getMessage()} otherwise. */
  static String of(FileSystemException f) {
    if (f.getReason() != null || f.getFile() == null) {
      return f.getMessage();
    }
    Path path = Path.of(f.getFile());
    if (f instanceof AccessDeniedException) {
      Path parent = path.toAbsolutePath().getParent();
      if (AtomicFiles.isTemporaryName(path) && parent != null) {
        return parent + ": cannot write in this folder: permission denied";
      }
      return path + ": permission denied";
    }
    if (f instanceof FileAlreadyExistsException) {
      // creating the folders on the way to an output finds a file where one of them belongs
      return path + (Files.isRegularFile(path) ? ": is a file where a folder is needed" : ": already exists");
    }
    if (f instanceof NotDirectoryException) {
      return path + ": is not a folder";
    }
    if (f instanceof DirectoryNotEmptyException) {
      return path + ": the folder is not empty";
    }
    return path + ": " + f.getClass().getSimpleName();
  }
}
