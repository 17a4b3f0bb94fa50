package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.BitSet;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;

class ChainLayoutTest {
  @Test
  void shouldGrowOutletsWithSeriesCountBetweenFourAndTwelve() {
    int[][] seriesAndOutlets = {{1, 4}, {20, 4}, {1000, 4}, {1001, 5}, {1500, 6}, {2999, 12}, {3000, 12},
        {20000, 12}};
    for (int[] pair : seriesAndOutlets) {
      ChainLayout layout = new ChainLayout(pair[0]);
      assertEquals(pair[1], layout.outletCount(), "series " + pair[0]);
      assertEquals((pair[0] + pair[1] - 1) / pair[1], layout.articleCount(), "series " + pair[0]);
    }
  }

  @Test
  void shouldNestNoStoreAttributeUnderAnotherAtAnyOutletCount() {
    // The slow definition: A lies under B when every value of A occurs with exactly one value of B.
    int[][] traits = {ChainLayout.OUTLET_BANNER, ChainLayout.OUTLET_FORMAT, ChainLayout.OUTLET_DISTRICT};
    String[] names = {"banner", "format", "district"};
    for (int outletCount = ChainLayout.MIN_OUTLET_COUNT; outletCount <= ChainLayout.MAX_OUTLET_COUNT; outletCount++) {
      for (int a = 0; a < traits.length; a++) {
        for (int b = 0; b < traits.length; b++) {
          if (a == b) {
            continue;
          }
          Map<Integer, Set<Integer>> parents = new HashMap<>();
          for (int outlet = 0; outlet < outletCount; outlet++) {
            parents.computeIfAbsent(traits[a][outlet], k -> new HashSet<>()).add(traits[b][outlet]);
          }
          boolean nested = parents.values().stream().allMatch(p -> p.size() == 1);
          assertFalse(nested, names[a] + " lies under " + names[b] + " with " + outletCount + " outlets");
        }
      }
    }
  }

  @Test
  void shouldGiveEveryArticleADistinctCodeThatKeepsNoOrder() {
    BitSet seen = new BitSet((int) ChainLayout.CODE_SPACE);
    int risingCount = 0;
    int articleCount = 2_000_000;
    long previous = -1;
    for (int article = 0; article < articleCount; article++) {
      long code = ChainLayout.articleCode(article);
      assertTrue(code >= 0 && code < ChainLayout.CODE_SPACE, "article " + article);
      assertFalse(seen.get((int) code), "article " + article + " repeats code " + code);
      seen.set((int) code);
      risingCount += code > previous ? 1 : 0;
      previous = code;
    }
    // Codes in index order rise about half of the time: they tell nothing about an article's place.
    assertEquals(0.5, (double) risingCount / articleCount, 0.01);
  }

  @Test
  void shouldWriteIdsOfOurOwnShape() throws IOException {
    ChainLayout layout = new ChainLayout(3000);
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (AsciiWriter out = new AsciiWriter(bytes)) {
      // Series 2 * 12 + 5: article 2 in outlet 5 (Tillbox, kiosk, Quarrytown); family 7 is Soda in Drinks.
      layout.writeSeriesCells(out, 29, 7);
    }
    String text = bytes.toString(StandardCharsets.US_ASCII);
    String code = text.substring(0, ChainLayout.CODE_LENGTH);
    assertEquals(code + "/L156," + code + ",Soda,Drinks,L156,Tillbox,kiosk,Quarrytown,", text);
    assertTrue(code.matches("[0-9A-HJKMNP-TV-Z]{5}"), code);
  }

  @Test
  void shouldSellTheLastArticleOnlyWhereItsSeriesExist() {
    ChainLayout layout = new ChainLayout(41);
    assertEquals(4, layout.outletCount());
    assertEquals(11, layout.articleCount());
    assertEquals(1, layout.outletCountOf(10));
    assertTrue(layout.sellsInBanner(10, 0));
    assertFalse(layout.sellsInBanner(10, 1));
    assertTrue(layout.sellsInBanner(9, 1));
    assertTrue(layout.hasDistrict(1));
    assertFalse(layout.hasDistrict(2));
  }
}
