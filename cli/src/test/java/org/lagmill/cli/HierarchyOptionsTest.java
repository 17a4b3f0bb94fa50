package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.SeriesAttributes;
import org.junit.jupiter.api.Test;

class HierarchyOptionsTest {
  private static final SeriesAttributes CHAIN = ArraySeriesAttributes.of(
      new String[] {"series_id", "item", "department", "category", "store", "region"},
      new String[][] {{"a@s1", "a", "d1", "c1", "s1", "r1"}, {"a@s2", "a", "d1", "c1", "s2", "r2"},
          {"b@s1", "b", "d2", "c1", "s1", "r1"}});

  @Test
  void shouldDefaultToTheCrossProductOfRegionStoreAndCategoryDepartmentItem() {
    assertEquals(12, new HierarchyOptions().hierarchy(CHAIN).levelCount());
  }

  @Test
  void shouldTakeExplicitLevelsInTheGivenOrder() {
    HierarchyOptions options = new HierarchyOptions();
    options.levels = List.of("total", "store", "store,item");
    assertEquals(List.of(List.of(), List.of("store"), List.of("store", "item")),
        options.hierarchy(CHAIN).levelAttributeNames());
  }

  @Test
  void shouldRefuseLevelsTogetherWithHierarchies() {
    HierarchyOptions options = new HierarchyOptions();
    options.levels = List.of("store");
    options.hierarchies = List.of("region>store");
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> options.hierarchy(CHAIN));
    assertEquals("give either --hierarchy or --level, not both", e.getMessage());
  }

  @Test
  void shouldFallBackToTotalAndSingleSeriesWithoutChainAttributes() {
    SeriesAttributes plain = ArraySeriesAttributes.of(new String[] {"series_id"}, new String[][] {{"x"}, {"y"}});
    assertEquals(List.of(List.of(), List.of("series_id")), new HierarchyOptions().hierarchy(plain)
        .levelAttributeNames());
  }
}
