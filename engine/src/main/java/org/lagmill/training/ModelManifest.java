package org.lagmill.training;

import java.util.List;
import java.util.Map;

/**
 * The model directory's {@code manifest.json}: everything needed to forecast with the models and to judge them.
 *
 * @param featureSpecYaml the feature spec in its YAML form, so the directory is self-describing
 * @param modelFileChecksums CRC32C (hex) of each model file, verified when the directory is opened
 * @param dispersionFileChecksum CRC32C (hex) of the dispersion table; null only in format version 1
 * @param zeroRowsKept share of the zero-sales training rows the models were trained on (each weighted by its
 *     inverse); a manifest written before zero-row sampling existed reads as 1, every row
 */
public record ModelManifest(int formatVersion, String createdAt, String storeFingerprint, String featureSpecYaml,
    Map<String, Object> trainParameters, Map<String, Object> datasetParameters, String trainingFirstDate,
    String trainingLastDate, String validationFirstDate, String validationLastDate, String partitionAttribute,
    List<PartitionReport> partitions, Map<String, String> modelFileChecksums, String dispersionFile,
    String dispersionFileChecksum, Double zeroRowsKept) {

  public ModelManifest {
    if (zeroRowsKept == null) {
      zeroRowsKept = TrainingPlan.ZERO_ROWS_KEPT_BY_DEFAULT;
    }
  }

  /** Written now: 2 = the manifest carries its own CRC32C and lists the dispersion table's. */
  public static final int FORMAT_VERSION_CURRENT = 2;
  /** Oldest version a reader accepts (1: no manifest or dispersion checksum). */
  public static final int FORMAT_VERSION_OLDEST = 1;
  public static final String FILE_NAME = "manifest.json";
  public static final String DISPERSION_FILE_NAME = "dispersion.csv";
}
