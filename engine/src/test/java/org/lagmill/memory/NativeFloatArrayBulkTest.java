package org.lagmill.memory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;

/** The bulk {@link NativeFloatArray#put} against one {@link NativeFloatArray#set} per value. */
class NativeFloatArrayBulkTest {
  private static final long SEED = TestSeeds.master(20261202L);

  @Test
  void shouldPutTheSameBitsAsOneSetPerValue() {
    Random random = new Random(SEED);
    float[] src = new float[40];
    for (int i = 0; i < src.length; i++) {
      src[i] = i % 7 == 0 ? Float.intBitsToFloat(0x7fc00001 + i) : (float) random.nextGaussian();
    }
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        NativeFloatArray bulk = new NativeFloatArray(budget, 50);
        NativeFloatArray single = new NativeFloatArray(budget, 50)) {
      bulk.fill(0, 50, -1f);
      single.fill(0, 50, -1f);
      bulk.put(6, src, 3, 30);
      for (int i = 0; i < 30; i++) {
        single.set(6 + i, src[3 + i]);
      }
      for (int i = 0; i < 50; i++) {
        assertEquals(Float.floatToRawIntBits(single.get(i)), Float.floatToRawIntBits(bulk.get(i)),
            "element " + i + ", seed " + SEED);
      }
    }
  }

  @Test
  void shouldRejectRangesOutsideEitherArrayAndUseAfterClose() {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      NativeFloatArray array = new NativeFloatArray(budget, 10);
      float[] src = new float[8];
      assertThrows(IndexOutOfBoundsException.class, () -> array.put(5, src, 0, 6));
      assertThrows(IndexOutOfBoundsException.class, () -> array.put(0, src, 4, 5));
      assertThrows(IndexOutOfBoundsException.class, () -> array.put(-1, src, 0, 1));
      array.close();
      assertThrows(IllegalStateException.class, () -> array.put(0, src, 0, 1));
    }
  }
}
