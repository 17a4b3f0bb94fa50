package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.store.SalesHistory;

class WideSalesReaderTest {
  private static final int U = SalesHistory.UNKNOWN_UNITS;

  @TempDir
  Path temp;

  private Path write(String name, String content) throws IOException {
    return write(name, content.getBytes(StandardCharsets.UTF_8));
  }

  private Path write(String name, byte[] content) throws IOException {
    Path file = temp.resolve(name);
    Files.write(file, content);
    return file;
  }

  private String failure(Path file) {
    return failure(file, "series_id");
  }

  private String failure(Path file, String seriesIdColumn) {
    InputFormatException e = assertThrows(InputFormatException.class, () -> {
      try (WideSalesReader reader = WideSalesReader.open(file, seriesIdColumn)) {
        String[] values = new String[reader.attributeNames().size()];
        int[] units = new int[reader.dayCount()];
        while (reader.next(values, units)) {
          assertTrue(values.length >= 0);
        }
      }
    });
    return e.getMessage().replace(temp + "/", "");
  }

  @Test
  void shouldReadAttributesAroundTheDateRunQuotedTextAndUnknownDays() throws IOException {
    Path file = write("sales.csv", "\uFEFFitem,\"store, \"\"north\"\"\",2024-02-28,2024-02-29,2024-03-01,promo\r\n"
        + "apple,\"s1, \"\"x\"\"\",3,,0,yes\r\n\r\n"
        + "pear,s2,12,7,2147483646,\"\"\n");
    try (WideSalesReader reader = WideSalesReader.open(file, "series_id")) {
      assertEquals(LocalDate.of(2024, 2, 28), reader.firstDate());
      assertEquals(3, reader.dayCount());
      assertEquals(List.of("item", "store, \"north\"", "promo"), reader.attributeNames());
      String[] values = new String[3];
      int[] units = new int[3];
      assertTrue(reader.next(values, units));
      assertArrayEquals(new String[] {"apple", "s1, \"x\"", "yes"}, values);
      assertArrayEquals(new int[] {3, U, 0}, units);
      assertEquals(2, reader.lineNumber());
      assertTrue(reader.next(values, units));
      assertArrayEquals(new String[] {"pear", "s2", ""}, values);
      assertArrayEquals(new int[] {12, 7, Integer.MAX_VALUE - 1}, units);
      assertEquals(4, reader.lineNumber());
      assertFalse(reader.next(values, units));
    }
  }

  @Test
  void shouldRenameTheSeriesIdColumn() throws IOException {
    Path file = write("sales.csv", "key,item,2024-01-01\nk1,a,1");
    try (WideSalesReader reader = WideSalesReader.open(file, "key")) {
      assertEquals(List.of("series_id", "item"), reader.attributeNames());
    }
  }

  @Test
  void shouldRejectEachMalformedUnitsCellWithLineAndColumn() throws IOException {
    String header = "item,store,2024-01-01,2024-01-02,2024-01-03\n";
    String ok = "a,s,1,2,3\n";
    assertEquals("sales.csv, line 3, column 4: expected a non-negative integer number of units, found \"-3\"",
        failure(write("sales.csv", header + ok + "b,s,1,-3,3\n")));
    assertEquals("sales.csv, line 2, column 3: expected a non-negative integer number of units, found \"3.5\"",
        failure(write("sales.csv", header + "b,s,3.5,1,3\n")));
    assertEquals("sales.csv, line 2, column 5: expected a non-negative integer number of units, found \"abc\"",
        failure(write("sales.csv", header + "b,s,1,1,abc\n")));
    assertEquals("sales.csv, line 2, column 4: expected a number of units of at most 2147483646, found "
        + "\"2147483647\"", failure(write("sales.csv", header + "b,s,1,2147483647,3\n")));
    assertEquals("sales.csv, line 2, column 4: expected a number of units of at most 2147483646, found "
        + "\"99999999999\"", failure(write("sales.csv", header + "b,s,1,99999999999,3\n")));
  }

  @Test
  void shouldRejectRaggedRows() throws IOException {
    String header = "item,store,2024-01-01,2024-01-02,2024-01-03\n";
    assertEquals("sales.csv, line 2: expected 5 cells as in the header, found 4",
        failure(write("sales.csv", header + "b,s,1,2\n")));
    assertEquals("sales.csv, line 2: expected 5 cells as in the header, found 1",
        failure(write("sales.csv", header + "b\n")));
    assertEquals("sales.csv, line 3: expected 5 cells as in the header, found 7",
        failure(write("sales.csv", header + "a,s,1,2,3\nb,s,1,2,3,4,5\n")));
    assertEquals("sales.csv, line 2: expected 4 cells as in the header, found 5",
        failure(write("sales.csv", "item,2024-01-01,2024-01-02,note\nb,1,2,x,y\n")));
  }

  @Test
  void shouldRejectBadHeaders() throws IOException {
    assertEquals("sales.csv: the file is empty: expected a header line of attribute and date columns",
        failure(write("sales.csv", "")));
    assertEquals("sales.csv, line 1: expected at least one column whose header is a date (yyyy-MM-dd), found none",
        failure(write("sales.csv", "item,store\na,b\n")));
    assertEquals("sales.csv, line 1, column 4: duplicate date column \"2024-01-01\" (first at column 2)",
        failure(write("sales.csv", "item,2024-01-01,2024-01-02,2024-01-01\n")));
    assertEquals("sales.csv, line 1, column 4: expected date 2024-01-03 (one day after the previous date column), "
        + "found \"2024-01-04\"", failure(write("sales.csv", "item,2024-01-01,2024-01-02,2024-01-04\n")));
    assertEquals("sales.csv, line 1, column 4: expected date 2024-01-15 (7 days, the step of the first two date "
        + "columns, after the previous date column), found \"2024-01-14\"",
        failure(write("sales.csv", "sku,2024-01-01,2024-01-08,2024-01-14\n")));
    assertEquals("sales.csv, line 1, column 3: expected the second date column 1 to 366 days after the first "
        + "(2024-01-08), found \"2024-01-01\"", failure(write("sales.csv", "sku,2024-01-08,2024-01-01\n")));
    assertEquals("sales.csv, line 1, column 4: expected the date columns in one contiguous run, found date "
        + "\"2024-01-02\" after the non-date column \"promo\"",
        failure(write("sales.csv", "item,2024-01-01,promo,2024-01-02\n")));
    assertEquals("sales.csv, line 1, column 2: expected a valid date (yyyy-MM-dd), found \"2023-02-29\"",
        failure(write("sales.csv", "item,2023-02-29\n")));
    assertEquals("sales.csv, line 1, column 3: duplicate column name \"item\" (first at column 1)",
        failure(write("sales.csv", "item,2024-01-01,item\n")));
  }

  @Test
  void shouldRejectInvalidUtf8AndBrokenQuotes() throws IOException {
    byte[] bad = "item,2024-01-01\nab\u00ff,1\n".getBytes(StandardCharsets.ISO_8859_1);
    assertEquals("sales.csv, line 2, column 1: expected UTF-8 text, found the invalid byte 0xFF at byte 3 of the cell",
        failure(write("sales.csv", bad)));
    assertEquals("sales.csv, line 2, column 1: unterminated quoted cell: expected a closing quote, found the end of "
        + "the file", failure(write("sales.csv", "item,2024-01-01\n\"abc,1\n")));
    assertEquals("sales.csv, line 2, column 1: expected a comma or the end of the line after a closing quote, found "
        + "\"x\"", failure(write("sales.csv", "item,2024-01-01\n\"abc\"x,1\n")));
  }

  @Test
  void shouldReadGzipLikePlainAndRejectATruncatedStream() throws IOException {
    StringBuilder csv = new StringBuilder("item,2024-01-01,2024-01-02\n");
    for (int i = 0; i < 5000; i++) {
      csv.append("item-").append(i).append(',').append(i % 300).append(',').append(i % 7 == 0 ? "" : "5").append('\n');
    }
    Path plain = write("sales.csv", csv.toString());
    ByteArrayOutputStream gz = new ByteArrayOutputStream();
    try (GZIPOutputStream out = new GZIPOutputStream(gz)) {
      out.write(csv.toString().getBytes(StandardCharsets.UTF_8));
    }
    Path gzip = write("sales.csv.gz", gz.toByteArray());
    try (WideSalesReader a = WideSalesReader.open(plain, "series_id");
        WideSalesReader b = WideSalesReader.open(gzip, "series_id")) {
      String[] va = new String[1];
      String[] vb = new String[1];
      int[] ua = new int[2];
      int[] ub = new int[2];
      int rows = 0;
      while (a.next(va, ua)) {
        assertTrue(b.next(vb, ub));
        assertArrayEquals(va, vb);
        assertArrayEquals(ua, ub);
        rows++;
      }
      assertFalse(b.next(vb, ub));
      assertEquals(5000, rows);
    }
    byte[] whole = gz.toByteArray();
    Path truncated = write("cut.csv.gz", java.util.Arrays.copyOf(whole, whole.length / 2));
    String message = failure(truncated);
    assertTrue(message.startsWith("cut.csv.gz, line "), message);
    assertTrue(message.endsWith(": truncated gzip stream: expected more compressed data, found the end of the file"),
        message);
  }

  @Test
  void shouldPropagateAMissingFile() {
    assertThrows(NoSuchFileException.class, () -> WideSalesReader.open(temp.resolve("none.csv"), "series_id"));
  }

  @Test
  void shouldParseCellsThatStraddleTheReadBuffer() throws IOException {
    int dayCount = 3000;
    StringBuilder header = new StringBuilder("item");
    LocalDate first = LocalDate.of(2020, 1, 1);
    for (int d = 0; d < dayCount; d++) {
      header.append(',').append(first.plusDays(d));
    }
    StringBuilder csv = new StringBuilder(header).append('\n');
    java.util.Random random = new java.util.Random(77);
    int[][] expected = new int[400][dayCount];
    for (int s = 0; s < expected.length; s++) {
      csv.append("i").append(s);
      for (int d = 0; d < dayCount; d++) {
        int v = random.nextInt(10) == 0 ? U : random.nextInt(1 << random.nextInt(31));
        expected[s][d] = v;
        csv.append(',').append(v == U ? "" : Integer.toString(v));
      }
      csv.append(s % 2 == 0 ? "\n" : "\r\n");
    }
    Path file = write("big.csv", csv.toString());
    try (WideSalesReader reader = WideSalesReader.open(file, "series_id")) {
      String[] values = new String[1];
      int[] units = new int[dayCount];
      for (int s = 0; s < expected.length; s++) {
        assertTrue(reader.next(values, units));
        assertEquals("i" + s, values[0]);
        assertArrayEquals(expected[s], units, "series " + s + " (seed 77)");
      }
      assertFalse(reader.next(values, units));
    }
  }

  @Test
  void shouldRefuseEmptySeriesIdsAndNulCharacters() throws IOException {
    assertEquals("w.csv, line 3: every attribute cell is empty: expected at least one value naming the series",
        failure(write("w.csv", "item,2024-03-01,store\na,1,s1\n,2,\n")));
    assertEquals("w.csv, line 2, column 1: series_id is empty: expected a value naming the series",
        failure(write("w.csv", "series_id,item,2024-03-01\n,a,1\n")));
    assertEquals("w.csv, line 2, column 3: key is empty: expected a value naming the series",
        failure(write("w.csv", "item,2024-03-01,key\na,1,\n"), "key"));
    assertEquals("w.csv, line 2, column 1: item 'a\\0b' holds a NUL character: expected text (is the file UTF-16 or"
        + " binary?)", failure(write("w.csv", "item,2024-03-01\na\0b,1\n")));
    assertEquals("w.csv, line 1, column 2: header cell 'st\\0' holds a NUL character: expected text (is the file"
        + " UTF-16 or binary?)", failure(write("w.csv", "item,st\0,2024-03-01\na,b,1\n")));
    assertEquals("w.csv, line 2, column 2: expected a non-negative integer number of units, found \"\\02\"",
        failure(write("w.csv", "item,2024-03-01\na,\0002\n")));
  }

  @Test
  void shouldReadAHeaderOfOneHundredThousandDayColumns() throws IOException {
    int dayCount = 100_000;
    StringBuilder csv = new StringBuilder("item");
    java.time.LocalDate first = java.time.LocalDate.of(1901, 1, 1);
    for (int d = 0; d < dayCount; d++) {
      csv.append(',').append(first.plusDays(d));
    }
    csv.append("\na").append(",1".repeat(dayCount)).append('\n');
    try (WideSalesReader reader = WideSalesReader.open(write("long.csv", csv.toString()), "series_id")) {
      assertEquals(dayCount, reader.dayCount());
      int[] units = new int[dayCount];
      assertTrue(reader.next(new String[1], units));
      assertEquals(1, units[dayCount - 1]);
    }
    // the duplicate check still names the first column of a repeated name
    assertEquals("w.csv, line 1, column 4: duplicate column name \"item\" (first at column 1)",
        failure(write("w.csv", "item,2024-03-01,2024-03-02,item\na,1,2,b\n")));
  }
}
