package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_double;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_int;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_long_long;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_void;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;
import com.microsoft.ml.lightgbm.lightgbmlibConstants;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import org.lagmill.features.FeatureBatch;
import org.lagmill.io.AtomicFiles;

/**
 * A trained LightGBM Booster owned by this object, cut back to its best iteration.
 *
 * <p>Predictions with {@link #predict} are on the response scale: for tweedie and poisson LightGBM applies the log
 * link's inverse ({@code exp}) itself; {@link #predictRaw} gives the raw score (log of the mean for those objectives).
 *
 * <p>Lifetime: closing frees the Booster; twice is harmless; any use after close throws {@link IllegalStateException}.
 * Not thread-safe. A trained model does not need its Datasets any more once {@link Trainer#train} returned.
 */
public final class TrainedModel implements AutoCloseable {
  private final int bestIteration;
  private final int startingIterationCount;
  private final double startingValidationLoss;
  private final double[] validationCurve;
  private final double[] validationRmseCurve;
  private final int featureCount;
  /** Rows per prediction batch: large enough to amortise the native call, small enough to stay a few MB. */
  public static final int PREDICTION_BATCH_ROWS = 16_384;
  private static final long MODEL_TEXT_INITIAL_BYTES = 1L << 20;

  private SWIGTYPE_p_void booster;
  private Objective objective;
  private RowScores rowScores;

  TrainedModel(SWIGTYPE_p_void booster, int bestIteration, double[] validationCurve, double[] validationRmseCurve) {
    this(booster, bestIteration, validationCurve, validationRmseCurve, 0, Double.NaN);
  }

  /**
   * @param startingIterationCount iterations at the front of the Booster taken over from the model training
   *     continued from, 0 when trained from scratch
   * @param startingValidationLoss the validation loss of those iterations alone, NaN when unknown
   */
  TrainedModel(SWIGTYPE_p_void booster, int bestIteration, double[] validationCurve, double[] validationRmseCurve,
      int startingIterationCount, double startingValidationLoss) {
    this.booster = booster;
    this.bestIteration = bestIteration;
    this.startingIterationCount = startingIterationCount;
    this.startingValidationLoss = startingValidationLoss;
    this.validationCurve = validationCurve;
    this.validationRmseCurve = validationRmseCurve;
    SWIGTYPE_p_int out = lightgbmlib.new_intp();
    try {
      Native.check(lightgbmlib.LGBM_BoosterGetNumFeature(booster, out), "LGBM_BoosterGetNumFeature");
      this.featureCount = lightgbmlib.intp_value(out);
    } finally {
      lightgbmlib.delete_intp(out);
    }
  }

  /**
   * Swaps the training Booster for one that holds only the trees, then frees the training one. After its last round a
   * training Booster still keeps its whole training state (gradients, hessians and scores per row, bagging and
   * partition indexes, the histogram pool: about 50 bytes per training row at 23 features) and still points at the
   * training Dataset, which its owner frees next. Kept in a model set, one such Booster per partition added up to the
   * unpartitioned peak. The model text round-trips exactly (LightGBM writes each double in its shortest exact form).
   * On failure this model still owns a valid Booster.
   */
  void dropTrainingState() {
    SWIGTYPE_p_void training = handle();
    SWIGTYPE_p_long_long textLength = lightgbmlib.new_int64_tp();
    SWIGTYPE_p_int iterationCount = lightgbmlib.new_intp();
    SWIGTYPE_p_p_void out = lightgbmlib.new_voidpp();
    try {
      // all iterations (0); the SWIG wrapper retries with a larger buffer when the text is longer
      String text = lightgbmlib.LGBM_BoosterSaveModelToStringSWIG(training, 0, 0,
          lightgbmlibConstants.C_API_FEATURE_IMPORTANCE_SPLIT, MODEL_TEXT_INITIAL_BYTES, textLength);
      if (text == null) {
        throw new LearnerException("LightGBM LGBM_BoosterSaveModelToString failed: " + lightgbmlib.LGBM_GetLastError());
      }
      int returnCode = lightgbmlib.LGBM_BoosterLoadModelFromString(text, iterationCount, out);
      SWIGTYPE_p_void treesOnly = Native.takeHandle(out);
      Native.check(returnCode, "LGBM_BoosterLoadModelFromString");
      booster = treesOnly;
      Native.check(lightgbmlib.LGBM_BoosterFree(training), "LGBM_BoosterFree");
    } finally {
      lightgbmlib.delete_int64_tp(textLength);
      lightgbmlib.delete_intp(iterationCount);
    }
  }

  /**
   * Loads a model written by {@link #saveTo}. Its validation curves are empty; its best iteration is its
   * iteration count (a saved model holds only the iterations up to the best one).
   *
   * @throws UncheckedIOException wrapping {@link NoSuchFileException} when the file does not exist
   * @throws LearnerException when LightGBM cannot parse the file
   */
  public static TrainedModel load(Path modelFile) {
    NativeLibrary.load();
    if (!Files.isRegularFile(modelFile)) {
      throw new UncheckedIOException(new NoSuchFileException(modelFile.toString(), null, "model file not found"));
    }
    SWIGTYPE_p_int iterationCount = lightgbmlib.new_intp();
    SWIGTYPE_p_p_void out = lightgbmlib.new_voidpp();
    try {
      int returnCode = lightgbmlib.LGBM_BoosterCreateFromModelfile(modelFile.toString(), iterationCount, out);
      SWIGTYPE_p_void handle = Native.takeHandle(out);
      Native.check(returnCode, "LGBM_BoosterCreateFromModelfile(" + modelFile + ")");
      return new TrainedModel(handle, lightgbmlib.intp_value(iterationCount), new double[0], new double[0]);
    } finally {
      lightgbmlib.delete_intp(iterationCount);
    }
  }

  /**
   * 1-based iteration with the lowest validation loss (the last one when trained without validation rows); 0 when
   * no split was possible at all and the model is the constant initial score. A continued training counts only the
   * iterations it added: 0 when none beat the starting model on the validation rows.
   */
  public int bestIteration() {
    return bestIteration;
  }

  /**
   * Iterations at the front of this model that a continued training took over from its starting model
   * ({@link Trainer#continueFrom}); 0 for a model trained from scratch or loaded from a file.
   */
  public int startingIterationCount() {
    return startingIterationCount;
  }

  /** The starting model's validation loss before a continued training added anything; NaN when not continued. */
  public double startingValidationLoss() {
    return startingValidationLoss;
  }

  /**
   * Number of boosting iterations the Booster holds: {@link #startingIterationCount()} plus {@link #bestIteration()}
   * after training.
   */
  public int iterationCount() {
    SWIGTYPE_p_int out = lightgbmlib.new_intp();
    try {
      Native.check(lightgbmlib.LGBM_BoosterGetCurrentIteration(handle(), out), "LGBM_BoosterGetCurrentIteration");
      return lightgbmlib.intp_value(out);
    } finally {
      lightgbmlib.delete_intp(out);
    }
  }

  public int featureCount() {
    return featureCount;
  }

  /** The objective's own validation metric after each iteration trained (index 0 = iteration 1), a copy. */
  public double[] validationCurve() {
    return validationCurve.clone();
  }

  /** Validation RMSE after each iteration trained (index 0 = iteration 1), a copy. */
  public double[] validationRmseCurve() {
    return validationRmseCurve.clone();
  }

  /** One importance per feature in schema order, over the iterations the model holds. */
  public double[] featureImportance(FeatureImportance type) {
    int importanceType = type == FeatureImportance.GAIN
        ? lightgbmlibConstants.C_API_FEATURE_IMPORTANCE_GAIN
        : lightgbmlibConstants.C_API_FEATURE_IMPORTANCE_SPLIT;
    SWIGTYPE_p_double out = lightgbmlib.new_doubleArray(featureCount);
    try {
      Native.check(lightgbmlib.LGBM_BoosterFeatureImportance(handle(), 0, importanceType, out),
          "LGBM_BoosterFeatureImportance");
      double[] importance = new double[featureCount];
      for (int feature = 0; feature < featureCount; feature++) {
        importance[feature] = lightgbmlib.doubleArray_getitem(out, feature);
      }
      return importance;
    } finally {
      lightgbmlib.delete_doubleArray(out);
    }
  }

  /**
   * Writes the model as LightGBM text to a temporary file beside {@code modelFile}, then renames it into place, so
   * a reader never sees a half-written model.
   */
  public void saveTo(Path modelFile) {
    SWIGTYPE_p_void handle = handle();
    try (AtomicFiles.Pending pending = AtomicFiles.begin(modelFile)) {
      Native.check(lightgbmlib.LGBM_BoosterSaveModel(handle, 0, 0, lightgbmlibConstants.C_API_FEATURE_IMPORTANCE_SPLIT,
          pending.tempFile().toString()), "LGBM_BoosterSaveModel(" + pending.tempFile() + ")");
      pending.commit();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot move the saved model into place at " + modelFile.toAbsolutePath(), e);
    }
  }

  /**
   * Predicts the first {@code batch.rowCount()} rows of {@code batch} on the response scale, reading the features
   * straight from the batch's native matrix.
   *
   * @param out receives one prediction per row, from index 0; length at least {@code batch.rowCount()}
   */
  public void predict(FeatureBatch batch, double[] out) {
    predict(batch, out, lightgbmlibConstants.C_API_PREDICT_NORMAL);
  }

  /** As {@link #predict}, but the raw score: log of the predicted mean for tweedie and poisson. */
  public void predictRaw(FeatureBatch batch, double[] out) {
    predict(batch, out, lightgbmlibConstants.C_API_PREDICT_RAW_SCORE);
  }

  /**
   * Writes the raw score of each of the first {@code batch.rowCount()} rows of {@code batch} straight into native
   * memory: what a continued training's Datasets start from.
   *
   * @param outAddress native address of at least {@code batch.rowCount()} doubles
   * @param threadCount OpenMP threads: those of the Dataset being pushed. A prediction sets LightGBM's thread count
   *     for the calls after it (its default when not given); a Dataset pushed with more threads than it was created
   *     for indexes past its per-thread buffers (a crash seen here in SparseBin::Push)
   */
  void predictRawInto(FeatureBatch batch, long outAddress, int threadCount) {
    checkFeatureCount(batch);
    predictRawRows(batch.valuesAddress(), batch.rowCount(), outAddress, threadCount);
  }

  /**
   * Raw scores of {@code rowCount} row-major float32 rows of {@link #featureCount()} features at
   * {@code valuesAddress}, written as float64 at {@code outAddress}: part of a batch, without copying it.
   */
  void predictRawRows(long valuesAddress, int rowCount, long outAddress, int threadCount) {
    SWIGTYPE_p_void handle = handle();
    if (rowCount == 0) {
      return;
    }
    SWIGTYPE_p_long_long resultCount = lightgbmlib.new_int64_tp();
    try {
      // num_threads on every call: a prediction otherwise leaves OpenMP at its own thread count, and the next push
      // of a Dataset built with fewer threads crashed
      Native.check(lightgbmlib.LGBM_BoosterPredictForMat(handle, Native.voidPointer(valuesAddress),
          lightgbmlibConstants.C_API_DTYPE_FLOAT32, rowCount, featureCount, 1,
          lightgbmlibConstants.C_API_PREDICT_RAW_SCORE, 0, 0, "num_threads=" + threadCount, resultCount,
          Native.doublePointer(outAddress)),
          "LGBM_BoosterPredictForMat");
      long written = lightgbmlib.int64_tp_value(resultCount);
      if (written != rowCount) {
        throw new LearnerException("LightGBM wrote " + written + " raw scores for " + rowCount + " rows");
      }
    } finally {
      lightgbmlib.delete_int64_tp(resultCount);
    }
  }

  /**
   * As {@link #predictRaw} over the iterations {@code [firstIteration, firstIteration + iterationCount)} only
   * (LightGBM's {@code start_iteration} and {@code num_iteration}): a continued model's added trees alone, or its
   * starting trees alone.
   */
  void predictRawIterations(FeatureBatch batch, double[] out, int firstIteration, int iterationCount) {
    predict(batch, out, lightgbmlibConstants.C_API_PREDICT_RAW_SCORE, firstIteration, iterationCount);
  }

  /**
   * Each feature's contribution to each row's raw score (LightGBM's SHAP values, predict type contrib), plus the
   * expected raw score over the training data (the bias) last: row {@code r} occupies
   * {@code out[r × (featureCount + 1) .. (r + 1) × (featureCount + 1))}, the bias at the end. LightGBM guarantees
   * that a row's contributions and bias sum to its raw score ({@link #predictRaw}).
   *
   * @param out length at least {@code batch.rowCount() × (featureCount() + 1)}
   */
  public void predictContributions(FeatureBatch batch, double[] out) {
    predict(batch, out, lightgbmlibConstants.C_API_PREDICT_CONTRIB);
  }

  /**
   * The model as LightGBM text, exactly what {@link #saveTo} writes: ranks of a distributed training compare it to
   * prove they hold the same model.
   */
  public String modelText() {
    SWIGTYPE_p_long_long textLength = lightgbmlib.new_int64_tp();
    try {
      String text = lightgbmlib.LGBM_BoosterSaveModelToStringSWIG(handle(), 0, 0,
          lightgbmlibConstants.C_API_FEATURE_IMPORTANCE_SPLIT, MODEL_TEXT_INITIAL_BYTES, textLength);
      if (text == null) {
        throw new LearnerException("LightGBM LGBM_BoosterSaveModelToString failed: " + lightgbmlib.LGBM_GetLastError());
      }
      return text;
    } finally {
      lightgbmlib.delete_int64_tp(textLength);
    }
  }

  /**
   * The objective the model was trained for, read from the model's own text ({@code objective=…}), so a model loaded
   * from a file knows it too; tells how a raw score becomes a prediction ({@link Objective#hasLogLink()}).
   *
   * @throws LearnerException when the model names an objective lagmill does not train
   */
  public Objective objective() {
    if (objective == null) {
      objective = Objective.ofModelText(modelText());
    }
    return objective;
  }

  private void checkFeatureCount(FeatureBatch batch) {
    if (batch.featureCount() != featureCount) {
      throw new IllegalArgumentException("batch has " + batch.featureCount() + " features but the model was trained on "
          + featureCount + "; predict with the feature definition the model was trained with");
    }
  }

  private void predict(FeatureBatch batch, double[] out, int predictType) {
    // iteration count 0 = every iteration held, which is the best one: training rolled the rest back
    predict(batch, out, predictType, 0, 0);
  }

  private void predict(FeatureBatch batch, double[] out, int predictType, int firstIteration, int iterationCount) {
    SWIGTYPE_p_void handle = handle();
    int rowCount = batch.rowCount();
    checkFeatureCount(batch);
    int valuesPerRow = predictType == lightgbmlibConstants.C_API_PREDICT_CONTRIB ? featureCount + 1 : 1;
    long valueCount = (long) rowCount * valuesPerRow;
    if (out.length < valueCount) {
      throw new IllegalArgumentException("out holds " + out.length + " values but the batch needs " + valueCount
          + " (" + rowCount + " rows x " + valuesPerRow + "); size it to at least batch.capacityRows() x "
          + valuesPerRow);
    }
    if (rowCount == 0) {
      return;
    }
    SWIGTYPE_p_double result = lightgbmlib.new_doubleArray(valueCount);
    SWIGTYPE_p_long_long resultCount = lightgbmlib.new_int64_tp();
    try {
      Native.check(lightgbmlib.LGBM_BoosterPredictForMat(handle, Native.voidPointer(batch.valuesAddress()),
          lightgbmlibConstants.C_API_DTYPE_FLOAT32, rowCount, featureCount, 1, predictType, firstIteration,
          iterationCount, "", resultCount, result), "LGBM_BoosterPredictForMat");
      long written = lightgbmlib.int64_tp_value(resultCount);
      if (written != valueCount) {
        throw new LearnerException("LightGBM wrote " + written + " values for " + rowCount + " rows, expected "
            + valueCount);
      }
      for (int i = 0; i < (int) valueCount; i++) {
        out[i] = lightgbmlib.doubleArray_getitem(result, i);
      }
    } finally {
      lightgbmlib.delete_doubleArray(result);
      lightgbmlib.delete_int64_tp(resultCount);
    }
  }

  SWIGTYPE_p_void handle() {
    if (booster == null) {
      throw new IllegalStateException("trained model is closed");
    }
    return booster;
  }

  /**
   * The raw scores this model gave the rows it was trained and validated on, kept when its Datasets recorded their
   * rows ({@link DatasetBuilder#build(org.lagmill.features.RowStream, StartingScores, boolean)}) so that a training
   * continued from it need not predict them; null otherwise. Owned by this model, freed by {@link #close()}.
   */
  public RowScores rowScores() {
    return rowScores;
  }

  /**
   * Gives this model the scores it gave its own training and validation rows (closing any it held): from its training
   * ({@link Trainer}) or read from where they were saved beside it ({@link RowScores#read}).
   *
   * @param scores owned by this model from now on
   */
  public void attachRowScores(RowScores scores) {
    if (rowScores != null) {
      rowScores.close();
    }
    rowScores = scores;
  }

  /**
   * Frees the kept row scores now, keeping the trees: a training continued from this model calls it once its Datasets
   * hold the scores (LightGBM copies them into its own starting scores), so that they do not also sit in memory,
   * 16 bytes per row, through the boosting that follows.
   */
  public void releaseRowScores() {
    attachRowScores(null);
  }

  @Override
  public void close() {
    if (rowScores != null) {
      rowScores.close();
      rowScores = null;
    }
    if (booster != null) {
      SWIGTYPE_p_void freed = booster;
      booster = null;
      Native.check(lightgbmlib.LGBM_BoosterFree(freed), "LGBM_BoosterFree");
    }
  }
}
