package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.eval.Hierarchy;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;

class HierarchyOptionsTest {
  /** Columns named unlike any default: sku under dept, shops crosswise. */
  private static final SalesHistory TILL = history(new String[] {"sku", "shop", "dept"},
      new String[][] {{"A", "s1", "D1"}, {"A", "s2", "D1"}, {"B", "s1", "D1"}, {"C", "s2", "D2"}});

  private static SalesHistory history(String[] names, String[][] rows) {
    return new ArraySalesHistory(LocalDate.of(2025, 1, 1), new int[rows.length][3],
        ArraySeriesAttributes.of(names, rows), PriceTable.EMPTY, DayCalendar.EMPTY);
  }

  @Test
  void shouldDefaultToTheNestingFoundInTheData() {
    Hierarchy hierarchy = new HierarchyOptions().hierarchy(TILL);
    assertEquals(Hierarchy.Source.DETECTED, hierarchy.source());
    assertEquals(List.of("total", "dept", "shop", "sku", "dept x shop", "sku x shop"), hierarchy.levelNames());
  }

  @Test
  void shouldTakeExplicitLevelsInTheGivenOrder() {
    HierarchyOptions options = new HierarchyOptions();
    options.levels = List.of("total", "shop", "shop,sku");
    Hierarchy hierarchy = options.hierarchy(TILL);
    assertEquals(List.of(List.of(), List.of("shop"), List.of("shop", "sku")), hierarchy.levelAttributeNames());
    assertEquals(Hierarchy.Source.DECLARED, hierarchy.source());
  }

  @Test
  void shouldRefuseLevelsTogetherWithHierarchies() {
    HierarchyOptions options = new HierarchyOptions();
    options.levels = List.of("shop");
    options.hierarchies = List.of("dept>sku");
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> options.hierarchy(TILL));
    assertEquals("give either --hierarchy or --level, not both", e.getMessage());
  }

  @Test
  void shouldFallBackToTotalAndSingleSeriesWithoutNesting() {
    SalesHistory plain = history(new String[] {"series_id"}, new String[][] {{"x"}, {"y"}});
    assertEquals(List.of(List.of(), List.of("series_id")), new HierarchyOptions().hierarchy(plain)
        .levelAttributeNames());
  }
}
