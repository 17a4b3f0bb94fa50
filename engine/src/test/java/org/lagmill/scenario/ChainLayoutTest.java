package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

class ChainLayoutTest {
  @Test
  void shouldGrowStoresWithSeriesCountBetweenThreeAndTen() {
    int[][] seriesAndStores = {{1, 3}, {20, 3}, {600, 3}, {901, 4}, {1500, 5}, {2999, 10}, {3000, 10}, {20000, 10}};
    for (int[] pair : seriesAndStores) {
      ChainLayout layout = new ChainLayout(pair[0]);
      assertEquals(pair[1], layout.storeCount(), "series " + pair[0]);
      assertEquals((pair[0] + pair[1] - 1) / pair[1], layout.itemCount(), "series " + pair[0]);
    }
  }

  @Test
  void shouldSpreadStoresOverRegionsAndItemsOverDepartments() {
    ChainLayout layout = new ChainLayout(3000);
    int[] storesPerRegion = new int[3];
    for (int store = 0; store < layout.storeCount(); store++) {
      storesPerRegion[layout.regionIndex(store)]++;
    }
    assertEquals("[4, 3, 3]", Arrays.toString(storesPerRegion));
    assertEquals(6, layout.departmentIndex(6));
    assertEquals(2, layout.categoryIndex(6));
    assertEquals(0, layout.departmentIndex(7));
  }

  @Test
  void shouldWriteIdsOfOurOwnShape() throws IOException {
    ChainLayout layout = new ChainLayout(3000);
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (AsciiWriter out = new AsciiWriter(bytes)) {
      // Series 2 * 10 + 5: item 2 (third department, first of its number), store 5 (Highmoor's second store).
      layout.writeSeriesCells(out, 25);
      out.writeByte('|');
      layout.writeItemId(out, 7 * 40 + 1);
    }
    assertEquals("PNT-D3-0001@HM-02,PNT-D3-0001,PNT-D3,Pantry,HM-02,Highmoor,|PNT-D2-0041",
        bytes.toString(StandardCharsets.US_ASCII));
  }

  @Test
  void shouldWidenItemNumbersBeyondFourDigits() throws IOException {
    ChainLayout layout = new ChainLayout(10 * 7 * 10_000 + 1);
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (AsciiWriter out = new AsciiWriter(bytes)) {
      layout.writeItemId(out, 0);
    }
    assertEquals("PNT-D1-00001", bytes.toString(StandardCharsets.US_ASCII));
  }
}
