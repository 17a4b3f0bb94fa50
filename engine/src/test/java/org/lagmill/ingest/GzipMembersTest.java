package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.SplittableRandom;
import java.util.zip.CRC32;
import java.util.zip.Deflater;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;

/**
 * gzip files read member after member, checked against the JDK's own gzip classes (java.util.zip, the reference for
 * RFC 1952 here), and every kind of damage named: cut short, corrupt inside, bytes after the end.
 */
@Tag("reliability")
class GzipMembersTest {
  private static final long MASTER_SEED = TestSeeds.master(0x6A1B2C3DL);

  @TempDir
  Path dir;

  private static byte[] gzip(byte[] plain) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    try (GZIPOutputStream gz = new GZIPOutputStream(out)) {
      gz.write(plain);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toByteArray();
  }

  private static byte[] readAll(byte[] compressed, SplittableRandom random) throws IOException {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    try (InputStream in = new GzipMembers(new ByteArrayInputStream(compressed))) {
      byte[] chunk = new byte[1 + random.nextInt(70_000)];
      for (int n = in.read(chunk, 0, chunk.length); n >= 0; n = in.read(chunk, 0, chunk.length)) {
        out.write(chunk, 0, n);
      }
    }
    return out.toByteArray();
  }

  private static byte[] jdkRead(byte[] compressed) throws IOException {
    try (InputStream in = new GZIPInputStream(new ByteArrayInputStream(compressed))) {
      return in.readAllBytes();
    }
  }

  private static byte[] randomText(SplittableRandom random, int byteCount) {
    byte[] text = new byte[byteCount];
    for (int i = 0; i < byteCount; i++) {
      text[i] = (byte) (random.nextInt(10) == 0 ? '\n' : '0' + random.nextInt(random.nextInt(1, 11)));
    }
    return text;
  }

  @Test
  void shouldReadLikeTheJdkWhateverTheMembersAndReadSizes() throws IOException {
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    for (int trial = 0; trial < 20; trial++) {
      byte[] plain = randomText(random, random.nextInt(0, 300_000));
      int memberCount = random.nextInt(1, 5);
      ByteArrayOutputStream compressed = new ByteArrayOutputStream();
      int from = 0;
      for (int m = 0; m < memberCount; m++) {
        int to = m == memberCount - 1 ? plain.length : random.nextInt(from, plain.length + 1);
        compressed.writeBytes(gzip(Arrays.copyOfRange(plain, from, to)));
        from = to;
      }
      byte[] expected = jdkRead(compressed.toByteArray());
      assertArrayEquals(plain, expected, "the JDK reads the members back to back");
      assertArrayEquals(expected, readAll(compressed.toByteArray(), random), "trial " + trial);
    }
  }

  @Test
  void shouldSkipTheOptionalHeaderFields() throws IOException {
    byte[] plain = "a,b\n1,2\n".getBytes(StandardCharsets.US_ASCII);
    ByteArrayOutputStream file = new ByteArrayOutputStream();
    // RFC 1952 section 2.3: ID1 ID2 CM FLG MTIME(4) XFL OS, then FEXTRA (XLEN + bytes), FNAME, FCOMMENT, FHCRC
    file.writeBytes(new byte[] {0x1F, (byte) 0x8B, 8, 0x04 | 0x08 | 0x10 | 0x02, 0, 0, 0, 0, 0, 3});
    file.writeBytes(new byte[] {3, 0, 'x', 'y', 'z'});
    file.writeBytes("sales.csv\0".getBytes(StandardCharsets.ISO_8859_1));
    file.writeBytes("a comment\0".getBytes(StandardCharsets.ISO_8859_1));
    file.writeBytes(new byte[] {0x12, 0x34});
    Deflater deflater = new Deflater(Deflater.DEFAULT_COMPRESSION, true);
    deflater.setInput(plain);
    deflater.finish();
    byte[] deflated = new byte[256];
    int deflatedLength = deflater.deflate(deflated);
    deflater.end();
    file.write(deflated, 0, deflatedLength);
    CRC32 crc = new CRC32();
    crc.update(plain);
    writeLittleEndian(file, crc.getValue());
    writeLittleEndian(file, plain.length);
    assertArrayEquals(plain, readAll(file.toByteArray(), new SplittableRandom(MASTER_SEED)));
  }

  private static void writeLittleEndian(ByteArrayOutputStream out, long value) {
    for (int i = 0; i < 4; i++) {
      out.write((int) (value >>> (8 * i)) & 0xFF);
    }
  }

  @Test
  void shouldRefuseBytesAfterTheLastMember() {
    byte[] gz = gzip("a,b\n1,2\n".getBytes(StandardCharsets.US_ASCII));
    for (byte[] tail : new byte[][] {{0}, {0, 0, 0, 0}, "garbage\n".getBytes(StandardCharsets.US_ASCII),
        {0x1F}}) {
      byte[] file = Arrays.copyOf(gz, gz.length + tail.length);
      System.arraycopy(tail, 0, file, gz.length, tail.length);
      GzipMembers.Damage e = assertThrows(GzipMembers.Damage.class,
          () -> readAll(file, new SplittableRandom(MASTER_SEED)));
      assertEquals(GzipMembers.DamageKind.TRAILING_BYTES, e.kind());
      assertEquals(gz.length, e.compressedOffset());
    }
  }

  @Test
  void shouldRefuseAMemberWhoseCheckValueOrLengthDiffers() {
    byte[] gz = gzip(randomText(new SplittableRandom(MASTER_SEED), 5000));
    for (int trailerByte : new int[] {gz.length - 8, gz.length - 1}) {
      byte[] bad = gz.clone();
      bad[trailerByte] ^= 0x01;
      GzipMembers.Damage e = assertThrows(GzipMembers.Damage.class,
          () -> readAll(bad, new SplittableRandom(MASTER_SEED)));
      assertEquals(GzipMembers.DamageKind.CORRUPT, e.kind());
      assertEquals(gz.length - 8, e.compressedOffset(), "the trailer's offset");
    }
  }

  @Test
  void shouldNameDamageCutShortOrNotGzip() {
    byte[] gz = gzip(randomText(new SplittableRandom(MASTER_SEED), 50_000));
    for (int length : new int[] {5, 12, gz.length / 2, gz.length - 3}) {
      assertThrows(EOFException.class,
          () -> readAll(Arrays.copyOf(gz, length), new SplittableRandom(MASTER_SEED)), "cut at " + length);
    }
    for (byte[] notGzip : new byte[][] {{}, {0x1F}, "a,b\n".getBytes(StandardCharsets.US_ASCII)}) {
      GzipMembers.Damage e = assertThrows(GzipMembers.Damage.class,
          () -> readAll(notGzip, new SplittableRandom(MASTER_SEED)));
      assertEquals(GzipMembers.DamageKind.NOT_GZIP, e.kind());
    }
  }

  /** A long sales file whose compressed middle is flipped: the reader sees garbled text first. */
  private Path corruptedMidStream(String name, byte[] plain) throws IOException {
    byte[] gz = gzip(plain);
    for (int i = gz.length / 2; i < gz.length / 2 + 20; i++) {
      gz[i] ^= 0x55;
    }
    return Files.write(dir.resolve(name), gz);
  }

  private static byte[] longSales(int rowCount) {
    StringBuilder text = new StringBuilder("sku,date,units\n");
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    for (int i = 0; i < rowCount; i++) {
      text.append("s").append(i / 60).append(",2024-").append(String.format("%02d-%02d", 1 + (i % 60) / 28,
          1 + (i % 60) % 28)).append(',').append(random.nextInt(10)).append('\n');
    }
    return text.toString().getBytes(StandardCharsets.US_ASCII);
  }

  @Test
  void shouldBlameTheCompressedStreamForTheReadersErrorOnDamagedData() throws IOException {
    Path file = corruptedMidStream("l.csv.gz", longSales(20_000));
    InputFormatException readerError = assertThrows(InputFormatException.class, () -> {
      try (CsvSource source = CsvSource.open(file)) {
        source.readHeader();
        while (source.next() != null) {
          // the garbled text fails a check of the CSV before the member's end is reached
        }
      }
    });
    InputFormatException blamed = InputFiles.blameCompressedStream(readerError);
    String expectedStart = file + ", line " + readerError.lineNumber() + ": compressed data is corrupt (";
    assertEquals(expectedStart, blamed.getMessage().substring(0, expectedStart.length()), blamed.getMessage());
    assertEquals(true, blamed.getMessage().endsWith(" of the file): expected an intact gzip stream"),
        blamed.getMessage());
  }

  @Test
  void shouldKeepTheReadersErrorWhenTheStreamIsIntact() {
    Path file = IngestFiles.write(dir, "ok.csv.gz", "sku,date,units\nA,2024-01-01,x\n");
    InputFormatException readerError = new InputFormatException(file, 2, 3, "expected units");
    assertSame(readerError, InputFiles.blameCompressedStream(readerError));
    Path plain = IngestFiles.write(dir, "ok.csv", "sku,date,units\nA,2024-01-01,x\n");
    InputFormatException plainError = new InputFormatException(plain, 2, 3, "expected units");
    assertSame(plainError, InputFiles.blameCompressedStream(plainError));
  }

  @Test
  void shouldNameTrailingBytesWithTheirCountAndOffset() throws IOException {
    byte[] gz = gzip("a,b\n1,2\n".getBytes(StandardCharsets.US_ASCII));
    byte[] withTail = Arrays.copyOf(gz, gz.length + 13);
    Path file = Files.write(dir.resolve("t.csv.gz"), withTail);
    InputFormatException e = assertThrows(InputFormatException.class, () -> {
      try (CsvSource source = CsvSource.open(file)) {
        source.readHeader();
        while (source.next() != null) {
          // read to the end, where the extra bytes are found
        }
      }
    });
    assertEquals(file + ", line 2: 13 bytes after the end of the gzip data at byte " + gz.length
        + ": expected the file to end with its last gzip member", e.getMessage());
  }
}
