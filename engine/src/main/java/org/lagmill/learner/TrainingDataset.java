package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_int;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;
import org.lagmill.features.FeatureSchema;

/**
 * A finished LightGBM Dataset (binned features, labels and optional weights) owned by this object. Only finished
 * Datasets are ever wrapped: creating a Booster on an unfinished one crashes the JVM.
 *
 * <p>Lifetime: close it after every Booster trained on it is done (a {@link TrainedModel} no longer needs it);
 * closing frees the native Dataset, twice is harmless, any use after close throws {@link IllegalStateException}.
 * Not thread-safe.
 */
public final class TrainingDataset implements AutoCloseable {
  private final FeatureSchema schema;
  private final DatasetStats stats;
  private final boolean validation;
  private final double weightSum;
  private final int[] categoricalColumns;
  private final TrainedModel initialScoresFrom;
  private SWIGTYPE_p_void handle;
  private RowScores.Rows recordedRows;
  private long carriedStartingScoreCount;
  private long predictedStartingScoreCount;

  TrainingDataset(SWIGTYPE_p_void handle, FeatureSchema schema, DatasetStats stats, boolean validation,
      double weightSum, int[] categoricalColumns) {
    this(handle, schema, stats, validation, weightSum, categoricalColumns, null);
  }

  /** @param initialScoresFrom the model whose raw scores the rows start from, or null (LightGBM's own start) */
  TrainingDataset(SWIGTYPE_p_void handle, FeatureSchema schema, DatasetStats stats, boolean validation,
      double weightSum, int[] categoricalColumns, TrainedModel initialScoresFrom) {
    this.handle = handle;
    this.initialScoresFrom = initialScoresFrom;
    this.categoricalColumns = categoricalColumns.clone();
    this.weightSum = weightSum;
    this.schema = schema;
    this.stats = stats;
    this.validation = validation;
  }

  public FeatureSchema schema() {
    return schema;
  }

  public long rowCount() {
    return stats.rowCount();
  }

  /** Sum of the rows' weights, or the row count when the rows carry none: what LightGBM's metrics divide by. */
  public double weightSum() {
    return weightSum;
  }

  public int featureCount() {
    return schema.featureCount();
  }

  public DatasetStats stats() {
    return stats;
  }

  /**
   * The columns LightGBM bins as categories: the schema's categorical columns, less those a distributed Dataset bins
   * as numbers ({@link DistributedBinning}). Ascending.
   */
  public int[] categoricalColumns() {
    return categoricalColumns.clone();
  }

  /**
   * The schema's categorical columns this Dataset bins as numbers (only a distributed Dataset does), ascending.
   */
  public int[] categoricalColumnsBinnedAsNumbers() {
    return java.util.Arrays.stream(schema.categoricalIndexes())
        .filter(column -> java.util.Arrays.binarySearch(categoricalColumns, column) < 0).toArray();
  }

  /** The most bins LightGBM gave any column binned as categories; 0 when there is none (or it dropped them all). */
  public int largestCategoricalBinCount() {
    SWIGTYPE_p_int out = lightgbmlib.new_intp();
    try {
      int largest = 0;
      for (int column : categoricalColumns) {
        Native.check(lightgbmlib.LGBM_DatasetGetFeatureNumBin(handle(), column, out),
            "LGBM_DatasetGetFeatureNumBin");
        largest = Math.max(largest, lightgbmlib.intp_value(out));
      }
      return largest;
    } finally {
      lightgbmlib.delete_intp(out);
    }
  }

  /** True for a Dataset built by reference to a training Dataset's bins (usable only for validation). */
  public boolean isValidation() {
    return validation;
  }

  public boolean isClosed() { return handle == null; }

  /**
   * The model whose raw scores each row starts from (LightGBM's {@code init_score}), set by
   * {@link DatasetBuilder#build(org.lagmill.features.RowStream, TrainedModel)}; null when the rows start from
   * LightGBM's own initial score. Not owned.
   */
  TrainedModel initialScoresFrom() {
    return initialScoresFrom;
  }

  /** Starting scores carried over from the starting model's own rows ({@link StartingScores}); 0 from scratch. */
  public long carriedStartingScoreCount() {
    return carriedStartingScoreCount;
  }

  /** Starting scores predicted by the starting model; 0 from scratch. */
  public long predictedStartingScoreCount() {
    return predictedStartingScoreCount;
  }

  void countStartingScores(long carried, long predicted) {
    carriedStartingScoreCount = carried;
    predictedStartingScoreCount = predicted;
  }

  /** Whether the builder recorded each row's series and day, for the trained model to keep the rows' scores. */
  boolean recordsRows() {
    return recordedRows != null;
  }

  /** @param rows this Dataset's rows' keys, owned from now on (freed by {@link #close()} unless taken) */
  void holdRecordedRows(RowScores.Rows rows) {
    recordedRows = rows;
  }

  /** The recorded rows, handed over to the caller (who closes them); null when none were recorded. */
  RowScores.Rows takeRecordedRows() {
    RowScores.Rows rows = recordedRows;
    recordedRows = null;
    return rows;
  }

  SWIGTYPE_p_void handle() {
    if (handle == null) {
      throw new IllegalStateException("training dataset is closed");
    }
    return handle;
  }

  @Override
  public void close() {
    if (recordedRows != null) {
      recordedRows.close();
      recordedRows = null;
    }
    if (handle != null) {
      SWIGTYPE_p_void freed = handle;
      handle = null;
      Native.check(lightgbmlib.LGBM_DatasetFree(freed), "LGBM_DatasetFree");
    }
  }
}
