package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.memory.MemoryBudget;

/**
 * The file sizes docs/formats/store.md states, recomputed here from the document's own words (header 16 bytes,
 * footer 8 bytes, the width table of units.bin, the record sizes of series.bin and prices.bin), not from the layout
 * classes: a change to a layout that the document does not follow fails here.
 */
class StoreFileSizesTest {
  private static final int HEADER_BYTES = 16;
  private static final int FOOTER_BYTES = 8;
  private static final int SERIES_RECORD_BYTES = 20;

  @TempDir
  Path temp;

  @Test
  void shouldSizeFilesAsTheFormatDocumentSays() throws Exception {
    Path dir = temp.resolve("sizes");
    RandomStoreData data = new RandomStoreData(9, 13, 25);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      data.write(dir, budget);
    }
    long columnBytes = 0;
    int changeCount = 0;
    for (int s = 0; s < data.seriesCount(); s++) {
      int max = 0;
      for (int u : data.units[s]) {
        max = Math.max(max, u);
      }
      columnBytes += (long) documentedWidthBytes(max) * data.dayCount;
      for (int k = 0; k < data.priceDays[s].length; k++) {
        // "an earlier price is clamped to day 0": of several changes on or before day 0 only the last one is kept
        boolean laterOneAlsoOnOrBeforeDayZero = k + 1 < data.priceDays[s].length && data.priceDays[s][k + 1] <= 0;
        changeCount += laterOneAlsoOnOrBeforeDayZero ? 0 : 1;
      }
    }
    int seriesCount = data.seriesCount();
    assertEquals(HEADER_BYTES + columnBytes + FOOTER_BYTES, Files.size(dir.resolve("units.bin")));
    // header, seriesCount and dayCount (int each), a 20-byte record per series, footer
    assertEquals(HEADER_BYTES + 8 + (long) SERIES_RECORD_BYTES * seriesCount + FOOTER_BYTES,
        Files.size(dir.resolve("series.bin")));
    // header, seriesCount and changeCount (int each), seriesCount + 1 int starts, an int day and a float32 price per
    // change, footer
    assertEquals(HEADER_BYTES + 8 + 4L * (seriesCount + 1) + 8L * changeCount + FOOTER_BYTES,
        Files.size(dir.resolve("prices.bin")));
  }

  /** The width table of units.bin: 1 byte for 0 .. 254, 2 bytes for 0 .. 65,534, else 4 bytes. */
  private static int documentedWidthBytes(int maxUnits) {
    return maxUnits <= 254 ? 1 : maxUnits <= 65_534 ? 2 : 4;
  }
}
