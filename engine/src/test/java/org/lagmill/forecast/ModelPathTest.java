package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Files;
import java.nio.file.FileSystemException;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.io.OutputRefusedException;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;

/** A store given where a model is expected is named as such, not reported as a broken model. */
class ModelPathTest {
  @Test
  void shouldSayInPlainWordsThatAStoreIsNotAModel(@TempDir Path temp) throws Exception {
    Path sales = Files.writeString(temp.resolve("s.csv"), "sku,2025-02-01,2025-02-02\nk1,1,2\n");
    Path store = temp.resolve("store");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(sales, store), budget);
    }
    // the mirror of a model given as the store, below: which folder it is and where it belongs
    FileSystemException e = assertThrows(FileSystemException.class, () -> ModelDirectory.readManifest(store));
    assertEquals(store + ": not a model: it holds a sales store; give the folder train wrote (a store folder goes to"
        + " ‹store›)", e.getMessage());
    OutputRefusedException refused = assertThrows(OutputRefusedException.class,
        () -> ModelDirectory.checkTarget(store));
    assertEquals("refusing to write " + store + ": it holds a sales store, not a model; nothing was changed, choose a"
        + " new or empty folder for the model (a store folder goes to ‹store›)", refused.getMessage());
  }

  @Test
  void shouldSayInPlainWordsThatAModelIsNotAStore(@TempDir Path temp) throws Exception {
    Path model = temp.resolve("model");
    org.lagmill.store.ArraySalesHistory history = SmallHistories.history(5L, 3, 60, 7);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(7), 2, 59, 7, null);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, plan, budget, org.lagmill.progress.ProgressListener.SILENT)) {
      ModelDirectory.save(trained, model, history, plan, "fp");
      java.nio.file.FileSystemException e = assertThrows(java.nio.file.FileSystemException.class,
          () -> org.lagmill.store.SalesStore.open(model, budget));
      assertEquals(model + ": not a store: it holds a trained model; give the folder ingest wrote (a model folder"
          + " goes to ‹model›)", e.getMessage());
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldNameAFileGivenWhereAStoreOrAModelFolderBelongs(@TempDir Path temp) throws Exception {
    Path notes = Files.writeString(temp.resolve("notes.txt"), "mine");
    FileSystemException asModel = assertThrows(FileSystemException.class, () -> ModelDirectory.readManifest(notes));
    assertEquals(notes + ": is a file, not a model: give the folder train wrote", asModel.getMessage());
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      FileSystemException asStore = assertThrows(FileSystemException.class,
          () -> org.lagmill.store.SalesStore.open(notes, budget));
      assertEquals(notes + ": is a file, not a store: give the folder ingest wrote", asStore.getMessage());
      assertEquals(0, budget.heldBytes());
    }
    assertEquals("mine", Files.readString(notes));
  }
}
