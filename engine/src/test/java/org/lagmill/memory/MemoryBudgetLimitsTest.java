package org.lagmill.memory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** Limits on child budgets and peak windows, hand-checked byte counts. */
class MemoryBudgetLimitsTest {
  @Test
  void shouldRefuseReservationsPastAChildLimitWhileTheRootHasRoom() {
    try (MemoryBudget root = MemoryBudget.root("run", 1000); MemoryBudget stage = root.child("features", 100)) {
      stage.reserve(80);
      MemoryBudgetExceededException e = assertThrows(MemoryBudgetExceededException.class, () -> stage.reserve(30));
      assertEquals(new MemoryBudgetExceededException("run/features", 30, 80, 100).getMessage(), e.getMessage());
      assertEquals(80, stage.heldBytes());
      assertEquals(80, root.heldBytes());
      assertEquals(100, stage.limitBytes());
      stage.release(80);
    }
  }

  @Test
  void shouldLetTheRootLimitBindUnderAGenerousChildLimit() {
    try (MemoryBudget root = MemoryBudget.root("run", 100); MemoryBudget stage = root.child("train", 1000)) {
      assertThrows(MemoryBudgetExceededException.class, () -> stage.reserve(101));
      assertEquals(0, stage.heldBytes());
      assertEquals(0, root.heldBytes());
    }
  }

  @Test
  void shouldRejectANonPositiveChildLimit() {
    try (MemoryBudget root = MemoryBudget.unlimited("run")) {
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> root.child("x", 0));
      assertEquals("limitBytes must be positive, got 0", e.getMessage());
    }
  }

  @Test
  void shouldWatchThePeakOnlyWhileTheWindowIsOpen() {
    try (MemoryBudget root = MemoryBudget.unlimited("run");
        MemoryBudget store = root.child("store");
        MemoryBudget stage = root.child("stage")) {
      stage.reserve(500);
      stage.release(500);
      store.reserve(40);
      try (MemoryBudget.PeakWindow outer = root.openPeakWindow()) {
        assertEquals(40, outer.peakBytes());
        stage.reserve(10);
        try (MemoryBudget.PeakWindow inner = root.openPeakWindow()) {
          stage.reserve(20);
          stage.release(30);
          assertEquals(70, inner.peakBytes());
        }
        stage.reserve(5);
        stage.release(5);
        assertEquals(70, outer.peakBytes());
      }
      assertEquals(500, root.peakBytes());
      store.release(40);
    }
  }
}
