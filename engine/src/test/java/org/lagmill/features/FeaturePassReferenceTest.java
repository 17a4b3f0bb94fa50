package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureSpec.RollingStat;
import org.lagmill.features.FeatureSpec.Strategy;

/** Every streamed feature value against {@link SlowFeatures} on seeded random stores. */
class FeaturePassReferenceTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);

  private static final List<RollingStat> ALL_STATS = List.of(RollingStat.values());

  @Test
  void shouldMatchReferenceForDefaultSpecWithTinyBatches() {
    checkTraining(FeatureSpec.defaults(), 24, 150, 7, true);
  }

  @Test
  void shouldMatchReferenceForEveryStatisticAndWindowsLongerThanShortSeries() {
    FeatureSpec spec = FeatureSpec.builder().rollingStats(ALL_STATS).rollingWindowDays(1, 7, 28, 90)
        .skipPreLaunch(false).build();
    checkTraining(spec, 18, 130, 13, true);
  }

  @Test
  void shouldMatchReferenceForRecursiveShortLagsWithoutPrices() {
    FeatureSpec spec = FeatureSpec.builder().strategy(Strategy.RECURSIVE).lagDays(1, 2, 7).rollingWindowDays(3, 7)
        .rollingShiftDays(1).rollingStats(ALL_STATS).build();
    checkTraining(spec, 15, 80, 1000, false);
  }

  @Test
  void shouldMatchReferenceForATrainingWindowInsideTheHistory() {
    FeatureSpec spec = FeatureSpec.builder().rollingStats(ALL_STATS).horizonDays(7).lagDays(7, 14).build();
    long seed = MASTER_SEED + 3;
    RandomStore store = new RandomStore(seed, 12, 120, 0, true);
    compare(FeaturePass.training(store.history, spec, 40, 119), new SlowFeatures(store, true).trainingRows(spec, 40,
        119), store, spec, 5, seed);
  }

  @Test
  void shouldMatchReferenceForPredictionRowsPastTheLastDay() {
    long seed = MASTER_SEED + 4;
    FeatureSpec spec = FeatureSpec.builder().rollingStats(ALL_STATS).build();
    RandomStore store = new RandomStore(seed, 15, 140, 28, true);
    int[] series = {14, 3, 7, 0};
    FeaturePass pass = FeaturePass.prediction(store.history, spec, series, 120, 48);
    List<int[]> expected = new java.util.ArrayList<>();
    for (int s : series) {
      for (int d = 120; d < 168; d++) {
        expected.add(new int[] {s, d});
      }
    }
    StreamedRows rows = compare(pass, expected, store, spec, 9, seed);
    for (StreamedRows.Row row : rows.rows) {
      float label = row.dayIndex() < 140 && store.units[row.seriesIndex()][row.dayIndex()] >= 0
          ? store.units[row.seriesIndex()][row.dayIndex()] : Float.NaN;
      assertEquals(label, row.label(), "label of series " + row.seriesIndex() + " day " + row.dayIndex());
    }
  }

  private void checkTraining(FeatureSpec spec, int seriesCount, int dayCount, int capacityRows, boolean withPrices) {
    Random seeds = new Random(MASTER_SEED);
    for (int round = 0; round < 3; round++) {
      long seed = seeds.nextLong();
      RandomStore store = new RandomStore(seed, seriesCount, dayCount, 0, withPrices);
      SlowFeatures slow = new SlowFeatures(store, withPrices);
      compare(FeaturePass.training(store.history, spec), slow.trainingRows(spec, 0, dayCount - 1), store, spec,
          capacityRows, seed);
    }
  }

  private static StreamedRows compare(FeaturePass pass, List<int[]> expectedRows, RandomStore store, FeatureSpec spec,
      int capacityRows, long seed) {
    String context = "master seed " + MASTER_SEED + ", store seed " + seed + ": ";
    boolean withPrices = !store.history.prices().isEmpty();
    SlowFeatures slow = new SlowFeatures(store, withPrices);
    assertEquals(expectedRows.size(), pass.rowCount(), context + "rowCount");
    StreamedRows rows = StreamedRows.of(pass, capacityRows);
    assertEquals(expectedRows.size(), rows.rows.size(), context + "streamed rows");
    assertTrue(rows.batchCount >= (expectedRows.size() + capacityRows - 1) / capacityRows, context + "batches");
    List<String> names = pass.schema().names();
    for (int i = 0; i < expectedRows.size(); i++) {
      StreamedRows.Row row = rows.rows.get(i);
      int s = expectedRows.get(i)[0];
      int d = expectedRows.get(i)[1];
      assertEquals(s, row.seriesIndex(), context + "series of row " + i);
      assertEquals(d, row.dayIndex(), context + "day of row " + i);
      assertEquals(1f, row.weight(), context + "weight");
      if (d < store.units[s].length && store.units[s][d] >= 0) {
        assertEquals(store.units[s][d], row.label(), context + "label of row " + i);
      }
      for (int f = 0; f < names.size(); f++) {
        String name = names.get(f);
        double expected = name.equals("days_since_first_sale")
            ? slow.daysSinceFirstSale(s, d, spec.shortestShiftDays()) : slow.value(name, s, d);
        assertClose(expected, row.values()[f], context + name + " of series " + s + " day " + d);
      }
    }
    return rows;
  }

  static void assertClose(double expected, float actual, String message) {
    if (Double.isNaN(expected) || Float.isNaN(actual)) {
      if (!(Double.isNaN(expected) && Float.isNaN(actual))) {
        fail(message + ": expected " + expected + " but was " + actual);
      }
      return;
    }
    double tolerance = 1e-5 * Math.max(1.0, Math.abs(expected));
    assertEquals(expected, actual, tolerance, message);
  }
}
