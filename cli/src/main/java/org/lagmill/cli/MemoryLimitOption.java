package org.lagmill.cli;

import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudget;
import picocli.CommandLine.Option;

/** {@code --memory-limit SIZE}: the run's off-heap limit; absent means none. */
final class MemoryLimitOption {
  @Option(names = "--memory-limit", paramLabel = "SIZE", converter = ByteSizeConverter.class,
      description = "off-heap budget: bytes, or with k, m, g (1024-based), e.g. 512m or 2g (default: none)")
  Long limitBytes;

  /** The limit in bytes, or {@link MemoryBudget#UNLIMITED_BYTES} when the option is absent. */
  long bytes() {
    if (limitBytes == null) {
      return MemoryBudget.UNLIMITED_BYTES;
    }
    if (limitBytes <= 0) {
      throw new InvalidRequestException("--memory-limit must be a positive number of bytes, got " + limitBytes
          + "; e.g. --memory-limit 2g");
    }
    return limitBytes;
  }
}
