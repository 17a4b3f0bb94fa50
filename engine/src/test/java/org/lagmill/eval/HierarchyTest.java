package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.lagmill.store.ArraySeriesAttributes;

class HierarchyTest {
  private static final List<String> TWO_HIERARCHIES = List.of("region>store", "category>department>item");

  @Test
  void shouldBuildTheCrossProductOfPrefixesCoarsestFirst() {
    Hierarchy hierarchy = Hierarchy.parse(TWO_HIERARCHIES);
    assertEquals(List.of("total", "region", "category", "region x store", "region x category",
        "category x department", "region x store x category", "region x category x department",
        "category x department x item", "region x store x category x department",
        "region x category x department x item", "region x store x category x department x item"),
        hierarchy.levelNames());
  }

  @Test
  void shouldCountAggregatesOfEveryLevel() {
    ArraySeriesAttributes attributes = RandomHistories.attributes();
    List<Level> levels = Hierarchy.parse(TWO_HIERARCHIES).bind(attributes, 120);
    assertEquals(12, levels.size());
    // 3 regions, 6 stores, 2 categories, 4 departments, 20 items, 120 item-store series.
    int[] expected = {1, 3, 2, 6, 6, 4, 12, 12, 20, 24, 60, 120};
    for (int l = 0; l < 12; l++) {
      assertEquals(expected[l], levels.get(l).aggregateCount(), levels.get(l).name());
    }
    assertTrue(levels.get(11).isBottom());
    assertFalse(levels.get(10).isBottom());
  }

  @Test
  void shouldMapEverySeriesToTheAggregateOfItsAttributeValues() {
    ArraySeriesAttributes attributes = RandomHistories.attributes();
    List<Level> levels = Hierarchy.parse(TWO_HIERARCHIES).bind(attributes, 120);
    for (Level level : levels) {
      Set<String> names = new HashSet<>();
      for (int g = 0; g < level.aggregateCount(); g++) {
        assertTrue(names.add(level.aggregateName(g)), "duplicate aggregate name " + level.aggregateName(g));
      }
      for (int s = 0; s < 120; s++) {
        StringBuilder expected = new StringBuilder();
        for (String name : level.attributeNames()) {
          String value = attributes.value(attributes.attributeIndex(name),
              attributes.code(s, attributes.attributeIndex(name)));
          expected.append(expected.length() == 0 ? "" : " / ").append(value);
        }
        String expectedName = level.attributeNames().isEmpty() ? "total" : expected.toString();
        assertEquals(expectedName, level.aggregateName(level.aggregateIndexOf(s)), level.name() + " series " + s);
      }
    }
    assertEquals("Northvale / Pantry", levels.get(4).aggregateName(0));
  }

  @Test
  void shouldKeepExplicitLevelsInGivenOrder() {
    Hierarchy hierarchy = Hierarchy.ofLevels(List.of(List.of(), List.of("store"), List.of("store", "item")));
    List<Level> levels = hierarchy.bind(RandomHistories.attributes(), 120);
    assertEquals(List.of("total", "store", "store x item"), hierarchy.levelNames());
    assertEquals(List.of(1, 6, 120), levels.stream().map(Level::aggregateCount).toList());
  }

  @Test
  void shouldGiveTotalOnlyForNoHierarchyAndDropRepeatedAttributeSets() {
    assertEquals(List.of("total"), Hierarchy.parse(List.of()).levelNames());
    assertEquals(List.of("total", "store", "item", "store x item"),
        Hierarchy.parse(List.of("store", "item", "store")).levelNames());
  }

  @Test
  void shouldRejectUnknownAttributeNamingTheAllowedOnes() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> Hierarchy.parse(List.of("region>shop")).bind(RandomHistories.attributes(), 120));
    assertEquals("unknown attribute 'shop' in level 'region x shop'; allowed: [region, store, category, department, "
        + "item]", e.getMessage());
  }

  @Test
  void shouldRejectMalformedHierarchies() {
    assertEquals("hierarchy 'region>>store' has an empty attribute name; expected names joined by '>', e.g. "
        + "'region>store'",
        assertThrows(IllegalArgumentException.class,
            () -> Hierarchy.parse(List.of("region>>store"))).getMessage());
    assertEquals("hierarchy 'store>store' names attribute 'store' twice", assertThrows(IllegalArgumentException.class,
        () -> Hierarchy.parse(List.of("store>store"))).getMessage());
    assertThrows(IllegalArgumentException.class, () -> Hierarchy.ofLevels(List.of()));
  }
}
