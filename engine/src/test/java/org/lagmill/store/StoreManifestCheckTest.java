package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.io.CorruptFileException;
import org.lagmill.io.Crc32c;
import org.lagmill.io.SealedJson;
import org.lagmill.memory.MemoryBudget;

/**
 * The manifest is checked like the binary files (its own CRC32C), and decoded values are checked even when a forger
 * re-signed every checksum: a first sale day outside the store, a largest value that does not fit its width.
 */
class StoreManifestCheckTest {
  @TempDir
  Path temp;
  private Path dir;
  private MemoryBudget budget;
  private RandomStoreData data;

  @BeforeEach
  void writeStore() throws IOException {
    dir = temp.resolve("store");
    budget = MemoryBudget.unlimited("test");
    data = new RandomStoreData(43, 6, 30);
    data.write(dir, budget);
  }

  @AfterEach
  void closeBudget() {
    budget.close();
  }

  private String openFailure() {
    CorruptFileException e = assertThrows(CorruptFileException.class, () -> SalesStore.open(dir, budget).close());
    assertEquals(0, budget.heldBytes(), "a failed open releases what it mapped");
    return e.getMessage();
  }

  @Test
  void shouldRefuseAChangedFirstDate() throws IOException {
    Path manifest = dir.resolve(StoreManifest.FILE_NAME);
    String json = Files.readString(manifest);
    String firstDate = StoreManifest.read(dir).firstDate();
    String shifted = StoreManifest.read(dir).firstLocalDate().plusDays(1).toString();
    Files.writeString(manifest, json.replace("\"" + firstDate + "\"", "\"" + shifted + "\""));
    String message = openFailure();
    assertTrue(message.startsWith(manifest + ": checksum mismatch: expected "), message);
    assertTrue(message.endsWith("; the file was changed after lagmill wrote it"), message);
  }

  @Test
  void shouldRefuseACurrentManifestWithoutItsChecksum() throws IOException {
    Path manifest = dir.resolve(StoreManifest.FILE_NAME);
    byte[] unsealed = SealedJson.unseal(manifest, Files.readAllBytes(manifest)).bytes();
    Files.write(manifest, unsealed);
    assertEquals(manifest + ": no crc32c member: expected one in format version 2, actual none (the line was "
        + "removed)", openFailure());
  }

  @Test
  void shouldOpenAVersionOneManifestWhichHadNoChecksum() throws IOException {
    Path manifest = dir.resolve(StoreManifest.FILE_NAME);
    String unsealed = new String(SealedJson.unseal(manifest, Files.readAllBytes(manifest)).bytes(),
        StandardCharsets.UTF_8);
    Files.writeString(manifest, unsealed.replace("\"formatVersion\" : 2", "\"formatVersion\" : 1"));
    try (SalesStore store = SalesStore.open(dir, budget)) {
      assertEquals(1, store.manifest().formatVersion());
      assertEquals(data.seriesCount(), store.seriesCount());
    }
  }

  @Test
  void shouldRefuseAVersionFromTheFuture() throws IOException {
    Path manifest = dir.resolve(StoreManifest.FILE_NAME);
    String unsealed = new String(SealedJson.unseal(manifest, Files.readAllBytes(manifest)).bytes(),
        StandardCharsets.UTF_8);
    Files.write(manifest, SealedJson.seal(unsealed.replace("\"formatVersion\" : 2", "\"formatVersion\" : 3")
        .getBytes(StandardCharsets.UTF_8)));
    assertEquals(manifest + ": unsupported format version: expected 1 to 2, actual 3", openFailure());
  }

  @Test
  void shouldRefuseAForgedFirstSaleDayOutsideTheStore() throws IOException {
    forgeSeriesField(0, SeriesTableLayout.FIRST_SALE_FIELD, 1_000_000_000);
    assertEquals(dir.resolve("series.bin") + ": series 0 has a first sale day outside the store: expected -1 or a "
        + "day index in [0, 30), actual 1000000000", openFailure());
  }

  @Test
  void shouldRefuseAForgedLargestValueThatDoesNotFitItsWidth() throws IOException {
    forgeSeriesField(1, SeriesTableLayout.MAX_UNITS_FIELD, -5);
    String message = openFailure();
    assertTrue(message.startsWith(dir.resolve("series.bin") + ": series 1 has a largest value that does not fit "
        + "its width: expected a value that needs "), message);
    assertTrue(message.endsWith(" bytes per value, actual -5"), message);
  }

  /** Writes one int of a series record, then re-signs the file, the manifest entry, the fingerprint and the seal. */
  private void forgeSeriesField(int seriesIndex, int field, int value) throws IOException {
    Path file = dir.resolve("series.bin");
    byte[] bytes = Files.readAllBytes(file);
    ByteBuffer buffer = ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN);
    buffer.putInt(SeriesTableLayout.recordOffset(seriesIndex) + field, value);
    int crc = Crc32c.of(bytes, 0, bytes.length - 4);
    buffer.putInt(bytes.length - 4, crc);
    Files.write(file, bytes);
    StoreManifest old = StoreManifest.read(dir);
    List<StoreManifest.StoreFile> files = new ArrayList<>();
    for (StoreManifest.StoreFile f : old.files()) {
      files.add(f.name().equals("series.bin") ? new StoreManifest.StoreFile(f.name(), f.bytes(), Crc32c.hex(crc)) : f);
    }
    // Through the JSON tree, so the forgery keeps whatever other fields the manifest has.
    Path manifest = dir.resolve(StoreManifest.FILE_NAME);
    ObjectMapper json = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    ObjectNode tree = (ObjectNode) json.readTree(SealedJson.unseal(manifest, Files.readAllBytes(manifest)).bytes());
    tree.set("files", json.valueToTree(files));
    tree.put("fingerprint", StoreManifest.fingerprintOf(files));
    Files.write(manifest, SealedJson.seal(json.writeValueAsBytes(tree)));
  }
}
