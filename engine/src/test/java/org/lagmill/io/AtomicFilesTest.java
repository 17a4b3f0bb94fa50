package org.lagmill.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class AtomicFilesTest {
  @TempDir
  Path temp;

  private List<String> listing() throws IOException {
    try (Stream<Path> files = Files.list(temp)) {
      return files.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  @Test
  void shouldReplaceAFileWholeAndLeaveNoTemporary() throws Exception {
    Path file = temp.resolve("out.csv");
    AtomicFiles.writeString(file, "old\n");
    AtomicFiles.writeString(file, "new\n");
    assertEquals("new\n", Files.readString(file));
    assertEquals(List.of("out.csv"), listing());
  }

  @Test
  void shouldLeaveTheOldFileWhenTheWriterFails() throws Exception {
    Path file = temp.resolve("out.csv");
    AtomicFiles.writeString(file, "old\n");
    assertThrows(IOException.class, () -> AtomicFiles.write(file, out -> {
      out.write("half".getBytes());
      throw new IOException("disk full");
    }));
    assertEquals("old\n", Files.readString(file));
    assertEquals(List.of("out.csv"), listing());
  }

  @Test
  void shouldQuoteCellsPerRfc4180() {
    // RFC 4180 section 2, rules 6 and 7: fields with line breaks, double quotes or commas are enclosed in double
    // quotes, and a double quote inside is escaped by another double quote.
    assertEquals("plain", CsvCells.cell("plain"));
    assertEquals("\"a,b\"", CsvCells.cell("a,b"));
    assertEquals("\"say \"\"hi\"\"\"", CsvCells.cell("say \"hi\""));
    assertEquals("\"two\nlines\"", CsvCells.cell("two\nlines"));
    assertEquals("\"cr\rhere\"", CsvCells.cell("cr\rhere"));
  }
}
