package org.lagmill.run;

/**
 * Time and memory of one finished stage, as {@code run.json} and the report show them.
 *
 * @param seconds wall time of the stage
 * @param peakResidentBytes the process's peak resident set ({@code VmHWM}) at the end of the stage; it never goes
 *     down, so a later stage shows at least an earlier one's figure (-1 where the system does not report it)
 * @param offHeapBytes the largest off-heap total the whole run held while the stage ran (its own reservations plus
 *     what earlier stages still held, such as a mapped store)
 * @param rowCount rows the stage handled (0 when rows do not apply)
 */
public record StageRecord(String name, double seconds, long peakResidentBytes, long offHeapBytes, long rowCount) {
  /** Rows per second of wall time, 0 for an instant stage. */
  public double rowsPerSecond() {
    return seconds > 0 ? rowCount / seconds : 0;
  }
}
