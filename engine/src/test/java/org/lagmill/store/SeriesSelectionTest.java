package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;

class SeriesSelectionTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);

  /** Series named by sku, shop and dept (no series_id column), so ids are the values joined by '/'. */
  private static SalesHistory history(String[][] rows) {
    return new ArraySalesHistory(LocalDate.of(2024, 3, 4), new int[rows.length][3],
        ArraySeriesAttributes.of(new String[] {"sku", "shop", "dept"}, rows), PriceTable.EMPTY, DayCalendar.EMPTY);
  }

  @Test
  void shouldPickSeriesByIdAndByConditionsAgainstASlowReference() {
    for (int round = 0; round < 20; round++) {
      long seed = MASTER_SEED + round;
      SplittableRandom random = new SplittableRandom(seed);
      int seriesCount = 1 + random.nextInt(40);
      String[][] rows = new String[seriesCount][];
      for (int s = 0; s < seriesCount; s++) {
        rows[s] = new String[] {"k" + s, "shop" + random.nextInt(4), "dept" + random.nextInt(3)};
      }
      SalesHistory history = history(rows);
      List<String> conditions = new ArrayList<>();
      conditions.add("shop=" + rows[random.nextInt(seriesCount)][1]);
      if (random.nextBoolean()) {
        conditions.add("shop=" + rows[random.nextInt(seriesCount)][1]);
      }
      if (random.nextBoolean()) {
        conditions.add("dept=" + rows[random.nextInt(seriesCount)][2]);
      }
      String id = String.join("/", rows[random.nextInt(seriesCount)]);
      List<Integer> expected = new ArrayList<>();
      for (int s = 0; s < seriesCount; s++) {
        boolean shopOk = false;
        boolean deptOk = true;
        boolean anyDept = false;
        boolean deptHit = false;
        for (String c : conditions) {
          if (c.startsWith("shop=")) {
            shopOk |= rows[s][1].equals(c.substring(5));
          } else {
            anyDept = true;
            deptHit |= rows[s][2].equals(c.substring(5));
          }
        }
        deptOk = !anyDept || deptHit;
        if ((shopOk && deptOk) || String.join("/", rows[s]).equals(id)) {
          expected.add(s);
        }
      }
      assertArrayEquals(expected.stream().mapToInt(Integer::intValue).toArray(),
          SeriesSelection.select(history, List.of(id), conditions), "seed " + seed + ", conditions " + conditions);
    }
  }

  @Test
  void shouldMatchTextInIdsAndValuesIgnoringCase() {
    for (int round = 0; round < 20; round++) {
      long seed = MASTER_SEED + 100 + round;
      SplittableRandom random = new SplittableRandom(seed);
      int seriesCount = 1 + random.nextInt(30);
      String[][] rows = new String[seriesCount][];
      for (int s = 0; s < seriesCount; s++) {
        rows[s] = new String[] {"Sku" + random.nextInt(50), "Shop" + random.nextInt(4), "Dept" + random.nextInt(3)};
      }
      SalesHistory history = history(rows);
      String text = random.nextBoolean() ? "shop" + random.nextInt(4) : "KU" + random.nextInt(10);
      List<Integer> expected = new ArrayList<>();
      for (int s = 0; s < seriesCount; s++) {
        if (String.join("/", rows[s]).toLowerCase(Locale.ROOT).contains(text.toLowerCase(Locale.ROOT))) {
          expected.add(s);
        }
      }
      assertArrayEquals(expected.stream().mapToInt(Integer::intValue).toArray(),
          SeriesSelection.matching(history, text), "seed " + seed + ", text " + text);
    }
  }

  @Test
  void shouldSelectEverySeriesWhenNothingIsGiven() {
    SalesHistory history = history(new String[][] {{"a", "s1", "d1"}});
    assertNull(SeriesSelection.select(history, List.of(), List.of()));
    assertArrayEquals(new int[] {0}, SeriesSelection.matching(history, null));
  }

  @Test
  void shouldNameWhatIsWrongInABadSelection() {
    SalesHistory history = history(new String[][] {{"a", "s1", "d1"}, {"b", "s2", "d1"}});
    assertEquals("‹where› 'shop': expected ATTRIBUTE=VALUE, e.g. ‹where› dept=d1",
        assertThrows(IllegalArgumentException.class, () -> SeriesSelection.select(history, null, List.of("shop")))
            .getMessage());
    assertEquals("‹where› 'store=s1': the store has no attribute 'store'; its attributes: sku, shop, dept",
        assertThrows(IllegalArgumentException.class,
            () -> SeriesSelection.select(history, null, List.of("store=s1"))).getMessage());
    assertEquals("‹where› 'shop=s9': no series has shop = s9; values of shop: s1, s2",
        assertThrows(IllegalArgumentException.class,
            () -> SeriesSelection.select(history, null, List.of("shop=s9"))).getMessage());
    assertEquals(
        "‹series› a/s9/d1: no such series in the store; list them with \u2039series command\u203a \u2039store\u203a"
            + " DIR \u2039match\u203a TEXT",
        assertThrows(IllegalArgumentException.class,
            () -> SeriesSelection.select(history, List.of("a/s9/d1"), null)).getMessage());
  }
}
