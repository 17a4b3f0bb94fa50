package org.lagmill.io;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class Crc32cTest {
  @TempDir
  Path temp;

  @Test
  void shouldGiveThePublishedCheckValue() throws Exception {
    // CRC-32C ("CRC-32/ISCSI") check value for the ASCII bytes "123456789": 0xE3069283, as listed in the CRC
    // catalogue of R. Williams' "A Painless Guide to CRC Error Detection Algorithms" parameter model and in
    // RFC 3720's CRC32C definition; also printed by a bit-by-bit Python script (reflected poly 0x82F63B78).
    byte[] digits = "123456789".getBytes(StandardCharsets.US_ASCII);
    assertEquals(0xE3069283, Crc32c.of(digits));
    assertEquals("e3069283", Crc32c.hex(Crc32c.of(digits)));
    Path file = Files.write(temp.resolve("digits"), digits);
    assertEquals(0xE3069283, Crc32c.ofFile(file));
  }

  @Test
  void shouldChecksumAFileLargerThanOneReadChunkLikeTheWholeArray() throws Exception {
    byte[] bytes = new byte[(1 << 16) * 3 + 17];
    new java.util.Random(Long.getLong("lagmill.seed", 7L)).nextBytes(bytes);
    Path file = Files.write(temp.resolve("big"), bytes);
    assertEquals(Crc32c.of(bytes), Crc32c.ofFile(file));
    assertEquals(Crc32c.of(bytes, 0, 100_000), Crc32c.ofFile(file, 100_000));
  }
}
