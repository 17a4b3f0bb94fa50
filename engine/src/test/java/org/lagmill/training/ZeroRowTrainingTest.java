package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.ZeroRowSampling;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.SealedJson;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.ArraySalesHistory;

/**
 * Training with zero-row sampling: the training rows (and a refit's) are the sampled ones, the validation rows stay
 * whole, the counts reach the partition report, and the manifest says the share (1 for a model trained before).
 */
class ZeroRowTrainingTest {
  private static final long SEED = TestSeeds.master(20261203L);
  private static final int HORIZON_DAYS = 7;
  private static final int CUT_DAY_INDEX = 170;

  private static TrainingPlan plan(double zeroRowsKept, boolean refit) {
    return SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 8, CUT_DAY_INDEX, 14, null).withRefit(refit)
        .withZeroRowsKept(zeroRowsKept);
  }

  /** Most series sell rarely, so a good share of the rows are zeros. */
  private static ArraySalesHistory sparseHistory(long seed) {
    ArraySalesHistory dense = SmallHistories.history(seed, 30, 200, 10);
    int[][] units = new int[dense.seriesCount()][dense.dayCount()];
    java.util.SplittableRandom random = new java.util.SplittableRandom(seed);
    for (int s = 0; s < units.length; s++) {
      dense.readUnits(s, 0, units[s], 0, dense.dayCount());
      for (int d = 0; d < units[s].length; d++) {
        if (units[s][d] > 0 && random.nextInt(3) > 0) {
          units[s][d] = 0;
        }
      }
    }
    return new ArraySalesHistory(dense.firstDate(), units, dense.attributes(), dense.prices(), dense.calendar());
  }

  @Test
  void shouldTrainOnTheSampledRowsAndValidateOnEveryRow() {
    ArraySalesHistory history = sparseHistory(SEED);
    TrainingPlan plan = plan(0.3, true);
    assertTrue(plan.datasetParameters().useWeights(), "the inverse-probability weights must reach LightGBM");
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet sampled = ModelTraining.train(history, plan, budget, ProgressListener.SILENT);
        ModelSet whole = ModelTraining.train(history, plan(1.0, true), budget, ProgressListener.SILENT)) {
      PartitionReport report = sampled.partitions().get(0).report();
      PartitionReport wholeReport = whole.partitions().get(0).report();
      FeaturePass allTraining = FeaturePass.training(history, plan.spec(), null, 0, plan.trainingLastDayIndex());
      FeaturePass sampledTraining = FeaturePass.training(history, plan.spec(), null, 0, plan.trainingLastDayIndex(),
          ZeroRowSampling.of(0.3, plan.datasetParameters().seed()));
      String where = "seed " + SEED;
      assertEquals(sampledTraining.rowCount(), report.trainingRowCount(), where);
      assertEquals(allTraining.rowCount(), report.trainingRowCount() + report.droppedZeroRowCount(), where);
      assertEquals(allTraining.zeroRowCount(), report.zeroRowCount(), where);
      assertTrue(report.droppedZeroRowCount() > 0, where);
      assertEquals((float) (1 / 0.3), (float) report.zeroRowWeight(), where);
      assertEquals(wholeReport.validationRowCount(), report.validationRowCount(), "validation untouched, " + where);
      long allRows = FeaturePass.training(history, plan.spec(), null, 0, CUT_DAY_INDEX).rowCount();
      assertEquals(allRows, report.refitRowCount() + report.refitDroppedZeroRowCount(), "refit sampled alike, "
          + where);
      assertTrue(report.refitDroppedZeroRowCount() > report.droppedZeroRowCount(), where);
      assertEquals(0, wholeReport.droppedZeroRowCount());
      assertEquals(1.0, wholeReport.zeroRowWeight());
      assertEquals(allTraining.rowCount(), wholeReport.trainingRowCount());
      assertNull(PartitionReport.zeroRowsNotice(List.of(wholeReport)));
      String notice = PartitionReport.zeroRowsNotice(List.of(report));
      assertTrue(notice.startsWith(String.format(java.util.Locale.ROOT, "dropped %,d of %,d training rows with zero"
          + " sales", report.droppedZeroRowCount(), report.zeroRowCount())), notice);
      assertTrue(notice.contains("the refit on every day dropped"), notice);
    }
  }

  @Test
  void shouldTrainTheSameModelAtShareOneAsWithoutSampling() {
    ArraySalesHistory history = sparseHistory(SEED + 1);
    TrainingPlan today = SmallHistories.plan(SmallHistories.spec(HORIZON_DAYS), 8, CUT_DAY_INDEX, 14, null);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet a = ModelTraining.train(history, today, budget, ProgressListener.SILENT);
        ModelSet b = ModelTraining.train(history, today.withZeroRowsKept(1.0), budget, ProgressListener.SILENT)) {
      assertFalse(today.withZeroRowsKept(1.0).datasetParameters().useWeights());
      assertEquals(a.partitions().get(0).model().modelText(), b.partitions().get(0).model().modelText());
      assertArrayEquals(a.dispersionBySeries(), b.dispersionBySeries());
    }
  }

  @Test
  void shouldRecordTheShareInTheManifestAndReadOneFromAnOlderModel(@TempDir Path dir) throws IOException {
    ArraySalesHistory history = sparseHistory(SEED + 2);
    TrainingPlan plan = plan(0.5, false);
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
      ModelDirectory.save(trained, dir.resolve("m"), history, plan, "fp");
    }
    ModelManifest read = ModelDirectory.readManifest(dir.resolve("m"));
    assertEquals(0.5, read.zeroRowsKept());
    assertEquals(2.0, read.partitions().get(0).zeroRowWeight());
    assertTrue(read.partitions().get(0).droppedZeroRowCount() > 0);

    // A manifest written before sampling existed has none of its fields.
    Path file = dir.resolve("m").resolve(ModelManifest.FILE_NAME);
    ObjectNode tree = (ObjectNode) ModelDirectory.JSON.readTree(SealedJson.unseal(file, Files.readAllBytes(file))
        .bytes());
    tree.remove("zeroRowsKept");
    for (JsonNode partition : tree.get("partitions")) {
      ((ObjectNode) partition).remove(List.of("zeroRowCount", "droppedZeroRowCount", "zeroRowWeight",
          "refitDroppedZeroRowCount"));
    }
    Files.write(file, SealedJson.seal(ModelDirectory.JSON.writeValueAsBytes(tree)));
    ModelManifest older = ModelDirectory.readManifest(dir.resolve("m"));
    assertEquals(1.0, older.zeroRowsKept());
    assertEquals(1.0, older.partitions().get(0).zeroRowWeight());
    assertEquals(0, older.partitions().get(0).droppedZeroRowCount());
    assertNull(PartitionReport.zeroRowsNotice(older.partitions()));
  }

  @Test
  void shouldRefuseAShareOutsideZeroToOne() {
    for (double bad : new double[] {0, -1, 1.01, Double.NaN}) {
      InvalidRequestException e = assertThrows(InvalidRequestException.class, () -> plan(bad, false));
      assertTrue(e.getMessage().startsWith("‹zero-rows-kept› must be a share in (0, 1]"), e.getMessage());
    }
  }
}
