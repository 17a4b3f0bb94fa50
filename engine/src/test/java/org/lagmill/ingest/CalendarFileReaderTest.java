package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar.ColumnKind;

class CalendarFileReaderTest {
  private static final long MASTER_SEED = TestSeeds.master(0x5EEDCA1L);
  private static final LocalDate STORE_START = LocalDate.of(2024, 3, 1);
  private static final ArraySeriesAttributes CHAIN = IngestFiles.chain();

  @TempDir
  Path dir;

  private CalendarReadResult read(String name, String text) {
    return CalendarFileReader.read(IngestFiles.write(dir, name, text), STORE_START, CHAIN, "date");
  }

  private String error(String text) {
    Path file = IngestFiles.write(dir, "bad.csv", text);
    return assertThrows(InputFormatException.class,
        () -> CalendarFileReader.read(file, STORE_START, CHAIN, "date")).getMessage().replace(file.toString(), "F");
  }

  @Test
  void shouldAlignToStoreStartAndExtendPastSalesEnd() {
    // Rows before 2024-03-01 are dropped; the calendar runs to 2024-03-04 whatever the sales' last day.
    ArrayDayCalendar cal = read("c.csv", "date,event,temp\n2024-02-28,,1\n2024-02-29,a,2\n2024-03-01,,3.5\n"
        + "2024-03-02,holiday,-1e1\n2024-03-03,fair,\n2024-03-04,holiday,0\n").calendar();
    assertEquals(4, cal.dayCount());
    assertEquals(2, cal.columnCount());
    assertEquals("event", cal.columnName(0));
    assertEquals(ColumnKind.CATEGORICAL, cal.kind(0));
    assertEquals(2, cal.cardinality(0));
    assertEquals("holiday", cal.categoryValue(0, 0));
    assertEquals("fair", cal.categoryValue(0, 1));
    assertEquals(Float.NaN, cal.value(0, 0, 0));
    assertEquals(0f, cal.value(0, 0, 1));
    assertEquals(1f, cal.value(0, 0, 2));
    assertEquals(0f, cal.value(0, 0, 3));
    assertNull(cal.keyAttribute(0));
    assertEquals(ColumnKind.NUMERIC, cal.kind(1));
    assertEquals(3.5f, cal.value(1, 0, 0));
    assertEquals(-10f, cal.value(1, 0, 1));
    assertEquals(Float.NaN, cal.value(1, 0, 2));
    assertEquals(0f, cal.value(1, 0, 3));
  }

  @Test
  void shouldGatherPerAttributeColumnsAndWarnAboutUnknownValues() {
    CalendarReadResult result = read("c.csv", "date,payday[region=Northvale],payday[region=Eastdale],"
        + "promo[store=south_1],payday[region=Southmoor]\n2024-03-01,1,1,x,0\n2024-03-02,0,1,,1\n");
    ArrayDayCalendar cal = result.calendar();
    assertEquals(List.of("calendar column 'payday[region=Eastdale]': no series has region=Eastdale; column ignored"),
        result.warnings());
    assertEquals(2, cal.columnCount());
    assertEquals("payday", cal.columnName(0));
    assertEquals("region", cal.keyAttribute(0));
    int region = CHAIN.attributeIndex("region");
    int north = CHAIN.codeOf(region, "Northvale");
    int south = CHAIN.codeOf(region, "Southmoor");
    assertEquals(1f, cal.value(0, north, 0));
    assertEquals(0f, cal.value(0, north, 1));
    assertEquals(0f, cal.value(0, south, 0));
    assertEquals(1f, cal.value(0, south, 1));
    assertEquals("promo", cal.columnName(1));
    assertEquals("store", cal.keyAttribute(1));
    assertEquals(ColumnKind.CATEGORICAL, cal.kind(1));
    int store = CHAIN.attributeIndex("store");
    assertEquals(0f, cal.value(1, CHAIN.codeOf(store, "south_1"), 0));
    assertEquals(Float.NaN, cal.value(1, CHAIN.codeOf(store, "south_1"), 1));
    // Stores without a promo column read NaN.
    assertEquals(Float.NaN, cal.value(1, CHAIN.codeOf(store, "north_1"), 0));
  }

  @Test
  void shouldMatchJavaTimeDayOfYearAcrossLeapDay() {
    // External check: day_of_year and weekday cells typed by hand from a printed 2024 calendar (2024 is a leap year;
    // 2024-02-29 is a Thursday), compared with java.time's LocalDate.getDayOfYear/getDayOfWeek for the date the
    // reader assigns to each day index. Catches any off-by-one in aligning rows to the store's day index.
    LocalDate start = LocalDate.of(2024, 2, 27);
    CalendarReadResult result = CalendarFileReader.read(IngestFiles.write(dir, "leap.csv",
        "weekday,date,day_of_year\nTUESDAY,2024-02-27,58\nWEDNESDAY,2024-02-28,59\nTHURSDAY,2024-02-29,60\n"
            + "FRIDAY,2024-03-01,61\nSATURDAY,2024-03-02,62\nSUNDAY,2024-03-03,63\n"),
        start, CHAIN, "date");
    ArrayDayCalendar cal = result.calendar();
    assertEquals(6, cal.dayCount());
    for (int day = 0; day < cal.dayCount(); day++) {
      LocalDate date = start.plusDays(day);
      assertEquals(date.getDayOfYear(), (int) cal.value(1, 0, day), "day " + day);
      assertEquals(date.getDayOfWeek().name(), cal.categoryValue(0, (int) cal.value(0, 0, day)), "day " + day);
    }
  }

  @Test
  void shouldReadGzipLikePlain() {
    String text = "date,a,b[region=Northvale]\n2024-03-01,x,1\n2024-03-02,y,2\n";
    ArrayDayCalendar plain = read("c.csv", text).calendar();
    ArrayDayCalendar gz = read("c.csv.gz", text).calendar();
    assertEquals(describe(plain), describe(gz));
  }

  @Test
  void shouldWarnWhenOneStrayCellTurnsANumericColumnIntoCategories() {
    CalendarReadResult result = read("c.csv", "date,temp,event\n2024-03-01,11.5,fair\n2024-03-02,12,\n"
        + "2024-03-03,n/a,fair\n2024-03-04,10,1\n");
    String file = dir.resolve("c.csv").toString();
    assertEquals(List.of(file + ", line 4, column 2: calendar column 'temp' read as categories because 1 of 4 cells"
        + " are not numbers (first: 'n/a'); write numbers only, or leave a cell empty for unknown"), result.warnings());
    assertEquals(ColumnKind.CATEGORICAL, result.calendar().kind(0));
    // a column mostly of texts is a category column, read without a word
    assertEquals(ColumnKind.CATEGORICAL, result.calendar().kind(1));
  }

  @Test
  void shouldRefuseNonFiniteCalendarValues() {
    for (String cell : new String[] {"NaN", "-Infinity", "inf", "+INF"}) {
      assertEquals("F, line 3, column 2: calendar column 'temp' value '" + cell + "': expected a finite number, a"
          + " category or an empty cell (empty means unknown)",
          error("date,temp\n2024-03-01,1\n2024-03-02," + cell
              + "\n"));
    }
    assertEquals("F, line 2, column 3: calendar column 'payday[region=Southmoor]' value '1e39': expected a number of"
        + " at most 3.4028235E38 in size",
        error("date,payday[region=Northvale],payday[region=Southmoor]\n"
            + "2024-03-01,1,1e39\n"));
  }

  @Test
  void shouldReportEveryErrorExactly() {
    assertEquals("F, line 4, column 1: calendar gap: expected 2024-03-03, found 2024-03-05",
        error("date,x\n2024-03-01,1\n2024-03-02,1\n2024-03-05,1\n"));
    assertEquals("F, line 3, column 1: duplicate calendar date 2024-03-01: expected 2024-03-02",
        error("date,x\n2024-03-01,1\n2024-03-01,1\n"));
    assertEquals("F, line 3, column 1: calendar dates not ascending: expected 2024-03-03, found 2024-02-28",
        error("date,x\n2024-03-02,1\n2024-02-28,1\n"));
    assertEquals("F, line 2, column 1: calendar starts 2024-03-02: expected it to cover the first sales day"
        + " 2024-03-01", error("date,x\n2024-03-02,1\n"));
    assertEquals("F: calendar ends 2024-02-29: expected it to cover the first sales day 2024-03-01",
        error("date,x\n2024-02-28,1\n2024-02-29,1\n"));
    assertEquals("F: no calendar rows: expected dates covering the first sales day 2024-03-01", error("date,x\n"));
    assertEquals("F: empty file: expected a header line", error(""));
    assertEquals("F, line 2, column 1: date '03/01/2024': expected an ISO date like 2024-03-05",
        error("date,x\n03/01/2024,1\n"));
    assertEquals("F, line 2, column 1: date '2024-02-30': expected an ISO date like 2024-03-05",
        error("date,x\n2024-02-30,1\n"));
    assertEquals("F, line 1: no column 'date' in header day,x: expected one (or name it with ‹date-column›)",
        error("day,x\n2024-03-01,1\n"));
    assertEquals("F, line 1, column 2: column 'p[color=red]' is keyed by 'color', which is not a series attribute:"
        + " expected one of item, store, region", error("date,p[color=red]\n2024-03-01,1\n"));
    assertEquals("F, line 1, column 3: column 'x' appears twice: expected distinct column names",
        error("date,x,x\n2024-03-01,1,2\n"));
    assertEquals("F, line 1, column 3: column 'p' is global here but keyed by region in another column: expected"
        + " one or the other", error("date,p[region=Northvale],p\n2024-03-01,1,2\n"));
    assertEquals("F, line 1, column 3: column 'p[store=north_1]' is keyed by store but 'p' is keyed by region in"
        + " another column: expected one key per column name",
        error("date,p[region=Northvale],p[store=north_1]\n2024-03-01,1,2\n"));
    assertEquals("F, line 3: found 3 fields, expected 2 as in the header",
        error("date,x\n2024-03-01,1\n2024-03-02,1,2\n"));
  }

  @Test
  void shouldMatchReferenceOnRandomCalendars() {
    Random master = new Random(MASTER_SEED);
    for (int round = 0; round < 40; round++) {
      long seed = master.nextLong();
      Random random = new Random(seed);
      String message = "master seed " + MASTER_SEED + ", round " + round + ", seed " + seed;
      int leadDays = random.nextInt(5);
      int dayCount = 1 + random.nextInt(60);
      String[] headers = {"event", "temp", "payday[region=Northvale]", "payday[region=Southmoor]",
          "promo[store=north_2]"};
      String[] pool = {"holiday", "fair", "sports", "parade"};
      StringBuilder text = new StringBuilder("date," + String.join(",", headers) + "\n");
      String[][] cells = new String[leadDays + dayCount][headers.length];
      for (int r = 0; r < cells.length; r++) {
        text.append(STORE_START.plusDays(r - leadDays));
        for (int c = 0; c < headers.length; c++) {
          boolean text2 = c == 0 || c == 4;
          String cell = random.nextInt(4) == 0 ? "" : text2 ? pool[random.nextInt(pool.length)]
              : String.valueOf(random.nextInt(2000) / 100.0);
          cells[r][c] = cell;
          text.append(',').append(cell);
        }
        text.append('\n');
      }
      ArrayDayCalendar cal = read("r" + round + (round % 2 == 0 ? ".csv" : ".csv.gz"), text.toString()).calendar();
      assertEquals(dayCount, cal.dayCount(), message);
      // Reference: per column, values looked up by (key value, date) in plain maps built from the generated cells.
      Map<String, List<String>> categories = new LinkedHashMap<>();
      for (int r = leadDays; r < cells.length; r++) {
        for (int c : new int[] {0, 4}) {
          String name = c == 0 ? "event" : "promo";
          List<String> seen = categories.computeIfAbsent(name, k -> new ArrayList<>());
          if (!cells[r][c].isEmpty() && !seen.contains(cells[r][c])) {
            seen.add(cells[r][c]);
          }
        }
      }
      int region = CHAIN.attributeIndex("region");
      int store = CHAIN.attributeIndex("store");
      for (int day = 0; day < dayCount; day++) {
        String[] row = cells[leadDays + day];
        assertEquals(expectText(row[0], categories.get("event")), cal.value(0, 0, day), message);
        assertEquals(expectNumber(row[1]), cal.value(1, 0, day), message);
        assertEquals(expectNumber(row[2]), cal.value(2, CHAIN.codeOf(region, "Northvale"), day), message);
        assertEquals(expectNumber(row[3]), cal.value(2, CHAIN.codeOf(region, "Southmoor"), day), message);
        assertEquals(expectText(row[4], categories.get("promo")), cal.value(3, CHAIN.codeOf(store, "north_2"), day),
            message);
        assertEquals(Float.NaN, cal.value(3, CHAIN.codeOf(store, "north_1"), day), message);
      }
      assertEquals(categories.get("event").size(), cal.cardinality(0), message);
    }
  }

  private static float expectText(String cell, List<String> categories) {
    return cell.isEmpty() ? Float.NaN : categories.indexOf(cell);
  }

  private static float expectNumber(String cell) {
    return cell.isEmpty() ? Float.NaN : Float.parseFloat(cell);
  }

  private static String describe(ArrayDayCalendar cal) {
    StringBuilder b = new StringBuilder();
    for (int c = 0; c < cal.columnCount(); c++) {
      b.append(cal.columnName(c)).append(cal.kind(c)).append(cal.keyAttribute(c));
      for (int key = 0; key < 3; key++) {
        for (int d = 0; d < cal.dayCount(); d++) {
          b.append(',').append(cal.value(c, key, d));
        }
      }
    }
    return b.toString();
  }
}
