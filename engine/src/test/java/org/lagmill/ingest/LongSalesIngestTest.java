package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.RandomStoreData;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;

class LongSalesIngestTest {
  private static final long MASTER_SEED = TestSeeds.master(7_340_211L);

  @TempDir
  Path temp;

  /**
   * One random table written both ways: the long file lists rows in random order, leaves out some unknown days and
   * writes others with an empty units cell. Both stores must hold the same series, attributes and units.
   */
  @Test
  void shouldBuildTheSameStoreFromLongAsFromWide() throws Exception {
    Random seeds = new Random(MASTER_SEED);
    for (int round = 0; round < 4; round++) {
      long seed = seeds.nextLong();
      String where = "master seed " + MASTER_SEED + ", round " + round;
      Random random = new Random(seed);
      RandomStoreData data = new RandomStoreData(seed, 1 + random.nextInt(40), 1 + random.nextInt(90));
      Path wide = temp.resolve("wide-" + round + ".csv");
      Files.writeString(wide, WideCsv.of(RandomStoreData.ATTRIBUTE_NAMES, data.attributeValues,
          RandomStoreData.FIRST_DATE, data.units, 0, data.dayCount));
      Path longFile = temp.resolve("long-" + round + ".csv");
      Files.writeString(longFile, longCsv(data, random, "date", "units"));
      try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
        StoreIngest.ingest(IngestOptions.of(wide, temp.resolve("w" + round)), budget);
        // The long file leaves out some unknown days: read them as unknown, as the wide file's empty cells are.
        StoreIngest.ingest(
            IngestOptions.of(SalesInputs.of(longFile).withMissingRows(MissingRows.UNKNOWN), temp.resolve("l" + round)),
            budget);
        try (SalesStore w = SalesStore.open(temp.resolve("w" + round), budget);
            SalesStore l = SalesStore.open(temp.resolve("l" + round), budget)) {
          assertSameSeries(w, l, where);
        }
        assertEquals(0, budget.heldBytes(), where);
      }
    }
  }

  @Test
  void shouldHonourRenamedColumnsAndAnExplicitFormat() throws Exception {
    RandomStoreData data = new RandomStoreData(MASTER_SEED, 12, 20);
    String text = longCsv(data, new Random(MASTER_SEED), "day", "qty").replaceFirst("^series_id,", "sku,");
    Path longFile = temp.resolve("long.csv");
    Files.writeString(longFile, text);
    Path wide = temp.resolve("wide.csv");
    Files.writeString(wide, WideCsv.of(RandomStoreData.ATTRIBUTE_NAMES, data.attributeValues,
        RandomStoreData.FIRST_DATE, data.units, 0, data.dayCount));
    ColumnNames names = ColumnNames.DEFAULTS.with(Column.SERIES_ID, "sku").withDateColumn("day").with(Column.UNITS,
        "qty");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class,
          () -> StoreIngest.ingest(IngestOptions.of(longFile, temp.resolve("bad")), budget));
      assertEquals(longFile + ", line 1: header sku,item,store,region,day,qty is neither wide nor long sales: "
          + "expected ISO date column headers (wide) or the columns 'date' and 'units' (long; rename with "
          + "‹date-column›, ‹units-column›)", e.getMessage());
      InputFormatException forced = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(wide).withSalesFormat(SalesFormat.LONG), temp.resolve("bad")), budget));
      // a long header is quoted as a bounded excerpt
      String header = Files.readAllLines(wide).get(0);
      assertEquals(wide + ", line 1: no column 'date' in header " + header.substring(0, 60) + "… (" + header.length()
          + " characters): expected one (or name it with ‹date-column›)", forced.getMessage());
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(longFile).withColumns(names)
          .withMissingRows(MissingRows.UNKNOWN), temp.resolve("l")), budget);
      StoreIngest.ingest(IngestOptions.of(wide, temp.resolve("w")), budget);
      try (SalesStore w = SalesStore.open(temp.resolve("w"), budget);
          SalesStore l = SalesStore.open(temp.resolve("l"), budget)) {
        assertEquals("series_id", l.attributes().attributeName(0), "the id column is stored as series_id");
        assertSameSeries(w, l, "renamed columns");
      }
    }
    assertEquals(List.of("l", "long.csv", "w", "wide.csv"), StoreIngestTest.listing(temp));
  }

  @Test
  void shouldParseTheFormatOption() {
    assertEquals(SalesFormat.LONG, SalesFormat.parse("long"));
    assertEquals(SalesFormat.WIDE, SalesFormat.parse("WIDE"));
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SalesFormat.parse("tall"));
    assertEquals("‹sales-format› must be one of wide, long, auto, got 'tall'; auto (the default) decides from the "
        + "header", e.getMessage());
  }

  /** Series of {@code actual} are found by id; the long store may list them in another order. */
  private static void assertSameSeries(SalesStore expected, SalesStore actual, String where) {
    assertEquals(expected.seriesCount(), actual.seriesCount(), where);
    assertEquals(expected.dayCount(), actual.dayCount(), where);
    assertEquals(expected.firstDate(), actual.firstDate(), where);
    int[] a = new int[expected.dayCount()];
    int[] b = new int[expected.dayCount()];
    for (int s = 0; s < expected.seriesCount(); s++) {
      String id = expected.attributes().seriesId(s);
      int t = actual.attributes().seriesIndexOf(id);
      for (int k = 0; k < expected.attributes().attributeCount(); k++) {
        assertEquals(expected.attributes().attributeName(k), actual.attributes().attributeName(k), where);
        assertEquals(expected.attributes().value(k, expected.attributes().code(s, k)),
            actual.attributes().value(k, actual.attributes().code(t, k)), where + ", series " + id);
      }
      expected.readUnits(s, 0, a, 0, a.length);
      actual.readUnits(t, 0, b, 0, b.length);
      assertArrayEquals(a, b, where + ", series " + id);
      assertEquals(expected.maxUnits(s), actual.maxUnits(t), where);
      assertEquals(expected.firstSaleDayIndex(s), actual.firstSaleDayIndex(t), where);
    }
  }

  /**
   * The table as long rows in random order. An unknown day is left out or written with an empty cell, except on
   * the first and last day of series 0, which always get a row so the long file spans the same days as the wide one.
   */
  static String longCsv(RandomStoreData data, Random random, String dateColumn, String unitsColumn) {
    List<String> rows = new ArrayList<>();
    for (int s = 0; s < data.units.length; s++) {
      String[] v = data.attributeValues[s];
      for (int d = 0; d < data.dayCount; d++) {
        int units = data.units[s][d];
        boolean spanRow = s == 0 && (d == 0 || d == data.dayCount - 1);
        if (units == SalesHistory.UNKNOWN_UNITS && !spanRow && random.nextBoolean()) {
          continue;
        }
        rows.add(String.join(",", v[0], v[1], v[2], v[3]) + "," + RandomStoreData.FIRST_DATE.plusDays(d) + ","
            + (units == SalesHistory.UNKNOWN_UNITS ? "" : Integer.toString(units)));
      }
    }
    Collections.shuffle(rows, random);
    return "series_id,item,store,region," + dateColumn + "," + unitsColumn + "\n" + String.join("\n", rows) + "\n";
  }
}
