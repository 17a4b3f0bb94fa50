package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import de.siegmar.fastcsv.reader.CsvRecord;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class CsvSourceTest {
  @TempDir
  Path dir;

  private static List<String> readAll(Path file) {
    List<String> lines = new ArrayList<>();
    try (CsvSource source = CsvSource.open(file)) {
      lines.add(String.join("|", source.readHeader()));
      for (CsvRecord r = source.next(); r != null; r = source.next()) {
        lines.add(source.lineNumber() + ":" + String.join("|", r.getFields()));
      }
    }
    return lines;
  }

  @Test
  void shouldReadGzipLikePlainText() {
    StringBuilder text = new StringBuilder("a,b\n");
    for (int i = 0; i < 5000; i++) {
      text.append(i).append(",\"x ").append(i * 7).append("\"\n");
    }
    assertEquals(readAll(IngestFiles.write(dir, "t.csv", text.toString())),
        readAll(IngestFiles.write(dir, "t.csv.gz", text.toString())));
  }

  @Test
  void shouldSkipBlankLinesAndByteOrderMark() {
    Path file = IngestFiles.write(dir, "t.csv", "\uFEFFa,b\n\n1,2\r\n3,4\n");
    assertEquals(List.of("a|b", "3:1|2", "4:3|4"), readAll(file));
  }

  @Test
  void shouldNameTheLineOfAnInvalidUtf8Byte() throws IOException {
    // The bad byte sits far past the decoder's first read-ahead block, so only the locating re-scan can name its line.
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    bytes.write("a,b\n".getBytes(StandardCharsets.UTF_8));
    for (int i = 0; i < 3000; i++) {
      bytes.write(("caf\u00e9,line " + (i + 2) + "\n").getBytes(StandardCharsets.UTF_8));
    }
    bytes.write(new byte[] {'x', ',', (byte) 0xFF, '\n'});
    bytes.write("y,z\n".getBytes(StandardCharsets.UTF_8));
    for (String name : new String[] {"bad.csv", "bad.csv.gz"}) {
      Path file = IngestFiles.write(dir, name, bytes.toByteArray());
      InputFormatException e = assertThrows(InputFormatException.class, () -> readAll(file));
      assertEquals(file + ", line 3002: invalid UTF-8 byte 0xFF: expected UTF-8 text", e.getMessage());
      assertEquals(3002, e.lineNumber());
    }
  }

  @Test
  void shouldRefuseANulCharacterInAnyCellNamingItsColumn() {
    // every field-based reader (long sales, calendar, prices, plan, closures, forecast files) reads through here
    Path inData = IngestFiles.write(dir, "d.csv", "date,price\n2024-01-01,1\n2024-01-02,2\0\n");
    assertEquals(inData + ", line 3, column 2: price '2\\0' holds a NUL character: expected text (is the file UTF-16 or"
        + " binary?)", assertThrows(InputFormatException.class, () -> readAll(inData)).getMessage());
    Path inHeader = IngestFiles.write(dir, "h.csv.gz", "date,\0p\0r\0i\0c\0e\n2024-01-01,1\n");
    assertEquals(inHeader + ", line 1, column 2: header cell '\\0p\\0r\\0i\\0c\\0e' holds a NUL character: expected"
        + " text (is the file UTF-16 or binary?)",
        assertThrows(InputFormatException.class, () -> readAll(inHeader))
            .getMessage());
  }

  @Test
  void shouldRejectTruncatedGzip() throws IOException {
    StringBuilder text = new StringBuilder("a,b\n");
    for (int i = 0; i < 2000; i++) {
      text.append(i).append(',').append(i * 31 % 97).append('\n');
    }
    Path whole = IngestFiles.write(dir, "whole.csv.gz", text.toString());
    byte[] gz = Files.readAllBytes(whole);
    Path cut = IngestFiles.write(dir, "cut.csv", Arrays.copyOf(gz, gz.length / 2));
    Path cutGz = Files.move(cut, dir.resolve("cut.csv.gz"));
    InputFormatException e = assertThrows(InputFormatException.class, () -> readAll(cutGz));
    // the line the reader had reached when the compressed data ran out
    assertEquals(cutGz + ", line " + e.lineNumber() + ": truncated gzip stream: expected more compressed data, found"
        + " the end of the file", e.getMessage());
  }

  @ParameterizedTest
  @ValueSource(strings = {"a.csv.gz", "a.csv.GZ", "a.CSV.Gz"})
  void shouldReadGzipWhateverTheCaseOfItsSuffix(String name) throws IOException {
    Path written = IngestFiles.write(dir, name + ".tmp.gz", "a,b\n1,2\n");
    Path file = Files.move(written, dir.resolve(name));
    assertEquals(List.of("a|b", "2:1|2"), readAll(file));
  }

  @Test
  void shouldNameASemicolonOrTabSeparatedHeader() throws IOException {
    Path semicolons = IngestFiles.write(dir, "s.csv", "date;temp\n2024-01-01;1\n");
    assertEquals(semicolons + ", line 1: the header is one column holding ';' between its names: expected"
        + " comma-separated values (lagmill reads commas only)",
        assertThrows(InputFormatException.class,
            () -> readAll(semicolons)).getMessage());
    Path tabs = IngestFiles.write(dir, "t.csv", "item\t2024-01-01\na\t1\n");
    assertEquals(tabs + ", line 1: the header is one column holding '\\t' between its names: expected"
        + " comma-separated values (lagmill reads commas only)",
        assertThrows(InputFormatException.class,
            () -> WideSalesReader.open(tabs, "series_id").close()).getMessage());
    assertEquals(List.of("date", "2:2024-01-01"), readAll(IngestFiles.write(dir, "one.csv", "date\n2024-01-01\n")),
        "one column without a separator is a header like any other");
  }

  @Test
  void shouldRejectPlainTextNamedGz() throws IOException {
    Path plain = IngestFiles.write(dir, "p.csv", "a,b\n1,2\n");
    Path named = Files.move(plain, dir.resolve("p.csv.gz"));
    InputFormatException e = assertThrows(InputFormatException.class, () -> readAll(named));
    assertEquals(named + ": not gzip data: expected a gzip stream in a file named .gz", e.getMessage());
  }

  @Test
  void shouldRejectEmptyFileMissingFileAndRaggedRows() {
    Path empty = IngestFiles.write(dir, "e.csv", "");
    assertEquals(empty + ": empty file: expected a header line",
        assertThrows(InputFormatException.class, () -> readAll(empty)).getMessage());
    Path missing = dir.resolve("none.csv");
    // A missing file is an I/O failure (exit 6), the same for every input file, not bad input.
    UncheckedIOException notFound = assertThrows(UncheckedIOException.class, () -> readAll(missing));
    assertEquals(NoSuchFileException.class, notFound.getCause().getClass());
    assertEquals(missing.toString(), ((NoSuchFileException) notFound.getCause()).getFile());
    Path ragged = IngestFiles.write(dir, "r.csv", "a,b\n1,2\n3\n");
    assertEquals(ragged + ", line 3: found 1 fields, expected 2 as in the header",
        assertThrows(InputFormatException.class, () -> readAll(ragged)).getMessage());
  }

  @Test
  void shouldReturnNullAtEnd() {
    Path file = IngestFiles.write(dir, "h.csv", "a\n");
    try (CsvSource source = CsvSource.open(file)) {
      assertArrayEquals(new String[] {"a"}, source.readHeader());
      assertNull(source.next());
    }
  }
}
