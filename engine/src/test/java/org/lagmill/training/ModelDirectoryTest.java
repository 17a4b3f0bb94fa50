package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.forecast.Forecaster;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.CorruptStoreException;

class ModelDirectoryTest {
  private static final long SEED = TestSeeds.master(4_401L);
  private static final int HORIZON_DAYS = 7;

  @Test
  void shouldForecastTheSameAfterSaveAndOpenWithOneModelPerStore(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED, 30, 180, 10);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 6, 179, HORIZON_DAYS, "store");
    Path modelDir = dir.resolve("model");
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      ModelManifest manifest = ModelDirectory.save(trained, modelDir, history, plan, "fp-1");
      assertEquals(List.of("dispersion.csv", "manifest.json", "model-0-st0.txt", "model-1-st1.txt", "model-2-st2.txt"),
          fileNames(modelDir));
      assertEquals(List.of("st0", "st1", "st2"), manifest.partitions().stream().map(PartitionReport::partitionValue)
          .toList());
      assertEquals("store", manifest.partitionAttribute());
      for (PartitionReport report : manifest.partitions()) {
        assertEquals(10, report.seriesCount(), report.partitionValue());
      }
      double[][] expected = Forecaster.forecast(trained, history, HORIZON_DAYS, budget);
      try (ModelSet opened = ModelDirectory.open(modelDir, history)) {
        double[][] actual = Forecaster.forecast(opened, history, HORIZON_DAYS, budget);
        for (int s = 0; s < expected.length; s++) {
          assertArrayEquals(expected[s], actual[s], "series " + s + ", seed " + SEED);
        }
        assertArrayEquals(trained.dispersionBySeries(), opened.dispersionBySeries());
        for (ModelSet.Partition partition : opened.partitions()) {
          for (int s : partition.seriesIndexes()) {
            assertEquals(partition.value(), history.attributes().value(2, history.attributes().code(s, 2)));
          }
        }
        // Each series is forecast by its own store's model: swapping two stores' model files changes the forecasts.
        ModelSet.Partition st0 = opened.partitions().get(0);
        ModelSet.Partition st1 = opened.partitions().get(1);
        double[][] crossed = new double[history.seriesCount()][HORIZON_DAYS];
        Forecaster.forecast(history, opened.spec(), st1.model()::predict, st0.seriesIndexes(), HORIZON_DAYS, budget,
            crossed);
        int s0 = st0.seriesIndexes()[0];
        assertTrue(!java.util.Arrays.equals(crossed[s0], actual[s0]), "store models are interchangeable; seed " + SEED);
      }
    }
  }

  @Test
  void shouldRecordTheTrainingAndValidationDates(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED + 1, 12, 120, 10);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 3, 110, 14, null);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      ModelManifest manifest = ModelDirectory.save(trained, dir.resolve("m"), history, plan, "fp");
      // Day 0 is 2022-12-26; the cut is day 110 (2023-04-15); validation is the 14 days ending there.
      assertEquals("2022-12-26", manifest.trainingFirstDate());
      assertEquals("2023-04-01", manifest.trainingLastDate());
      assertEquals("2023-04-02", manifest.validationFirstDate());
      assertEquals("2023-04-15", manifest.validationLastDate());
      ModelManifest read = ModelDirectory.readManifest(dir.resolve("m"));
      assertEquals(List.of("2022-12-26", "2023-04-01", "2023-04-02", "2023-04-15"), List.of(read.trainingFirstDate(),
          read.trainingLastDate(), read.validationFirstDate(), read.validationLastDate()));
      assertEquals(List.of("dispersion.csv", "manifest.json", "model.txt"), fileNames(dir.resolve("m")));
    }
  }

  @Test
  void shouldRejectAModelFileWithAFlippedByte(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED + 2, 12, 120, 10);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 3, 119, HORIZON_DAYS, null);
    Path modelDir = dir.resolve("m");
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      ModelManifest manifest = ModelDirectory.save(trained, modelDir, history, plan, "fp");
      Path file = modelDir.resolve("model.txt");
      byte[] bytes = Files.readAllBytes(file);
      bytes[bytes.length / 2] ^= 0x04;
      Files.write(file, bytes);
      String expected = manifest.modelFileChecksums().get("model.txt");
      CorruptStoreException e = assertThrows(CorruptStoreException.class, () -> ModelDirectory.open(modelDir,
          history));
      assertEquals(file + ": model file checksum mismatch: expected " + expected + ", actual "
          + ModelDirectory.crc32c(file), e.getMessage());
      assertTrue(!expected.equals(ModelDirectory.crc32c(file)));
    }
  }

  @Test
  void shouldLeaveAnExistingModelDirectoryIntactWhenASaveFails(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = SmallHistories.history(SEED + 3, 12, 120, 10);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 3, 119, HORIZON_DAYS, null);
    Path modelDir = dir.resolve("m");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      try (ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
        ModelDirectory.save(trained, modelDir, history, plan, "first");
      }
      Map<String, byte[]> before = contents(modelDir);
      ModelSet closed = ModelTraining.train(history, plan.withCutDayIndex(110), budget, ProgressListener.SILENT);
      closed.close();
      // A closed booster cannot be saved: the failure comes after the temporary sibling was created and written to.
      assertThrows(IllegalStateException.class, () -> ModelDirectory.save(closed, modelDir, history, plan, "second"));
      Map<String, byte[]> after = contents(modelDir);
      assertEquals(before.keySet(), after.keySet());
      for (String name : before.keySet()) {
        assertArrayEquals(before.get(name), after.get(name), name);
      }
      assertEquals(List.of("m"), fileNames(dir), "no temporary sibling is left behind");
      assertEquals("first", ModelDirectory.readManifest(modelDir).storeFingerprint());
    }
  }

  private static List<String> fileNames(Path dir) throws IOException {
    try (Stream<Path> files = Files.list(dir)) {
      List<String> names = new ArrayList<>(files.map(p -> p.getFileName().toString()).toList());
      names.sort(null);
      return names;
    }
  }

  private static Map<String, byte[]> contents(Path dir) throws IOException {
    Map<String, byte[]> result = new TreeMap<>();
    for (String name : fileNames(dir)) {
      result.put(name, Files.readAllBytes(dir.resolve(name)));
    }
    return result;
  }
}
