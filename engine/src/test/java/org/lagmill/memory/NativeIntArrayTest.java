package org.lagmill.memory;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class NativeIntArrayTest {
  @Test
  void shouldStoreReserveAndReleaseOnce() {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      NativeIntArray array = new NativeIntArray(budget, 10);
      assertEquals(40, budget.heldBytes());
      array.fill(0, 10, -1);
      array.set(3, 123_456_789);
      int[] out = new int[5];
      array.read(1, out, 0, 5);
      assertArrayEquals(new int[] {-1, -1, 123_456_789, -1, -1}, out);
      array.close();
      array.close();
      assertEquals(0, budget.heldBytes());
      assertThrows(IllegalStateException.class, () -> array.get(0));
    }
  }

  @Test
  void shouldRejectLengthOutOfRange() {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
          () -> new NativeIntArray(budget, NativeIntArray.MAX_LENGTH + 1));
      assertEquals("length must be in [0, 536870911], got 536870912; split the data into smaller arrays",
          e.getMessage());
    }
  }
}
