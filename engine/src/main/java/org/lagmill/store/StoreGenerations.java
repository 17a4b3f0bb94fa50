package org.lagmill.store;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.security.SecureRandom;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.function.Consumer;
import java.util.regex.Pattern;
import org.lagmill.io.PathNames;
import org.lagmill.io.Setting;

/**
 * The commit protocol of a store directory: immutable generations plus a pointer file swapped atomically.
 *
 * <pre>
 * store/
 *   lock                      the writers' lock file ({@link StoreLock})
 *   current                   one line: the name of the generation to read
 *   gen-0000000007-3fa9c1/    manifest.json and the binary files of one complete store, never changed once named
 *   .building-4711-a1b2c3/    a generation being written by a writer holding the lock
 * </pre>
 *
 * <p>A writer holds the lock, writes a whole store into a building directory, flushes it to disk, renames it to a
 * fresh generation name, writes a new pointer beside the old one and renames it over the old one (the commit point),
 * then deletes the generations the pointer no longer names. Every step is a single rename or delete, so a crash at
 * any instant leaves the pointer naming a complete generation: the old one before the pointer's rename, the new one
 * after it. What a crash leaves behind (building directories, a pointer's temporary file, unnamed generations) is
 * removed by {@link #recover} under the lock, which the next writer or reader runs.
 *
 * <p>Readers never lock: they read the pointer and open the generation it names. A generation's files never change,
 * so a reader cannot mix two generations; a generation deleted under a reader before it opened its files shows up as
 * a missing file, and the reader re-reads the pointer ({@link SalesStore#open}). Once opened, a store stays readable
 * after its generation is deleted, because its files are mapped (Linux keeps unlinked files alive while mapped).
 *
 * <p>A directory holding {@code manifest.json} and no pointer is a store of the previous layout (format version 1, or
 * a bare store written by {@link StoreWriter} directly); it is read in place, and the first commit into it moves it
 * to the generation layout.
 */
public final class StoreGenerations {
  /** Name of the pointer file. */
  public static final String POINTER_FILE_NAME = "current";
  static final String GENERATION_PREFIX = "gen-";
  static final String BUILDING_PREFIX = ".building-";
  static final String POINTER_TEMP_PREFIX = ".current.tmp-";
  private static final Pattern GENERATION_NAME = Pattern.compile("gen-(\\d{10})-[0-9a-f]{6}");
  private static final SecureRandom RANDOM = new SecureRandom();
  private static final ThreadLocal<Consumer<Step>> HOOK = new ThreadLocal<>();

  /** The file-system changes of a commit, in order; a test hook sees each just before it happens. */
  public enum Step {
    /** The finished building directory is renamed to its generation name. */
    RENAME_BUILDING,
    /** The new pointer is written to a temporary file beside the old one. */
    WRITE_POINTER,
    /** The new pointer replaces the old one: the commit point. */
    RENAME_POINTER,
    /** A generation the pointer no longer names is deleted. */
    DELETE_OLD_GENERATION,
    /** A file of a previous-layout store at the top of the directory is deleted. */
    DELETE_PREVIOUS_LAYOUT_FILE
  }

  private StoreGenerations() {}

  /**
   * Runs {@code action} on this thread with {@code hook} called before every step of every commit it makes; a hook
   * that throws stops the commit right there, as a crash at that instant would (tests of crash recovery).
   */
  public static void runWithCommitHook(Consumer<Step> hook, IoAction action) throws IOException {
    HOOK.set(hook);
    try {
      action.run();
    } finally {
      HOOK.remove();
    }
  }

  /** An action that may throw an I/O exception. */
  @FunctionalInterface
  public interface IoAction {
    void run() throws IOException;
  }

  /**
   * The directory holding the manifest and files to read: the generation the pointer names, or the store directory
   * itself for a previous-layout store.
   *
   * @throws NoSuchFileException when {@code storeDir} holds neither a pointer nor a manifest
   * @throws CorruptStoreException when the pointer is malformed
   */
  /**
   * A folder with a manifest but neither a pointer nor units is a model directory given where a store belongs; the
   * user hears that in those words instead of a manifest parse error. A model's manifest lists its files under
   * {@code modelFileChecksums} (the forecast package's model manifest, which this package cannot import).
   */
  private static void requireNotAModel(Path storeDir) throws IOException {
    if (Files.exists(storeDir.resolve("units.bin"))) {
      return;
    }
    String manifest = new String(Files.readAllBytes(storeDir.resolve(StoreManifest.FILE_NAME)),
        StandardCharsets.UTF_8);
    if (manifest.contains("\"modelFileChecksums\"")) {
      throw new FileSystemException(storeDir.toString(), null, "not a store: it holds a trained model; give the"
          + " folder ingest wrote (a model folder goes to " + Setting.MODEL + ")");
    }
  }

  public static Path readableDir(Path storeDir) throws IOException {
    Path pointer = storeDir.resolve(POINTER_FILE_NAME);
    String name;
    try {
      // Latin-1 decodes any byte, so a damaged pointer fails the name check below rather than the decoder.
      name = new String(Files.readAllBytes(pointer), StandardCharsets.ISO_8859_1);
    } catch (NoSuchFileException e) {
      if (Files.isRegularFile(storeDir.resolve(StoreManifest.FILE_NAME))) {
        requireNotAModel(storeDir);
        return storeDir;
      }
      if (!Files.exists(storeDir)) {
        throw new NoSuchFileException(storeDir.toString(), null, "no such store");
      }
      throw new NoSuchFileException(storeDir.toString(), null, "not a store: no " + POINTER_FILE_NAME + " or "
          + StoreManifest.FILE_NAME + " in it");
    }
    String stripped = name.endsWith("\n") ? name.substring(0, name.length() - 1) : name;
    if (!GENERATION_NAME.matcher(stripped).matches()) {
      throw new CorruptStoreException(pointer, "malformed pointer: expected one line naming a generation "
          + "(gen-<10 digits>-<6 hex digits>), actual \"" + excerpt(name) + "\"");
    }
    return storeDir.resolve(stripped);
  }

  /** True when {@code storeDir} holds a pointer or a previous-layout manifest (not whether it verifies). */
  public static boolean looksLikeStore(Path storeDir) {
    return Files.isRegularFile(storeDir.resolve(POINTER_FILE_NAME), LinkOption.NOFOLLOW_LINKS)
        || Files.isRegularFile(storeDir.resolve(StoreManifest.FILE_NAME), LinkOption.NOFOLLOW_LINKS);
  }

  /** Creates an empty building directory for a new generation; the caller holds the lock. */
  public static Path beginBuilding(StoreLock lock) throws IOException {
    return Files.createDirectory(lock.storeDir().resolve(BUILDING_PREFIX + ProcessHandle.current().pid() + "-"
        + randomHex()));
  }

  /**
   * Makes a finished building directory the store's current generation and deletes what it replaces (see the class
   * comment for the steps). Returns the new generation's directory.
   */
  public static Path commit(StoreLock lock, Path building) throws IOException {
    Path storeDir = lock.storeDir();
    Path previous = currentGeneration(storeDir);
    StoreManifest previousLayout = previous == null && Files.isRegularFile(storeDir.resolve(StoreManifest.FILE_NAME))
        ? readPreviousLayoutManifest(storeDir) : null;
    long sequence = previous == null ? 1 : sequenceOf(previous) + 1;
    String name = String.format("%s%010d-%s", GENERATION_PREFIX, sequence, randomHex());
    Path generation = storeDir.resolve(name);

    syncTree(building);
    step(Step.RENAME_BUILDING);
    move(building, generation);
    step(Step.WRITE_POINTER);
    Path pointerTemp = storeDir.resolve(POINTER_TEMP_PREFIX + ProcessHandle.current().pid() + "-" + randomHex());
    try (FileChannel out = FileChannel.open(pointerTemp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
      out.write(java.nio.ByteBuffer.wrap((name + "\n").getBytes(StandardCharsets.UTF_8)));
      out.force(true);
    }
    step(Step.RENAME_POINTER);
    move(pointerTemp, storeDir.resolve(POINTER_FILE_NAME));
    syncDirectory(storeDir);
    try {
      deleteUnnamed(storeDir, name, previousLayout, new ArrayList<>());
    } catch (IOException e) {
      // Committed already: what is left is removed by the next command's recovery.
      StoreNotices.tell("store " + storeDir + ": committed " + name + " but could not remove what it replaces ("
          + e.getMessage() + "); the next command removes it");
    }
    return generation;
  }

  /**
   * Removes what crashed or failed writers left behind: building directories, pointer temporaries, generations the
   * pointer does not name, and previous-layout files once a pointer exists. Holding the lock proves their writers
   * are gone, since every one of these is created under it.
   *
   * @return one line per thing removed, for the user (empty when there was nothing to do)
   */
  public static List<String> recover(StoreLock lock) throws IOException {
    Path storeDir = lock.storeDir();
    List<String> notes = new ArrayList<>();
    Path current = currentGeneration(storeDir);
    if (current == null) {
      deleteLeftovers(storeDir, notes, null);
      return notes;
    }
    if (!Files.isDirectory(current)) {
      throw new CorruptStoreException(storeDir.resolve(POINTER_FILE_NAME), "names generation "
          + current.getFileName() + ", which does not exist");
    }
    StoreManifest previousLayout = Files.isRegularFile(storeDir.resolve(StoreManifest.FILE_NAME))
        ? readPreviousLayoutManifest(storeDir) : null;
    deleteUnnamed(storeDir, PathNames.nameOf(current), previousLayout, notes);
    return notes;
  }

  /** The generation the pointer names, or null when there is no pointer. */
  private static Path currentGeneration(Path storeDir) throws IOException {
    if (!Files.exists(storeDir.resolve(POINTER_FILE_NAME))) {
      return null;
    }
    return readableDir(storeDir);
  }

  private static long sequenceOf(Path generation) {
    var m = GENERATION_NAME.matcher(PathNames.nameOf(generation));
    if (!m.matches()) {
      throw new AssertionError(generation);
    }
    return Long.parseLong(m.group(1));
  }

  private static StoreManifest readPreviousLayoutManifest(Path storeDir) {
    try {
      return StoreManifest.read(storeDir);
    } catch (IOException | RuntimeException e) {
      return null;
    }
  }

  private static void deleteUnnamed(Path storeDir, String currentName, StoreManifest previousLayout,
      List<String> notes) throws IOException {
    deleteLeftovers(storeDir, notes, currentName);
    if (previousLayout != null) {
      List<String> names = new ArrayList<>();
      for (StoreManifest.StoreFile f : previousLayout.files()) {
        names.add(f.name());
      }
      // The manifest goes last: until it is gone the remaining files are still recognisably ours.
      names.add(StoreManifest.FILE_NAME);
      for (String fileName : names) {
        Path file = storeDir.resolve(fileName);
        if (Files.isRegularFile(file, LinkOption.NOFOLLOW_LINKS)) {
          step(Step.DELETE_PREVIOUS_LAYOUT_FILE);
          Files.delete(file);
          notes.add("removed " + fileName + " of the previous store layout (now in " + currentName + ")");
        }
      }
    }
  }

  private static void deleteLeftovers(Path storeDir, List<String> notes, String currentName) throws IOException {
    List<Path> entries = new ArrayList<>();
    try (DirectoryStream<Path> stream = Files.newDirectoryStream(storeDir)) {
      for (Path entry : stream) {
        entries.add(entry);
      }
    }
    entries.sort(null);
    for (Path entry : entries) {
      String name = PathNames.nameOf(entry);
      if (name.startsWith(BUILDING_PREFIX)) {
        StoreDirectories.deleteRecursively(entry);
        notes.add("removed " + name + ", a store generation left unfinished by a writer that stopped");
      } else if (name.startsWith(POINTER_TEMP_PREFIX)) {
        Files.deleteIfExists(entry);
        notes.add("removed " + name + ", a pointer left uncommitted by a writer that stopped");
      } else if (GENERATION_NAME.matcher(name).matches() && !name.equals(currentName)) {
        step(Step.DELETE_OLD_GENERATION);
        StoreDirectories.deleteRecursively(entry);
        boolean committed = currentName != null && sequenceOfName(name) < sequenceOfName(currentName);
        notes.add("removed " + name + (committed ? ", a store generation replaced by " + currentName
            : ", a store generation never committed by a writer that stopped"));
      }
    }
  }

  private static long sequenceOfName(String name) {
    return sequenceOf(Path.of(name));
  }

  private static void step(Step step) {
    Consumer<Step> hook = HOOK.get();
    if (hook != null) {
      hook.accept(step);
    }
  }

  /** Flushes every file of a finished generation and the directory itself to disk before it is committed. */
  private static void syncTree(Path dir) throws IOException {
    try (DirectoryStream<Path> stream = Files.newDirectoryStream(dir)) {
      for (Path file : stream) {
        if (Files.isRegularFile(file, LinkOption.NOFOLLOW_LINKS)) {
          try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
            channel.force(true);
          }
        }
      }
    }
    syncDirectory(dir);
  }

  private static void syncDirectory(Path dir) {
    try (FileChannel channel = FileChannel.open(dir, StandardOpenOption.READ)) {
      channel.force(true);
    } catch (IOException e) {
      // Some file systems cannot sync a directory; the rename itself is still atomic there.
    }
  }

  private static void move(Path from, Path to) throws IOException {
    try {
      Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      throw new IOException("cannot rename " + from + " to " + to + " atomically on this file system", e);
    }
  }

  private static String randomHex() {
    byte[] bytes = new byte[3];
    RANDOM.nextBytes(bytes);
    return HexFormat.of().formatHex(bytes);
  }

  private static String excerpt(String text) {
    return text.length() <= 80 ? text : text.substring(0, 80) + "…";
  }
}
