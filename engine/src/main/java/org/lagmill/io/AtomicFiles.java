package org.lagmill.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.security.SecureRandom;
import java.util.HexFormat;
import org.lagmill.io.PathNames;

/**
 * The one way lagmill writes a whole file: into {@code .<name>.tmp-<pid>-<hex>} beside it, flushed to disk, then
 * renamed over the target, so a reader sees the old file or the new one and a failed write leaves the old one as it
 * was. The temporary file is created with the default permissions of any file the user writes (not owner-only).
 */
public final class AtomicFiles {
  /** What marks a temporary sibling's name, after {@code .<name>}. */
  public static final String TEMP_MARK = ".tmp-";
  private static final SecureRandom RANDOM = new SecureRandom();

  private AtomicFiles() {}

  /** Writes the content produced by {@code body}. */
  @FunctionalInterface
  public interface Body {
    void writeTo(OutputStream out) throws IOException;
  }

  /** Writes bytes to {@code file} atomically; creates missing parent folders. */
  public static void write(Path file, byte[] bytes) throws IOException {
    write(file, out -> out.write(bytes));
  }

  /** Writes UTF-8 text to {@code file} atomically. */
  public static void writeString(Path file, String text) throws IOException {
    write(file, text.getBytes(StandardCharsets.UTF_8));
  }

  /** Writes what {@code body} produces to {@code file} atomically; {@code body} must not close the stream. */
  public static void write(Path file, Body body) throws IOException {
    try (Pending pending = begin(file)) {
      try (OutputStream out = Files.newOutputStream(pending.tempFile(), StandardOpenOption.CREATE_NEW,
          StandardOpenOption.WRITE)) {
        body.writeTo(out);
      }
      pending.commit();
    }
  }

  /**
   * Starts an atomic write whose bytes someone else puts into {@link Pending#tempFile()} (a native library, or
   * several files that should all appear only once all are written).
   */
  public static Pending begin(Path file) throws IOException {
    Path target = file.toAbsolutePath().normalize();
    Files.createDirectories(PathNames.parentOf(target));
    return new Pending(target, tempSibling(target));
  }

  /**
   * One file being written under a temporary name: {@link #commit()} flushes it and renames it over the target;
   * closing without a commit deletes it.
   */
  public static final class Pending implements AutoCloseable {
    private final Path target;
    private final Path tempFile;
    private boolean done;

    private Pending(Path target, Path tempFile) {
      this.target = target;
      this.tempFile = tempFile;
    }

    /** Where to write the bytes. */
    public Path tempFile() {
      return tempFile;
    }

    /** Flushes the temporary file and renames it over the target. */
    public void commit() throws IOException {
      moveIntoPlace(tempFile, target);
      done = true;
    }

    /** Deletes the temporary file unless committed; idempotent. */
    @Override
    public void close() throws IOException {
      if (!done) {
        done = true;
        Files.deleteIfExists(tempFile);
      }
    }
  }

  /**
   * Flushes a finished temporary file to disk and renames it over {@code target} (atomically where the file system
   * can). For writers that finish several files before any may appear.
   */
  public static void moveIntoPlace(Path tempFile, Path target) throws IOException {
    try (FileChannel channel = FileChannel.open(tempFile, StandardOpenOption.WRITE)) {
      channel.force(true);
    }
    try {
      Files.move(tempFile, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(tempFile, target, StandardCopyOption.REPLACE_EXISTING);
    }
  }

  /** A fresh temporary name beside {@code target}: {@code .<name>.tmp-<pid>-<6 hex digits>}. */
  public static Path tempSibling(Path target) {
    byte[] bytes = new byte[3];
    RANDOM.nextBytes(bytes);
    return target.resolveSibling("." + target.getFileName() + TEMP_MARK + ProcessHandle.current().pid() + "-"
        + HexFormat.of().formatHex(bytes));
  }

  /**
   * Whether a path has the form of a temporary sibling, {@code .<name>.tmp-…}: a file made here or a store or model
   * folder being built, which a user never named.
   */
  public static boolean isTemporaryName(Path path) {
    Path name = path.getFileName();
    return name != null && name.toString().startsWith(".") && name.toString().contains(TEMP_MARK);
  }
}
