package org.lagmill.store;

import java.io.IOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.security.SecureRandom;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import org.lagmill.io.AtomicFiles;

/**
 * Builds stores beside their target and swaps them in by rename, so a reader never sees a half-written store and a
 * failed build leaves the previous store as it was.
 */
public final class StoreDirectories {
  private static final SecureRandom RANDOM = new SecureRandom();
  private static final String TEMP_MARK = AtomicFiles.TEMP_MARK;
  private static final String BACKUP_MARK = ".old-";

  private StoreDirectories() {}

  /** Creates an empty sibling {@code .<name>.tmp-<random>} of {@code targetDir} to build a store in. */
  public static Path createTempSibling(Path targetDir) throws IOException {
    Path absolute = targetDir.toAbsolutePath().normalize();
    Path parent = absolute.getParent();
    Files.createDirectories(parent);
    return Files.createDirectory(parent.resolve("." + absolute.getFileName() + TEMP_MARK + ownerSuffix()));
  }

  /**
   * Moves a finished store from {@code tempDir} to {@code targetDir}: an existing target is first renamed to a sibling
   * backup, then the temp directory is renamed into place, then the backup is deleted. On any failure the temp
   * directory is deleted and the existing store is restored.
   */
  public static void publish(Path tempDir, Path targetDir) throws IOException {
    Path target = targetDir.toAbsolutePath().normalize();
    Path backup = null;
    try {
      if (Files.exists(target)) {
        backup = target.resolveSibling("." + target.getFileName() + BACKUP_MARK + ownerSuffix());
        move(target, backup);
      }
      move(tempDir, target);
    } catch (IOException | RuntimeException e) {
      try {
        deleteRecursively(tempDir);
        if (backup != null && Files.exists(backup) && !Files.exists(target)) {
          move(backup, target);
        }
      } catch (IOException suppressed) {
        e.addSuppressed(suppressed);
      }
      throw e;
    }
    if (backup != null) {
      deleteRecursively(backup);
    }
  }

  private static void move(Path from, Path to) throws IOException {
    try {
      Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(from, to);
    }
  }

  /**
   * Deletes an unpublished temp directory after {@code failure}; a failure to delete it is added to {@code failure} as
   * suppressed, so the first cause is the one that reaches the caller.
   */
  public static void deleteAfterFailure(Path tempDir, Throwable failure) {
    try {
      deleteRecursively(tempDir);
    } catch (IOException suppressed) {
      failure.addSuppressed(suppressed);
    }
  }

  /** Deletes a directory tree; a missing path is not an error. */
  public static void deleteRecursively(Path dir) throws IOException {
    if (!Files.exists(dir)) {
      return;
    }
    Files.walkFileTree(dir, new SimpleFileVisitor<>() {
      @Override
      public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
        Files.delete(file);
        return FileVisitResult.CONTINUE;
      }

      @Override
      public FileVisitResult postVisitDirectory(Path d, IOException e) throws IOException {
        if (e != null) {
          throw e;
        }
        Files.delete(d);
        return FileVisitResult.CONTINUE;
      }
    });
  }

  /**
   * Repairs what a process that died during {@link #publish} left beside {@code targetDir}: when the target is
   * missing, its backup is renamed back; temporary folders and backups of dead processes are deleted. Each is told to
   * {@link StoreNotices}. Only names this class makes ({@code .<name>.tmp-<pid>-<hex>}, {@code .<name>.old-…}) are
   * touched, and only when their process is gone (names without a process id come from older versions: gone too).
   */
  public static void recoverSiblings(Path targetDir) throws IOException {
    Path target = targetDir.toAbsolutePath().normalize();
    Path parent = target.getParent();
    if (parent == null || !Files.isDirectory(parent)) {
      return;
    }
    String prefix = "." + target.getFileName();
    List<Path> temps = new ArrayList<>();
    List<Path> backups = new ArrayList<>();
    try (DirectoryStream<Path> entries = Files.newDirectoryStream(parent, prefix + ".*")) {
      for (Path entry : entries) {
        String name = entry.getFileName().toString();
        if (name.startsWith(prefix + TEMP_MARK) && ownerGone(name.substring((prefix + TEMP_MARK).length()))) {
          temps.add(entry);
        } else if (name.startsWith(prefix + BACKUP_MARK)
            && ownerGone(name.substring((prefix + BACKUP_MARK).length()))) {
          backups.add(entry);
        }
      }
    }
    backups.sort(null);
    if (!Files.exists(target) && !backups.isEmpty()) {
      Path restored = backups.remove(backups.size() - 1);
      move(restored, target);
      StoreNotices.tell(target + ": restored from " + restored.getFileName() + ", left by a run that stopped "
          + "between its two renames");
    }
    for (Path leftover : temps) {
      deleteRecursively(leftover);
      StoreNotices.tell(target + ": removed " + leftover.getFileName() + ", left unfinished by a run that stopped");
    }
    for (Path leftover : backups) {
      deleteRecursively(leftover);
      StoreNotices.tell(target + ": removed " + leftover.getFileName() + ", an old copy left by a run that stopped");
    }
  }

  private static boolean ownerGone(String suffix) {
    int dash = suffix.indexOf('-');
    if (dash <= 0) {
      return true;
    }
    try {
      long pid = Long.parseLong(suffix.substring(0, dash));
      return ProcessHandle.of(pid).map(p -> !p.isAlive()).orElse(true);
    } catch (NumberFormatException e) {
      return true;
    }
  }

  private static String ownerSuffix() {
    return ProcessHandle.current().pid() + "-" + randomSuffix();
  }

  private static String randomSuffix() {
    byte[] bytes = new byte[6];
    RANDOM.nextBytes(bytes);
    return HexFormat.of().formatHex(bytes);
  }
}
