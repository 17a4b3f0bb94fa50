package org.lagmill.forecast;

import java.util.List;

/**
 * What training one model partition produced and cost; written to the model manifest and the report.
 *
 * @param partitionValue the partition attribute's value, or "all"
 * @param datasetResidentBytes growth of resident memory while the training Dataset was built
 * @param peakResidentBytes the process's peak resident memory when this partition finished (VmHWM)
 */
public record PartitionReport(String partitionValue, String modelFile, int seriesCount, long trainingRowCount,
    long validationRowCount, int featureCount, int bestIteration, int iterationCount, double[] validationCurve,
    String validationMetric, List<FeatureImportanceRow> featureImportance, double datasetSeconds, double trainSeconds,
    long datasetResidentBytes, long peakResidentBytes, double pooledDispersion) {

  /** Importance of one feature: total gain of its splits and how many splits use it. */
  public record FeatureImportanceRow(String feature, double gain, long splitCount) {}

  /** Bytes of resident memory per training row that the Dataset took. */
  public double datasetBytesPerRow() {
    return trainingRowCount == 0 ? 0 : datasetResidentBytes / (double) trainingRowCount;
  }
}
