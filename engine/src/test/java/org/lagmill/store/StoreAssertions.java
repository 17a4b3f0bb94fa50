package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;

/** Compares a stored history with its plain-array reference, value by value. */
public final class StoreAssertions {
  private StoreAssertions() {}

  public static void assertSameHistory(SalesHistory expected, SalesHistory actual, Random random, String where) {
    assertEquals(expected.seriesCount(), actual.seriesCount(), where);
    assertEquals(expected.dayCount(), actual.dayCount(), where);
    assertEquals(expected.firstDate(), actual.firstDate(), where);
    int dayCount = expected.dayCount();
    int[] expectedRow = new int[dayCount];
    int[] actualRow = new int[dayCount + 3];
    for (int s = 0; s < expected.seriesCount(); s++) {
      String at = where + ", series " + s;
      for (int d = 0; d < dayCount; d++) {
        assertEquals(expected.units(s, d), actual.units(s, d), at + ", day " + d);
      }
      expected.readUnits(s, 0, expectedRow, 0, dayCount);
      actual.readUnits(s, 0, actualRow, 3, dayCount);
      assertArrayEquals(expectedRow, java.util.Arrays.copyOfRange(actualRow, 3, 3 + dayCount), at);
      int from = random.nextInt(dayCount);
      int count = random.nextInt(dayCount - from + 1);
      int[] part = new int[count];
      actual.readUnits(s, from, part, 0, count);
      assertArrayEquals(java.util.Arrays.copyOfRange(expectedRow, from, from + count), part, at + " from " + from);
      assertEquals(expected.firstSaleDayIndex(s), actual.firstSaleDayIndex(s), at);
      assertEquals(expected.maxUnits(s), actual.maxUnits(s), at);
      if (actual instanceof SalesStore store) {
        assertEquals(UnitsWidth.forMaxValue(expected.maxUnits(s)), store.unitsWidth(s), at);
      }
    }
    assertSameAttributes(expected.attributes(), actual.attributes(), expected.seriesCount(), where);
    assertSamePrices(expected.prices(), actual.prices(), expected.seriesCount(), dayCount, where);
    assertSameCalendar(expected.calendar(), actual.calendar(), where);
  }

  static void assertSameAttributes(SeriesAttributes expected, SeriesAttributes actual, int seriesCount, String where) {
    assertEquals(expected.attributeCount(), actual.attributeCount(), where);
    for (int a = 0; a < expected.attributeCount(); a++) {
      assertEquals(expected.attributeName(a), actual.attributeName(a), where);
      assertEquals(a, actual.attributeIndex(expected.attributeName(a)), where);
      assertEquals(expected.cardinality(a), actual.cardinality(a), where);
      for (int code = 0; code < expected.cardinality(a); code++) {
        assertEquals(expected.value(a, code), actual.value(a, code), where);
        assertEquals(code, actual.codeOf(a, expected.value(a, code)), where);
      }
      assertEquals(-1, actual.codeOf(a, "no such value"), where);
      for (int s = 0; s < seriesCount; s++) {
        assertEquals(expected.code(s, a), actual.code(s, a), where + ", series " + s);
      }
    }
    assertEquals(-1, actual.attributeIndex("no such attribute"), where);
    for (int s = 0; s < seriesCount; s++) {
      assertEquals(expected.seriesId(s), actual.seriesId(s), where);
      assertEquals(s, actual.seriesIndexOf(expected.seriesId(s)), where);
    }
  }

  /** Prices are compared by the price in force on each day, which clamping before day 0 does not change. */
  static void assertSamePrices(PriceTable expected, PriceTable actual, int seriesCount, int dayCount, String where) {
    int span = dayCount + 40;
    float[] expectedPrices = new float[span];
    float[] actualPrices = new float[span];
    for (int s = 0; s < seriesCount; s++) {
      expected.readPrices(s, 0, expectedPrices, 0, span);
      actual.readPrices(s, 0, actualPrices, 0, span);
      assertArrayEquals(expectedPrices, actualPrices, where + ", prices of series " + s);
      for (int d = 0; d < span; d += 7) {
        assertEquals(expected.priceAt(s, d), actual.priceAt(s, d), where + ", price of series " + s + " day " + d);
      }
      for (int k = 0; k < actual.changeCount(s); k++) {
        assertEquals(k == 0 ? Math.max(0, actual.changeDayIndex(s, k)) : actual.changeDayIndex(s, k),
            actual.changeDayIndex(s, k), where);
      }
    }
  }

  static void assertSameCalendar(DayCalendar expected, DayCalendar actual, String where) {
    assertEquals(expected.dayCount(), actual.dayCount(), where);
    assertEquals(expected.columnCount(), actual.columnCount(), where);
    for (int c = 0; c < expected.columnCount(); c++) {
      assertEquals(expected.columnName(c), actual.columnName(c), where);
      assertEquals(expected.kind(c), actual.kind(c), where);
      assertEquals(expected.keyAttribute(c), actual.keyAttribute(c), where);
      assertEquals(expected.cardinality(c), actual.cardinality(c), where);
      for (int code = 0; code < expected.cardinality(c); code++) {
        assertEquals(expected.categoryValue(c, code), actual.categoryValue(c, code), where);
      }
      int keyCount = expected.keyAttribute(c) == null ? 1 : 8;
      for (int key = -1; key <= keyCount; key++) {
        for (int d = -1; d <= expected.dayCount(); d++) {
          assertEquals(expected.value(c, key, d), actual.value(c, key, d), where + ", column " + c + " key " + key
              + " day " + d);
        }
      }
    }
  }
}
