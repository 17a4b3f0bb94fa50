package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.lagmill.memory.MemoryBudget;

/** One naming rule for series, whichever view of the attributes names them. */
class SeriesIdentityTest {
  @TempDir
  Path temp;

  @ParameterizedTest(name = "{0} / {1} -> {2}")
  @CsvSource(delimiter = '|', textBlock = """
      sku,shop          | k1,north      | k1/north
      shop,series_id    | north,A-7     | A-7
      series_id         | solo          | solo
      dept              | a/b           | a/b
      sku,shop,dept     | x y,s,d       | x y/s/d
      """)
  void shouldNameBySeriesIdElseByJoinedValues(String names, String values, String expectedId) throws IOException {
    String[] nameArray = names.split(",");
    String[] valueArray = values.split(",");
    int idIndex = SeriesIdentity.idIndex(List.of(nameArray));
    assertEquals(expectedId, SeriesIdentity.seriesId(valueArray, idIndex));
    assertEquals(expectedId, SeriesIdentity.seriesId(idIndex >= 0 ? valueArray[idIndex] : null, valueArray));

    ArraySeriesAttributes array = ArraySeriesAttributes.of(nameArray, new String[][] {valueArray});
    assertEquals(expectedId, array.seriesId(0));
    assertEquals(0, array.seriesIndexOf(expectedId));
    assertEquals(List.of(nameArray), array.attributeNames());

    Path dir = temp.resolve("store");
    try (MemoryBudget budget = MemoryBudget.root("test", 1L << 24)) {
      try (StoreWriter writer = new StoreWriter(dir, LocalDate.of(2024, 1, 1), 2, List.of(nameArray), budget)) {
        writer.addSeries(valueArray, new int[] {1, 2});
        assertEquals(expectedId, writer.attributes().seriesId(0));
        writer.finish(List.of());
      }
      try (SalesStore store = SalesStore.open(dir, budget)) {
        assertEquals(expectedId, store.attributes().seriesId(0));
        assertEquals(0, store.attributes().seriesIndexOf(expectedId));
        assertEquals(List.of(nameArray), store.attributes().attributeNames());
      }
    }
  }

  @Test
  void shouldListAttributeNamesInIndexOrderThroughTheDefaultMethod() {
    SeriesAttributes attributes = ArraySeriesAttributes.of(new String[] {"shop", "sku"}, new String[][] {{"a", "b"}});
    SeriesAttributes plain = new DelegatingAttributes(attributes);
    assertEquals(List.of("shop", "sku"), plain.attributeNames());
  }

  /** Implements only the abstract methods, so the interface's default {@code attributeNames()} is what runs. */
  private record DelegatingAttributes(SeriesAttributes inner) implements SeriesAttributes {
    @Override
    public int attributeCount() { return inner.attributeCount(); }
    @Override
    public String attributeName(int attributeIndex) { return inner.attributeName(attributeIndex); }
    @Override
    public int attributeIndex(String attributeName) { return inner.attributeIndex(attributeName); }
    @Override
    public int cardinality(int attributeIndex) { return inner.cardinality(attributeIndex); }
    @Override
    public int code(int seriesIndex, int attributeIndex) { return inner.code(seriesIndex, attributeIndex); }
    @Override
    public String value(int attributeIndex, int code) { return inner.value(attributeIndex, code); }
    @Override
    public int codeOf(int attributeIndex, String value) { return inner.codeOf(attributeIndex, value); }
    @Override
    public String seriesId(int seriesIndex) { return inner.seriesId(seriesIndex); }
    @Override
    public int seriesIndexOf(String seriesId) { return inner.seriesIndexOf(seriesId); }
  }
}
