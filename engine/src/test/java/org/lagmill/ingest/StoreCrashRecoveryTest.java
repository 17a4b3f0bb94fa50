package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreGenerations;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreNotices;
import org.lagmill.store.StoreWriter;

/**
 * A crash at every step of the commit protocol: before each rename and each delete, the test hook copies the store
 * folder as it is at that instant (what a killed process leaves on disk) and stops the writer. Every copy must open
 * as the old or the new store, never anything else, tidy itself up on that first open and say so, and take the next
 * append.
 */
@Tag("reliability")
class StoreCrashRecoveryTest {
  private static final LocalDate FIRST = LocalDate.of(2025, 6, 2);

  @TempDir
  Path temp;
  private final List<String> notices = new ArrayList<>();
  private Consumer<String> previousSink;

  @BeforeEach
  void captureNotices() {
    previousSink = StoreNotices.sink();
    StoreNotices.setSink(notices::add);
  }

  @AfterEach
  void restoreNotices() {
    StoreNotices.setSink(previousSink);
  }

  /** A wide file of days [from, to) whose every cell is {@code value}. */
  private Path days(String name, int from, int to, int value) throws IOException {
    StringBuilder csv = new StringBuilder("sku,shop");
    for (int d = from; d < to; d++) {
      csv.append(',').append(FIRST.plusDays(d));
    }
    csv.append('\n');
    for (int s = 0; s < 5; s++) {
      csv.append("k").append(s).append(",s1");
      for (int d = from; d < to; d++) {
        csv.append(',').append(value);
      }
      csv.append('\n');
    }
    return Files.writeString(temp.resolve(name), csv);
  }

  private interface Setup {
    void make(Path store, MemoryBudget budget) throws IOException;
  }

  private interface Change {
    void run(Path store, MemoryBudget budget) throws IOException;
  }

  /** Marks where the hook stopped the writer, so it can be told from a real failure. */
  private static final class SimulatedCrash extends RuntimeException {
    private static final long serialVersionUID = 1L;
  }

  @Test
  void shouldRecoverFromACrashAtEveryStepOfAnAppend() throws Exception {
    Path base = days("base.csv", 0, 4, 3);
    Path next = days("next.csv", 4, 6, 900);
    crashAtEveryStep((store, budget) -> StoreIngest.ingest(IngestOptions.of(base, store), budget),
        (store, budget) -> StoreAppend.append(AppendOptions.of(store, next), budget), 4, 6);
  }

  @Test
  void shouldRecoverFromACrashAtEveryStepOfAReplacingIngest() throws Exception {
    Path base = days("base.csv", 0, 4, 3);
    Path other = days("other.csv", 0, 9, 7);
    crashAtEveryStep((store, budget) -> StoreIngest.ingest(IngestOptions.of(base, store), budget),
        (store, budget) -> StoreIngest.ingest(IngestOptions.of(other, store), budget), 4, 9);
  }

  @Test
  void shouldRecoverFromACrashAtEveryStepOfMovingAPreviousLayoutStore() throws Exception {
    Path next = days("next.csv", 4, 5, 1);
    crashAtEveryStep((store, budget) -> {
      // A store of the previous layout: the files at the top of the folder, no pointer.
      try (StoreWriter writer = new StoreWriter(store, FIRST, 4, List.of("sku", "shop"), budget)) {
        for (int s = 0; s < 5; s++) {
          writer.addSeries(new String[] {"k" + s, "s1"}, new int[] {3, 3, 3, 3});
        }
        writer.finish(List.of());
      }
    }, (store, budget) -> StoreAppend.append(AppendOptions.of(store, next), budget), 4, 5);
  }

  private void crashAtEveryStep(Setup setup, Change change, int oldDayCount, int newDayCount) throws Exception {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      Path probe = temp.resolve("probe");
      setup.make(probe, budget);
      List<StoreGenerations.Step> steps = new ArrayList<>();
      StoreGenerations.runWithCommitHook(steps::add, () -> change.run(probe, budget));
      assertTrue(steps.contains(StoreGenerations.Step.RENAME_POINTER), steps.toString());
      int commitPoint = steps.indexOf(StoreGenerations.Step.RENAME_POINTER);

      for (int k = 0; k < steps.size(); k++) {
        Path store = temp.resolve("store-" + k);
        Path crashed = temp.resolve("crashed-" + k);
        setup.make(store, budget);
        int crashAt = k;
        int[] seen = {0};
        assertThrows(SimulatedCrash.class, () -> StoreGenerations.runWithCommitHook(step -> {
          if (seen[0]++ == crashAt) {
            copyTree(store, crashed);
            throw new SimulatedCrash();
          }
        }, () -> change.run(store, budget)));

        notices.clear();
        String where = "crash before step " + k + " (" + steps.get(k) + ")";
        try (SalesStore opened = SalesStore.open(crashed, budget)) {
          assertEquals(k <= commitPoint ? oldDayCount : newDayCount, opened.dayCount(), where);
        }
        assertFalse(notices.isEmpty(), where + ": the first open says what it tidied up");
        for (String notice : notices) {
          assertTrue(notice.startsWith("store " + crashed + ": removed "), notice);
        }
        if (Files.exists(crashed.resolve(StoreGenerations.POINTER_FILE_NAME))) {
          assertEquals(List.of(StoreGenerations.POINTER_FILE_NAME, StoreGenerations.readableDir(crashed)
              .getFileName().toString(), "lock"), StoreIngestTest.listing(crashed), where + ": only the current "
                  + "generation is left");
        } else {
          List<String> expected = new ArrayList<>(List.of("lock", StoreManifest.FILE_NAME));
          StoreManifest.read(crashed).files().forEach(f -> expected.add(f.name()));
          expected.sort(null);
          assertEquals(expected, StoreIngestTest.listing(crashed), where + ": the previous-layout store, as it was");
        }
        notices.clear();
        try (SalesStore opened = SalesStore.open(crashed, budget)) {
          assertEquals(List.of(), notices, where + ": nothing left to tidy up the second time");
        }
        int day = k <= commitPoint ? oldDayCount : newDayCount;
        StoreAppend.append(AppendOptions.of(crashed, days("after-" + k + ".csv", day, day + 1, 5)), budget);
        try (SalesStore opened = SalesStore.open(crashed, budget)) {
          assertEquals(day + 1, opened.dayCount(), where + ": the next append lands");
          assertEquals(5, opened.units(0, day));
        }
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  private static void copyTree(Path from, Path to) {
    try (Stream<Path> paths = Files.walk(from)) {
      for (Path p : paths.toList()) {
        Path target = to.resolve(from.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(target);
        } else {
          Files.copy(p, target);
        }
      }
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }
}
