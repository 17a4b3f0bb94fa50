package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import de.siegmar.fastcsv.reader.CsvRecord;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArraySeriesAttributes;

/** The shared key matcher of dated per-key files against a slow reference that compares the cells as text. */
class SeriesKeysTest {
  private static final long MASTER_SEED = TestSeeds.master(0x4B3E_75L);
  private static final String[] NAMES = {"sku", "shop", "dept", "banner"};

  @TempDir
  Path dir;

  @Test
  void shouldMatchEveryKeySubsetLikeTheSlowReference() {
    for (int round = 0; round < 40; round++) {
      long seed = MASTER_SEED + round;
      Random random = new Random(seed);
      int seriesCount = 1 + random.nextInt(12);
      String[][] values = new String[seriesCount][NAMES.length];
      for (int s = 0; s < seriesCount; s++) {
        for (int a = 0; a < NAMES.length; a++) {
          values[s][a] = NAMES[a].charAt(0) + "" + random.nextInt(1 + a);
        }
      }
      ArraySeriesAttributes attributes = ArraySeriesAttributes.of(NAMES, values);
      // A random subset of the attributes (possibly none) in a random order, with a value column mixed in.
      List<Integer> keyAttributes = new ArrayList<>();
      for (int a = 0; a < NAMES.length; a++) {
        if (random.nextBoolean()) {
          keyAttributes.add(random.nextInt(keyAttributes.size() + 1), a);
        }
      }
      List<String> header = new ArrayList<>();
      for (int a : keyAttributes) {
        header.add(NAMES[a]);
      }
      int valueColumn = random.nextInt(header.size() + 1);
      header.add(valueColumn, "promo");
      StringBuilder csv = new StringBuilder(String.join(",", header)).append('\n');
      List<String[]> rows = new ArrayList<>();
      for (int r = 0; r < 10; r++) {
        String[] row = new String[header.size()];
        for (int c = 0; c < row.length; c++) {
          int a = List.of(NAMES).indexOf(header.get(c));
          row[c] = a < 0 ? "1" : random.nextInt(4) == 0 ? "unknown" : values[random.nextInt(seriesCount)][a];
        }
        rows.add(row);
        csv.append(String.join(",", row)).append('\n');
      }
      Path file = IngestFiles.write(dir, "keys" + round + ".csv", csv.toString());
      try (CsvSource source = CsvSource.open(file)) {
        String[] fileHeader = source.readHeader();
        SeriesKeys keys = SeriesKeys.attributeColumns(fileHeader, new int[0], attributes, seriesCount);
        SeriesKeys same = SeriesKeys.allColumnsExcept(file, fileHeader, new int[] {valueColumn}, attributes,
            seriesCount, "plan", false);
        assertEquals(keyAttributes.size(), keys.keyColumnCount());
        int r = 0;
        for (CsvRecord record = source.next(); record != null; record = source.next(), r++) {
          String context = "seed " + seed + " (replay with -Dlagmill.seed=" + MASTER_SEED + "), row " + r;
          int[] expected = slowSeriesOf(rows.get(r), header, values);
          int keyId = keys.keyIdOf(record);
          assertArrayEquals(expected, keyId < 0 ? new int[0] : keys.seriesOf(keyId), context);
          assertEquals(keyId, same.keyIdOf(record), context);
        }
      }
    }
  }

  /** Every series whose attribute values equal the row's key cells, compared as text. */
  private static int[] slowSeriesOf(String[] row, List<String> header, String[][] values) {
    List<Integer> matches = new ArrayList<>();
    for (int s = 0; s < values.length; s++) {
      boolean all = true;
      for (int c = 0; c < row.length; c++) {
        int a = List.of(NAMES).indexOf(header.get(c));
        all &= a < 0 || values[s][a].equals(row[c]);
      }
      if (all) {
        matches.add(s);
      }
    }
    return matches.stream().mapToInt(Integer::intValue).toArray();
  }

  @Test
  void shouldNameTheFileKindAndTheValueColumnsInErrors() {
    ArraySeriesAttributes chain = IngestFiles.chain();
    Path file = dir.resolve("plan.csv");
    InputFormatException e = assertThrows(InputFormatException.class, () -> SeriesKeys.allColumnsExcept(file,
        new String[] {"item", "aisle", "date", "promo"}, new int[] {2, 3}, chain, 9, "plan", true));
    assertEquals(file + ", line 1, column 2: plan key column 'aisle' is not a series attribute: expected one of item,"
        + " store, region", e.getMessage());
    e = assertThrows(InputFormatException.class, () -> SeriesKeys.allColumnsExcept(file,
        new String[] {"date", "promo", "depth"}, new int[] {0, 1, 2}, chain, 9, "plan", true));
    assertEquals(file + ", line 1: no key columns: expected at least one series attribute column (item, store, region)"
        + " besides 'date', 'promo' and 'depth'", e.getMessage());
  }

  @Test
  void shouldCoverTheWholeChainWithNoKeyColumn() {
    ArraySeriesAttributes chain = IngestFiles.chain();
    SeriesKeys keys = SeriesKeys.allColumnsExcept(dir.resolve("c.csv"), new String[] {"from", "until"},
        new int[] {0, 1}, chain, 9, "closure", false);
    assertEquals(1, keys.keyCount());
    assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5, 6, 7, 8}, keys.seriesOf(0));
    assertEquals("all series", keys.describe(0));
  }
}
