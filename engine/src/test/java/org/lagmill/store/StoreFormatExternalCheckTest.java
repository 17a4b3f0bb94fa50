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

/** Checks the store files' footers against the published CRC-32C, a source outside our own code. */
class StoreFormatExternalCheckTest {
  @TempDir
  Path temp;

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
}
