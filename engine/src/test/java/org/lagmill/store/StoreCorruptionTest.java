package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.io.SealedJson;
import org.lagmill.memory.MemoryBudget;

/** Injected faults on the store files: each must raise CorruptStoreException naming the file, expected and actual. */
class StoreCorruptionTest {
  @TempDir
  Path temp;
  private Path dir;
  private MemoryBudget budget;

  @BeforeEach
  void writeStore() throws IOException {
    dir = temp.resolve("store");
    budget = MemoryBudget.unlimited("test");
    new RandomStoreData(42, 5, 30).write(dir, budget);
  }

  private String openFailure() {
    CorruptStoreException e = assertThrows(CorruptStoreException.class, () -> SalesStore.open(dir, budget).close());
    assertEquals(0, budget.heldBytes(), "a failed open releases what it mapped");
    return e.getMessage();
  }

  private void putInt(String fileName, long offset, int value) throws IOException {
    try (FileChannel channel = FileChannel.open(dir.resolve(fileName), StandardOpenOption.WRITE)) {
      channel.write(ByteBuffer.allocate(4).order(ByteOrder.LITTLE_ENDIAN).putInt(0, value), offset);
    }
  }

  @Test
  void shouldRejectWrongMagic() throws IOException {
    putInt("units.bin", 0, 0x12345678);
    assertEquals(dir.resolve("units.bin") + ": wrong magic: expected 0x534D474C, actual 0x12345678", openFailure());
  }

  @Test
  void shouldRejectWrongVersion() throws IOException {
    putInt("attributes.bin", 8, 7);
    assertEquals(dir.resolve("attributes.bin") + ": unsupported format version: expected 1, actual 7",
        openFailure());
  }

  @Test
  void shouldRejectWrongKind() throws IOException {
    putInt("prices.bin", 4, 1);
    assertEquals(dir.resolve("prices.bin") + ": wrong file kind: expected 4 (PRICES), actual 1", openFailure());
  }

  @Test
  void shouldRejectTruncatedFile() throws IOException {
    Path units = dir.resolve("units.bin");
    long size = Files.size(units);
    try (FileChannel channel = FileChannel.open(units, StandardOpenOption.WRITE)) {
      channel.truncate(size - 3);
    }
    assertEquals(units + ": wrong size: expected " + size + " bytes, actual " + (size - 3) + " bytes", openFailure());
  }

  @Test
  void shouldRejectFlippedByte() throws IOException {
    Path series = dir.resolve("series.bin");
    byte[] bytes = Files.readAllBytes(series);
    int stored = ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN).getInt(bytes.length - 4);
    bytes[30] ^= 0x10;
    Files.write(series, bytes);
    java.util.zip.CRC32C crc = new java.util.zip.CRC32C();
    crc.update(bytes, 0, bytes.length - 4);
    assertEquals(series + ": checksum mismatch: expected " + StoreFileFormat.hex(stored) + " (footer), actual "
        + StoreFileFormat.hex((int) crc.getValue()), openFailure());
  }

  @Test
  void shouldRejectAManifestWhoseFingerprintDoesNotMatchItsFiles() throws IOException {
    Path manifest = dir.resolve("manifest.json");
    String json = Files.readString(manifest);
    StoreManifest read = StoreManifest.read(dir);
    // Re-sealed after the edit, so the manifest's own checksum passes and the fingerprint check is what fails.
    String unsealed = new String(SealedJson.unseal(manifest, json.getBytes(StandardCharsets.UTF_8)).bytes(),
        StandardCharsets.UTF_8);
    Files.write(manifest, SealedJson.seal(unsealed.replace(read.fingerprint(), "0000000000000000")
        .getBytes(StandardCharsets.UTF_8)));
    assertEquals(manifest + ": fingerprint mismatch: expected " + read.fingerprint()
        + " (from the files listed), actual 0000000000000000", openFailure());
  }
}
