package org.lagmill.training;

import java.util.List;

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
 */
public record PartitionReport(String partitionValue, String modelFile, int seriesCount, long trainingRowCount,
    long validationRowCount, int featureCount, int bestIteration, int iterationCount, double[] validationCurve,
    String validationMetric, List<FeatureImportanceRow> featureImportance, double datasetSeconds, double trainSeconds,
    long datasetResidentBytes, long peakResidentBytes, double pooledDispersion, long refitRowCount,
    int refitRounds) {

  /** Importance of one feature: total gain of its splits and how many splits use it. */
  public record FeatureImportanceRow(String feature, double gain, long splitCount) {}

  /** Bytes of resident memory per training row that the Dataset took. */
  public double datasetBytesPerRow() {
    return trainingRowCount == 0 ? 0 : datasetResidentBytes / (double) trainingRowCount;
  }
}
