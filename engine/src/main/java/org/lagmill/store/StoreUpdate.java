package org.lagmill.store;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import org.lagmill.io.OutputRefusedException;
import org.lagmill.io.OutputTargets;
import org.lagmill.io.PathNames;

/**
 * One change of a store directory, from taking its lock to committing a new generation: every writer (ingest,
 * replace, append, and any later one) goes through it, so none needs to know the commit protocol.
 *
 * <pre>
 * try (StoreUpdate update = StoreUpdate.begin(dir, new StoreUpdate.Policy(Mode.CHANGE, true))) {
 *   write a whole store into update.buildingDir();
 *   update.commit();
 * }
 * </pre>
 *
 * <p>Closing without a commit deletes the building directory (and a store directory this update created, when it
 * holds nothing else), then releases the lock, so a failed writer leaves the store byte-identical.
 */
public final class StoreUpdate implements AutoCloseable {
  /** What the caller means to do with the path. */
  public enum Mode {
    /** A new store: the path must be missing or an empty folder. */
    CREATE,
    /** A new store or a replacement of an existing one, which must verify as a lagmill store first. */
    REPLACE,
    /** A change of an existing store (append): the path must hold one. */
    CHANGE
  }

  /**
   * How a writer treats the path and the lock.
   *
   * @param mode what the path may hold
   * @param waitForLock wait for another writer to finish; false fails at once with {@link StoreBusyException}
   */
  public record Policy(Mode mode, boolean waitForLock) {
    /** Create or replace a verified store, waiting for the lock: the engine's default for ingest. */
    public static final Policy REPLACE_WAITING = new Policy(Mode.REPLACE, true);
    /** Change an existing store, waiting for the lock: the engine's default for append. */
    public static final Policy CHANGE_WAITING = new Policy(Mode.CHANGE, true);
  }

  private static final Set<String> IGNORED = Set.of(StoreLock.FILE_NAME);

  private final StoreLock lock;
  private final boolean createdDir;
  private final Path building;
  private boolean committed;

  private StoreUpdate(StoreLock lock, boolean createdDir, Path building) {
    this.lock = lock;
    this.createdDir = createdDir;
    this.building = building;
  }

  /**
   * Checks the path for {@code mode}, takes the store's lock (waiting for another writer when {@code wait}), tidies
   * up after a writer that died, checks again under the lock, and creates the building directory.
   *
   * <p>Waiting for the lock and anything recovered are told to {@link StoreNotices}.
   *
   * @throws OutputRefusedException when the path holds something else than {@code mode} allows; nothing is changed
   * @throws StoreBusyException when another writer holds the lock and {@code wait} is false
   */
  public static StoreUpdate begin(Path storeDir, Policy policy) throws IOException {
    Mode mode = policy.mode();
    Path dir = storeDir.toAbsolutePath().normalize();
    check(dir, mode);
    boolean createdDir = !Files.exists(dir);
    StoreLock lock = StoreLock.acquire(dir, policy.waitForLock(), StoreNotices::tell);
    try {
      for (String note : StoreGenerations.recover(lock)) {
        StoreNotices.tell("store " + dir + ": " + note);
      }
      check(dir, mode);
      return new StoreUpdate(lock, createdDir, StoreGenerations.beginBuilding(lock));
    } catch (IOException | RuntimeException | Error e) {
      release(lock, createdDir, e);
      throw e;
    }
  }

  private static void check(Path dir, Mode mode) throws IOException {
    boolean holdsStore = OutputTargets.checkFolder(dir, "store", StoreGenerations::looksLikeStore, IGNORED);
    switch (mode) {
      case CREATE -> {
        if (holdsStore) {
          throw new OutputRefusedException(dir, OutputRefusedException.Reason.EXISTS, "it already holds a store; "
              + "nothing was changed (replacing it must be asked for)");
        }
      }
      case REPLACE -> {
        if (holdsStore) {
          try {
            SalesStore.verifyFiles(dir);
          } catch (CorruptStoreException | IOException e) {
            throw new OutputRefusedException(dir, OutputRefusedException.Reason.NOT_OURS, "it does not verify as "
                + "a lagmill store, so it is not replaced (" + e.getMessage() + ")");
          }
        }
      }
      case CHANGE -> {
        if (!holdsStore) {
          throw new NoSuchFileException(dir.toString(), null, Files.exists(dir) ? "not a store: empty folder"
              : "no such store");
        }
      }
      default -> throw new AssertionError(mode);
    }
  }

  /** The directory to write the new generation's files into (empty at first). */
  public Path buildingDir() {
    return building;
  }

  /** The store directory (absolute). */
  public Path storeDir() {
    return lock.storeDir();
  }

  /** Makes the building directory the store's current generation; at most once. */
  public Path commit() throws IOException {
    if (committed) {
      throw new IllegalStateException("store update of " + storeDir() + " was already committed");
    }
    Path generation = StoreGenerations.commit(lock, building);
    committed = true;
    return generation;
  }

  /** Deletes an uncommitted building directory, then releases the lock; idempotent. */
  @Override
  public void close() throws IOException {
    if (committed) {
      lock.close();
      return;
    }
    IOException failure = new IOException("cleaning up an uncommitted store update failed");
    try {
      StoreDirectories.deleteRecursively(building);
    } catch (IOException e) {
      failure.addSuppressed(e);
    }
    committed = true;
    release(lock, createdDir, failure);
    if (failure.getSuppressed().length > 0) {
      throw failure;
    }
  }

  /** Releases the lock, first removing a store directory this update created when it holds only the lock file. */
  private static void release(StoreLock lock, boolean createdDir, Throwable failure) {
    try {
      if (createdDir) {
        Path dir = lock.storeDir();
        try (var entries = Files.list(dir)) {
          List<Path> left = entries.toList();
          if (left.size() == 1 && PathNames.nameOf(left.get(0)).equals(StoreLock.FILE_NAME)) {
            Files.delete(left.get(0));
            Files.delete(dir);
          }
        }
      }
    } catch (IOException e) {
      failure.addSuppressed(e);
    } finally {
      try {
        lock.close();
      } catch (IOException e) {
        failure.addSuppressed(e);
      }
    }
  }
}
