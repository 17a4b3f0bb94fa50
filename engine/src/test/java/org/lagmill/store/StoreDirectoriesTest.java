package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class StoreDirectoriesTest {
  @TempDir
  Path temp;

  private List<String> siblings() throws IOException {
    try (Stream<Path> files = Files.list(temp)) {
      return files.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  @Test
  void shouldPublishIntoANewTarget() throws IOException {
    Path target = temp.resolve("store");
    Path build = StoreDirectories.createTempSibling(target);
    assertEquals(temp, build.getParent());
    Files.writeString(build.resolve("a"), "new");
    StoreDirectories.publish(build, target);
    assertEquals("new", Files.readString(target.resolve("a")));
    assertEquals(List.of("store"), siblings());
  }

  @Test
  void shouldReplaceAnExistingStoreAndLeaveNoBackup() throws IOException {
    Path target = temp.resolve("store");
    Files.createDirectory(target);
    Files.writeString(target.resolve("old"), "old");
    Path build = StoreDirectories.createTempSibling(target);
    Files.writeString(build.resolve("a"), "new");
    StoreDirectories.publish(build, target);
    assertFalse(Files.exists(target.resolve("old")));
    assertEquals(List.of("store"), siblings());
  }

  @Test
  void shouldKeepTheExistingStoreWhenTheSwapFails() throws IOException {
    Path target = temp.resolve("store");
    Files.createDirectory(target);
    Files.writeString(target.resolve("old"), "old");
    Path missing = temp.resolve(".store.tmp-gone");
    assertThrows(IOException.class, () -> StoreDirectories.publish(missing, target));
    assertEquals("old", Files.readString(target.resolve("old")));
    assertEquals(List.of("store"), siblings());
  }
}
