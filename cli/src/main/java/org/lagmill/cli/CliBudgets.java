package org.lagmill.cli;

import org.lagmill.memory.MemoryBudget;

/** The root memory budget of one command, from its {@code --memory-limit}. */
final class CliBudgets {
  private CliBudgets() {}

  static MemoryBudget root(Long memoryLimitBytes) {
    if (memoryLimitBytes == null) {
      return MemoryBudget.unlimited("lagmill");
    }
    if (memoryLimitBytes <= 0) {
      throw new IllegalArgumentException("--memory-limit must be a positive number of bytes, got " + memoryLimitBytes
          + "; e.g. --memory-limit 2g");
    }
    return MemoryBudget.root("lagmill", memoryLimitBytes);
  }
}
