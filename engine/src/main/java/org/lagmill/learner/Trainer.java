package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_double;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_int;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_void;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;
import java.util.Arrays;

/**
 * Trains a LightGBM Booster on a {@link TrainingDataset}, optionally early-stopping on a validation Dataset: after
 * every iteration it reads the objective's own metric on the validation rows, and when that has not improved for
 * {@link TrainParameters#earlyStoppingRounds()} iterations it stops and rolls the Booster back to the best one.
 *
 * <p>Stateless apart from its parameters; one training at a time per Dataset.
 */
public final class Trainer {
  /** Metrics the Booster evaluates, in this order: the objective's own, then rmse. */
  private static final int METRIC_COUNT = 2;
  private static final int VALIDATION_DATA_INDEX = 1;

  private final TrainParameters parameters;

  public Trainer(TrainParameters parameters) {
    this.parameters = parameters;
    NativeLibrary.load();
  }

  public TrainParameters parameters() {
    return parameters;
  }

  /** Trains {@link TrainParameters#maxRounds()} iterations with no validation rows and no early stopping. */
  public TrainedModel train(TrainingDataset training, TrainingListener listener) {
    return train(training, null, listener);
  }

  /**
   * Trains on {@code training}; with {@code validation} (built by {@link DatasetBuilder#createValidation}) stops
   * early and keeps the best iteration. Both Datasets may be closed once this returns.
   *
   * @param validation validation rows binned like {@code training}, or null
   */
  public TrainedModel train(TrainingDataset training, TrainingDataset validation, TrainingListener listener) {
    if (training.initialScoresFrom() != null) {
      throw new IllegalArgumentException("the training rows start from a model's scores: continue from it with "
          + "continueFrom, or build the Dataset without a starting model");
    }
    return train(training, validation, validation != null, null, parameters.toLightGbmString(), null, listener);
  }

  /**
   * Continues boosting from {@code startingModel} (LightGBM's init model): the Datasets already start from its raw
   * scores ({@link DatasetBuilder#build(org.lagmill.features.RowStream, TrainedModel)}), a new Booster on them takes
   * its trees in front (LGBM_BoosterMerge), and boosting goes on with early stopping as in {@link #train}. Early
   * stopping measures the added rounds against the starting model's own validation loss, so when no round beats it
   * the returned model holds exactly the starting trees ({@link TrainedModel#bestIteration()} 0).
   * {@link TrainParameters#maxRounds()} bounds the added rounds. The returned model holds the starting trees then the
   * kept added ones; its {@link TrainedModel#startingIterationCount()} says how many came from the start.
   *
   * @param startingModel not owned; stays open and unchanged
   * @param validation validation rows built from {@code training} with the same starting model, or null
   */
  public TrainedModel continueFrom(TrainedModel startingModel, TrainingDataset training, TrainingDataset validation,
      TrainingListener listener) {
    if (training.initialScoresFrom() != startingModel || validation != null
        && validation.initialScoresFrom() != startingModel) {
      throw new IllegalArgumentException("the Datasets of a continued training must start from the starting model's "
          + "scores: build them with DatasetBuilder.build(rows, startingModel) and createValidation(.., startingModel)");
    }
    return train(training, validation, validation != null, null, parameters.toLightGbmString(), startingModel,
        listener);
  }

  /**
   * Trains one rank's share of a distributed model over an open {@link LearnerNetwork}: the Booster grows every tree
   * with {@code learner} over all ranks' rows, and after each iteration {@code reducer} turns this rank's validation
   * loss into the loss over every rank's validation rows, so that every rank stops (and rolls back) at the same
   * iteration. Every rank must call this with the same parameters and the same {@code validatingAnywhere}.
   *
   * @param validation this rank's validation rows, or null when it holds none
   * @param validatingAnywhere whether any rank holds validation rows (then early stopping runs on every rank)
   * @param machineCount ranks in the network, at least 2
   */
  public TrainedModel trainDistributed(TrainingDataset training, TrainingDataset validation,
      boolean validatingAnywhere, TreeLearner learner, int machineCount, ValidationReducer reducer,
      TrainingListener listener) {
    if (learner == TreeLearner.SERIAL || machineCount < 2) {
      throw new IllegalArgumentException("a distributed training needs the data or voting learner and at least 2 "
          + "machines, got " + learner.lightGbmName() + " on " + machineCount);
    }
    if (validation != null && !validatingAnywhere) {
      throw new IllegalArgumentException("this rank holds validation rows, so validatingAnywhere must be true");
    }
    String parameterText = parameters.toLightGbmString() + " tree_learner=" + learner.lightGbmName()
        + " num_machines=" + machineCount + " max_cat_threshold=" + categoriesPerSplit(training);
    return train(training, validation, validatingAnywhere, reducer, parameterText, null, listener);
  }

  /**
   * The most categories one split may hold in a distributed training on {@code training}
   * ({@code max_cat_threshold}): the same on every rank, since every rank holds the same bins
   * ({@link DistributedBinning}, first point). One machine trains with LightGBM's default,
   * {@link DistributedBinning#DEFAULT_CATEGORIES_PER_SPLIT}.
   */
  public static int categoriesPerSplit(TrainingDataset training) {
    return DistributedBinning.categoriesPerSplit(training.largestCategoricalBinCount());
  }

  /** @param startingModel the model whose trees go in front, or null to boost from scratch */
  private TrainedModel train(TrainingDataset training, TrainingDataset validation, boolean validating,
      ValidationReducer reducer, String parameterText, TrainedModel startingModel, TrainingListener listener) {
    if (training.isValidation()) {
      throw new IllegalArgumentException("training data must be a training Dataset, got a validation Dataset");
    }
    if (validation != null && !validation.isValidation()) {
      throw new IllegalArgumentException("validation data must come from DatasetBuilder.createValidation so it "
          + "shares the training Dataset's bins");
    }
    SWIGTYPE_p_p_void out = lightgbmlib.new_voidpp();
    int returnCode = lightgbmlib.LGBM_BoosterCreate(training.handle(), parameterText, out);
    SWIGTYPE_p_void booster = Native.takeHandle(out);
    Native.check(returnCode, "LGBM_BoosterCreate");
    TrainedModel model;
    try {
      int startingIterationCount = 0;
      if (startingModel != null) {
        // the order LightGBM's own bindings use for an init model: create on the Datasets that start from its
        // scores, merge its trees in front, then add the validation data
        Native.check(lightgbmlib.LGBM_BoosterMerge(booster, startingModel.handle()), "LGBM_BoosterMerge");
        startingIterationCount = currentIteration(booster);
      }
      if (validation != null) {
        Native.check(lightgbmlib.LGBM_BoosterAddValidData(booster, validation.handle()), "LGBM_BoosterAddValidData");
      }
      model = boost(booster, validating, validation == null ? -1 : validation.weightSum(), reducer,
          startingIterationCount, listener);
    } catch (RuntimeException | Error e) {
      lightgbmlib.LGBM_BoosterFree(booster);
      throw e;
    }
    try {
      if (training.recordsRows()) {
        keepRowScores(model, training, validation);
      }
      // without this, each model kept after training (one per partition) held its training state (≈ 50 B/row)
      model.dropTrainingState();
    } catch (RuntimeException | Error e) {
      model.close();
      throw e;
    }
    return model;
  }

  /**
   * Hands the Datasets' recorded rows to {@code model} with the score its Booster holds for each, at the kept
   * iteration (rolling back takes each dropped tree's output off every row's score): the next training continued from
   * this model starts from them ({@link StartingScores}). Must run before the training state is dropped.
   */
  private void keepRowScores(TrainedModel model, TrainingDataset training, TrainingDataset validation) {
    RowScores.Rows trainingRows = training.takeRecordedRows();
    RowScores.Rows validationRows = validation == null ? null : validation.takeRecordedRows();
    try {
      boolean logLink = parameters.objective().hasLogLink();
      trainingRows.fillScores(model.handle(), 0, logLink);
      if (validationRows != null) {
        validationRows.fillScores(model.handle(), VALIDATION_DATA_INDEX, logLink);
      }
    } catch (RuntimeException | Error e) {
      trainingRows.close();
      if (validationRows != null) {
        validationRows.close();
      }
      throw e;
    }
    model.attachRowScores(new RowScores(trainingRows, validationRows));
  }

  /**
   * @param localWeightSum this rank's validation weight sum, or -1 when it holds no validation rows
   * @param reducer null on one machine
   * @param startingIterationCount iterations merged in front from a starting model; the added rounds must beat
   *     their validation loss to be kept
   */
  private TrainedModel boost(SWIGTYPE_p_void booster, boolean validating, double localWeightSum,
      ValidationReducer reducer, int startingIterationCount, TrainingListener listener) {
    int maxRounds = parameters.maxRounds();
    int patience = validating && parameters.earlyStoppingRounds() > 0
        ? parameters.earlyStoppingRounds() : Integer.MAX_VALUE;
    double[] curve = new double[validating ? maxRounds : 0];
    double[] rmseCurve = new double[validating ? maxRounds : 0];
    SWIGTYPE_p_int finished = lightgbmlib.new_intp();
    SWIGTYPE_p_int evalCount = lightgbmlib.new_intp();
    SWIGTYPE_p_double evals = lightgbmlib.new_doubleArray(METRIC_COUNT);
    long startNanos = System.nanoTime();
    int trainedCount = 0;
    int bestIteration = 0;
    double bestLoss = Double.POSITIVE_INFINITY;
    double startingLoss = Double.NaN;
    try {
      if (startingIterationCount > 0 && validating && localWeightSum >= 0 && reducer == null) {
        // LightGBM scores the validation rows from their initial scores before any round: the starting model's loss
        startingLoss = evaluate(booster, evalCount, evals)[0];
        bestLoss = startingLoss;
      }
      for (int iteration = 1; iteration <= maxRounds; iteration++) {
        Native.check(lightgbmlib.LGBM_BoosterUpdateOneIter(booster, finished), "LGBM_BoosterUpdateOneIter");
        if (lightgbmlib.intp_value(finished) == 1) {
          // no leaf could be split: LightGBM added no iteration (only a constant first tree when nothing was built)
          break;
        }
        trainedCount = iteration;
        double loss = Double.NaN;
        if (validating) {
          double rmse = Double.NaN;
          if (localWeightSum >= 0) {
            double[] metrics = evaluate(booster, evalCount, evals);
            loss = metrics[0];
            rmse = metrics[1];
          }
          if (reducer != null) {
            // LightGBM's metrics are weighted means over this rank's rows (rmse the root of one): weighted by each
            // rank's weight sum they add up to the metric over every rank's rows.
            double weight = Math.max(0, localWeightSum);
            double[] global = reducer.reduce(iteration, weight == 0 ? 0 : loss * weight,
                weight == 0 ? 0 : rmse * rmse * weight, weight);
            loss = global[1] > 0 ? global[0] / global[1] : Double.NaN;
            rmse = global[1] > 0 ? Math.sqrt(global[2] / global[1]) : Double.NaN;
          }
          curve[iteration - 1] = loss;
          rmseCurve[iteration - 1] = rmse;
          if (loss < bestLoss || patience == Integer.MAX_VALUE) {
            // with early stopping disabled every trained iteration is kept: the validation rows only report
            bestLoss = Math.min(loss, bestLoss);
            bestIteration = iteration;
          }
        } else {
          bestIteration = iteration;
        }
        listener.onIteration(iteration, (System.nanoTime() - startNanos) / 1e9, loss);
        if (iteration - bestIteration >= patience) {
          break;
        }
      }
      // LightGBM never rolls back merged starting iterations: only added ones count here
      for (int held = currentIteration(booster); held > startingIterationCount + bestIteration; held--) {
        Native.check(lightgbmlib.LGBM_BoosterRollbackOneIter(booster), "LGBM_BoosterRollbackOneIter");
      }
    } finally {
      lightgbmlib.delete_intp(finished);
      lightgbmlib.delete_intp(evalCount);
      lightgbmlib.delete_doubleArray(evals);
    }
    return new TrainedModel(booster, bestIteration, Arrays.copyOf(curve, validating ? trainedCount : 0),
        Arrays.copyOf(rmseCurve, validating ? trainedCount : 0), startingIterationCount, startingLoss);
  }

  /** The validation rows' metrics now: the objective's own, then rmse. */
  private double[] evaluate(SWIGTYPE_p_void booster, SWIGTYPE_p_int evalCount, SWIGTYPE_p_double evals) {
    Native.check(lightgbmlib.LGBM_BoosterGetEval(booster, VALIDATION_DATA_INDEX, evalCount, evals),
        "LGBM_BoosterGetEval");
    if (lightgbmlib.intp_value(evalCount) != METRIC_COUNT) {
      throw new LearnerException("LightGBM evaluated " + lightgbmlib.intp_value(evalCount) + " metrics, expected "
          + METRIC_COUNT + " (" + parameters.objective().metricName() + ", rmse)");
    }
    return new double[] {lightgbmlib.doubleArray_getitem(evals, 0), lightgbmlib.doubleArray_getitem(evals, 1)};
  }

  private static int currentIteration(SWIGTYPE_p_void booster) {
    SWIGTYPE_p_int out = lightgbmlib.new_intp();
    try {
      Native.check(lightgbmlib.LGBM_BoosterGetCurrentIteration(booster, out), "LGBM_BoosterGetCurrentIteration");
      return lightgbmlib.intp_value(out);
    } finally {
      lightgbmlib.delete_intp(out);
    }
  }
}
