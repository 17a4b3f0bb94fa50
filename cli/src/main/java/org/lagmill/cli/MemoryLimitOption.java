package org.lagmill.cli;

import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudget;

/** The run's off-heap limit from {@code --memory-limit}: absent means none. */
final class MemoryLimitOption {
  private MemoryLimitOption() {}

  static long bytes(Long memoryLimitBytes) {
    if (memoryLimitBytes == null) {
      return MemoryBudget.UNLIMITED_BYTES;
    }
    if (memoryLimitBytes <= 0) {
      throw new InvalidRequestException("--memory-limit must be a positive number of bytes, got " + memoryLimitBytes
          + "; e.g. --memory-limit 2g");
    }
    return memoryLimitBytes;
  }
}
