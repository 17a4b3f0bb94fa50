package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_double;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_int;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_double;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_int;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_void;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;
import com.microsoft.ml.lightgbm.lightgbmlibConstants;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeDoubleArray;
import org.lagmill.memory.NativeFloatArray;
import org.lagmill.memory.ProcessMemory;

/**
 * Builds LightGBM Datasets from a {@link RowStream} without ever holding the full feature matrix: one pass samples
 * rows to place the bin boundaries, a second pass pushes row batches straight from the batch's native memory, then
 * the Dataset is finished by hand and labels (and weights) are set.
 *
 * <p>Memory: the feature batch, the label and weight arrays and the sampled columns are reserved from the budget
 * given here and freed before a build returns; LightGBM's binned Dataset itself lives outside the budget (see
 * {@link DatasetStats}). Not thread-safe; one builder may build several Datasets one after the other.
 */
public final class DatasetBuilder {
  private static final int ROW_LIMIT = Integer.MAX_VALUE;
  /**
   * The sampling pass streams at least this many rows per sampled row (from {@link RowStream#sampleSource}): the row
   * sample is then drawn uniformly from a sub-stream a few times its size, never from a handful of series.
   */
  static final int SAMPLE_SOURCE_ROWS_PER_SAMPLE_ROW = 2;
  /**
   * ... and at least this share of the stream (1 / 32 of its rows), so the number of series the bins see grows with
   * the data; it costs the sampling pass about 3 % of a full pass.
   */
  static final int SAMPLE_SOURCE_STREAM_FRACTION_DIVISOR = 32;

  private final MemoryBudget budget;
  private final DatasetParameters parameters;

  public DatasetBuilder(MemoryBudget budget, DatasetParameters parameters) {
    this.budget = budget;
    this.parameters = parameters;
    NativeLibrary.load();
  }

  public DatasetParameters parameters() {
    return parameters;
  }

  /**
   * Builds a training Dataset from every row of {@code rows}; its bins come from a seeded sample of
   * {@link DatasetParameters#sampleRowCount()} rows (all rows when fewer), drawn uniformly from the rows of
   * {@code rows.sampleSource(...)}: for a large feature pass a seeded subset of whole series holding a few times the
   * sample, so the sampling pass produces only those rows; for a small stream, or one that cannot subset itself, the
   * whole stream. Every row of {@code rows} is pushed either way.
   *
   * @throws IllegalArgumentException when the stream is empty, holds 2^31 rows or more, or has a NaN/infinite label
   */
  public TrainingDataset build(RowStream rows) {
    return build(rows, rows.rowCount(), null, null, false);
  }

  /**
   * As {@link #build(RowStream)}, with every row starting from {@code startingModel}'s raw score (LightGBM's
   * {@code init_score}) instead of LightGBM's own initial score: the Dataset a training continued from that model
   * boosts on ({@link Trainer#continueFrom}). The raw scores are predicted batch by batch as the rows are pushed;
   * they take 8 bytes per row from this builder's budget until LightGBM has copied them.
   *
   * @param startingModel trained on the same feature schema; not owned, must stay open while the Dataset is used
   */
  public TrainingDataset build(RowStream rows, TrainedModel startingModel) {
    return build(rows, StartingScores.predicted(startingModel), false);
  }

  /**
   * As {@link #build(RowStream)}, with every row starting from {@code start}'s raw scores when it is given (carried
   * over where {@link StartingScores#carried()} holds the row, else predicted), and, with {@code recordRows}, each
   * row's series and day recorded so that the model trained on this Dataset keeps every row's score
   * ({@link TrainedModel#rowScores()}) for the next continued training: 16 bytes per row from this builder's budget,
   * held until that model is closed.
   *
   * @param start where the rows' starting scores come from, or null to start from LightGBM's own score
   */
  public TrainingDataset build(RowStream rows, StartingScores start, boolean recordRows) {
    return build(rows, rows.rowCount(), null, start, recordRows);
  }

  /**
   * Builds this rank's share of a distributed training Dataset over an open {@link LearnerNetwork}: only
   * {@code rows} (this rank's rows) are pushed, and LightGBM is told the row count over all ranks. Each rank draws
   * its bin sample from its own rows; LightGBM bins a slice of the features on each rank from that rank's sample and
   * exchanges the bin mappers, so every rank ends with the same bins (which therefore depend on how rows are split).
   * Every rank must call this at the same point, with the same schema and parameters. Before LightGBM bins, the
   * ranks agree through {@code rankSum} which categorical columns to bin as numbers ({@link DistributedBinning}).
   *
   * @param distributedRowCount training rows over every rank, at least {@code rows.rowCount()}
   * @param rankSum adds numbers over every rank
   */
  public TrainingDataset buildDistributed(RowStream rows, long distributedRowCount, RankSum rankSum) {
    if (distributedRowCount < rows.rowCount()) {
      throw new IllegalArgumentException("rows over all ranks (" + distributedRowCount + ") cannot be fewer than "
          + "this rank's " + rows.rowCount());
    }
    return build(rows, distributedRowCount, rankSum, null, false);
  }

  /**
   * @param rankSum null on one machine
   * @param start where the rows' starting raw scores come from, or null
   * @param recordRows record each row's series and day for the trained model to keep the rows' scores
   */
  private TrainingDataset build(RowStream rows, long distributedRowCount, RankSum rankSum, StartingScores start,
      boolean recordRows) {
    FeatureSchema schema = rows.schema();
    int rowCount = checkedRowCount(rows);
    int sampleRowCount = Math.min(parameters.sampleRowCount(), rowCount);
    long residentBefore = ProcessMemory.residentBytes();
    RowStream sampleSource = sampleSource(rows, sampleRowCount, parameters.seed());
    long sourceRowCount = sampleSource.rowCount();
    RowSample sample = new RowSample(sourceRowCount, sampleRowCount, schema.featureCount(), parameters.seed());
    try (FeatureBatch batch = newBatch(schema, rowCount)) {
      sampleSource.stream(batch, sample::accept);
      if (sample.rowsSeen() != sourceRowCount || sample.rowsSelected() != sampleRowCount) {
        throw new IllegalStateException("sample source promised " + sourceRowCount + " rows but produced "
            + sample.rowsSeen() + "; a RowStream must report its exact rowCount()");
      }
      int[] categoricalColumns = schema.categoricalIndexes();
      if (rankSum != null) {
        categoricalColumns = categoricalColumnsOnEveryRank(categoricalColumns, sample, rankSum);
      }
      SWIGTYPE_p_void handle = createFromSample(sample, schema, sampleRowCount, rowCount, distributedRowCount,
          categoricalColumns);
      return pushRowsAndWrap(handle, rows, batch, rowCount, start, recordRows, false, categoricalColumns,
          sampleRowCount, sample.keptValueCount(), residentBefore);
    }
  }

  /**
   * Pushes the rows into the created Dataset {@code handle} and wraps it; frees it on failure.
   *
   * @param start where the rows' starting raw scores come from, or null
   */
  private TrainingDataset pushRowsAndWrap(SWIGTYPE_p_void handle, RowStream rows, FeatureBatch batch, int rowCount,
      StartingScores start, boolean recordRows, boolean validation, int[] categoricalColumns, int sampleRowCount,
      long sampleValueCount, long residentBefore) {
    TrainedModel startingModel = start == null ? null : start.model();
    RowScores.Rows recorded = null;
    StartingScoreFiller filler = null;
    double weightSum;
    try {
      recorded = recordRows ? new RowScores.Rows(budget, rowCount) : null;
      filler = start == null ? null : new StartingScoreFiller(start, parameters.threadCount(), budget);
      weightSum = pushRowsAndFinish(handle, rows, batch, rowCount, filler, recorded);
    } catch (RuntimeException | Error e) {
      if (recorded != null) {
        recorded.close();
      }
      lightgbmlib.LGBM_DatasetFree(handle);
      throw e;
    } finally {
      if (filler != null) {
        filler.close();
      }
    }
    DatasetStats stats = new DatasetStats(rowCount, rows.schema().featureCount(), sampleRowCount, sampleValueCount,
        residentBefore, ProcessMemory.residentBytes());
    TrainingDataset dataset = new TrainingDataset(handle, rows.schema(), stats, validation, weightSum,
        categoricalColumns, startingModel);
    dataset.holdRecordedRows(recorded);
    if (filler != null) {
      dataset.countStartingScores(filler.carriedRowCount(), filler.predictedRowCount());
    }
    return dataset;
  }

  /**
   * The categorical columns LightGBM may bin as categories on every rank: those every rank's sample holds a category
   * for; the others are binned as numbers everywhere ({@link DistributedBinning}, second point).
   */
  private static int[] categoricalColumnsOnEveryRank(int[] categoricalColumns, RowSample sample, RankSum rankSum) {
    double[] lacking = new double[categoricalColumns.length];
    for (int i = 0; i < categoricalColumns.length; i++) {
      lacking[i] = sample.hasCategory(categoricalColumns[i]) ? 0 : 1;
    }
    double[] ranksLacking = rankSum.sum(lacking);
    int[] asNumbers = DistributedBinning.binnedAsNumbers(categoricalColumns, ranksLacking);
    return java.util.Arrays.stream(categoricalColumns)
        .filter(column -> java.util.Arrays.binarySearch(asNumbers, column) < 0).toArray();
  }

  /**
   * The rows {@link #build} streams in its sampling pass for {@code rows} (to size progress reports): the whole stream
   * when it is small or cannot subset itself, else a subset of whole series.
   */
  public RowStream sampleSource(RowStream rows) {
    int sampleRowCount = (int) Math.min(parameters.sampleRowCount(), Math.max(1, rows.rowCount()));
    return sampleSource(rows, sampleRowCount, parameters.seed());
  }

  /**
   * The rows the bin sample is drawn from: {@code rows.sampleSource} asked for
   * {@code max(2 × sampleRowCount, rowCount / 32)} rows under the Dataset's seed, checked to be a usable subset.
   */
  static RowStream sampleSource(RowStream rows, int sampleRowCount, long seed) {
    long minimumRowCount = Math.max((long) SAMPLE_SOURCE_ROWS_PER_SAMPLE_ROW * sampleRowCount,
        rows.rowCount() / SAMPLE_SOURCE_STREAM_FRACTION_DIVISOR);
    RowStream source = rows.sampleSource(minimumRowCount, seed);
    if (source == rows) {
      return rows;
    }
    if (!source.schema().equals(rows.schema()) || source.rowCount() < sampleRowCount
        || source.rowCount() > rows.rowCount()) {
      throw new IllegalStateException("sample source of " + source.rowCount() + " rows with features "
          + source.schema().names() + " cannot stand for a stream of " + rows.rowCount() + " rows with features "
          + rows.schema().names() + " and a sample of " + sampleRowCount + " rows; a sample source keeps the schema"
          + " and holds between the sample size and the stream's row count");
    }
    return source;
  }

  /**
   * Builds a validation Dataset binned exactly like {@code reference} (LightGBM's CreateByReference), for early
   * stopping. The reference must stay open while a Booster uses both.
   */
  public TrainingDataset createValidation(TrainingDataset reference, RowStream rows) {
    return createValidation(reference, rows, null);
  }

  /**
   * As {@link #createValidation(TrainingDataset, RowStream)}, with every row starting from {@code startingModel}'s
   * raw score, as the rows of {@code reference} do: the validation rows of a continued training.
   *
   * @param startingModel the model {@code reference} starts from, or null when it starts from LightGBM's own score
   */
  public TrainingDataset createValidation(TrainingDataset reference, RowStream rows, TrainedModel startingModel) {
    return createValidation(reference, rows, startingModel == null ? null : StartingScores.predicted(startingModel),
        false);
  }

  /**
   * As {@link #createValidation(TrainingDataset, RowStream)}, the rows starting from {@code start} as those of
   * {@code reference} do and, with {@code recordRows}, their series and days recorded as by
   * {@link #build(RowStream, StartingScores, boolean)}.
   *
   * @param start where the rows' starting scores come from (the model {@code reference} starts from), or null
   */
  public TrainingDataset createValidation(TrainingDataset reference, RowStream rows, StartingScores start,
      boolean recordRows) {
    TrainedModel startingModel = start == null ? null : start.model();
    if (startingModel != reference.initialScoresFrom()) {
      throw new IllegalArgumentException("validation rows must start from the same model as the training rows ("
          + (reference.initialScoresFrom() == null ? "none" : "a starting model") + ")");
    }
    FeatureSchema schema = rows.schema();
    if (!schema.equals(reference.schema())) {
      throw new IllegalArgumentException("validation rows have schema " + schema.names() + " but the training "
          + "Dataset has " + reference.schema().names() + "; build both from the same feature definition");
    }
    if (reference.isValidation()) {
      throw new IllegalArgumentException("reference must be a training Dataset, got a validation Dataset");
    }
    int rowCount = checkedRowCount(rows);
    long residentBefore = ProcessMemory.residentBytes();
    SWIGTYPE_p_p_void out = lightgbmlib.new_voidpp();
    int returnCode = lightgbmlib.LGBM_DatasetCreateByReference(reference.handle(), rowCount, out);
    SWIGTYPE_p_void handle = Native.takeHandle(out);
    Native.check(returnCode, "LGBM_DatasetCreateByReference");
    try (FeatureBatch batch = newBatch(schema, rowCount)) {
      return pushRowsAndWrap(handle, rows, batch, rowCount, start, recordRows, true, reference.categoricalColumns(),
          0, 0, residentBefore);
    }
  }

  /**
   * Builds a training Dataset from a whole row-major float32 matrix already in native memory, through LightGBM's
   * {@code LGBM_DatasetCreateFromMat}: the route that holds every feature value at once, kept to compare footprints
   * and models against {@link #build}. LightGBM samples its own rows for the bin boundaries (same count and seed as
   * {@link #build}, not the same rows). LightGBM copies what it needs: the caller may free both arrays on return.
   *
   * @param matrixAddress native address of {@code rowCount × schema.featureCount()} floats, row r and feature f at
   *     {@code matrixAddress + 4 * (r * featureCount + f)}
   * @param labels one finite label per row (at least {@code rowCount} of them)
   * @throws IllegalArgumentException when {@code rowCount} is outside [1, 2^31 - 1) or labels are too few
   */
  public TrainingDataset buildFromMatrix(long matrixAddress, int rowCount, FeatureSchema schema,
      NativeFloatArray labels) {
    if (rowCount < 1 || rowCount >= ROW_LIMIT) {
      throw new IllegalArgumentException("a Dataset needs between 1 and " + (ROW_LIMIT - 1) + " rows, got " + rowCount
          + " (LightGBM counts rows in int32)");
    }
    if (labels.length() < rowCount) {
      throw new IllegalArgumentException("labels hold " + labels.length() + " values for " + rowCount
          + " rows; give one label per row");
    }
    int featureCount = schema.featureCount();
    long residentBefore = ProcessMemory.residentBytes();
    SWIGTYPE_p_p_void out = lightgbmlib.new_voidpp();
    int returnCode = lightgbmlib.LGBM_DatasetCreateFromMat(Native.voidPointer(matrixAddress),
        lightgbmlibConstants.C_API_DTYPE_FLOAT32, rowCount, featureCount, 1, parameterString(schema, rowCount), null,
        out);
    SWIGTYPE_p_void handle = Native.takeHandle(out);
    Native.check(returnCode, "LGBM_DatasetCreateFromMat");
    try {
      Native.check(lightgbmlib.LGBM_DatasetSetField(handle, "label", Native.voidPointer(labels.address()), rowCount,
          lightgbmlibConstants.C_API_DTYPE_FLOAT32), "LGBM_DatasetSetField(label)");
    } catch (RuntimeException | Error e) {
      lightgbmlib.LGBM_DatasetFree(handle);
      throw e;
    }
    int sampledRowCount = Math.min(parameters.sampleRowCount(), rowCount);
    DatasetStats stats = new DatasetStats(rowCount, featureCount, sampledRowCount, 0, residentBefore,
        ProcessMemory.residentBytes());
    return new TrainingDataset(handle, schema, stats, false, rowCount, schema.categoricalIndexes());
  }

  /** The Dataset parameter string a stream of {@code schema} with {@code rowCount} rows is built with. */
  String parameterString(FeatureSchema schema, int rowCount) {
    return parameters.toLightGbmString(schema, Math.min(parameters.sampleRowCount(), rowCount));
  }

  private FeatureBatch newBatch(FeatureSchema schema, int rowCount) {
    return new FeatureBatch(budget, Math.min(parameters.batchRowCount(), rowCount), schema.featureCount());
  }

  private static int checkedRowCount(RowStream rows) {
    long rowCount = rows.rowCount();
    if (rowCount < 1 || rowCount >= ROW_LIMIT) {
      throw new IllegalArgumentException("a Dataset needs between 1 and " + (ROW_LIMIT - 1) + " rows, got "
          + rowCount + " (LightGBM counts rows in int32; train on fewer days or per partition)");
    }
    return (int) rowCount;
  }

  /**
   * Copies the kept sample into LightGBM's {@code double**}/{@code int**} column arrays and creates the empty
   * Dataset. The copies are transient: LightGBM reads them only inside the call.
   */
  private SWIGTYPE_p_void createFromSample(RowSample sample, FeatureSchema schema, int sampleRowCount, int rowCount,
      long distributedRowCount, int[] categoricalColumns) {
    int featureCount = schema.featureCount();
    long sampleBytes = sample.keptValueCount() * (Double.BYTES + Integer.BYTES)
        + (long) featureCount * (2L * Long.BYTES + Integer.BYTES);
    budget.reserve(sampleBytes);
    SWIGTYPE_p_p_double columnValues = lightgbmlib.new_doublePtrArray(featureCount);
    SWIGTYPE_p_p_int columnPositions = lightgbmlib.new_intPtrArray(featureCount);
    SWIGTYPE_p_int keptCounts = lightgbmlib.new_intArray(featureCount);
    SWIGTYPE_p_double[] valueArrays = new SWIGTYPE_p_double[featureCount];
    SWIGTYPE_p_int[] positionArrays = new SWIGTYPE_p_int[featureCount];
    try {
      for (int column = 0; column < featureCount; column++) {
        int kept = sample.keptCount(column);
        // never a zero-length allocation: LightGBM reads only `kept` entries, and 1 keeps the pointer non-null
        valueArrays[column] = lightgbmlib.new_doubleArray(Math.max(kept, 1));
        positionArrays[column] = lightgbmlib.new_intArray(Math.max(kept, 1));
        for (int i = 0; i < kept; i++) {
          lightgbmlib.doubleArray_setitem(valueArrays[column], i, sample.value(column, i));
          lightgbmlib.intArray_setitem(positionArrays[column], i, sample.position(column, i));
        }
        lightgbmlib.doublePtrArray_setitem(columnValues, column, valueArrays[column]);
        lightgbmlib.intPtrArray_setitem(columnPositions, column, positionArrays[column]);
        lightgbmlib.intArray_setitem(keptCounts, column, kept);
      }
      SWIGTYPE_p_p_void out = lightgbmlib.new_voidpp();
      // one machine: the local and the distributed row count are the same; several: the sum over every rank
      int returnCode = lightgbmlib.LGBM_DatasetCreateFromSampledColumn(columnValues, columnPositions, featureCount,
          keptCounts, sampleRowCount, rowCount, distributedRowCount,
          parameters.toLightGbmString(categoricalColumns, sampleRowCount), out);
      SWIGTYPE_p_void handle = Native.takeHandle(out);
      Native.check(returnCode, "LGBM_DatasetCreateFromSampledColumn");
      return handle;
    } finally {
      for (int column = 0; column < featureCount; column++) {
        if (valueArrays[column] != null) {
          lightgbmlib.delete_doubleArray(valueArrays[column]);
        }
        if (positionArrays[column] != null) {
          lightgbmlib.delete_intArray(positionArrays[column]);
        }
      }
      lightgbmlib.delete_doublePtrArray(columnValues);
      lightgbmlib.delete_intPtrArray(columnPositions);
      lightgbmlib.delete_intArray(keptCounts);
      budget.release(sampleBytes);
    }
  }

  /**
   * Second pass: pushes every batch at its start row, finishes the Dataset by hand and sets the label (and weight)
   * fields. Manual finish matters: left to itself, LightGBM finishes the Dataset as soon as a push ends at the last
   * row, and would silently ignore any push after that.
   */
  /**
   * @param filler writes each row's starting raw score, or null to start from LightGBM's own score
   * @param recorded receives each row's series and day, or null
   * @return the sum of the rows' weights, or the row count without weights (what LightGBM's metrics divide by)
   */
  private double pushRowsAndFinish(SWIGTYPE_p_void handle, RowStream rows, FeatureBatch batch, int rowCount,
      StartingScoreFiller filler, RowScores.Rows recorded) {
    TrainedModel startingModel = filler == null ? null : filler.model();
    int featureCount = rows.schema().featureCount();
    if (startingModel != null && startingModel.featureCount() != featureCount) {
      throw new IllegalArgumentException("the starting model reads " + startingModel.featureCount() + " features but"
          + " the rows hold " + featureCount + "; continue only from a model of the same feature definition");
    }
    if (startingModel != null && rowCount > NativeDoubleArray.MAX_LENGTH) {
      throw new IllegalArgumentException("a continued training holds one raw score per row in one array of at most "
          + NativeDoubleArray.MAX_LENGTH + " rows, got " + rowCount + "; train per partition");
    }
    Native.check(lightgbmlib.LGBM_DatasetSetWaitForManualFinish(handle, 1), "LGBM_DatasetSetWaitForManualFinish");
    try (NativeFloatArray labels = new NativeFloatArray(budget, rowCount);
        NativeFloatArray weights = new NativeFloatArray(budget, parameters.useWeights() ? rowCount : 0);
        NativeDoubleArray initialScores = new NativeDoubleArray(budget, startingModel != null ? rowCount : 0)) {
      long[] pushedRows = {0};
      rows.stream(batch, full -> {
        int batchRows = full.rowCount();
        if (full.firstRowIndex() != pushedRows[0] || pushedRows[0] + batchRows > rowCount) {
          throw new IllegalStateException("row stream handed rows " + full.firstRowIndex() + ".."
              + (full.firstRowIndex() + batchRows - 1) + " after " + pushedRows[0] + " of " + rowCount
              + " rows; a RowStream must produce its rows in order and exactly rowCount() of them");
        }
        copyLabels(full, (int) pushedRows[0], labels, weights);
        if (filler != null) {
          filler.fill(full, initialScores, (int) pushedRows[0]);
        }
        if (recorded != null) {
          recorded.record(full, (int) pushedRows[0]);
        }
        Native.check(lightgbmlib.LGBM_DatasetPushRows(handle, Native.voidPointer(full.valuesAddress()),
            lightgbmlibConstants.C_API_DTYPE_FLOAT32, batchRows, featureCount, (int) pushedRows[0]),
            "LGBM_DatasetPushRows");
        pushedRows[0] += batchRows;
      });
      if (pushedRows[0] != rowCount) {
        throw new IllegalStateException("row stream promised " + rowCount + " rows but produced " + pushedRows[0]
            + "; a RowStream must report its exact rowCount()");
      }
      Native.check(lightgbmlib.LGBM_DatasetMarkFinished(handle), "LGBM_DatasetMarkFinished");
      Native.check(lightgbmlib.LGBM_DatasetSetField(handle, "label", Native.voidPointer(labels.address()), rowCount,
          lightgbmlibConstants.C_API_DTYPE_FLOAT32), "LGBM_DatasetSetField(label)");
      if (startingModel != null) {
        // LightGBM keeps its own copy: the initial scores are float64 only
        Native.check(lightgbmlib.LGBM_DatasetSetField(handle, "init_score", Native.voidPointer(initialScores
            .address(0)), rowCount, lightgbmlibConstants.C_API_DTYPE_FLOAT64), "LGBM_DatasetSetField(init_score)");
      }
      if (parameters.useWeights()) {
        Native.check(lightgbmlib.LGBM_DatasetSetField(handle, "weight", Native.voidPointer(weights.address()),
            rowCount, lightgbmlibConstants.C_API_DTYPE_FLOAT32), "LGBM_DatasetSetField(weight)");
        double weightSum = 0;
        for (int row = 0; row < rowCount; row++) {
          weightSum += weights.get(row);
        }
        return weightSum;
      }
      return rowCount;
    }
  }

  private void copyLabels(FeatureBatch batch, int firstRow, NativeFloatArray labels, NativeFloatArray weights) {
    float[] batchLabels = batch.labels();
    float[] batchWeights = batch.weights();
    boolean useWeights = parameters.useWeights();
    for (int row = 0; row < batch.rowCount(); row++) {
      float label = batchLabels[row];
      if (!Float.isFinite(label)) {
        throw new IllegalArgumentException("label of row " + (firstRow + row) + " is " + label
            + "; training rows need a finite label (rows to forecast belong in a prediction stream)");
      }
      labels.set(firstRow + row, label);
      if (useWeights) {
        float weight = batchWeights[row];
        if (!(weight >= 0) || Float.isInfinite(weight)) {
          throw new IllegalArgumentException("weight of row " + (firstRow + row) + " is " + weight
              + "; weights must be finite and >= 0");
        }
        weights.set(firstRow + row, weight);
      }
    }
  }
}
