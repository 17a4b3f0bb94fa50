package org.lagmill.training;

import com.fasterxml.jackson.annotation.JsonProperty;
import java.util.List;
import java.util.Locale;

/**
 * What training one model partition produced and cost; written to the model manifest and the report.
 *
 * @param partitionValue the partition attribute's value, or "all"
 * @param datasetResidentBytes growth of resident memory while the training Dataset was built
 * @param peakResidentBytes the process's peak resident memory when this partition finished (VmHWM)
 * @param trainingRowCount rows before the validation window, on which early stopping chose {@code bestIteration}
 * @param refitRowCount rows of every day up to the cut that the shipped model was trained on again, 0 when it was
 *     not refit (absent in model manifests written before refits existed)
 * @param refitRounds rounds of that refit: {@code bestIteration} scaled by {@code refitRowCount / trainingRowCount}
 * @param zeroRowCount training rows with label 0 before zero-row sampling (kept or dropped; 0 in manifests written
 *     before it existed)
 * @param droppedZeroRowCount of those, the rows zero-row sampling dropped; {@code trainingRowCount} counts the kept
 *     rows only
 * @param zeroRowWeight the weight factor each kept zero row carried (1 / the kept share; 1 when none was dropped, and
 *     in manifests written before sampling existed)
 * @param refitDroppedZeroRowCount zero rows the refit's sampling dropped from every day up to the cut, 0 without one
 * @param bestIteration the early-stopped round count; for a continued model the rounds it added to its starting
 *     model's (0 when none beat the starting model on the validation rows)
 * @param iterationCount rounds the model holds: {@code startingRounds + bestIteration} (without a refit)
 * @param continuedFrom where the model this one continued from came from (its folder, or the backtest origin that
 *     trained it); null for a model boosted from scratch (and in manifests written before continuing existed)
 * @param startingRounds rounds taken over from that model, in front of the added ones; 0 when not continued
 * @param startingValidationLoss that model's validation loss on this training's validation rows, which the added
 *     rounds had to beat; null when not continued or without validation rows
 */
public record PartitionReport(String partitionValue, String modelFile, int seriesCount, long trainingRowCount,
    long validationRowCount, int featureCount, int bestIteration, int iterationCount, double[] validationCurve,
    String validationMetric, List<FeatureImportanceRow> featureImportance, double datasetSeconds, double trainSeconds,
    long datasetResidentBytes, long peakResidentBytes, double pooledDispersion, long refitRowCount,
    int refitRounds, long zeroRowCount, long droppedZeroRowCount, double zeroRowWeight,
    long refitDroppedZeroRowCount, String continuedFrom, int startingRounds, Double startingValidationLoss) {

  public PartitionReport {
    if (zeroRowWeight == 0) {
      // absent from a manifest written before zero-row sampling: every row was kept at weight 1
      zeroRowWeight = 1;
    }
  }

  /** A report of a model boosted from scratch. */
  public PartitionReport(String partitionValue, String modelFile, int seriesCount, long trainingRowCount,
      long validationRowCount, int featureCount, int bestIteration, int iterationCount, double[] validationCurve,
      String validationMetric, List<FeatureImportanceRow> featureImportance, double datasetSeconds,
      double trainSeconds, long datasetResidentBytes, long peakResidentBytes, double pooledDispersion,
      long refitRowCount, int refitRounds, long zeroRowCount, long droppedZeroRowCount, double zeroRowWeight,
      long refitDroppedZeroRowCount) {
    this(partitionValue, modelFile, seriesCount, trainingRowCount, validationRowCount, featureCount, bestIteration,
        iterationCount, validationCurve, validationMetric, featureImportance, datasetSeconds, trainSeconds,
        datasetResidentBytes, peakResidentBytes, pooledDispersion, refitRowCount, refitRounds, zeroRowCount,
        droppedZeroRowCount, zeroRowWeight, refitDroppedZeroRowCount, null, 0, null);
  }

  /** Whether this model continued from a starting model instead of boosting from scratch. */
  public boolean continued() {
    return continuedFrom != null;
  }

  /** Rounds this training added: all of them for a model boosted from scratch. Written, never read back. */
  @JsonProperty(value = "addedRounds", access = JsonProperty.Access.READ_ONLY)
  public int addedRounds() {
    return iterationCount - startingRounds;
  }

  /** Importance of one feature: total gain of its splits and how many splits use it. */
  public record FeatureImportanceRow(String feature, double gain, long splitCount) {}

  /** Share of label-0 rows among the training rows before sampling, in [0, 1]. */
  public double zeroRowShare() {
    long before = trainingRowCount + droppedZeroRowCount;
    return before == 0 ? 0 : zeroRowCount / (double) before;
  }

  /**
   * What zero-row sampling did to these partitions, summed over them (the origins of a backtest, say), in one line:
   * "dropped 1,234 of 2,000 training rows with zero sales (62 % of the 3,000 rows before sampling); each kept one
   * weighs 4", plus the refit's drop when there was one; null when no row was dropped.
   */
  public static String zeroRowsNotice(List<PartitionReport> partitions) {
    long dropped = 0;
    long zeros = 0;
    long before = 0;
    long refitDropped = 0;
    double weight = 1;
    for (PartitionReport p : partitions) {
      dropped += p.droppedZeroRowCount;
      zeros += p.zeroRowCount;
      before += p.trainingRowCount + p.droppedZeroRowCount;
      refitDropped += p.refitDroppedZeroRowCount;
      weight = Math.max(weight, p.zeroRowWeight);
    }
    if (dropped == 0 && refitDropped == 0) {
      return null;
    }
    String line = String.format(Locale.ROOT, "dropped %,d of %,d training rows with zero sales (%.0f %% of the %,d"
        + " rows before sampling); each kept one weighs %s", dropped, zeros, before == 0 ? 0 : 100.0 * zeros / before,
        before, weight);
    return refitDropped == 0 ? line : line + String.format(Locale.ROOT, "; the refit on every day dropped %,d",
        refitDropped);
  }

  /** Bytes of resident memory per training row that the Dataset took. */
  public double datasetBytesPerRow() {
    return trainingRowCount == 0 ? 0 : datasetResidentBytes / (double) trainingRowCount;
  }
}
