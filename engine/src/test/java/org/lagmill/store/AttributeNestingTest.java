package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

public class AttributeNestingTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20_261_202L);

  /** A department holding several categories, each holding items; stores in regions; a series_id naming each. */
  public static ArraySeriesAttributes departmentHoldingCategories() {
    String[][] items = {{"i1", "c1", "D1"}, {"i2", "c1", "D1"}, {"i3", "c2", "D1"}, {"i4", "c2", "D1"},
        {"i5", "c3", "D2"}, {"i6", "c3", "D2"}};
    String[][] stores = {{"s1", "r1"}, {"s2", "r1"}, {"s3", "r2"}};
    List<String[]> rows = new ArrayList<>();
    for (String[] item : items) {
      for (String[] store : stores) {
        rows.add(new String[] {item[0] + "@" + store[0], item[0], item[1], item[2], store[0], store[1]});
      }
    }
    return ArraySeriesAttributes.of(new String[] {"series_id", "item", "category", "department", "store", "region"},
        rows.toArray(new String[0][]));
  }

  @Test
  void shouldFindADepartmentHoldingCategoriesWhateverTheNames() {
    AttributeNesting nesting = AttributeNesting.detect(departmentHoldingCategories(), 18);
    Map<String, String> expected = new LinkedHashMap<>();
    expected.put("series_id", "item");
    expected.put("item", "category");
    expected.put("category", "department");
    expected.put("department", null);
    expected.put("store", "region");
    expected.put("region", null);
    assertEquals(expected, nesting.parents());
    assertEquals(List.of(List.of("department", "category", "item"), List.of("region", "store")), nesting.chains());
  }

  @Test
  void shouldBreakTiesBetweenAttributesThatDetermineEachOtherByOrder() {
    ArraySeriesAttributes attributes = ArraySeriesAttributes.of(new String[] {"sku", "dept_code", "dept_name", "shop"},
        new String[][] {{"a", "10", "Bakery", "s1"}, {"a", "10", "Bakery", "s2"}, {"b", "20", "Dairy", "s1"},
            {"c", "20", "Dairy", "s2"}});
    // dept_name lies under dept_code (the earlier of the two), so it stands between sku and dept_code.
    Map<String, String> expected = new LinkedHashMap<>();
    expected.put("sku", "dept_name");
    expected.put("dept_code", null);
    expected.put("dept_name", "dept_code");
    expected.put("shop", null);
    AttributeNesting nesting = AttributeNesting.detect(attributes, 4);
    assertEquals(expected, nesting.parents());
    assertEquals(List.of(List.of("dept_code", "dept_name", "sku"), List.of("shop")), nesting.chains());
  }

  /**
   * Random attribute tables, some attributes drawn as a function of another (a nesting), some with a value changed
   * afterwards (a broken nesting), against a slow reference on value strings.
   */
  @Test
  void shouldAgreeWithASlowReferenceOnRandomTables() {
    Random seeds = new Random(MASTER_SEED);
    for (int round = 0; round < 300; round++) {
      long seed = seeds.nextLong();
      Random random = new Random(seed);
      int seriesCount = 1 + random.nextInt(30);
      int attributeCount = 1 + random.nextInt(5);
      String[][] rows = new String[seriesCount][attributeCount];
      for (int a = 0; a < attributeCount; a++) {
        int valueCount = 1 + random.nextInt(8);
        int from = a > 0 && random.nextBoolean() ? random.nextInt(a) : -1;
        Map<String, String> mapping = new HashMap<>();
        for (int s = 0; s < seriesCount; s++) {
          String value;
          if (from >= 0) {
            value = mapping.computeIfAbsent(rows[s][from], k -> "v" + random.nextInt(valueCount));
          } else {
            value = "v" + random.nextInt(valueCount);
          }
          rows[s][a] = random.nextInt(20) == 0 ? "x" + random.nextInt(3) : value;
        }
      }
      String[] names = new String[attributeCount];
      for (int a = 0; a < attributeCount; a++) {
        names[a] = "attr" + (char) ('a' + random.nextInt(26)) + a;
      }
      ArraySeriesAttributes attributes = ArraySeriesAttributes.of(names, rows);
      AttributeNesting nesting = AttributeNesting.detect(attributes, seriesCount);
      String where = "master seed " + MASTER_SEED + " (-Dlagmill.seed), round " + round + ", rows "
          + Arrays.deepToString(rows);
      for (int a = 0; a < attributeCount; a++) {
        for (int b = 0; b < attributeCount; b++) {
          if (a != b) {
            assertEquals(slowLiesUnder(rows, a, b), nesting.liesUnder(a, b), where + ", " + a + " under " + b);
          }
        }
        assertEquals(distinct(rows, a) == seriesCount, nesting.isIdentity(a), where);
      }
      assertEquals(slowParents(names, rows), nesting.parents(), where);
    }
  }

  private static boolean slowLiesUnder(String[][] rows, int a, int b) {
    Map<String, Set<String>> parents = new HashMap<>();
    for (String[] row : rows) {
      parents.computeIfAbsent(row[a], k -> new HashSet<>()).add(row[b]);
    }
    return parents.values().stream().allMatch(set -> set.size() == 1);
  }

  private static int distinct(String[][] rows, int a) {
    Set<String> values = new HashSet<>();
    for (String[] row : rows) {
      values.add(row[a]);
    }
    return values.size();
  }

  /** The documented rules, written out directly: candidates, the nearest ones, the most values, the earliest. */
  private static Map<String, String> slowParents(String[] names, String[][] rows) {
    int n = names.length;
    Map<String, String> parents = new LinkedHashMap<>();
    for (int a = 0; a < n; a++) {
      List<Integer> candidates = new ArrayList<>();
      for (int b = 0; b < n; b++) {
        if (isAncestor(rows, a, b)) {
          candidates.add(b);
        }
      }
      String parent = null;
      int parentValues = -1;
      for (int b : candidates) {
        boolean somethingBetween = false;
        for (int c : candidates) {
          somethingBetween |= c != b && isAncestor(rows, c, b);
        }
        if (!somethingBetween && distinct(rows, b) > parentValues) {
          parent = names[b];
          parentValues = distinct(rows, b);
        }
      }
      parents.put(names[a], parent);
    }
    return parents;
  }

  private static boolean isAncestor(String[][] rows, int a, int b) {
    boolean identity = distinct(rows, b) == rows.length;
    return a != b && !identity && slowLiesUnder(rows, a, b) && (!slowLiesUnder(rows, b, a) || b < a);
  }
}
