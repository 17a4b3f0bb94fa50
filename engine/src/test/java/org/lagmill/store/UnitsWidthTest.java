package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.memory.MemoryBudget;

class UnitsWidthTest {
  // A series whose largest daily sale is 763 needs 2 bytes: a rule of thumb of the trade (common practice, no source).
  private static final int[] MAX_VALUES = {0, 254, 255, 256, 763, 65_534, 65_535, 65_536, Integer.MAX_VALUE - 1};
  private static final UnitsWidth[] EXPECTED = {UnitsWidth.BYTE, UnitsWidth.BYTE, UnitsWidth.SHORT, UnitsWidth.SHORT,
      UnitsWidth.SHORT, UnitsWidth.SHORT, UnitsWidth.INT, UnitsWidth.INT, UnitsWidth.INT};

  @TempDir
  Path temp;

  @Test
  void shouldPickTheNarrowestWidthThatLeavesTheSentinelFree() {
    for (int i = 0; i < MAX_VALUES.length; i++) {
      assertEquals(EXPECTED[i], UnitsWidth.forMaxValue(MAX_VALUES[i]), "max " + MAX_VALUES[i]);
    }
    assertEquals(2, UnitsWidth.forMaxValue(763).bytesPerValue());
    assertEquals(1, UnitsWidth.BYTE.bytesPerValue());
    assertEquals(4, UnitsWidth.INT.bytesPerValue());
    for (int max = 0; max <= 70_000; max++) {
      UnitsWidth width = UnitsWidth.forMaxValue(max);
      assertEquals(max <= 254 ? UnitsWidth.BYTE : max <= 65_534 ? UnitsWidth.SHORT : UnitsWidth.INT, width, "" + max);
    }
  }

  @Test
  void shouldRejectValuesOutsideTheUnitsRange() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> UnitsWidth.forMaxValue(Integer.MAX_VALUE));
    assertEquals("maxUnits must be in [0, 2147483646], got 2147483647; daily units are non-negative and "
        + "fit a signed int, whose all-ones value (-1) marks an unknown day", e.getMessage());
    assertThrows(IllegalArgumentException.class, () -> UnitsWidth.forMaxValue(-1));
  }

  /** Every boundary value, its neighbours and an unknown day survive a store round trip in every width. */
  @Test
  void shouldRoundTripBoundaryValuesInEveryWidth() throws Exception {
    int[][] units = new int[MAX_VALUES.length][];
    for (int i = 0; i < MAX_VALUES.length; i++) {
      int max = MAX_VALUES[i];
      units[i] = new int[] {0, Math.max(0, max - 1), SalesHistory.UNKNOWN_UNITS, max, max / 2, 0};
    }
    Path dir = temp.resolve("widths");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      try (StoreWriter writer = new StoreWriter(dir, RandomStoreData.FIRST_DATE, 6, List.of("item"), budget)) {
        for (int i = 0; i < units.length; i++) {
          writer.addSeries(new String[] {"item-" + i}, units[i]);
        }
        writer.finish(List.of());
      }
      long expectedColumnBytes = 0;
      for (UnitsWidth width : EXPECTED) {
        expectedColumnBytes += width.bytesRequired(6);
      }
      assertEquals(UnitsLayout.fileBytes(expectedColumnBytes), Files.size(dir.resolve("units.bin")));
      try (SalesStore store = SalesStore.open(dir, budget)) {
        for (int i = 0; i < units.length; i++) {
          assertEquals(EXPECTED[i], store.unitsWidth(i), "max " + MAX_VALUES[i]);
          assertEquals(MAX_VALUES[i], store.maxUnits(i));
          int[] read = new int[6];
          store.readUnits(i, 0, read, 0, 6);
          assertArrayEquals(units[i], read, "max " + MAX_VALUES[i]);
          for (int d = 0; d < 6; d++) {
            assertEquals(units[i][d], store.units(i, d));
          }
          int max = MAX_VALUES[i];
          assertEquals(max == 0 ? SalesHistory.NO_SALE : max > 1 ? 1 : 3, store.firstSaleDayIndex(i));
        }
        assertArrayEquals(new long[] {2, 4, 3}, store.seriesCountByWidth());
      }
    }
  }
}
