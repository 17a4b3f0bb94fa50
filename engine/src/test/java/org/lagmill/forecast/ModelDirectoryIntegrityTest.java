package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.io.CorruptFileException;
import org.lagmill.io.OutputRefusedException;
import org.lagmill.io.SealedJson;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.CorruptStoreException;
import org.lagmill.store.StoreNotices;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelManifest;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.TrainingPlan;

/**
 * Every byte of a model directory is checked on open (the manifest by its own checksum, the dispersion table by the
 * manifest's), a save never replaces a folder that is not a model, and a model left only as its backup by a killed
 * run is put back.
 */
class ModelDirectoryIntegrityTest {
  private static final long SEED = 4_511L;
  private static final int HORIZON_DAYS = 7;

  @TempDir
  Path temp;
  private final List<String> notices = new ArrayList<>();
  private Consumer<String> previousSink;
  private ArraySalesHistory history;
  private TrainingPlan plan;

  @BeforeEach
  void setUp() {
    previousSink = StoreNotices.sink();
    StoreNotices.setSink(notices::add);
    history = SmallHistories.history(Long.getLong("lagmill.seed", SEED), 12, 120, 10);
    plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 3, 119, HORIZON_DAYS, null);
  }

  @AfterEach
  void restore() {
    StoreNotices.setSink(previousSink);
  }

  private Path saved(String name) throws IOException {
    Path dir = temp.resolve(name);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      ModelDirectory.save(trained, dir, history, plan, "fp");
    }
    return dir;
  }

  @Test
  void shouldRefuseAnEditedManifestAndAnEditedDispersionTable() throws IOException {
    Path dir = saved("m");
    Path manifest = dir.resolve(ModelManifest.FILE_NAME);
    byte[] original = Files.readAllBytes(manifest);
    String text = new String(original, StandardCharsets.UTF_8);
    Files.writeString(manifest, text.replace("\"trainingFirstDate\" : \"", "\"trainingFirstDate\" : \"1"));
    CorruptFileException edited = assertThrows(CorruptFileException.class, () -> ModelDirectory.readManifest(dir));
    assertTrue(edited.getMessage().startsWith(manifest + ": checksum mismatch: expected "), edited.getMessage());

    Files.write(manifest, original);
    Path dispersion = dir.resolve(ModelManifest.DISPERSION_FILE_NAME);
    List<String> lines = new ArrayList<>(Files.readAllLines(dispersion));
    lines.set(1, lines.get(1).substring(0, lines.get(1).lastIndexOf(',')) + ",0.5");
    Files.write(dispersion, lines);
    CorruptStoreException table = assertThrows(CorruptStoreException.class, () -> ModelDirectory.open(dir, history));
    assertTrue(table.getMessage().startsWith(dispersion + ": dispersion table checksum mismatch: expected "),
        table.getMessage());
  }

  @Test
  void shouldReadAVersionOneManifestWithoutChecksums() throws IOException {
    Path dir = saved("m");
    Path manifest = dir.resolve(ModelManifest.FILE_NAME);
    String unsealed = new String(SealedJson.unseal(manifest, Files.readAllBytes(manifest)).bytes(),
        StandardCharsets.UTF_8);
    String versionOne = unsealed.replace("\"formatVersion\" : 2", "\"formatVersion\" : 1")
        .replaceAll(",\\n  \"dispersionFileChecksum\" : \"[0-9a-f]{8}\"", "");
    Files.writeString(manifest, versionOne);
    assertEquals(1, ModelDirectory.readManifest(dir).formatVersion());
    try (ModelSet opened = ModelDirectory.open(dir, history)) {
      assertEquals(history.seriesCount(), opened.dispersionBySeries().length);
    }
    Files.writeString(manifest, versionOne.replace("\"formatVersion\" : 1", "\"formatVersion\" : 2"));
    CorruptStoreException e = assertThrows(CorruptStoreException.class, () -> ModelDirectory.readManifest(dir));
    assertEquals(manifest + ": expected the crc32c member and the dispersion table's checksum in format version 2, "
        + "actual no crc32c member", e.getMessage());
  }

  @Test
  void shouldNeverSaveOverAFolderThatIsNotAModel() throws IOException {
    Path folder = Files.createDirectory(temp.resolve("notes"));
    Files.writeString(folder.resolve("plan.txt"), "mine");
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      OutputRefusedException e = assertThrows(OutputRefusedException.class,
          () -> ModelDirectory.save(trained, folder, history, plan, "fp"));
      assertEquals("refusing to write " + folder + ": the folder holds files that are not a lagmill model directory "
          + "(e.g. plan.txt); nothing was changed, choose a new or empty folder", e.getMessage());
      Path file = Files.writeString(temp.resolve("model"), "a file");
      assertThrows(OutputRefusedException.class, () -> ModelDirectory.save(trained, file, history, plan, "fp"));
    }
    assertEquals("mine", Files.readString(folder.resolve("plan.txt")));
    assertEquals("a file", Files.readString(temp.resolve("model")));
  }

  @Test
  void shouldPutBackAModelLeftOnlyAsItsBackupByARunThatDied() throws IOException {
    Path dir = saved("m");
    // What a kill between the two renames of a save leaves: the old model under its backup name, owned by a process
    // id that no longer exists (the largest pid Linux can hand out is 4194304).
    Path backup = temp.resolve(".m.old-99999999-a1b2c3");
    Files.move(dir, backup);
    Path unfinished = Files.createDirectory(temp.resolve(".m.tmp-99999999-d4e5f6"));
    Files.writeString(unfinished.resolve("model.txt"), "half");
    ModelManifest manifest = ModelDirectory.readManifest(dir);
    assertEquals("fp", manifest.storeFingerprint());
    assertEquals(List.of(dir + ": restored from .m.old-99999999-a1b2c3, left by a run that stopped between its two "
        + "renames", dir + ": removed .m.tmp-99999999-d4e5f6, left unfinished by a run that stopped"), notices);
    assertEquals(List.of("m"), listing(temp));
  }

  private static List<String> listing(Path dir) throws IOException {
    try (var files = Files.list(dir)) {
      return files.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }
}
