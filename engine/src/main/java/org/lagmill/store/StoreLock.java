package org.lagmill.store;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.Semaphore;
import java.util.function.Consumer;
import org.lagmill.io.Setting;

/**
 * The one-writer-at-a-time lock of a store: an exclusive OS lock ({@link FileChannel#lock}) on the store's
 * {@value #FILE_NAME} file. The kernel releases it when the holding process dies, so a killed writer never leaves a
 * stale lock behind. Inside one JVM a semaphore per store path comes first, because the JVM refuses two overlapping
 * file locks of its own.
 *
 * <p>Whoever holds the lock may change the store directory (build, commit, recover); readers never take it to read
 * (they read an immutable generation, see {@link StoreGenerations}) and take it only with {@link #tryAcquire} to tidy
 * up after a dead writer. The holder's process id is written into the file so a waiting writer can name it.
 *
 * <p>The OS lock is a POSIX record lock on Linux, and closing any descriptor of the lock file in the holding process
 * releases it, whichever channel took it. So nothing in a process may open the lock file except through the one
 * channel kept here: the holder's id is read through the waiting process's own channel, and a second request inside
 * the holding process is answered from the semaphore without touching the file. {@code ConcurrentProcessesTest}
 * (cli) runs writers as separate processes to keep this true.
 */
public final class StoreLock implements AutoCloseable {
  /** Name of the lock file inside a store directory. */
  public static final String FILE_NAME = "lock";

  private static final ConcurrentHashMap<Path, Semaphore> IN_PROCESS = new ConcurrentHashMap<>();

  private final Path storeDir;
  private final Semaphore inProcess;
  private final FileChannel channel;
  private final FileLock lock;
  private boolean released;

  private StoreLock(Path storeDir, Semaphore inProcess, FileChannel channel, FileLock lock) {
    this.storeDir = storeDir;
    this.inProcess = inProcess;
    this.channel = channel;
    this.lock = lock;
  }

  /**
   * Takes the writer lock of {@code storeDir} (created when missing), waiting for another writer when {@code wait}.
   *
   * @param notices told once, in words for the user, when this call has to wait for another writer
   * @throws StoreBusyException when another writer holds the lock and {@code wait} is false
   */
  public static StoreLock acquire(Path storeDir, boolean wait, Consumer<String> notices) throws IOException {
    Path dir = storeDir.toAbsolutePath().normalize();
    Semaphore inProcess = IN_PROCESS.computeIfAbsent(dir, d -> new Semaphore(1));
    boolean noticed = false;
    if (!inProcess.tryAcquire()) {
      // This process holds the lock: the owner is known without opening the lock file, and opening it would be
      // fatal (closing any descriptor of a file drops every POSIX lock the process holds on it, see the class note).
      String self = String.valueOf(ProcessHandle.current().pid());
      if (!wait) {
        throw busy(dir, self);
      }
      notices.accept(waitingNotice(dir, self));
      noticed = true;
      inProcess.acquireUninterruptibly();
    }
    try {
      while (true) {
        Files.createDirectories(dir);
        FileChannel channel = openLockFile(dir);
        try {
          Object keyAtOpen = fileKey(dir);
          FileLock lock = channel.tryLock();
          if (lock == null) {
            String owner = ownerOf(channel);
            if (!wait) {
              throw busy(dir, owner);
            }
            if (!noticed) {
              notices.accept(waitingNotice(dir, owner));
              noticed = true;
            }
            lock = channel.lock();
          }
          if (keyAtOpen != null && keyAtOpen.equals(fileKey(dir))) {
            StoreLock held = new StoreLock(dir, inProcess, channel, lock);
            held.recordOwner();
            return held;
          }
          // The previous holder removed the directory it had created (a failed first ingest); lock the new one.
          lock.release();
          channel.close();
        } catch (IOException | RuntimeException | Error e) {
          channel.close();
          throw e;
        }
      }
    } catch (IOException | RuntimeException | Error e) {
      inProcess.release();
      throw e;
    }
  }

  /**
   * Takes the lock only when it is free at once; returns null otherwise, or when the lock file cannot be created
   * (a read-only store is still readable, it is only never tidied up).
   */
  public static StoreLock tryAcquire(Path storeDir) {
    try {
      return acquire(storeDir, false, text -> {});
    } catch (StoreBusyException e) {
      return null;
    } catch (IOException e) {
      return null;
    }
  }

  private static FileChannel openLockFile(Path dir) throws IOException {
    return FileChannel.open(dir.resolve(FILE_NAME), StandardOpenOption.CREATE, StandardOpenOption.READ,
        StandardOpenOption.WRITE);
  }

  /**
   * The identity (inode) of the lock file now at the path, or null when there is none. Compared before and after
   * locking: a lock won on a file that was removed meanwhile guards nothing.
   */
  private static Object fileKey(Path dir) throws IOException {
    try {
      Object key = Files.readAttributes(dir.resolve(FILE_NAME), BasicFileAttributes.class).fileKey();
      return key == null ? "no file keys on this file system" : key;
    } catch (NoSuchFileException e) {
      return null;
    }
  }

  private void recordOwner() throws IOException {
    byte[] pid = (ProcessHandle.current().pid() + "\n").getBytes(StandardCharsets.US_ASCII);
    channel.truncate(0);
    channel.write(ByteBuffer.wrap(pid), 0);
  }

  private static String waitingNotice(Path dir, String owner) {
    return "waiting for another writer to finish with store " + dir + (owner.isEmpty() ? "" : " (process " + owner
        + ")") + "; use " + Setting.NO_WAIT + " to fail at once instead";
  }

  private static StoreBusyException busy(Path dir, String owner) {
    return new StoreBusyException(dir, owner.isEmpty() ? "another writer" : "process " + owner);
  }

  /**
   * The process id the holder wrote, read through the channel this process already has open on the lock file (it
   * holds no lock, so nothing is lost when that channel closes); empty when unreadable.
   */
  private static String ownerOf(FileChannel channel) {
    try {
      ByteBuffer bytes = ByteBuffer.allocate(32);
      channel.read(bytes, 0);
      return new String(bytes.array(), 0, bytes.position(), StandardCharsets.US_ASCII).strip();
    } catch (IOException e) {
      return "";
    }
  }

  /** The store directory this lock guards (absolute). */
  public Path storeDir() {
    return storeDir;
  }

  /** Releases the lock; idempotent. The lock file stays, so every later writer locks the same file. */
  @Override
  public void close() throws IOException {
    if (released) {
      return;
    }
    released = true;
    try {
      if (lock.isValid()) {
        lock.release();
      }
      channel.close();
    } finally {
      inProcess.release();
    }
  }
}
