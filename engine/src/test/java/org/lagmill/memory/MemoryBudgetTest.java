package org.lagmill.memory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class MemoryBudgetTest {

  @Test
  void shouldChargeChildReservationsToTheRoot() {
    try (MemoryBudget root = MemoryBudget.unlimited("run")) {
      try (MemoryBudget ingest = root.child("ingest")) {
        ingest.reserve(1000);
        assertEquals(1000, root.heldBytes());
        ingest.release(1000);
      }
      assertEquals(0, root.heldBytes());
      assertEquals(1000, root.peakBytes());
    }
  }

  @Test
  void shouldRefuseReservationsPastTheRootLimitAndKeepCountsUnchanged() {
    try (MemoryBudget root = MemoryBudget.root("run", 100); MemoryBudget stage = root.child("features")) {
      stage.reserve(60);
      MemoryBudgetExceededException e = assertThrows(MemoryBudgetExceededException.class, () -> stage.reserve(50));
      assertTrue(e.getMessage().contains("run"), e.getMessage());
      assertEquals(60, stage.heldBytes());
      assertEquals(60, root.heldBytes());
      stage.release(60);
    }
  }

  @Test
  void shouldFailLoudlyWhenClosedWhileHoldingBytes() {
    MemoryBudget root = MemoryBudget.unlimited("run");
    MemoryBudget stage = root.child("learner");
    stage.reserve(8);
    IllegalStateException e = assertThrows(IllegalStateException.class, stage::close);
    assertEquals("budget run/learner closed while still holding 8 bytes: an owner of off-heap memory in this stage"
        + " was not closed", e.getMessage());
  }

  @Test
  void shouldRejectReleasingMoreThanHeld() {
    try (MemoryBudget root = MemoryBudget.unlimited("run")) {
      assertThrows(IllegalStateException.class, () -> root.release(1));
    }
  }
}
