package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreSummary;

/** Ingests testdata/tiny (sales, calendar, prices) and checks every value its hand-worked expected.json lists. */
class TinyFixtureIngestTest {
  /** Surefire runs in the engine module's folder; the fixtures live in the sibling testdata module. */
  static final Path TINY = Path.of("..", "testdata", "tiny");
  /** Every store file carries a 16-byte header and an 8-byte footer (see StoreFileFormat). */
  private static final int HEADER_AND_FOOTER_BYTES = 16 + 8;

  @TempDir
  Path temp;

  @Test
  void shouldIngestTheTinyFixtureToTheHandWorkedValues() throws Exception {
    assertTrue(Files.isDirectory(TINY), "run from the engine module: " + TINY.toAbsolutePath());
    JsonNode expected = new ObjectMapper().readTree(TINY.resolve("expected.json").toFile());
    Path storeDir = temp.resolve("store");
    IngestOptions options = IngestOptions.of(SalesInputs.of(TINY.resolve("sales.csv"))
        .with(SideFile.CALENDAR, TINY.resolve("calendar.csv")).with(SideFile.PRICES, TINY.resolve("prices.csv")),
        storeDir);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult result = StoreIngest.ingest(options, budget);
      assertEquals(List.of(expected.get("priceRowsForUnknownKeys").asLong()
          + " price rows for unknown keys skipped (first: item=ZZZ-D9-0999, store=NV-01)"), result.warnings());
      try (SalesStore store = SalesStore.open(storeDir, budget)) {
        StoreSummary summary = StoreSummary.of(store);
        assertEquals(expected.get("seriesCount").asInt(), summary.seriesCount());
        assertEquals(expected.get("dayCount").asInt(), summary.dayCount());
        LocalDate firstDate = LocalDate.parse(expected.get("firstDate").asText());
        assertEquals(firstDate, summary.firstDate());
        assertEquals(LocalDate.parse(expected.get("lastDate").asText()), summary.lastDate());
        for (JsonNode series : expected.get("series")) {
          checkSeries(store, series);
        }
        assertEquals(expected.get("unitsBytes").asLong(), summary.unitsFileBytes() - HEADER_AND_FOOTER_BYTES);
        assertEquals(expected.get("unitsBytesPerItemDay").asDouble(),
            (double) (summary.unitsFileBytes() - HEADER_AND_FOOTER_BYTES) / (summary.seriesCount()
                * summary.dayCount()),
            1e-12);
        assertEquals(expected.get("zeroDayShare").asDouble(), summary.zeroDayShare(), 1e-12);
        Map<String, Integer> cardinalities = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = expected.get("attributeCardinalities").fields(); it
            .hasNext();) {
          Map.Entry<String, JsonNode> e = it.next();
          cardinalities.put(e.getKey(), e.getValue().asInt());
        }
        assertEquals(cardinalities, summary.attributeCardinalities());
        assertEquals(expected.get("calendarDayCount").asInt(), store.calendar().dayCount());
        for (Iterator<Map.Entry<String, JsonNode>> it = expected.get("pricesOnDay").fields(); it.hasNext();) {
          Map.Entry<String, JsonNode> bySeries = it.next();
          int s = store.attributes().seriesIndexOf(bySeries.getKey());
          for (Iterator<Map.Entry<String, JsonNode>> days = bySeries.getValue().fields(); days.hasNext();) {
            Map.Entry<String, JsonNode> day = days.next();
            // Day index by java.time's calendar arithmetic, an outside reference for the store's own date mapping.
            int dayIndex = (int) ChronoUnit.DAYS.between(firstDate, LocalDate.parse(day.getKey()));
            float price = store.prices().priceAt(s, dayIndex);
            String where = bySeries.getKey() + " on " + day.getKey();
            if (day.getValue().isNull()) {
              assertTrue(Float.isNaN(price), where + ": expected no price, found " + price);
            } else {
              assertEquals((float) day.getValue().asDouble(), price, 0f, where);
            }
          }
        }
      }
      assertEquals(0, budget.heldBytes());
    }
    assertEquals(List.of("store"), StoreIngestTest.listing(temp), "no temporary directory is left behind");
  }

  private static void checkSeries(SalesStore store, JsonNode series) {
    String id = series.get("seriesId").asText();
    int s = store.attributes().seriesIndexOf(id);
    assertTrue(s >= 0, id);
    int firstSale = series.get("firstSaleDayIndex").asInt();
    assertEquals(firstSale < 0 ? SalesHistory.NO_SALE : firstSale, store.firstSaleDayIndex(s), id);
    assertEquals(series.get("maxUnits").asInt(), store.maxUnits(s), id);
    assertEquals(series.get("bytesPerValue").asInt(), store.unitsWidth(s).bytesPerValue(), id);
    int[] units = new int[store.dayCount()];
    store.readUnits(s, 0, units, 0, units.length);
    int unknownDays = 0;
    for (int u : units) {
      unknownDays += u == SalesHistory.UNKNOWN_UNITS ? 1 : 0;
    }
    assertEquals(series.get("unknownDays").asInt(), unknownDays, id);
  }
}
