package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.AttributeNesting;
import org.lagmill.store.AttributeNestingTest;
import org.lagmill.store.SeriesAttributes;

/** Default levels come from how the data nest, never from attribute names. */
class DetectedHierarchyTest {
  /**
   * A department holding several categories: the levels name department and category each once (the old name-based
   * default assumed category over department and scored one grouping twice, the other never).
   */
  @Test
  void shouldScoreEachLevelOfADepartmentHoldingCategoriesOnce() {
    SeriesAttributes attributes = AttributeNestingTest.departmentHoldingCategories();
    Hierarchy hierarchy = Hierarchy.detected(AttributeNesting.detect(attributes, 18));
    assertEquals(Hierarchy.Source.DETECTED, hierarchy.source());
    assertEquals(List.of("total", "department", "region", "category", "store", "item", "department x region",
        "category x region", "department x store", "item x region", "category x store", "item x store"),
        hierarchy.levelNames());
    List<Level> levels = hierarchy.bind(attributes, 18);
    List<Integer> aggregateCounts = new ArrayList<>();
    for (Level level : levels) {
      aggregateCounts.add(level.aggregateCount());
    }
    // 2 departments, 2 regions, 3 categories, 3 stores, 6 items, and their products.
    assertEquals(List.of(1, 2, 2, 3, 3, 6, 4, 6, 6, 12, 9, 18), aggregateCounts);
    assertTrue(levels.get(levels.size() - 1).isBottom());
  }

  /** Columns named sku, shop, dept: the bottom level sku × shop is scored, and dept over sku is found. */
  @Test
  void shouldFindTheLevelsOfOtherColumnNames() {
    String[][] rows = {{"A", "s1", "D1"}, {"A", "s2", "D1"}, {"B", "s1", "D1"}, {"C", "s2", "D2"}};
    SeriesAttributes attributes = ArraySeriesAttributes.of(new String[] {"sku", "shop", "dept"}, rows);
    Hierarchy hierarchy = Hierarchy.detected(AttributeNesting.detect(attributes, 4));
    assertEquals(List.of("total", "dept", "shop", "sku", "dept x shop", "sku x shop"), hierarchy.levelNames());
    assertTrue(hierarchy.bind(attributes, 4).get(5).isBottom());
  }

  @Test
  void shouldFallBackToTheSeriesIdWhenNoAttributesNest() {
    SeriesAttributes attributes = ArraySeriesAttributes.of(new String[] {"series_id", "promo_class"},
        new String[][] {{"a", "x"}, {"b", "x"}, {"c", "y"}, {"d", "y"}, {"e", "x"}});
    assertEquals(List.of("total", "promo_class", "series_id"),
        Hierarchy.detected(AttributeNesting.detect(attributes, 5)).levelNames());
    SeriesAttributes single = ArraySeriesAttributes.of(new String[] {"sku"}, new String[][] {{"a"}, {"b"}});
    assertEquals(List.of("total", "sku"), Hierarchy.detected(AttributeNesting.detect(single, 2)).levelNames());
  }

  @Test
  void shouldDropAnAttributeWithOneValueAndOneOfTwoThatDetermineEachOther() {
    SeriesAttributes attributes = ArraySeriesAttributes.of(new String[] {"sku", "dept_code", "dept_name", "country"},
        new String[][] {{"a", "10", "Bakery", "X"}, {"b", "10", "Bakery", "X"}, {"c", "20", "Dairy", "X"}});
    assertEquals(List.of("total", "dept_code", "sku"),
        Hierarchy.detected(AttributeNesting.detect(attributes, 3)).levelNames());
  }

  @Test
  void shouldRefuseADeclaredChildUnderTwoParentsNamingAll() {
    SeriesAttributes attributes = AttributeNestingTest.departmentHoldingCategories();
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> Hierarchy.parse(List.of("region>store", "category>department>item")).bind(attributes, 18));
    assertEquals("hierarchy 'category>department>item': department 'D1' lies under two category values, 'c1' and "
        + "'c2'; expected each department under exactly one category (drop the hierarchy to use the nesting found "
        + "in the data)", e.getMessage());
    assertEquals(12, Hierarchy.parse(List.of("region>store", "department>category>item")).bind(attributes, 18)
        .size());
  }
}
