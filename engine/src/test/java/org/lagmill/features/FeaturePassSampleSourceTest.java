package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;

/** The sample source of a feature pass: whole series drawn by a seed, their rows exactly as the full pass has them. */
class FeaturePassSampleSourceTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);

  @Test
  void shouldYieldExactlyTheFullPassRowsOfTheChosenSeries() {
    for (int round = 0; round < 4; round++) {
      long seed = MASTER_SEED + round;
      RandomStore store = new RandomStore(seed, 60, 150, 0, round % 2 == 0);
      FeaturePass full = FeaturePass.training(store.history, FeatureSpec.defaults());
      long minimumRowCount = full.rowCount() / 5;
      RowStream source = full.sampleSource(minimumRowCount, seed);
      assertNotSame(full, source, "a pass of " + full.rowCount() + " rows, master seed " + MASTER_SEED);
      checkSubsetOf(full, source, minimumRowCount, 7, "round " + round + ", master seed " + MASTER_SEED);
    }
  }

  @Test
  void shouldKeepTheSeriesOrderAndWeightsOfAPartition() {
    RandomStore store = new RandomStore(MASTER_SEED, 40, 120, 0, true);
    Random random = new Random(MASTER_SEED);
    int[] partition = {37, 3, 21, 8, 30, 14, 1, 26, 11, 33, 5, 19, 28, 0, 24, 16, 9, 39, 2, 35};
    float[] weights = new float[store.history.seriesCount()];
    for (int s = 0; s < weights.length; s++) {
      weights[s] = 0.5f + random.nextInt(100) / 10f;
    }
    FeaturePass full = FeaturePass.training(store.history, FeatureSpec.defaults(), partition, 0, 119)
        .withSeriesWeights(weights);
    long minimumRowCount = full.rowCount() / 4;
    RowStream source = full.sampleSource(minimumRowCount, 99);
    List<Integer> order = checkSubsetOf(full, source, minimumRowCount, 64, "master seed " + MASTER_SEED);
    List<Integer> expectedOrder = new ArrayList<>();
    for (int s : partition) {
      if (order.contains(s)) {
        expectedOrder.add(s);
      }
    }
    assertEquals(expectedOrder, order, "series stream in the partition's order");
  }

  @Test
  void shouldChooseTheSameSeriesForASeedAndOthersForOtherSeeds() {
    RandomStore store = new RandomStore(MASTER_SEED, 80, 100, 0, false);
    FeaturePass full = FeaturePass.training(store.history, FeatureSpec.defaults());
    long minimumRowCount = full.rowCount() / 8;
    Set<Integer> first = seriesOf(full.sampleSource(minimumRowCount, 7));
    assertEquals(first, seriesOf(full.sampleSource(minimumRowCount, 7)), "master seed " + MASTER_SEED);
    assertEquals(first, seriesOf(FeaturePass.training(store.history, FeatureSpec.defaults())
        .sampleSource(minimumRowCount, 7)), "a new pass over the same history, master seed " + MASTER_SEED);
    Set<Set<Integer>> distinct = new LinkedHashSet<>();
    for (long seed = 0; seed < 5; seed++) {
      distinct.add(seriesOf(full.sampleSource(minimumRowCount, seed)));
    }
    // ten-odd series of about 70 with rows: five seeds drawing one subset would be a broken shuffle
    assertTrue(distinct.size() > 1, "five seeds chose " + distinct + ", master seed " + MASTER_SEED);
  }

  @Test
  void shouldDrawEverySeriesWithRowsAlikeAndNeverOneWithout() {
    // a partial Fisher-Yates shuffle draws each series first with probability 1 / candidates
    RandomStore store = new RandomStore(MASTER_SEED, 30, 100, 0, false);
    FeaturePass full = FeaturePass.training(store.history, FeatureSpec.defaults());
    int[] series = full.seriesIndexes();
    List<Integer> candidates = new ArrayList<>();
    StreamedRows rows = StreamedRows.of(full, 64);
    for (int s : series) {
      if (rows.rows.stream().anyMatch(r -> r.seriesIndex() == s)) {
        candidates.add(s);
      }
    }
    assertTrue(candidates.size() < series.length, "the random store has series without rows");
    int draws = 3_000;
    int[] chosenCounts = new int[series.length];
    for (int draw = 0; draw < draws; draw++) {
      // one row asked for: exactly one series is drawn
      RowStream source = full.sampleSource(1, MASTER_SEED + draw);
      Set<Integer> chosen = seriesOf(source);
      assertEquals(1, chosen.size());
      chosenCounts[chosen.iterator().next()]++;
    }
    double expected = draws / (double) candidates.size();
    double chiSquare = 0;
    for (int s : series) {
      if (!candidates.contains(s)) {
        assertEquals(0, chosenCounts[s], "series " + s + " has no rows but was drawn");
      } else {
        chiSquare += (chosenCounts[s] - expected) * (chosenCounts[s] - expected) / expected;
      }
    }
    // outside check: the 99.9th percentile of chi-square with (candidates - 1) degrees of freedom from commons-math3
    double limit = new ChiSquaredDistribution(candidates.size() - 1).inverseCumulativeProbability(0.999);
    assertTrue(chiSquare < limit, "chi-square " + chiSquare + " >= " + limit + " over " + candidates.size()
        + " series, master seed " + MASTER_SEED);
  }

  @Test
  void shouldBeThePassItselfWhenASubsetWouldHoldHalfOrMore() {
    RandomStore store = new RandomStore(MASTER_SEED, 20, 80, 0, true);
    FeaturePass full = FeaturePass.training(store.history, FeatureSpec.defaults());
    long rowCount = full.rowCount();
    assertTrue(rowCount > 10);
    assertSame(full, full.sampleSource(rowCount, 1));
    assertSame(full, full.sampleSource(rowCount * 3, 1));
    if (rowCount % 2 == 0) {
      assertSame(full, full.sampleSource(rowCount / 2, 1), "exactly twice the minimum");
    }
    assertSame(full, full.sampleSource((rowCount + 1) / 2, 1));
    assertNotSame(full, full.sampleSource((rowCount - 1) / 2, 1), "more than twice the minimum");
  }

  @Test
  void shouldRejectANonPositiveMinimum() {
    RandomStore store = new RandomStore(MASTER_SEED, 5, 60, 0, false);
    FeaturePass full = FeaturePass.training(store.history, FeatureSpec.defaults());
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> full.sampleSource(0, 1));
    assertEquals("minimumRowCount 0 is out of range: need at least 1 (ask for a few times the sample size)",
        e.getMessage());
  }

  /**
   * Streams the full pass, the source, then the full pass again, and checks that the source's rows are the full
   * pass's rows of the source's series in the full pass's order (features compared bit for bit), that it holds at
   * least {@code minimumRowCount} rows but would hold fewer without its largest series, and that streaming the source
   * left the full pass's rows unchanged (the two share buffers).
   *
   * @return the source's series in stream order
   */
  private static List<Integer> checkSubsetOf(FeaturePass full, RowStream source, long minimumRowCount,
      int capacityRows, String message) {
    assertEquals(full.schema(), source.schema(), message);
    StreamedRows fullRows = StreamedRows.of(full, capacityRows);
    StreamedRows sourceRows = StreamedRows.of(source, capacityRows);
    StreamedRows fullAgain = StreamedRows.of(full, capacityRows);
    assertEquals(source.rowCount(), sourceRows.rows.size(), message);
    assertTrue(source.rowCount() >= minimumRowCount, message);
    List<Integer> order = new ArrayList<>();
    int[] rowsBySeries = new int[full.seriesIndexes().length == 0 ? 0 : 1 + maxOf(full.seriesIndexes())];
    for (StreamedRows.Row row : sourceRows.rows) {
      if (order.isEmpty() || order.get(order.size() - 1) != row.seriesIndex()) {
        assertTrue(!order.contains(row.seriesIndex()), "series " + row.seriesIndex() + " streamed twice; " + message);
        order.add(row.seriesIndex());
      }
      rowsBySeries[row.seriesIndex()]++;
    }
    int largest = 0;
    for (int count : rowsBySeries) {
      largest = Math.max(largest, count);
    }
    assertTrue(source.rowCount() - largest < minimumRowCount, "drawn past the minimum: " + source.rowCount()
        + " rows, largest series " + largest + ", minimum " + minimumRowCount + "; " + message);
    List<StreamedRows.Row> expected = fullRows.rows.stream().filter(r -> order.contains(r.seriesIndex())).toList();
    assertEquals(expected.size(), sourceRows.rows.size(), message);
    for (int i = 0; i < expected.size(); i++) {
      assertSameRow(expected.get(i), sourceRows.rows.get(i), "source row " + i + "; " + message);
    }
    assertEquals(fullRows.rows.size(), fullAgain.rows.size(), message);
    for (int i = 0; i < fullRows.rows.size(); i++) {
      assertSameRow(fullRows.rows.get(i), fullAgain.rows.get(i), "full row " + i + " after the source; " + message);
    }
    return order;
  }

  private static void assertSameRow(StreamedRows.Row expected, StreamedRows.Row actual, String message) {
    assertEquals(expected.seriesIndex(), actual.seriesIndex(), message);
    assertEquals(expected.dayIndex(), actual.dayIndex(), message);
    assertEquals(Float.floatToIntBits(expected.label()), Float.floatToIntBits(actual.label()), message);
    assertEquals(Float.floatToIntBits(expected.weight()), Float.floatToIntBits(actual.weight()), message);
    int[] expectedBits = new int[expected.values().length];
    int[] actualBits = new int[actual.values().length];
    for (int f = 0; f < expectedBits.length; f++) {
      expectedBits[f] = Float.floatToIntBits(expected.values()[f]);
    }
    for (int f = 0; f < actualBits.length; f++) {
      actualBits[f] = Float.floatToIntBits(actual.values()[f]);
    }
    assertArrayEquals(expectedBits, actualBits, message);
  }

  private static Set<Integer> seriesOf(RowStream stream) {
    Set<Integer> series = new LinkedHashSet<>();
    for (StreamedRows.Row row : StreamedRows.of(stream, 256).rows) {
      series.add(row.seriesIndex());
    }
    assertNotEquals(0, series.size());
    return series;
  }

  private static int maxOf(int[] values) {
    int max = Integer.MIN_VALUE;
    for (int v : values) {
      max = Math.max(max, v);
    }
    return max;
  }
}
