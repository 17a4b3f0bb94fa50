package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ScenarioFileShapeTest {
  private static final LocalDate START = LocalDate.of(2024, 2, 26);

  @Test
  void shouldWriteWideSalesWithConsecutiveDatesAndFullRows(@TempDir Path dir) throws IOException {
    // 37 series over 3 stores: 13 items, the last one truncated to one store.
    ScenarioSummary summary = ScenarioGenerator.write(new ScenarioSpec(37, 90, START, 5, 14, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    assertEquals(List.of("series_id", "item", "department", "category", "store", "region"),
        List.of(files.salesHeader).subList(0, 6));
    assertEquals(90, files.dayCount());
    for (int day = 0; day < 90; day++) {
      assertEquals(START.plusDays(day), files.salesDates.get(day));
    }
    assertEquals(37, files.salesRows.size());
    Set<String> seriesIds = new HashSet<>();
    for (String[] row : files.salesRows) {
      assertEquals(6 + 90, row.length, row[0]);
      assertTrue(row[1].matches("(PNT-D[123]|HSH-D[12]|LSR-D[12])-\\d{4}"), row[1]);
      assertTrue(row[4].matches("(NV|SM|HM)-\\d{2}"), row[4]);
      assertEquals(row[1] + "@" + row[4], row[0]);
      assertTrue(row[1].startsWith(row[2] + "-"), row[2]);
      assertTrue(seriesIds.add(row[0]), "duplicate " + row[0]);
      for (int c = 6; c < row.length; c++) {
        assertTrue(row[c].matches("0|[1-9]\\d*"), row[0] + " cell " + c + ": " + row[c]);
      }
    }
    assertEquals("LSR-D1-0002@NV-01", files.salesRows.get(36)[0]);
    assertEquals(3, summary.files().size());
    assertEquals(37L * 90, summary.itemDayCount());
    long bytes = 0;
    for (Path file : summary.files()) {
      bytes += Files.size(file);
    }
    assertEquals(bytes, summary.fileBytes());
  }

  @Test
  void shouldWriteACalendarThroughTheFutureDaysWithOnePaydayColumnPerRegion(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(10, 400, START, 5, 28, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    assertArrayEquals(new String[] {"date", "event", "event_kind", "payday[region=Northvale]",
        "payday[region=Saltmarsh]", "payday[region=Highmoor]"}, files.calendarHeader);
    Set<String> regions = new HashSet<>();
    for (String[] row : files.salesRows) {
      regions.add(row[5]);
    }
    for (String region : regions) {
      assertTrue(List.of(files.calendarHeader).contains("payday[region=" + region + "]"), region);
    }
    assertEquals(428, files.calendarRows.size());
    for (int day = 0; day < 428; day++) {
      String[] row = files.calendarRows.get(day);
      assertEquals(6, row.length);
      assertEquals(START.plusDays(day).toString(), row[0]);
      assertEquals(row[1].isEmpty(), row[2].isEmpty(), row[0]);
      assertTrue(row[2].matches("|civic|cultural|sport|religious"), row[2]);
      for (int c = 3; c < 6; c++) {
        assertTrue(row[c].equals("0") || row[c].equals("1"), row[0] + " " + row[c]);
      }
    }
  }

  @Test
  void shouldWritePriceChangePointsForKnownSeriesInDateOrder(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(120, 500, START, 9, 28, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    Set<String> salesKeys = new HashSet<>();
    for (String[] row : files.salesRows) {
      salesKeys.add(row[1] + "," + row[4]);
    }
    Map<String, List<String[]>> byKey = files.pricesByKey();
    assertEquals(salesKeys, byKey.keySet(), "every series has prices and every price key is a series");
    LocalDate lastCalendarDay = START.plusDays(500 + 28 - 1);
    for (Map.Entry<String, List<String[]>> entry : byKey.entrySet()) {
      LocalDate previous = null;
      String previousPrice = null;
      for (String[] change : entry.getValue()) {
        LocalDate from = LocalDate.parse(change[0]);
        assertTrue(previous == null || from.isAfter(previous), entry.getKey() + " " + from);
        assertTrue(!from.isBefore(START) && !from.isAfter(lastCalendarDay), entry.getKey() + " " + from);
        assertTrue(change[1].matches("[1-9]\\d*\\.\\d9|0\\.\\d9"), entry.getKey() + " " + change[1]);
        assertTrue(!change[1].equals(previousPrice), "a change point changes the price: " + entry.getKey());
        previous = from;
        previousPrice = change[1];
      }
    }
  }

  @Test
  void shouldLeaveNoTemporaryFilesAndReplaceEarlierOutput(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(30, 40, START, 1, 7, false), dir);
    ScenarioGenerator.write(new ScenarioSpec(12, 20, START, 1, 7, false), dir);
    try (Stream<Path> listing = Files.list(dir)) {
      assertEquals(List.of("calendar.csv", "prices.csv", "sales.csv"),
          listing.map(p -> p.getFileName().toString()).sorted().toList());
    }
    assertEquals(12, new ScenarioFiles(dir).salesRows.size());
  }

  @Test
  void shouldHandleOneSeriesOfOneDay(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(1, 1, START, 3, 0, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    assertEquals(1, files.salesRows.size());
    assertEquals(7, files.salesRows.get(0).length);
    assertEquals(1, files.calendarRows.size());
    assertEquals(1, files.priceRows.size());
    assertEquals(START.toString(), files.priceRows.get(0)[2]);
  }
}
