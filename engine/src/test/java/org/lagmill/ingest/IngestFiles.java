package org.lagmill.ingest;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.GZIPOutputStream;
import org.lagmill.store.ArraySeriesAttributes;

/** Test fixtures: input files and a small invented chain of series. */
final class IngestFiles {
  private IngestFiles() {}

  static Path write(Path dir, String name, String text) {
    return write(dir, name, text.getBytes(StandardCharsets.UTF_8));
  }

  /** Writes bytes, gzip-compressed when the name ends in .gz. */
  static Path write(Path dir, String name, byte[] bytes) {
    Path file = dir.resolve(name);
    try (OutputStream out = name.endsWith(".gz") ? new GZIPOutputStream(Files.newOutputStream(file))
        : Files.newOutputStream(file)) {
      out.write(bytes);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return file;
  }

  /** Items oat_bar, tea_tin, jam_jar in stores north_1, north_2 (region Northvale) and south_1 (region Southmoor). */
  static ArraySeriesAttributes chain() {
    String[] items = {"oat_bar", "tea_tin", "jam_jar"};
    String[][] stores = {{"north_1", "Northvale"}, {"north_2", "Northvale"}, {"south_1", "Southmoor"}};
    String[][] rows = new String[items.length * stores.length][];
    int s = 0;
    for (String item : items) {
      for (String[] store : stores) {
        rows[s++] = new String[] {item, store[0], store[1]};
      }
    }
    return ArraySeriesAttributes.of(new String[] {"item", "store", "region"}, rows);
  }
}
