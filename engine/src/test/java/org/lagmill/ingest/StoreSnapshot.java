package org.lagmill.ingest;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/** Every file under a store folder (pointer, lock, generations), names and bytes in path order, as one array. */
final class StoreSnapshot {
  private StoreSnapshot() {}

  static byte[] bytes(Path dir) throws IOException {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    List<Path> files;
    try (var paths = Files.walk(dir)) {
      files = paths.filter(Files::isRegularFile).sorted().toList();
    }
    for (Path file : files) {
      out.write(dir.relativize(file).toString().getBytes(StandardCharsets.UTF_8));
      out.write(0);
      out.write(Files.readAllBytes(file));
    }
    return out.toByteArray();
  }
}
