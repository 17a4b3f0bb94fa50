package org.lagmill.learner;

import java.util.Arrays;
import java.util.stream.Collectors;
import org.lagmill.features.FeatureSchema;
import org.lagmill.io.InvalidRequestException;

/**
 * How a LightGBM Dataset is binned and built. LightGBM reads these only when the Dataset is created: given later to
 * the Booster they are silently ignored, so they live here and not in {@link TrainParameters}.
 *
 * @param maxBinCount largest number of histogram bins per feature ({@code max_bin}), in [2, 65535]
 * @param minDataInBin smallest number of sampled rows in one bin ({@code min_data_in_bin}), at least 1
 * @param sampleRowCount rows sampled to find the bin boundaries; all rows when the stream holds fewer
 * @param batchRowCount rows per pushed batch (the native batch holds {@code batchRowCount × featureCount} floats)
 * @param seed seeds the row sample and LightGBM's {@code data_random_seed}
 * @param deterministic asks LightGBM for bit-identical results across runs with the same thread count
 * @param useWeights whether the per-row weights of the stream become LightGBM's {@code weight} field
 * @param threadCount OpenMP threads used while pushing rows and binning
 */
public record DatasetParameters(
    int maxBinCount,
    int minDataInBin,
    int sampleRowCount,
    int batchRowCount,
    long seed,
    boolean deterministic,
    boolean useWeights,
    int threadCount) {
  public static final int DEFAULT_MAX_BIN_COUNT = 255;
  public static final int DEFAULT_MIN_DATA_IN_BIN = 3;
  public static final int DEFAULT_SAMPLE_ROW_COUNT = 200_000;
  public static final int DEFAULT_BATCH_ROW_COUNT = 65_536;

  public DatasetParameters {
    requireRange("maxBinCount", maxBinCount, 2, 65_535, "LightGBM's max_bin; 255 is the usual choice");
    requireRange("minDataInBin", minDataInBin, 1, Integer.MAX_VALUE, "3 is LightGBM's default");
    requireRange("sampleRowCount", sampleRowCount, 1, Integer.MAX_VALUE, "200000 rows bin most data well");
    requireRange("batchRowCount", batchRowCount, 1, Integer.MAX_VALUE, "a few tens of thousands of rows");
    requireRange("threadCount", threadCount, 1, 1024, "use the number of available processors");
  }

  /** Defaults: 255 bins, 3 rows per bin, 200,000 sampled rows, 65,536-row batches, seed 1, not deterministic. */
  public static DatasetParameters defaults() {
    return new DatasetParameters(DEFAULT_MAX_BIN_COUNT, DEFAULT_MIN_DATA_IN_BIN, DEFAULT_SAMPLE_ROW_COUNT,
        DEFAULT_BATCH_ROW_COUNT, 1L, false, false, Runtime.getRuntime().availableProcessors());
  }

  public DatasetParameters withMaxBinCount(int value) {
    return new DatasetParameters(value, minDataInBin, sampleRowCount, batchRowCount, seed, deterministic, useWeights,
        threadCount);
  }

  public DatasetParameters withSampleRowCount(int value) {
    return new DatasetParameters(maxBinCount, minDataInBin, value, batchRowCount, seed, deterministic, useWeights,
        threadCount);
  }

  public DatasetParameters withBatchRowCount(int value) {
    return new DatasetParameters(maxBinCount, minDataInBin, sampleRowCount, value, seed, deterministic, useWeights,
        threadCount);
  }

  public DatasetParameters withSeed(long value) {
    return new DatasetParameters(maxBinCount, minDataInBin, sampleRowCount, batchRowCount, value, deterministic,
        useWeights, threadCount);
  }

  public DatasetParameters withDeterministic(boolean value) {
    return new DatasetParameters(maxBinCount, minDataInBin, sampleRowCount, batchRowCount, seed, value, useWeights,
        threadCount);
  }

  public DatasetParameters withUseWeights(boolean value) {
    return new DatasetParameters(maxBinCount, minDataInBin, sampleRowCount, batchRowCount, seed, deterministic, value,
        threadCount);
  }

  public DatasetParameters withThreadCount(int value) {
    return new DatasetParameters(maxBinCount, minDataInBin, sampleRowCount, batchRowCount, seed, deterministic,
        useWeights, value);
  }

  /**
   * LightGBM's parameter string for a Dataset of {@code schema}. {@code force_col_wise=true} is always set: without
   * it LightGBM builds both the row-wise and the column-wise layout to time them, doubling the training peak.
   *
   * @param sampledRowCount rows actually sampled (becomes {@code bin_construct_sample_cnt})
   */
  String toLightGbmString(FeatureSchema schema, int sampledRowCount) {
    return toLightGbmString(schema.categoricalIndexes(), sampledRowCount);
  }

  /**
   * As {@link #toLightGbmString(FeatureSchema, int)}, binning as categories only {@code categoricalColumns} (a
   * distributed Dataset bins some of the schema's categorical columns as numbers: {@link DistributedBinning}).
   */
  String toLightGbmString(int[] categoricalColumns, int sampledRowCount) {
    StringBuilder text = new StringBuilder();
    text.append("max_bin=").append(maxBinCount)
        .append(" min_data_in_bin=").append(minDataInBin)
        .append(" bin_construct_sample_cnt=").append(sampledRowCount)
        .append(" data_random_seed=").append(seedAsInt(seed))
        .append(" force_col_wise=true")
        .append(" num_threads=").append(threadCount)
        .append(" verbosity=-1");
    if (deterministic) {
      text.append(" deterministic=true");
    }
    if (categoricalColumns.length > 0) {
      text.append(" categorical_feature=")
          .append(Arrays.stream(categoricalColumns).mapToObj(Integer::toString).collect(Collectors.joining(",")));
    }
    return text.toString();
  }

  /** LightGBM's seeds are C ints; fold the 64-bit seed so distinct high bits still matter. */
  static int seedAsInt(long seed) {
    return (int) (seed ^ (seed >>> 32)) & Integer.MAX_VALUE;
  }

  static void requireRange(String name, long value, long min, long max, String hint) {
    if (value < min || value > max) {
      throw new InvalidRequestException(name + " must be in [" + min + ", " + max + "], got " + value + " (" + hint
          + ")");
    }
  }

  static void requireRange(String name, double value, double min, double max, String hint) {
    if (!(value >= min && value <= max)) {
      throw new InvalidRequestException(name + " must be in [" + min + ", " + max + "], got " + value + " (" + hint
          + ")");
    }
  }
}
