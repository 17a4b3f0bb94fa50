package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreAssertions;
import org.lagmill.store.StoreGenerations;
import org.lagmill.store.StoreManifest;

/**
 * {@code testdata/store-v1} is the tiny fixture's store as format version 1 wrote it (files at the top of the folder,
 * a manifest without its own checksum). It must open as the same history a fresh ingest gives, and its first append
 * must move it to the generation layout without losing a day.
 */
@Tag("reliability")
class PreviousFormatFixtureTest {
  private static final Path TINY = Path.of("..", "testdata", "tiny");
  private static final Path STORE_V1 = Path.of("..", "testdata", "store-v1");

  @TempDir
  Path temp;

  @Test
  void shouldOpenAStoreOfThePreviousFormatVersionAndMoveItOnItsFirstAppend() throws IOException {
    Path copy = Files.createDirectory(temp.resolve("store"));
    try (Stream<Path> files = Files.list(STORE_V1)) {
      for (Path file : files.toList()) {
        Files.copy(file, copy.resolve(file.getFileName()));
      }
    }
    Path fresh = temp.resolve("fresh");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest
          .ingest(IngestOptions.of(SalesInputs.of(TINY.resolve("sales.csv")).with(SideFile.CALENDAR, TINY.resolve(
              "calendar.csv")).with(SideFile.PRICES, TINY.resolve("prices.csv")), fresh), budget);
      try (SalesStore old = SalesStore.open(copy, budget); SalesStore now = SalesStore.open(fresh, budget)) {
        assertEquals(StoreManifest.FORMAT_VERSION_OLDEST, old.manifest().formatVersion());
        assertEquals(StoreManifest.FORMAT_VERSION_CURRENT, now.manifest().formatVersion());
        for (StoreManifest.StoreFile file : old.manifest().files()) {
          // Files added to the format since (e.g. closures.bin) are optional; the ones version 1 had are unchanged.
          assertEquals(file, now.manifest().file(file.name()), "the same bytes of " + file.name());
        }
        StoreAssertions.assertSameHistory(now, old, new Random(1), "version 1 fixture");
      }
      Path next = temp.resolve("next.csv");
      Files.writeString(next, "series_id,item,department,category,store,region,2026-01-19\n"
          + "PNT-D1-0001@NV-01,PNT-D1-0001,PNT-D1,Pantry,NV-01,Northvale,7\n");
      StoreAppend.append(AppendOptions.of(copy, next), budget);
      assertEquals(List.of(StoreGenerations.POINTER_FILE_NAME, StoreGenerations.readableDir(copy).getFileName()
          .toString(), "lock"), StoreIngestTest.listing(copy), "the version 1 files moved into a generation");
      try (SalesStore appended = SalesStore.open(copy, budget); SalesStore now = SalesStore.open(fresh, budget)) {
        assertEquals(15, appended.dayCount());
        int series = appended.attributes().seriesIndexOf("PNT-D1-0001@NV-01");
        assertEquals(7, appended.units(series, 14));
        for (int s = 0; s < now.seriesCount(); s++) {
          for (int d = 0; d < 14; d++) {
            assertEquals(now.units(s, d), appended.units(s, d), "series " + s + " day " + d);
          }
        }
      }
    }
  }
}
