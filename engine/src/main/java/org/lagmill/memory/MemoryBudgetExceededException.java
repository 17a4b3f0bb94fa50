package org.lagmill.memory;

import org.lagmill.io.Setting;

/** Thrown when a reservation would take a budget past its limit; the CLI maps it to its own exit code. */
public final class MemoryBudgetExceededException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public MemoryBudgetExceededException(String budgetName, long requestedBytes, long heldBytes, long limitBytes) {
    super("memory budget " + budgetName + " exceeded: asked for " + requestedBytes + " bytes while holding "
        + heldBytes + " of a limit of " + limitBytes + " bytes; raise " + Setting.MEMORY_LIMIT
        + " or train per partition");
  }
}
