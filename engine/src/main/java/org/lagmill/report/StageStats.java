package org.lagmill.report;

/**
 * Time and memory of one pipeline stage (ingest, feature pass, Dataset build, training, backtest, forecast).
 *
 * @param stageName the stage as the command line names it, not blank
 * @param seconds wall-clock seconds the stage took, at least 0
 * @param peakRssBytes the process's peak resident set size at the end of the stage (VmHWM), or null
 * @param offHeapBytes off-heap bytes the stage's memory budget held at its peak, or null
 * @param rowCount rows (item-days) the stage processed, or null
 * @param rowsPerSecond rowCount divided by seconds, or null
 * @param datasetBytesPerRow native bytes of the LightGBM Dataset per row, or null when the stage builds none
 */
public record StageStats(
    String stageName,
    double seconds,
    Long peakRssBytes,
    Long offHeapBytes,
    Long rowCount,
    Double rowsPerSecond,
    Double datasetBytesPerRow) {

  public StageStats {
    stageName = ReportData.requireText(stageName, "stageName");
    if (!(seconds >= 0)) {
      throw new IllegalArgumentException("seconds of stage " + stageName + " must be >= 0, got " + seconds);
    }
  }
}
