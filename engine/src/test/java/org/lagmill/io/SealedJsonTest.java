package org.lagmill.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class SealedJsonTest {
  private static final Path FILE = Path.of("m/manifest.json");

  @Test
  void shouldAppendTheChecksumOfTheUnsealedBytesAsTheLastMember() {
    byte[] json = "{\n  \"firstDate\" : \"2025-01-06\",\n  \"dayCount\" : 3\n}".getBytes(StandardCharsets.UTF_8);
    String sealed = new String(SealedJson.seal(json), StandardCharsets.UTF_8);
    // Expected value from a bit-by-bit CRC-32C written in Python (reflected polynomial 0x82F63B78, initial value and
    // final xor 0xFFFFFFFF, as RFC 3720 appendix B.4 defines it), run on these exact bytes; the same script gives the
    // published check value e3069283 for "123456789" (see Crc32cTest).
    int expected = 0x6a929106;
    assertEquals("{\n  \"firstDate\" : \"2025-01-06\",\n  \"dayCount\" : 3,\n  \"crc32c\" : \""
        + String.format("%08x", expected) + "\"\n}", sealed);
    SealedJson.Unsealed back = SealedJson.unseal(FILE, sealed.getBytes(StandardCharsets.UTF_8));
    assertTrue(back.sealed());
    assertArrayEquals(json, back.bytes());
  }

  @Test
  void shouldRefuseAChangedDigit() {
    byte[] sealed = SealedJson.seal("{\n  \"firstDate\" : \"2025-01-06\"\n}\n".getBytes(StandardCharsets.UTF_8));
    String edited = new String(sealed, StandardCharsets.UTF_8).replace("2025-01-06", "2025-01-07");
    CorruptFileException e = assertThrows(CorruptFileException.class,
        () -> SealedJson.unseal(FILE, edited.getBytes(StandardCharsets.UTF_8)));
    assertTrue(e.getMessage().startsWith(FILE + ": checksum mismatch: expected "), e.getMessage());
    assertTrue(e.getMessage().endsWith("; the file was changed after lagmill wrote it"), e.getMessage());
  }

  @Test
  void shouldPassAFileWithoutTheMemberThroughFlaggedAsUnsealed() {
    byte[] plain = "{\n  \"formatVersion\" : 1\n}\n".getBytes(StandardCharsets.UTF_8);
    SealedJson.Unsealed back = SealedJson.unseal(FILE, plain);
    assertFalse(back.sealed());
    assertArrayEquals(plain, back.bytes());
  }

  @Test
  void shouldRefuseAMalformedMember() {
    String text = "{\n  \"a\" : 1,\n  \"crc32c\" : \"12\"\n}";
    CorruptFileException e = assertThrows(CorruptFileException.class,
        () -> SealedJson.unseal(FILE, text.getBytes(StandardCharsets.UTF_8)));
    assertEquals(FILE + ": malformed crc32c member: expected 8 lowercase hex digits", e.getMessage());
  }
}
