package org.lagmill.forecast;

import java.util.List;
import java.util.Map;

/**
 * The model directory's {@code manifest.json}: everything needed to forecast with the models and to judge them.
 *
 * @param featureSpecYaml the feature spec in its YAML form, so the directory is self-describing
 * @param modelFileChecksums CRC32C (hex) of each model file, verified when the directory is opened
 */
public record ModelManifest(int formatVersion, String createdAt, String storeFingerprint, String featureSpecYaml,
    Map<String, Object> trainParameters, Map<String, Object> datasetParameters, String trainingFirstDate,
    String trainingLastDate, String validationFirstDate, String validationLastDate, String partitionAttribute,
    List<PartitionReport> partitions, Map<String, String> modelFileChecksums, String dispersionFile) {

  public static final int FORMAT_VERSION_CURRENT = 1;
  public static final String FILE_NAME = "manifest.json";
  public static final String DISPERSION_FILE_NAME = "dispersion.csv";
}
