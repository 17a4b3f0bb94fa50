package org.lagmill.report;

import java.util.Arrays;
import java.util.List;

/**
 * What training recorded: the validation curve and the feature importance.
 *
 * @param validation the metric on the validation days after each boosting iteration, or null
 * @param importance features with their total gain and split count, any order; empty when not recorded
 * @param rowNotice what the training did to its rows that changes the model (zero-sales rows dropped and the weight
 *     of those kept), one line, or null when it kept every row as it is
 * @param continuation what the model continued from, or null when it was boosted from scratch
 */
public record TrainingSummary(ValidationCurve validation, List<FeatureImportance> importance, String rowNotice,
    Continuation continuation) {

  public TrainingSummary {
    importance = importance == null ? List.of() : List.copyOf(importance);
  }

  /** A summary of a training that kept every row as it is and boosted from scratch. */
  public TrainingSummary(ValidationCurve validation, List<FeatureImportance> importance) {
    this(validation, importance, null, null);
  }

  /** A summary of a training that boosted from scratch. */
  public TrainingSummary(ValidationCurve validation, List<FeatureImportance> importance, String rowNotice) {
    this(validation, importance, rowNotice, null);
  }

  /**
   * A model that continued from another one's trees instead of boosting from scratch.
   *
   * @param source where the starting model came from (a folder, or the backtest origin that trained it)
   * @param startingRounds rounds of the starting model, in front of the added ones
   * @param addedRounds rounds this training added (the validation curve covers those tried)
   * @param startingValidationLoss the starting model's validation metric, or null when unknown
   */
  public record Continuation(String source, int startingRounds, int addedRounds, Double startingValidationLoss) {
    public Continuation {
      source = ReportData.requireText(source, "source");
      if (startingRounds < 0 || addedRounds < 0) {
        throw new IllegalArgumentException("round counts must be >= 0, got " + startingRounds + " and "
            + addedRounds);
      }
    }
  }

  /**
   * The validation metric per boosting iteration.
   *
   * @param metricName the metric as LightGBM names it, e.g. "rmse" or "tweedie"
   * @param values metric after iteration {@code i + 1} at index {@code i}; lower is better
   * @param trainingValues the same metric on the training rows, same length, or null
   * @param bestIteration the 1-based iteration kept by early stopping, in [1, values.length], or 0 when none
   */
  public record ValidationCurve(String metricName, double[] values, double[] trainingValues, int bestIteration) {
    public ValidationCurve {
      metricName = ReportData.requireText(metricName, "metricName");
      if (values == null) {
        throw new IllegalArgumentException("values must not be null; pass an empty array when no iteration ran");
      }
      if (trainingValues != null && trainingValues.length != values.length) {
        throw new IllegalArgumentException("trainingValues has " + trainingValues.length
            + " iterations but values has " + values.length + "; both curves must cover the same iterations");
      }
      if (bestIteration < 0 || bestIteration > values.length) {
        throw new IllegalArgumentException("bestIteration must be in [0, " + values.length + "], got "
            + bestIteration + " (1-based; 0 means no best iteration)");
      }
    }

    @Override
    public boolean equals(Object o) {
      return o instanceof ValidationCurve c && metricName.equals(c.metricName) && Arrays.equals(values, c.values)
          && Arrays.equals(trainingValues, c.trainingValues) && bestIteration == c.bestIteration;
    }

    @Override
    public int hashCode() {
      return 31 * (31 * (31 * metricName.hashCode() + Arrays.hashCode(values)) + Arrays.hashCode(trainingValues))
          + bestIteration;
    }

    @Override
    public String toString() {
      return "ValidationCurve[" + metricName + ", " + values.length + " iterations, best " + bestIteration + "]";
    }
  }

  /**
   * One feature's importance.
   *
   * @param featureName the feature as the schema names it
   * @param gain total loss reduction of the splits on this feature, at least 0
   * @param splitCount splits on this feature, at least 0
   */
  public record FeatureImportance(String featureName, double gain, long splitCount) {
    public FeatureImportance {
      featureName = ReportData.requireText(featureName, "featureName");
      if (!(gain >= 0) || splitCount < 0) {
        throw new IllegalArgumentException("feature " + featureName + ": gain and splitCount must be >= 0, got "
            + gain + " and " + splitCount);
      }
    }
  }
}
