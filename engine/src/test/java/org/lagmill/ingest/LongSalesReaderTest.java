package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;

class LongSalesReaderTest {
  private static final long MASTER_SEED = TestSeeds.master(0x10A65L);
  private static final int U = SalesHistory.UNKNOWN_UNITS;

  @TempDir
  Path dir;

  /** Collects what the reader hands out, copying the reused arrays. */
  private static final class Collected implements SeriesSink {
    final Map<String, int[]> unitsBySeries = new LinkedHashMap<>();
    LongSalesHeader begun;
    long zeroFilledItemDays;

    @Override
    public void begin(LongSalesHeader header) { begun = header; }

    @Override
    public void accept(String[] attributeValues, int[] units) {
      unitsBySeries.put(String.join("/", attributeValues), units.clone());
    }
  }

  private Collected read(Path file) {
    return read(file, MissingRows.UNKNOWN);
  }

  private Collected read(Path file, MissingRows missingRows) {
    Collected sink = new Collected();
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      LongSalesRead read = LongSalesReader.read(file, "date", "units", missingRows, budget, sink);
      assertEquals(read.header(), sink.begun);
      sink.zeroFilledItemDays = read.zeroFilledItemDays();
    }
    return sink;
  }

  @Test
  void shouldFillUnknownDaysBetweenFirstAndLastDate() {
    Collected c = read(IngestFiles.write(dir, "s.csv", "item,store,date,units\n"
        + "oat_bar,north_1,2024-03-03,5\n"
        + "tea_tin,north_1,2024-03-01,0\n"
        + "oat_bar,north_1,2024-03-01,2\n"
        + "tea_tin,north_1,2024-03-04,\n"));
    assertEquals(new LongSalesHeader(List.of("item", "store"), LocalDate.of(2024, 3, 1), 4, 2), c.begun);
    assertEquals(List.of("oat_bar/north_1", "tea_tin/north_1"), new ArrayList<>(c.unitsBySeries.keySet()));
    assertArrayEquals(new int[] {2, U, 5, U}, c.unitsBySeries.get("oat_bar/north_1"));
    assertArrayEquals(new int[] {0, U, U, U}, c.unitsBySeries.get("tea_tin/north_1"));
  }

  /**
   * Hand-worked: under the zero policy a day with no row from the series' first row on is zero; days before its first
   * row and rows with an empty units cell stay unknown. oat_bar: rows on days 1 and 3 (0-based 0 and 2), no row on
   * day 2 and 4; tea_tin: first row on day 2, an empty cell on day 4. Filled: oat_bar days 2 and 4, tea_tin day 3.
   */
  @Test
  void shouldReadDaysWithNoRowAsZeroFromEachSeriesFirstRow() {
    Collected c = read(IngestFiles.write(dir, "s.csv", "item,store,date,units\n"
        + "oat_bar,north_1,2024-03-03,5\n"
        + "tea_tin,north_1,2024-03-02,1\n"
        + "oat_bar,north_1,2024-03-01,2\n"
        + "tea_tin,north_1,2024-03-04,\n"), MissingRows.ZERO);
    assertArrayEquals(new int[] {2, 0, 5, 0}, c.unitsBySeries.get("oat_bar/north_1"));
    assertArrayEquals(new int[] {U, 1, 0, U}, c.unitsBySeries.get("tea_tin/north_1"));
    assertEquals(3, c.zeroFilledItemDays);
  }

  @Test
  void shouldNameTheMissingRowsPolicies() {
    assertEquals(MissingRows.ZERO, MissingRows.parse("Zero"));
    assertEquals(MissingRows.UNKNOWN, MissingRows.parse("unknown"));
    assertEquals("‹missing-rows› must be one of zero, unknown, got 'none'; zero (the default) reads a day with no "
        + "row as no sale",
        assertThrows(IllegalArgumentException.class, () -> MissingRows.parse("none"))
            .getMessage());
  }

  @Test
  void shouldNameSeriesBySeriesIdAndCheckItsAttributes() {
    Collected c = read(IngestFiles.write(dir, "s.csv", "series_id,item,date,units\na,oat_bar,2024-03-01,1\n"
        + "a,oat_bar,2024-03-02,2\n"));
    assertArrayEquals(new int[] {1, 2}, c.unitsBySeries.get("a/oat_bar"));
    assertEquals("F, line 3, column 2: series a has item=tea_tin: expected item=oat_bar as on line 2",
        error("series_id,item,date,units\na,oat_bar,2024-03-01,1\na,tea_tin,2024-03-02,2\n"));
  }

  private String error(String text) {
    Path file = IngestFiles.write(dir, "bad.csv", text);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      return assertThrows(InputFormatException.class,
          () -> LongSalesReader.read(file, "date", "units", MissingRows.ZERO, budget, new Collected())).getMessage()
          .replace(file.toString(), "F");
    }
  }

  @Test
  void shouldReportEveryErrorExactly() {
    assertEquals("F, line 5: duplicate row for series oat_bar on 2024-03-01: lines 2 and 5, expected one row per"
        + " series and date",
        error("item,date,units\noat_bar,2024-03-01,1\ntea_tin,2024-03-01,1\n"
            + "oat_bar,2024-03-02,1\noat_bar,2024-03-01,3\n"));
    assertEquals("F, line 3: duplicate row for series oat_bar/north_1 on 2024-03-01: lines 2 and 3, expected one"
        + " row per series and date",
        error("item,store,date,units\noat_bar,north_1,2024-03-01,\n"
            + "oat_bar,north_1,2024-03-01,4\n"));
    for (String units : new String[] {"-3", "1.5", "x", "+2"}) {
      assertEquals("F, line 2, column 3: units '" + units + "': expected a non-negative integer or an empty cell",
          error("item,date,units\noat_bar,2024-03-01," + units + "\n"));
    }
    assertEquals("F, line 2, column 3: units '2147483648': expected an integer at most 2147483646",
        error("item,date,units\noat_bar,2024-03-01,2147483648\n"));
    // The all-ones int is the store's unknown-day marker, so the reader refuses it with the line named.
    assertEquals("F, line 2, column 3: units '2147483647': expected an integer at most 2147483646",
        error("item,date,units\noat_bar,2024-03-01,2147483647\n"));
    assertEquals("F, line 1: no column 'date' in header item,day,units: expected one (or name it with"
        + " ‹date-column›)", error("item,day,units\n"));
    assertEquals("F, line 1: no column 'units' in header item,date,qty: expected one (or name it with"
        + " ‹units-column›)", error("item,date,qty\n"));
    assertEquals("F: empty file: expected a header line", error(""));
    assertEquals("F: no sales rows: expected at least one row after the header", error("item,date,units\n"));
    assertEquals("F, line 2, column 2: date '20240301': expected an ISO date like 2024-03-05",
        error("item,date,units\noat_bar,20240301,1\n"));
    assertEquals("F, line 1: no attribute columns: expected at least one column naming the series besides 'date'"
        + " and 'units'", error("date,units\n2024-03-01,1\n"));
  }

  @Test
  void shouldMatchReferenceOnRandomShuffledFiles() {
    Random master = new Random(MASTER_SEED);
    for (int round = 0; round < 30; round++) {
      long seed = master.nextLong();
      Random random = new Random(seed);
      String message = "master seed " + MASTER_SEED + ", round " + round + ", seed " + seed;
      LocalDate start = LocalDate.of(2023, 12, 20).plusDays(random.nextInt(30));
      int seriesCount = 1 + random.nextInt(8);
      int dayCount = 2 + random.nextInt(40);
      // Reference: a plain map from "item/store" to its units per day, UNKNOWN where no row was written.
      Map<String, int[]> expected = new LinkedHashMap<>();
      List<String> rows = new ArrayList<>();
      for (int s = 0; s < seriesCount; s++) {
        int[] units = new int[dayCount];
        for (int d = 0; d < dayCount; d++) {
          int kind = random.nextInt(10);
          units[d] = kind < 2 ? U : kind < 4 ? 0 : random.nextInt(kind == 9 ? 100_000 : 20);
          if (units[d] != U || random.nextInt(4) == 0) {
            rows.add("item" + s + ",store" + (s % 3) + "," + start.plusDays(d) + "," + (units[d] == U ? ""
                : units[d]));
          }
        }
        expected.put("item" + s + "/store" + (s % 3), units);
      }
      // Make sure the first and last day appear so the date range is known to the reference.
      rows.add("anchor,x," + start + ",1");
      rows.add("anchor,x," + start.plusDays(dayCount - 1) + ",2");
      int[] anchor = new int[dayCount];
      Arrays.fill(anchor, U);
      anchor[0] = 1;
      anchor[dayCount - 1] = 2;
      expected.put("anchor/x", anchor);
      Collections.shuffle(rows, random);
      StringBuilder text = new StringBuilder("item,store,date,units\n");
      rows.forEach(r -> text.append(r).append('\n'));
      Collected c = read(IngestFiles.write(dir, "r" + round + (round % 2 == 0 ? ".csv" : ".csv.gz"),
          text.toString()));
      assertEquals(start, c.begun.firstDate(), message);
      assertEquals(dayCount, c.begun.dayCount(), message);
      int seriesWithRows = 0;
      for (Map.Entry<String, int[]> e : expected.entrySet()) {
        boolean anyRow = false;
        for (String r : rows) {
          anyRow |= r.startsWith(e.getKey().replace('/', ',') + ",");
        }
        if (anyRow) {
          seriesWithRows++;
          assertArrayEquals(e.getValue(), c.unitsBySeries.get(e.getKey()), message + ", series " + e.getKey());
        }
      }
      assertEquals(seriesWithRows, c.begun.seriesCount(), message);
    }
  }

  @Test
  void shouldRefuseEmptySeriesIdsAndNulAttributeCells() {
    assertEquals("F, line 3: every attribute cell is empty: expected at least one value naming the series",
        error("item,store,date,units\noat_bar,north_1,2024-03-01,1\n,,2024-03-01,2\n"));
    assertEquals("F, line 2, column 1: series_id is empty: expected a value naming the series",
        error("series_id,item,date,units\n,oat_bar,2024-03-01,1\n"));
    assertEquals("F, line 2, column 1: item 'oat\\0bar' holds a NUL character: expected text (is the file UTF-16 or"
        + " binary?)", error("item,date,units\noat\0bar,2024-03-01,1\n"));
  }

  @Test
  void shouldWarnWhenOneDateStretchesTheSpanTenfold() {
    StringBuilder csv = new StringBuilder("sku,date,units\n");
    for (int d = 1; d <= 20; d++) {
      csv.append("A,2024-03-").append(String.format("%02d", d)).append(",1\n");
    }
    csv.append("B,2024-03-05,1\n");
    Path plain = IngestFiles.write(dir, "plain.csv", csv.toString());
    Path typo = IngestFiles.write(dir, "typo.csv", csv + "B,2042-03-05,2\n");
    Path early = IngestFiles.write(dir, "early.csv", "sku,date,units\nB,2004-03-05,2\n" + csv.substring(15));
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      assertEquals(List.of(), LongSalesReader.read(plain, "date", "units", MissingRows.ZERO, budget, new Collected())
          .warnings());
      assertEquals(List.of(typo + ", line 23: date 2042-03-05 stretches the dates to 6579 days, more than 10 times"
          + " the 20 days of the other rows (1 row on that date); the store holds every day in between: check it for"
          + " a typo, or narrow ‹date-window› to refuse such dates"),
          LongSalesReader.read(typo, "date", "units", MissingRows.UNKNOWN, budget, new Collected()).warnings());
      assertEquals(List.of(early + ", line 2: date 2004-03-05 stretches the dates to 7321 days, more than 10 times"
          + " the 20 days of the other rows (1 row on that date); the store holds every day in between: check it for"
          + " a typo, or narrow ‹date-window› to refuse such dates"),
          LongSalesReader.read(early, "date", "units", MissingRows.UNKNOWN, budget, new Collected()).warnings());
    }
  }
}
