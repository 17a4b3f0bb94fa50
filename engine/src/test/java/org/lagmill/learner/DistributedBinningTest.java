package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.memory.MemoryBudget;

/** The settings every rank shares beyond one machine's, against LightGBM 4.3.0's own layout and rules. */
class DistributedBinningTest {
  private static final long MASTER_SEED = TestSeeds.master(6_491L);

  /**
   * Bytes of one split's slot in the exchange: {@code SplitInfo::Size(max_cat_threshold)} of LightGBM 4.3.0,
   * src/treelearner/split_info.hpp: 2 ints, a uint32, a bool, 7 doubles, 2 int32 counts, the thresholds, an int8.
   */
  private static int slotBytes(int maxCategoriesPerSplit) {
    return 2 * 4 + 4 + 1 + 8 * 7 + 4 * 2 + maxCategoriesPerSplit * 4 + 1;
  }

  /**
   * Bytes {@code SplitInfo::CopyTo} writes for a split of {@code categoryCount} categories (same file): feature,
   * left and right count (int32 each), gain (double), threshold (uint32), left and right output, left sum of
   * gradients and hessians (doubles), left int64 sum, right sums likewise, default_left (bool), monotone type (int8),
   * the category count (int32) and the categories (uint32 each).
   */
  private static int writtenBytes(int categoryCount) {
    return 4 + 4 + 4 + 8 + 4 + 8 + 8 + 8 + 8 + 8 + 8 + 8 + 8 + 1 + 1 + 4 + 4 * categoryCount;
  }

  /**
   * The most categories LightGBM 4.3.0 lets one split of a feature with {@code binCount} bins hold
   * (FindBestThresholdCategoricalInner, src/treelearner/feature_histogram.hpp): one category while the bins fit
   * one-vs-rest ({@code max_cat_to_onehot}, 4), else at most {@code min(max_cat_threshold, (usedBins + 1) / 2)} of
   * the {@code binCount - 1} bins past the missing-value bin.
   */
  private static int mostCategoriesPerSplit(int binCount, int maxCategoriesPerSplit) {
    if (binCount <= 4) {
      return 1;
    }
    int usedBins = binCount - 1;
    return Math.min(maxCategoriesPerSplit, (usedBins + 1) / 2);
  }

  @Test
  void shouldNeverLetASplitOverrunItsSlotForAnyBinCount() {
    for (int binCount = 0; binCount <= 70_000; binCount++) {
      int limit = DistributedBinning.categoriesPerSplit(binCount);
      assertTrue(limit >= DistributedBinning.DEFAULT_CATEGORIES_PER_SPLIT, "bins " + binCount);
      assertTrue(writtenBytes(mostCategoriesPerSplit(binCount, limit)) <= slotBytes(limit),
          "bins " + binCount + ", limit " + limit);
      if (limit > DistributedBinning.DEFAULT_CATEGORIES_PER_SPLIT) {
        // the limit is the smallest that cannot overrun: one less would let the widest split overrun
        assertTrue(writtenBytes(mostCategoriesPerSplit(binCount, limit - 1)) > slotBytes(limit - 1),
            "bins " + binCount + ", limit " + limit);
      }
    }
  }

  @Test
  void shouldKeepOneMachinesLimitWhileItCannotOverrun() {
    // LightGBM's default overruns once a split may hold more than 28 categories, i.e. from 58 bins on
    assertTrue(writtenBytes(mostCategoriesPerSplit(57, 32)) <= slotBytes(32));
    assertTrue(writtenBytes(mostCategoriesPerSplit(58, 32)) > slotBytes(32));
    assertEquals(32, DistributedBinning.categoriesPerSplit(0));
    assertEquals(32, DistributedBinning.categoriesPerSplit(57));
    assertEquals(33, DistributedBinning.categoriesPerSplit(58));
    assertEquals(65, DistributedBinning.categoriesPerSplit(123));
  }

  @Test
  void shouldBinAsNumbersTheColumnsSomeRankLacks() {
    assertArrayEquals(new int[] {4, 9}, DistributedBinning.binnedAsNumbers(new int[] {1, 4, 6, 9},
        new double[] {0, 1, 0, 3}));
    assertArrayEquals(new int[0], DistributedBinning.binnedAsNumbers(new int[] {1, 4}, new double[] {0, 0}));
  }

  /**
   * A sample has a category for a column exactly when LightGBM's categorical binning (BinMapper::FindBin,
   * src/io/bin.cpp) would count at least one sampled row as not missing: NaN and codes whose integer part is negative
   * are missing; zeros, which the sample does not keep, are category 0.
   */
  @Test
  void shouldFindACategoryExactlyWhenLightGbmWouldCountANonMissingRow() {
    SplittableRandom random = new SplittableRandom(MASTER_SEED);
    float[] kinds = {Float.NaN, -1f, -7.5f, -0.5f, 0f, 1e-36f, 2f, 130f};
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        FeatureBatch batch = new FeatureBatch(budget, 64, 1)) {
      for (int trial = 0; trial < 2_000; trial++) {
        int rowCount = 1 + random.nextInt(40);
        // most trials draw only from the missing kinds, so "no category" is common
        int kindCount = random.nextInt(4) == 0 ? kinds.length : 3;
        float[] column = new float[rowCount];
        for (int r = 0; r < rowCount; r++) {
          column[r] = kinds[random.nextInt(kindCount)];
        }
        RowSample sample = new RowSample(rowCount, rowCount, 1, MASTER_SEED);
        batch.reset(0);
        for (int r = 0; r < rowCount; r++) {
          batch.addRow(0, r, 0f, 1f);
          batch.set(r, 0, column[r]);
        }
        sample.accept(batch);
        boolean expected = false;
        for (float value : column) {
          // FindBin: values within 1e-35 of zero are zeros; C++ casts toward zero, so -0.5 is code 0
          double code = Math.abs(value) <= 1e-35 ? 0 : value;
          expected |= !Double.isNaN(code) && (long) code >= 0;
        }
        assertEquals(expected, sample.hasCategory(0), "values " + java.util.Arrays.toString(column)
            + ", master seed " + MASTER_SEED);
      }
    }
  }

  @Test
  void shouldBinEveryCategoricalColumnAsCategoriesOnOneMachine() {
    List<String> names = new ArrayList<>(List.of("a", "b", "c"));
    FeatureSchema schema = new FeatureSchema(names, List.of(true, false, true));
    assertEquals(new DatasetParameters(255, 3, 10, 10, 1, false, false, 1).toLightGbmString(schema, 10),
        new DatasetParameters(255, 3, 10, 10, 1, false, false, 1).toLightGbmString(new int[] {0, 2}, 10));
    assertTrue(DatasetParameters.defaults().toLightGbmString(new int[] {2}, 10).endsWith(" categorical_feature=2"));
  }
}
