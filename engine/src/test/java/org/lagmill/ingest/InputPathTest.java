package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.UncheckedIOException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** An input path that is not a readable file is named with the reason, for every reader that opens files. */
@Tag("reliability")
class InputPathTest {
  @TempDir
  Path temp;

  @Test
  void shouldNameAFolderGivenAsAFile() throws Exception {
    Path folder = Files.createDirectory(temp.resolve("sales.csv"));
    FileSystemException e = assertThrows(FileSystemException.class, () -> InputFiles.open(folder));
    assertEquals(folder + ": is a folder: expected a file", e.getMessage());
    UncheckedIOException wrapped = assertThrows(UncheckedIOException.class, () -> CsvSource.open(folder));
    assertEquals(folder + ": is a folder: expected a file", wrapped.getCause().getMessage());
    assertThrows(FileSystemException.class, () -> WideSalesReader.open(folder, "series_id"));
  }
}
