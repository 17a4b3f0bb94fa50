package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeFalse;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A destination that cannot be written and an input that cannot be read are named with the reason, exit code 6. The
 * permission cases need a user the permission bits apply to: run as root (as in some containers) they are skipped,
 * and the destination whose parent is a regular file, which denies every user, always runs.
 */
@Tag("reliability")
class DeniedPathTest {
  private static final Path TINY = Path.of("..", "testdata", "tiny");

  @TempDir
  static Path shared;
  private static Path store;
  private static Path model;

  @BeforeAll
  static void buildStoreAndModel() {
    store = shared.resolve("store");
    model = shared.resolve("model");
    MainRun ingest = MainRun.of("ingest", "--sales", TINY.resolve("sales.csv").toString(), "--store", store.toString(),
        "--quiet");
    assertEquals(0, ingest.exitCode(), ingest.err());
    MainRun train = MainRun.of("train", "--store", store.toString(), "--model", model.toString(), "--horizon", "2",
        "--lags", "2,3", "--windows", "2", "--rounds", "3", "--quiet");
    assertEquals(0, train.exitCode(), train.err());
  }

  private static void assertRefused(String expectedMessage, String... args) {
    MainRun run = MainRun.of(args);
    assertEquals(ExitCodes.IO_ERROR, run.exitCode(), run.err());
    assertEquals("lagmill: " + expectedMessage, run.err().strip());
  }

  @Test
  void shouldNameTheFileInTheWayWhenADestinationsParentIsARegularFile(@TempDir Path temp) throws IOException {
    Path file = Files.writeString(temp.resolve("notes.txt"), "mine");
    assertRefused(file + ": is a file where a folder is needed", "forecast", "--store", store.toString(), "--model",
        model.toString(), "--out", file.resolve("week.csv").toString());
    assertRefused(file + ": is a file where a folder is needed", "train", "--store", store.toString(), "--model",
        file.resolve("m").toString(), "--horizon", "2", "--lags", "2,3", "--windows", "2", "--rounds", "3",
        "--quiet");
    assertRefused(file.resolve("s") + ": Not a directory", "ingest", "--sales", TINY.resolve("sales.csv").toString(),
        "--store", file.resolve("s").toString(), "--quiet");
    assertEquals("mine", Files.readString(file), "the file in the way is untouched");
  }

  @Test
  void shouldSayPermissionDeniedForAFolderThatCannotBeWritten(@TempDir Path temp) throws IOException {
    Path folder = Files.createDirectory(temp.resolve("locked"));
    Files.setPosixFilePermissions(folder, PosixFilePermissions.fromString("r-xr-xr-x"));
    try {
      assumeFalse(Files.isWritable(folder), "permission bits do not deny this user (root): nothing to check");
      assertRefused(folder + ": cannot write in this folder: permission denied", "forecast", "--store",
          store.toString(), "--model", model.toString(), "--out", folder.resolve("week.csv").toString());
      assertRefused(folder.resolve("s") + ": permission denied", "ingest", "--sales", TINY.resolve("sales.csv")
          .toString(), "--store", folder.resolve("s").toString(), "--quiet");
    } finally {
      Files.setPosixFilePermissions(folder, PosixFilePermissions.fromString("rwxr-xr-x"));
    }
  }

  @Test
  void shouldSayPermissionDeniedForAnInputThatCannotBeRead(@TempDir Path temp) throws IOException {
    Path sales = Files.copy(TINY.resolve("sales.csv"), temp.resolve("sales.csv"));
    Files.setPosixFilePermissions(sales, PosixFilePermissions.fromString("---------"));
    try {
      assumeFalse(Files.isReadable(sales), "permission bits do not deny this user (root): nothing to check");
      assertRefused(sales + ": cannot be read: permission denied", "ingest", "--sales", sales.toString(), "--store",
          temp.resolve("s").toString(), "--quiet");
    } finally {
      Files.setPosixFilePermissions(sales, PosixFilePermissions.fromString("rw-r--r--"));
    }
  }

  @Test
  void shouldWordTheFailuresTheJdkLeavesWithoutAReason() {
    // Built by hand so the wording is checked whoever runs the tests: the JDK gives these exceptions no reason.
    Path temp = Path.of("/data/out/.week.csv.tmp-41-0a1b2c");
    assertEquals("/data/out: cannot write in this folder: permission denied", Main.message(new AccessDeniedException(
        temp.toString())));
    assertEquals("/data/out/week.csv: permission denied", Main.message(new AccessDeniedException(
        "/data/out/week.csv")));
    assertEquals(ExitCodes.IO_ERROR, Main.exitCodeOf(new AccessDeniedException("/data/out/week.csv")));
    assertEquals("/data/out: already exists", Main.message(new FileAlreadyExistsException("/data/out")));
  }
}
