package org.lagmill.learner;

import java.util.Arrays;

/**
 * Settings every rank of a distributed training must share beyond those of one machine, each decided identically on
 * every rank. Both guard against native crashes of LightGBM 4.3.0's distributed learners (the version lightgbm4j
 * ships), read from its sources and reproduced here with 2 ranks:
 *
 * <ol>
 *   <li><b>Categories per split</b> ({@code max_cat_threshold}). The data and voting learners send each leaf's best
 *       split to the other ranks in a slot sized by {@code SplitInfo::Size(max_cat_threshold)}, which leaves out two
 *       64-bit sums the split also writes (src/treelearner/split_info.hpp; LightGBM issue #6491, fixed after 4.3.0). A
 *       categorical split holding more than {@code max_cat_threshold - 4} categories therefore overruns its slot: its
 *       last categories are overwritten or never sent, and a rank splits on garbage bins (SIGSEGV in
 *       {@code SerialTreeLearner::SplitInner}, heap corruption, or ranks holding different models). LightGBM lets a
 *       split hold at most {@code min(max_cat_threshold, binCount / 2)} categories, so a limit of at least
 *       {@code binCount / 2 + 4} for the feature with the most bins can never overrun. Every rank holds the same bin
 *       mappers, so every rank computes the same limit.</li>
 *   <li><b>Categorical columns with no category in a rank's sample.</b> Each rank finds the bins of a slice of the
 *       features from its own sample and sends them to the others ({@code BinMapper::CopyTo}). For a categorical
 *       column whose sampled values are all missing or negative, LightGBM leaves the bin-to-category table empty and
 *       copies from its null pointer: SIGSEGV in {@code LGBM_DatasetCreateFromSampledColumn} (src/io/bin.cpp; still
 *       so upstream). One machine never copies, so it simply drops such a column as constant. Every rank therefore
 *       reports which categorical columns its sample lacks a category for, and a column any rank lacks is binned as
 *       a number on every rank: all-missing numbers make a constant feature LightGBM drops, as one machine would.</li>
 * </ol>
 */
public final class DistributedBinning {
  /** LightGBM's default {@code max_cat_threshold}, what one machine trains with. */
  public static final int DEFAULT_CATEGORIES_PER_SPLIT = 32;
  /** Categories a split's slot loses to the two 64-bit sums {@code SplitInfo::Size} leaves out (16 bytes / 4). */
  static final int OVERRUN_CATEGORY_COUNT = 4;

  private DistributedBinning() {}

  /**
   * The {@code max_cat_threshold} every rank trains with: LightGBM's default when that cannot overrun, else the
   * smallest limit that cannot ({@code largestCategoricalBinCount / 2 + 4}).
   *
   * @param largestCategoricalBinCount the most bins of any feature binned as categories (0 when there is none)
   */
  public static int categoriesPerSplit(int largestCategoricalBinCount) {
    if (largestCategoricalBinCount < 0) {
      throw new IllegalArgumentException("bin count must be >= 0, got " + largestCategoricalBinCount);
    }
    return Math.max(DEFAULT_CATEGORIES_PER_SPLIT, largestCategoricalBinCount / 2 + OVERRUN_CATEGORY_COUNT);
  }

  /**
   * The categorical columns to bin as numbers on every rank: those for which at least one rank's sample holds no
   * usable category.
   *
   * @param categoricalColumns the schema's categorical column indexes, ascending
   * @param ranksLacking per entry of {@code categoricalColumns}, how many ranks' samples hold no usable category
   * @return column indexes, ascending (empty when every rank's sample has a category for every column)
   */
  static int[] binnedAsNumbers(int[] categoricalColumns, double[] ranksLacking) {
    if (categoricalColumns.length != ranksLacking.length) {
      throw new IllegalArgumentException(categoricalColumns.length + " categorical columns but "
          + ranksLacking.length + " counts");
    }
    int[] columns = new int[categoricalColumns.length];
    int count = 0;
    for (int i = 0; i < categoricalColumns.length; i++) {
      if (ranksLacking[i] > 0) {
        columns[count++] = categoricalColumns[i];
      }
    }
    return Arrays.copyOf(columns, count);
  }
}
