package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;

class AsciiWriterTest {
  private static final long MASTER_SEED = TestSeeds.master(77L);

  @Test
  void shouldFormatIntegersLikeIntegerToStringAcrossBufferBoundaries() throws IOException {
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    StringBuilder expected = new StringBuilder();
    // Enough values to cross the 1 MiB buffer several times.
    try (AsciiWriter out = new AsciiWriter(bytes)) {
      int[] edges = {0, 9, 10, 99, 100, 254, 255, 999_999_999, Integer.MAX_VALUE};
      for (int value : edges) {
        out.writeInt(value);
        out.writeByte(',');
        expected.append(value).append(',');
      }
      for (int i = 0; i < 600_000; i++) {
        int value = random.nextInt(4) == 0 ? random.nextInt(Integer.MAX_VALUE) : random.nextInt(300);
        out.writeInt(value);
        out.writeByte(',');
        expected.append(value).append(',');
      }
      assertEquals(expected.length(), out.writtenBytes(), "seed " + MASTER_SEED);
    }
    assertEquals(expected.toString(), bytes.toString(StandardCharsets.US_ASCII), "seed " + MASTER_SEED);
  }

  @Test
  void shouldWriteCentsWithTwoDecimalsAndPadIds() throws IOException {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (AsciiWriter out = new AsciiWriter(bytes)) {
      for (int cents : new int[] {0, 5, 19, 100, 1249, 123456}) {
        out.writeCents(cents);
        out.writeByte(' ');
      }
      out.writeZeroPadded(41, 4);
      out.writeByte(' ');
      out.writeZeroPadded(12345, 4);
    }
    assertEquals("0.00 0.05 0.19 1.00 12.49 1234.56 0041 12345", bytes.toString(StandardCharsets.US_ASCII));
  }

  @Test
  void shouldCloseOnce() throws IOException {
    int[] closeCount = {0};
    ByteArrayOutputStream bytes = new ByteArrayOutputStream() {
      @Override
      public void close() {
        closeCount[0]++;
      }
    };
    AsciiWriter out = new AsciiWriter(bytes);
    out.writeAscii("abc");
    out.close();
    out.close();
    assertEquals(1, closeCount[0]);
    assertEquals("abc", bytes.toString(StandardCharsets.US_ASCII));
  }
}
