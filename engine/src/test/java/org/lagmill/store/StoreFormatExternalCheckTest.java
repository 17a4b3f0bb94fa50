package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.CRC32C;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.memory.MemoryBudget;

/** Checks the footers and file sizes against sources outside our own code. */
class StoreFormatExternalCheckTest {
  @TempDir Path temp;

  @Test
  void shouldUseTheStandardCrc32cInEveryFooter() throws Exception {
    // Check value of CRC-32C (Castagnoli) over the ASCII string "123456789" is 0xE3069283, as listed in the CRC
    // catalogue (reveng "CRC-32/ISCSI") and used by RFC 3720 (iSCSI); quoted from memory.
    CRC32C reference = new CRC32C();
    reference.update("123456789".getBytes(StandardCharsets.US_ASCII));
    assertEquals(0xE3069283L, reference.getValue());

    Path dir = temp.resolve("store");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreManifest manifest = new RandomStoreData(7, 11, 40).write(dir, budget);
      for (FileKind kind : FileKind.values()) {
        if (kind.optional() && manifest.file(kind.fileName()) == null) {
          continue;
        }
        byte[] bytes = Files.readAllBytes(dir.resolve(kind.fileName()));
        CRC32C crc = new CRC32C();
        crc.update(bytes, 0, bytes.length - 4);
        int footer = ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN).getInt(bytes.length - 4);
        assertEquals((int) crc.getValue(), footer, kind.fileName());
        assertEquals(String.format("%08x", footer), manifest.file(kind.fileName()).crc32c(), kind.fileName());
        assertEquals(bytes.length, manifest.file(kind.fileName()).bytes(), kind.fileName());
      }
    }
  }

  @Test
  void shouldSizeFilesAsTheLayoutsSay() throws Exception {
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
      columnBytes += UnitsWidth.forMaxValue(max).bytesRequired(data.dayCount);
      int kept = 0;
      for (int k = 0; k < data.priceDays[s].length; k++) {
        boolean laterOneAlsoBeforeDayZero = k + 1 < data.priceDays[s].length && data.priceDays[s][k + 1] <= 0;
        kept += laterOneAlsoBeforeDayZero ? 0 : 1;
      }
      changeCount += kept;
    }
    assertEquals(UnitsLayout.fileBytes(columnBytes), Files.size(dir.resolve("units.bin")));
    assertEquals(SeriesTableLayout.fileBytes(data.seriesCount()), Files.size(dir.resolve("series.bin")));
    assertEquals(PricesLayout.fileBytes(data.seriesCount(), changeCount), Files.size(dir.resolve("prices.bin")));
  }
}
