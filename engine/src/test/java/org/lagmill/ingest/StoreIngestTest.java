package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.stream.Stream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.RandomStoreData;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreAssertions;
import org.lagmill.store.StoreGenerations;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;

class StoreIngestTest {
  private static final long MASTER_SEED = TestSeeds.master(20_240_601L);

  @TempDir
  Path temp;

  private Path writeCsv(String name, RandomStoreData data) throws IOException {
    Path file = temp.resolve(name);
    Files.writeString(file, WideCsv.of(RandomStoreData.ATTRIBUTE_NAMES, data.attributeValues,
        RandomStoreData.FIRST_DATE, data.units, 0, data.dayCount));
    return file;
  }

  @Test
  void shouldIngestAWideFileWithPricesAndCalendarLikeTheReference() throws Exception {
    Random seeds = new Random(MASTER_SEED);
    for (int round = 0; round < 4; round++) {
      long seed = seeds.nextLong();
      RandomStoreData data = new RandomStoreData(seed, 1 + new Random(seed).nextInt(60), 1 + round * 70);
      Path csv = writeCsv("sales-" + round + ".csv", data);
      Path storeDir = temp.resolve("store-" + round);
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        StoreManifest manifest = StoreIngest.ingest(IngestOptions.of(csv, storeDir).withPrices(data.prices())
            .withCalendar(data.calendar), budget).manifest();
        assertEquals(List.of(new StoreManifest.SourceFile(csv.getFileName().toString(), Files.size(csv))),
            manifest.sources());
        try (SalesStore store = SalesStore.open(storeDir, budget)) {
          StoreAssertions.assertSameHistory(data.reference(), store, new Random(seed),
              "master seed " + MASTER_SEED + ", round " + round);
        }
        assertEquals(0, budget.heldBytes());
      }
    }
    assertEquals(List.of("sales-0.csv", "sales-1.csv", "sales-2.csv", "sales-3.csv", "store-0", "store-1", "store-2",
        "store-3"), listing(temp), "no temporary directory is left behind");
  }

  @Test
  void shouldBuildTheSameStoreFromGzipAsFromPlainText() throws Exception {
    RandomStoreData data = new RandomStoreData(MASTER_SEED, 40, 90);
    Path plain = writeCsv("sales.csv", data);
    Path gzip = temp.resolve("sales.csv.gz");
    try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(gzip))) {
      out.write(Files.readAllBytes(plain));
    }
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(plain, temp.resolve("a")), budget);
      StoreIngest.ingest(IngestOptions.of(gzip, temp.resolve("b")), budget);
    }
    for (String file : List.of("units.bin", "series.bin", "attributes.bin", "prices.bin", "calendar.bin")) {
      assertArrayEquals(Files.readAllBytes(StoreGenerations.readableDir(temp.resolve("a")).resolve(file)),
          Files.readAllBytes(StoreGenerations.readableDir(temp.resolve("b")).resolve(file)), file);
    }
  }

  @Test
  void shouldLeaveAnExistingStoreByteIdenticalWhenIngestFails() throws Exception {
    RandomStoreData data = new RandomStoreData(MASTER_SEED + 1, 20, 30);
    Path storeDir = temp.resolve("store");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(writeCsv("good.csv", data), storeDir), budget);
      Map<String, byte[]> before = contents(StoreGenerations.readableDir(storeDir));
      List<String> topLevel = listing(storeDir);
      String csv = Files.readString(temp.resolve("good.csv"));
      Path bad = temp.resolve("bad.csv");
      Files.writeString(bad, csv + csv.substring(csv.indexOf('\n') + 1, csv.indexOf('\n', csv.indexOf('\n') + 1) + 1));
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreIngest.ingest(IngestOptions.of(bad, storeDir), budget));
      assertEquals(bad + ", line 22: duplicate series \"" + data.attributeValues[0][0] + "\": each series may appear "
          + "once", e.getMessage());
      Path broken = temp.resolve("broken.csv");
      Files.writeString(broken, csv.replaceFirst(",(\\d+)\n", ",-$1\n"));
      assertThrows(InputFormatException.class, () -> StoreIngest.ingest(IngestOptions.of(broken, storeDir), budget));
      assertEquals(topLevel, listing(storeDir), "the failed ingests leave no building directory");
      Map<String, byte[]> after = contents(StoreGenerations.readableDir(storeDir));
      assertEquals(before.keySet(), after.keySet());
      for (String name : before.keySet()) {
        assertArrayEquals(before.get(name), after.get(name), name);
      }
      assertEquals(List.of("bad.csv", "broken.csv", "good.csv", "store"), listing(temp));
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldRejectAHeaderWithoutRows() throws Exception {
    Path csv = temp.resolve("empty.csv");
    Files.writeString(csv, "item,2024-01-01\n", StandardCharsets.UTF_8);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreIngest.ingest(IngestOptions.of(csv, temp.resolve("store")), budget));
      assertEquals(csv + ", line 2: expected at least one series row after the header, found none", e.getMessage());
    }
    assertEquals(List.of("empty.csv"), listing(temp));
  }

  @Test
  void shouldSummariseAStore() throws Exception {
    Path csv = temp.resolve("small.csv");
    Files.writeString(csv, "item,store,2024-01-30,2024-01-31,2024-02-01\na,s1,0,,300\nb,s1,0,0,2\nc,s2,,,\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(csv, temp.resolve("store")), budget);
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        StoreSummary summary = StoreSummary.of(store);
        assertEquals(3, summary.seriesCount());
        assertEquals("2024-02-01", summary.lastDate().toString());
        assertEquals(Map.of("item", 3, "store", 2), summary.attributeCardinalities());
        assertEquals(Map.of("BYTE", 2L, "SHORT", 1L, "INT", 0L), summary.seriesCountByWidth());
        assertEquals(4, summary.unknownDayCount());
        assertEquals(3.0 / 5.0, summary.zeroDayShare(), 1e-12);
        assertEquals(3 * 3 * 8, summary.int64ColumnBytes());
        assertEquals(Files.size(csv), summary.sourceCsvBytes());
        assertEquals(Files.size(StoreGenerations.readableDir(temp.resolve("store")).resolve("units.bin")),
            summary.unitsFileBytes());
        assertEquals((16 + 3 + 6 + 3 + 8) / 9.0, summary.unitsBytesPerItemDay(), 1e-12);
        assertEquals(store.offHeapBytes(), summary.offHeapBytes());
      }
    }
  }

  static List<String> listing(Path dir) throws IOException {
    try (Stream<Path> files = Files.list(dir)) {
      return files.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  private static Map<String, byte[]> contents(Path dir) throws IOException {
    Map<String, byte[]> map = new TreeMap<>();
    for (String name : listing(dir)) {
      map.put(name, Files.readAllBytes(dir.resolve(name)));
    }
    return map;
  }
}
