package org.lagmill.training;

import org.lagmill.features.FeatureSpec;
import org.lagmill.features.ZeroRowSampling;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.learner.DatasetParameters;
import org.lagmill.learner.TrainParameters;

/**
 * What to train: the feature spec, LightGBM's parameters, the last day the model may learn from, and how the series
 * are split into partitions (one model each).
 *
 * @param cutDayIndex last day (inclusive) whose units the model may read; validation is the {@code validationDays}
 *     days ending here and training uses the days before them
 * @param validationDays length of the time-based validation window, usually the horizon
 * @param partitionAttribute attribute whose values split the series into separately trained models, or null for one
 * @param salesValueWeights weight each series' rows by its recent sales value (units × price), the weight the error
 *     metric gives it, instead of weighting every row alike
 * @param refit after early stopping chose the best round count on the validation window, train again on every day up
 *     to the cut with that count scaled by the ratio of rows (the shipped model then learns the newest days); false
 *     ships the early-stopped model
 * @param zeroRowsKept share in (0, 1] of the training rows with zero sales kept (each kept one weighted by its
 *     inverse), chosen by a hash of series, day and the Dataset seed ({@link ZeroRowSampling}); the training rows of
 *     a refit are sampled alike, the validation rows never; 1 keeps every row
 * @param startingModels models to continue from instead of boosting from scratch (LightGBM's init model), or null:
 *     each partition's rows start from its starting model's raw scores and the added rounds stop early against that
 *     model's own validation loss; not owned by the plan
 */
public record TrainingPlan(FeatureSpec spec, TrainParameters trainParameters, DatasetParameters datasetParameters,
    int cutDayIndex, int validationDays, String partitionAttribute, boolean salesValueWeights, boolean refit,
    double zeroRowsKept, StartingModels startingModels) {
  /**
   * Whether a plan refits on every day unless the user says otherwise: no. On two scenarios shaped differently the
   * early-stopped model forecast the next horizon better than its refit on every day, in every run (mean WRMSSE over
   * 3 origins: daily 0.6624/0.6540/0.6366 against 0.6843/0.6866/0.6750 for seeds 1 to 3; weekly 0.7419 against
   * 0.7727; docs/benchmarks.md, "Refit or not"). The round count early stopping picks is tuned on the newest days,
   * which a refit on more rows no longer matches.
   */
  public static final boolean REFIT_BY_DEFAULT = false;

  /** Share of zero-sales training rows kept unless the user says otherwise: every one (today's route). */
  public static final double ZERO_ROWS_KEPT_BY_DEFAULT = 1.0;

  public TrainingPlan {
    if (validationDays < 1) {
      throw new InvalidRequestException("validationDays must be >= 1, got " + validationDays);
    }
    ZeroRowSampling.checkFraction(zeroRowsKept);
    if (zeroRowsKept < 1 && !datasetParameters.useWeights()) {
      // the inverse-probability weights are the point of sampling: LightGBM must read the weight field
      datasetParameters = datasetParameters.withUseWeights(true);
    }
  }

  /** A plan boosting from scratch. */
  public TrainingPlan(FeatureSpec spec, TrainParameters trainParameters, DatasetParameters datasetParameters,
      int cutDayIndex, int validationDays, String partitionAttribute, boolean salesValueWeights, boolean refit,
      double zeroRowsKept) {
    this(spec, trainParameters, datasetParameters, cutDayIndex, validationDays, partitionAttribute, salesValueWeights,
        refit, zeroRowsKept, null);
  }

  /** A plan keeping every zero-sales training row and boosting from scratch. */
  public TrainingPlan(FeatureSpec spec, TrainParameters trainParameters, DatasetParameters datasetParameters,
      int cutDayIndex, int validationDays, String partitionAttribute, boolean salesValueWeights, boolean refit) {
    this(spec, trainParameters, datasetParameters, cutDayIndex, validationDays, partitionAttribute, salesValueWeights,
        refit, ZERO_ROWS_KEPT_BY_DEFAULT);
  }

  /** Which zero-sales training rows to keep: {@link #zeroRowsKept} under the Dataset's seed. */
  public ZeroRowSampling zeroSampling() {
    return ZeroRowSampling.of(zeroRowsKept, datasetParameters.seed());
  }

  /** First day of the validation window. */
  public int validationFirstDayIndex() {
    return cutDayIndex - validationDays + 1;
  }

  /** Last day of the training window (inclusive). */
  public int trainingLastDayIndex() {
    return cutDayIndex - validationDays;
  }

  public TrainingPlan withCutDayIndex(int dayIndex) {
    return new TrainingPlan(spec, trainParameters, datasetParameters, dayIndex, validationDays, partitionAttribute,
        salesValueWeights, refit, zeroRowsKept, startingModels);
  }

  public TrainingPlan withSpec(FeatureSpec value) {
    return new TrainingPlan(value, trainParameters, datasetParameters, cutDayIndex, validationDays, partitionAttribute,
        salesValueWeights, refit, zeroRowsKept, startingModels);
  }

  public TrainingPlan withRefit(boolean value) {
    return new TrainingPlan(spec, trainParameters, datasetParameters, cutDayIndex, validationDays, partitionAttribute,
        salesValueWeights, value, zeroRowsKept, startingModels);
  }

  public TrainingPlan withZeroRowsKept(double value) {
    return new TrainingPlan(spec, trainParameters, datasetParameters, cutDayIndex, validationDays, partitionAttribute,
        salesValueWeights, refit, value, startingModels);
  }

  /** This plan continuing from {@code value} (null: from scratch). */
  public TrainingPlan withStartingModels(StartingModels value) {
    return new TrainingPlan(spec, trainParameters, datasetParameters, cutDayIndex, validationDays, partitionAttribute,
        salesValueWeights, refit, zeroRowsKept, value);
  }
}
