package org.lagmill.memory;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Resident memory of this process as the Linux kernel reports it in {@code /proc/self/status}. Native libraries
 * (LightGBM's Dataset and Booster) allocate outside any {@link MemoryBudget}, so footprint figures compare these
 * readings before and after a stage.
 *
 * <p>Thread-safe (stateless). On systems without {@code /proc} every reading is {@link #UNAVAILABLE}.
 */
public final class ProcessMemory {
  /** Returned when the reading is not available on this system. */
  public static final long UNAVAILABLE = -1;

  private static final Path STATUS = Path.of("/proc/self/status");

  private ProcessMemory() {
  }

  /** Current resident set size ({@code VmRSS}) in bytes, or {@link #UNAVAILABLE}. */
  public static long residentBytes() {
    return readKibField("VmRSS:");
  }

  /** Peak resident set size since the process started ({@code VmHWM}) in bytes, or {@link #UNAVAILABLE}. */
  public static long peakResidentBytes() {
    return readKibField("VmHWM:");
  }

  static long parseKibField(Iterable<String> statusLines, String field) {
    for (String line : statusLines) {
      if (line.startsWith(field)) {
        String[] parts = line.substring(field.length()).trim().split("\\s+");
        // the kernel always reports these fields in kB (KiB)
        return Long.parseLong(parts[0]) * 1024L;
      }
    }
    return UNAVAILABLE;
  }

  private static long readKibField(String field) {
    if (!Files.isReadable(STATUS)) {
      return UNAVAILABLE;
    }
    try {
      return parseKibField(Files.readAllLines(STATUS), field);
    } catch (IOException | NumberFormatException e) {
      return UNAVAILABLE;
    }
  }
}
