package org.lagmill.learner;

import org.lagmill.io.InvalidRequestException;

import static org.lagmill.learner.DatasetParameters.requireRange;

/**
 * Booster parameters. Binning parameters belong to {@link DatasetParameters}: LightGBM ignores them here.
 *
 * @param objective the loss; {@link Objective#TWEEDIE} by default
 * @param tweedieVariancePower in [1, 2) for tweedie; 1.1 by default (close to Poisson, tolerant of many zeros)
 * @param learningRate shrinkage per tree, in (0, 1]
 * @param leafCount largest number of leaves per tree ({@code num_leaves}), in [2, 131072]
 * @param minDataInLeaf smallest number of rows in a leaf
 * @param featureFraction fraction of features tried per tree, in (0, 1]
 * @param baggingFraction fraction of rows used per tree, in (0, 1]; below 1 rows are re-drawn every iteration
 * @param lambdaL2 L2 penalty on leaf values, at least 0
 * @param maxRounds most boosting iterations (the CLI's {@code --rounds})
 * @param earlyStoppingRounds stop when the validation metric has not improved for this many iterations; 0 disables
 * @param threadCount OpenMP threads
 * @param seed seeds bagging, feature sampling and LightGBM's other random choices
 * @param deterministic bit-identical models across runs with the same data, seed and thread count
 * @param goss gradient-based one-side sampling (LightGBM's {@code data_sample_strategy=goss}: every row with a large
 *     gradient, a weighted sample of the rest) instead of bagging; {@code baggingFraction} is then unused
 */
public record TrainParameters(
    Objective objective,
    double tweedieVariancePower,
    double learningRate,
    int leafCount,
    int minDataInLeaf,
    double featureFraction,
    double baggingFraction,
    double lambdaL2,
    int maxRounds,
    int earlyStoppingRounds,
    int threadCount,
    long seed,
    boolean deterministic,
    boolean goss) {

  public TrainParameters {
    if (objective == null) {
      throw new InvalidRequestException("objective must be one of tweedie, poisson, regression, got null");
    }
    requireRange("tweedieVariancePower", tweedieVariancePower, 1.0, 1.999_999, "1.1 for sparse daily sales");
    requireRange("learningRate", learningRate, 1e-6, 1.0, "0.05 is a common choice");
    requireRange("leafCount", leafCount, 2, 131_072, "127 suits large retail data");
    requireRange("minDataInLeaf", minDataInLeaf, 1, Integer.MAX_VALUE, "100 keeps leaves stable");
    requireRange("featureFraction", featureFraction, 1e-6, 1.0, "0.8 is common");
    requireRange("baggingFraction", baggingFraction, 1e-6, 1.0, "0.8 is common; 1 disables bagging");
    requireRange("lambdaL2", lambdaL2, 0.0, Double.MAX_VALUE, "0.1 is a mild penalty");
    requireRange("maxRounds", maxRounds, 1, 1_000_000, "1000 with early stopping");
    requireRange("earlyStoppingRounds", earlyStoppingRounds, 0, 1_000_000, "50; 0 disables early stopping");
    requireRange("threadCount", threadCount, 1, 1024, "use the number of available processors");
  }

  /**
   * Defaults: tweedie (power 1.1), learning rate 0.05, 127 leaves, 100 rows per leaf, feature and bagging
   * fraction 0.8, lambda_l2 0.1, 1000 rounds, early stopping after 50, all processors, seed 1, not deterministic.
   */
  public static TrainParameters defaults() {
    return new TrainParameters(Objective.TWEEDIE, 1.1, 0.05, 127, 100, 0.8, 0.8, 0.1, 1000, 50,
        Runtime.getRuntime().availableProcessors(), 1L, false, false);
  }

  public TrainParameters withObjective(Objective value) {
    return new TrainParameters(value, tweedieVariancePower, learningRate, leafCount, minDataInLeaf, featureFraction,
        baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic, goss);
  }

  public TrainParameters withTweedieVariancePower(double value) {
    return new TrainParameters(objective, value, learningRate, leafCount, minDataInLeaf, featureFraction,
        baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic, goss);
  }

  public TrainParameters withLearningRate(double value) {
    return new TrainParameters(objective, tweedieVariancePower, value, leafCount, minDataInLeaf, featureFraction,
        baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic, goss);
  }

  public TrainParameters withLeafCount(int value) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, value, minDataInLeaf, featureFraction,
        baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic, goss);
  }

  public TrainParameters withMinDataInLeaf(int value) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, value, featureFraction,
        baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic, goss);
  }

  public TrainParameters withFractions(double features, double bagging) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, minDataInLeaf, features,
        bagging, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic, goss);
  }

  public TrainParameters withLambdaL2(double value) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, minDataInLeaf,
        featureFraction, baggingFraction, value, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic,
        goss);
  }

  public TrainParameters withRounds(int maxRounds, int earlyStoppingRounds) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, minDataInLeaf,
        featureFraction, baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic,
        goss);
  }

  public TrainParameters withThreadCount(int value) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, minDataInLeaf,
        featureFraction, baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, value, seed, deterministic, goss);
  }

  public TrainParameters withSeed(long value) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, minDataInLeaf,
        featureFraction, baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, value, deterministic,
        goss);
  }

  public TrainParameters withDeterministic(boolean value) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, minDataInLeaf,
        featureFraction, baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, value, goss);
  }

  public TrainParameters withGoss(boolean value) {
    return new TrainParameters(objective, tweedieVariancePower, learningRate, leafCount, minDataInLeaf,
        featureFraction, baggingFraction, lambdaL2, maxRounds, earlyStoppingRounds, threadCount, seed, deterministic,
        value);
  }

  /**
   * LightGBM's Booster parameter string. The metrics are the objective's own first (early stopping reads it) and
   * rmse second. {@code force_col_wise=true} is repeated here because the Booster, not the Dataset, decides the
   * histogram layout at creation.
   */
  String toLightGbmString() {
    int lightGbmSeed = DatasetParameters.seedAsInt(seed);
    StringBuilder text = new StringBuilder();
    text.append("objective=").append(objective.lightGbmName())
        .append(" metric=").append(objective.metricName()).append(",rmse")
        .append(" learning_rate=").append(format(learningRate))
        .append(" num_leaves=").append(leafCount)
        .append(" min_data_in_leaf=").append(minDataInLeaf)
        .append(" feature_fraction=").append(format(featureFraction))
        .append(goss ? " data_sample_strategy=goss" : " bagging_fraction=" + format(baggingFraction)
            + " bagging_freq=" + (baggingFraction < 1.0 ? 1 : 0))
        .append(" lambda_l2=").append(format(lambdaL2))
        .append(" num_threads=").append(threadCount)
        .append(" seed=").append(lightGbmSeed)
        .append(" bagging_seed=").append(lightGbmSeed)
        .append(" feature_fraction_seed=").append(lightGbmSeed)
        .append(" force_col_wise=true")
        .append(" verbosity=-1");
    if (objective == Objective.TWEEDIE) {
      text.append(" tweedie_variance_power=").append(format(tweedieVariancePower));
    }
    if (deterministic) {
      text.append(" deterministic=true");
    }
    return text.toString();
  }

  /** Shortest text that parses back to the same double; locale-independent. */
  private static String format(double value) {
    return Double.toString(value);
  }
}
