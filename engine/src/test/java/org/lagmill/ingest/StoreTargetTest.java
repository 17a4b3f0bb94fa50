package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.io.OutputRefusedException;
import org.lagmill.io.OutputTargets;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreGenerations;
import org.lagmill.store.StoreUpdate;

/** Ingest writes only where nothing is, or over a lagmill store it was asked to replace: never over anything else. */
class StoreTargetTest {
  private static final StoreUpdate.Policy CREATE = new StoreUpdate.Policy(StoreUpdate.Mode.CREATE, true);
  private static final StoreUpdate.Policy REPLACE = new StoreUpdate.Policy(StoreUpdate.Mode.REPLACE, true);

  @TempDir
  Path temp;

  private Path sales(String name, String units) throws IOException {
    Path file = temp.resolve(name);
    Files.writeString(file, "sku,shop,2025-03-01,2025-03-02\nk1,s1," + units + "\nk2,s1,0,4\n");
    return file;
  }

  private IngestResult ingest(Path sales, Path store, StoreUpdate.Policy policy) throws IOException {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      return StoreIngest.ingest(IngestOptions.of(sales, store), policy, budget);
    }
  }

  @Test
  void shouldRefuseARegularFileAndLeaveItAsItWas() throws Exception {
    Path file = temp.resolve("notes.txt");
    Files.writeString(file, "keep me\n");
    OutputRefusedException e = assertThrows(OutputRefusedException.class,
        () -> ingest(sales("a.csv", "1,2"), file, REPLACE));
    assertEquals("refusing to write " + file + ": it is a file, not a store; nothing was changed", e.getMessage());
    assertEquals("keep me\n", Files.readString(file));
  }

  @Test
  void shouldRefuseAFolderOfOtherFilesAndLeaveNoLockFileInIt() throws Exception {
    Path folder = Files.createDirectory(temp.resolve("photos"));
    Files.writeString(folder.resolve("holiday.jpg"), "jpeg");
    OutputRefusedException e = assertThrows(OutputRefusedException.class,
        () -> ingest(sales("a.csv", "1,2"), folder, REPLACE));
    assertEquals("refusing to write " + folder + ": the folder holds files that are not a lagmill store (e.g. "
        + "holiday.jpg); nothing was changed, choose a new or empty folder", e.getMessage());
    assertEquals(List.of("holiday.jpg"), StoreIngestTest.listing(folder));
  }

  @Test
  void shouldRefuseTheWorkingFolderGivenAsDotOrThroughDotDot() throws Exception {
    // The module folder holds pom.xml and sources: "." must never be taken for an empty or a store folder.
    assertThrows(OutputRefusedException.class,
        () -> OutputTargets.checkFolder(Path.of("."), "store", StoreGenerations::looksLikeStore, Set.of()));
    assertTrue(Files.exists(Path.of("pom.xml")));
    Path folder = Files.createDirectory(temp.resolve("work"));
    Files.writeString(folder.resolve("sales.csv"), "x");
    Files.createDirectory(folder.resolve("sub"));
    assertThrows(OutputRefusedException.class, () -> ingest(sales("a.csv", "1,2"), folder.resolve("sub/.."),
        REPLACE));
    assertEquals(List.of("sales.csv", "sub"), StoreIngestTest.listing(folder));
  }

  @Test
  void shouldCreateInAMissingPathOrAnEmptyFolder() throws Exception {
    ingest(sales("a.csv", "1,2"), temp.resolve("new/store"), CREATE);
    Path empty = Files.createDirectory(temp.resolve("empty"));
    ingest(sales("b.csv", "1,2"), empty, CREATE);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        SalesStore store = SalesStore.open(empty, budget)) {
      assertEquals(2, store.seriesCount());
    }
  }

  @Test
  void shouldReplaceAStoreOnlyWhenAsked() throws Exception {
    Path store = temp.resolve("store");
    ingest(sales("a.csv", "1,2"), store, CREATE);
    OutputRefusedException e = assertThrows(OutputRefusedException.class,
        () -> ingest(sales("b.csv", "7,7"), store, CREATE));
    assertEquals(OutputRefusedException.Reason.EXISTS, e.reason());
    assertEquals("refusing to write " + store + ": it already holds a store; nothing was changed (replacing it "
        + "must be asked for)", e.getMessage());
    ingest(sales("b.csv", "7,7"), store, REPLACE);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        SalesStore opened = SalesStore.open(store, budget)) {
      assertEquals(7, opened.units(0, 0));
    }
    assertEquals(List.of(StoreGenerations.POINTER_FILE_NAME, StoreGenerations.readableDir(store).getFileName()
        .toString(), "lock"), StoreIngestTest.listing(store), "the replaced generation is gone, nothing else left");
  }

  @Test
  void shouldRefuseToReplaceAStoreThatFailsItsChecks() throws Exception {
    Path store = temp.resolve("store");
    ingest(sales("a.csv", "1,2"), store, CREATE);
    Path units = StoreGenerations.readableDir(store).resolve("units.bin");
    byte[] bytes = Files.readAllBytes(units);
    bytes[17] ^= 0x10;
    Files.write(units, bytes);
    OutputRefusedException e = assertThrows(OutputRefusedException.class,
        () -> ingest(sales("b.csv", "7,7"), store, REPLACE));
    assertEquals(OutputRefusedException.Reason.NOT_OURS, e.reason());
    assertTrue(e.getMessage().startsWith("refusing to write " + store + ": it does not verify as a lagmill store, "
        + "so it is not replaced (" + units + ": checksum mismatch"), e.getMessage());
    assertArrayEquals(bytes, Files.readAllBytes(units));
  }

  @Test
  void shouldRemoveAStoreFolderItCreatedWhenTheFirstIngestFails() throws Exception {
    Path bad = temp.resolve("bad.csv");
    Files.writeString(bad, "sku,2025-03-01\nk1,-4\n");
    Path store = temp.resolve("store");
    assertThrows(InputFormatException.class, () -> ingest(bad, store, CREATE));
    assertFalse(Files.exists(store));
    Path empty = Files.createDirectory(temp.resolve("empty"));
    assertThrows(InputFormatException.class, () -> ingest(bad, empty, CREATE));
    assertEquals(List.of("lock"), StoreIngestTest.listing(empty), "a folder the user made stays, with the lock");
  }
}
