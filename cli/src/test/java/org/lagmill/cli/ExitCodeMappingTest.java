package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.lagmill.memory.MemoryBudgetExceededException;

/** One exit code per kind of failure, and a JVM out-of-memory told apart from a budget refusal. */
class ExitCodeMappingTest {
  @Test
  void shouldTellAJvmOutOfMemoryFromABudgetRefusal() {
    OutOfMemoryError heap = new OutOfMemoryError("Java heap space");
    assertEquals(ExitCodes.JVM_OUT_OF_MEMORY, Main.exitCodeOf(heap));
    assertEquals("the Java process ran out of memory (Java heap space), outside lagmill's off-heap budget; give it"
        + " more heap with LAGMILL_HEAP (e.g. LAGMILL_HEAP=4g, the launcher's default is 1g) or run on fewer series",
        Main.message(heap));
    MemoryBudgetExceededException budget = new MemoryBudgetExceededException("lagmill/train", 10, 95, 100);
    assertEquals(ExitCodes.OUT_OF_MEMORY_BUDGET, Main.exitCodeOf(budget));
  }
}
