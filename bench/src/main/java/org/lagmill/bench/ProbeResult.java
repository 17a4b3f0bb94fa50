package org.lagmill.bench;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.List;
import java.util.Optional;

/**
 * What one {@link FootprintProbe} run reports, printed as one line {@code FOOTPRINT {json}} so the harness can find it
 * in the probe's log among LightGBM's and the JVM's own output.
 *
 * @param mode baseline, dump, stream, floor or matrix
 * @param rowCount training rows in the Dataset (0 for baseline)
 * @param featureCount features per row
 * @param peakBeforeDatasetBytes VmHWM once the rows' source is open, before any Dataset work
 * @param peakAfterDatasetBytes VmHWM once the Dataset is finished (includes the sampling transient)
 * @param peakAfterTrainingBytes VmHWM after the last boosting round, the process's peak
 * @param residentAfterDatasetBytes VmRSS right after the Dataset is finished
 * @param sourceSeconds producing the rows (feature pass, file read or matrix fill), summed over every pass
 * @param sampleSeconds our row sample's own time (selection sampling and copies), in the sampling pass
 * @param datasetSeconds LightGBM's share of the Dataset build: bin boundaries, pushes (binning) and finish
 * @param trainSeconds boosting all rounds
 * @param sourcePassCount how many times the rows were produced (2 for the streamed route: sample, then push)
 * @param storeOffHeapBytes bytes the store maps (0 when the probe holds no store)
 * @param samplePassRowCount rows produced by the sampling pass (the build's sample source; 0 without one)
 * @param samplePassSourceSeconds producing those rows, part of {@code sourceSeconds}
 */
record ProbeResult(String mode, long rowCount, int featureCount, long peakBeforeDatasetBytes,
    long peakAfterDatasetBytes, long peakAfterTrainingBytes, long residentAfterDatasetBytes, double sourceSeconds,
    double sampleSeconds, double datasetSeconds, double trainSeconds, int sourcePassCount, long storeOffHeapBytes,
    long samplePassRowCount, double samplePassSourceSeconds) {

  static final String LINE_PREFIX = "FOOTPRINT ";

  private static final ObjectMapper JSON = new ObjectMapper()
      .configure(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES, false);

  String toLine() {
    try {
      return LINE_PREFIX + JSON.writeValueAsString(this);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write probe result " + this, e);
    }
  }

  /**
   * The last result line among {@code logLines}, or empty when the probe printed none (it failed before the end).
   *
   * @throws IllegalArgumentException when a result line is present but is not a valid result
   */
  static Optional<ProbeResult> findIn(List<String> logLines) {
    for (int i = logLines.size() - 1; i >= 0; i--) {
      String line = logLines.get(i);
      if (line.startsWith(LINE_PREFIX)) {
        try {
          return Optional.of(JSON.readValue(line.substring(LINE_PREFIX.length()), ProbeResult.class));
        } catch (JsonProcessingException e) {
          throw new IllegalArgumentException("line " + (i + 1) + " starts with '" + LINE_PREFIX.trim()
              + "' but holds no valid probe result: " + e.getOriginalMessage(), e);
        }
      }
    }
    return Optional.empty();
  }
}
