package org.lagmill.learner;

import org.lagmill.memory.ProcessMemory;

/**
 * Figures about one built Dataset. LightGBM allocates its binned Dataset outside any memory budget, so its size is
 * measured as the growth of the process's resident memory while it was built (a rough figure: the JVM's own heap
 * and other threads count too).
 *
 * @param rowCount rows in the Dataset
 * @param featureCount feature columns
 * @param sampledRowCount rows sampled to find bin boundaries (0 for a validation Dataset, which reuses the training
 *     Dataset's bins)
 * @param sampledValueCount non-zero or missing values kept from the sample, all columns together
 * @param residentBytesBefore process RSS in bytes before building, or {@link ProcessMemory#UNAVAILABLE}
 * @param residentBytesAfter process RSS in bytes once the Dataset was finished, or {@link ProcessMemory#UNAVAILABLE}
 */
public record DatasetStats(
    long rowCount,
    int featureCount,
    int sampledRowCount,
    long sampledValueCount,
    long residentBytesBefore,
    long residentBytesAfter) {

  /** RSS growth in bytes while building (may be negative after a garbage collection), or UNAVAILABLE. */
  public long residentBytesGrowth() {
    if (residentBytesBefore == ProcessMemory.UNAVAILABLE || residentBytesAfter == ProcessMemory.UNAVAILABLE) {
      return ProcessMemory.UNAVAILABLE;
    }
    return residentBytesAfter - residentBytesBefore;
  }
}
