package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.features.FeatureSpec.RollingStat;
import org.lagmill.features.FeatureSpec.Strategy;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ArraySalesHistory;

/**
 * Bit-for-bit regression guard: every streamed value, label, weight, series and day of a few fixed passes, folded into
 * one 64-bit fingerprint over the raw float bits (so even a different NaN payload or a last-bit rounding change
 * fails). The expected fingerprints were recorded from the straightforward per-value implementation (each kernel
 * writing every value with {@code FeatureBatch.set}, commit 162a615) before its loops were restructured for speed;
 * the reference tests check the values' meaning, this one checks that a speed change altered no bit.
 */
class FeaturePassBitsTest {
  private static final List<RollingStat> ALL_STATS = List.of(RollingStat.values());

  @Test
  void shouldStreamTheSameBitsAsThePerValueImplementationForTheDefaultSpec() {
    RandomStore store = new RandomStore(7001L, 30, 200, 0, true);
    FeaturePass pass = FeaturePass.training(store.history, FeatureSpec.defaults());
    assertEquals(0xe628586f220735c5L, fingerprint(pass, 37), "default spec, 37-row batches");
    assertEquals(0xe628586f220735c5L, fingerprint(pass, 100_000), "default spec, one batch");
  }

  @Test
  void shouldStreamTheSameBitsForEveryStatisticWithoutPreLaunchSkip() {
    RandomStore store = new RandomStore(7002L, 24, 160, 0, true);
    FeatureSpec spec = FeatureSpec.builder().rollingStats(ALL_STATS).rollingWindowDays(1, 7, 28, 90)
        .skipPreLaunch(false).build();
    assertEquals(0xa2ae4bf74e0a644dL, fingerprint(FeaturePass.training(store.history, spec), 13), "every statistic");
  }

  @Test
  void shouldStreamTheSameBitsForRecursiveShortLagsWithoutPrices() {
    RandomStore store = new RandomStore(7003L, 20, 120, 0, false);
    FeatureSpec spec = FeatureSpec.builder().strategy(Strategy.RECURSIVE).lagDays(1, 2, 7).rollingWindowDays(3, 7)
        .rollingShiftDays(1).rollingStats(ALL_STATS).build();
    assertEquals(0x9e2df43d24f6cbd9L, fingerprint(FeaturePass.training(store.history, spec), 1000),
        "recursive, no prices");
  }

  @Test
  void shouldStreamTheSameBitsForAWindowASubsetWithWeightsAndPredictionRows() {
    RandomStore store = new RandomStore(7004L, 18, 150, 28, true);
    FeatureSpec spec = FeatureSpec.builder().rollingStats(ALL_STATS).horizonDays(7).lagDays(7, 14).build();
    float[] weights = new float[18];
    for (int s = 0; s < weights.length; s++) {
      weights[s] = 0.5f + s / 7f;
    }
    FeaturePass window = FeaturePass.training(store.history, spec, new int[] {17, 2, 9, 4}, 40, 149)
        .withSeriesWeights(weights);
    assertEquals(0xe92f3109bc1430e4L, fingerprint(window, 29), "training window of a subset with weights");
    FeaturePass prediction = FeaturePass.prediction(store.history, FeatureSpec.defaults(), new int[] {15, 3, 7, 0},
        120, 58);
    assertEquals(0x450e5596aeec7baaL, fingerprint(prediction, 11), "prediction rows past the last day");
  }

  @Test
  void shouldStreamTheSameBitsForTotalsOnlyStatisticsAndOneDayWindows() {
    RandomStore store = new RandomStore(7005L, 20, 150, 0, true);
    FeatureSpec spec = FeatureSpec.builder().rollingStats(List.of(RollingStat.MEAN, RollingStat.STD,
        RollingStat.ZERO_SHARE)).rollingWindowDays(1, 2, 7, 30).skipPreLaunch(false).build();
    assertEquals(0x3dd37344fb5d1e70L, fingerprint(FeaturePass.training(store.history, spec), 17), "totals only");
  }

  @Test
  void shouldStreamTheSameBitsForUnitsWhoseSquaresPassTwoToThe53() {
    RandomStore store = new RandomStore(7006L, 12, 120, 0, true);
    java.util.Random random = new java.util.Random(7006L);
    int[][] units = new int[12][120];
    for (int s = 0; s < units.length; s++) {
      for (int d = 0; d < units[s].length; d++) {
        // up to 2^30: window sums of squares wrap a long, as the per-value implementation's did
        units[s][d] = random.nextInt(10) == 0 ? -1 : s < 4 ? random.nextInt(50) : random.nextInt(1 << (8 + 2 * s));
      }
    }
    ArraySalesHistory history = new ArraySalesHistory(RandomStore.FIRST_DATE, units, store.history.attributes(),
        store.history.prices(), store.history.calendar());
    FeatureSpec spec = FeatureSpec.builder().rollingStats(List.of(RollingStat.MEAN, RollingStat.STD))
        .rollingWindowDays(3, 28, 56).build();
    assertEquals(0x1651b75bc410432L, fingerprint(FeaturePass.training(history, spec), 64), "large units, mean and std");
    FeatureSpec all = spec.withRollingStats(ALL_STATS);
    assertEquals(0x216e58d2ea4a3882L, fingerprint(FeaturePass.training(history, all), 64),
        "large units, every statistic");
  }

  private static long fingerprint(RowStream pass, int capacityRows) {
    long[] hash = {1125899906842597L};
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        FeatureBatch batch = new FeatureBatch(budget, capacityRows, pass.schema().featureCount())) {
      pass.stream(batch, b -> {
        for (int r = 0; r < b.rowCount(); r++) {
          long h = hash[0];
          h = mix(h, b.seriesIndexes()[r]);
          h = mix(h, b.dayIndexes()[r]);
          h = mix(h, Float.floatToRawIntBits(b.labels()[r]));
          h = mix(h, Float.floatToRawIntBits(b.weights()[r]));
          for (int f = 0; f < b.featureCount(); f++) {
            h = mix(h, Float.floatToRawIntBits(b.get(r, f)));
          }
          hash[0] = h;
        }
      });
    }
    return hash[0];
  }

  private static long mix(long hash, int value) {
    return (hash ^ (value & 0xffffffffL)) * 0x100000001b3L + 31;
  }
}
