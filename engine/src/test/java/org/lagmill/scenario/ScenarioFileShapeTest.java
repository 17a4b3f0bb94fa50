package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.HashMap;
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
    // 37 series over 4 outlets: 10 articles, the last one in one outlet only.
    ScenarioSummary summary = ScenarioGenerator.write(new ScenarioSpec(37, 90, START, 5, 14, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    assertEquals(List.of("series_id", "article", "family", "section", "outlet", "banner", "format", "district"),
        List.of(files.salesHeader).subList(0, ScenarioFiles.KEY_CELLS));
    assertEquals(90, files.periodCount());
    for (int day = 0; day < 90; day++) {
      assertEquals(START.plusDays(day), files.salesDates.get(day));
    }
    assertEquals(37, files.salesRows.size());
    Set<String> seriesIds = new HashSet<>();
    for (String[] row : files.salesRows) {
      assertEquals(ScenarioFiles.KEY_CELLS + 90, row.length, row[0]);
      assertTrue(row[ScenarioFiles.ARTICLE].matches("[0-9A-HJKMNP-TV-Z]{5}"), row[1]);
      assertTrue(row[ScenarioFiles.OUTLET].matches("L\\d{3}"), row[4]);
      assertEquals(row[ScenarioFiles.ARTICLE] + "/" + row[ScenarioFiles.OUTLET], row[0]);
      assertTrue(seriesIds.add(row[0]), "duplicate " + row[0]);
      for (int c = ScenarioFiles.KEY_CELLS; c < row.length; c++) {
        assertTrue(row[c].matches("0|[1-9]\\d*"), row[0] + " cell " + c + ": " + row[c]);
      }
    }
    assertEquals(5, summary.files().size());
    assertEquals(37L * 90, summary.itemDayCount());
    long bytes = 0;
    for (Path file : summary.files()) {
      bytes += Files.size(file);
    }
    assertEquals(bytes, summary.fileBytes());
  }

  @Test
  void shouldNestFamiliesInSectionsAndGiveEachOutletOneBannerFormatAndDistrict(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(3000, 30, START, 8, 0, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    Map<String, String> sectionOfFamily = new HashMap<>();
    Map<String, String> familyOfArticle = new HashMap<>();
    Map<String, String> storeTraitsOfOutlet = new HashMap<>();
    for (String[] row : files.salesRows) {
      String family = row[ScenarioFiles.FAMILY];
      assertEquals(sectionOfFamily.computeIfAbsent(family, f -> row[ScenarioFiles.SECTION]),
          row[ScenarioFiles.SECTION], family);
      assertEquals(familyOfArticle.computeIfAbsent(row[ScenarioFiles.ARTICLE], a -> family), family, row[0]);
      String traits = row[ScenarioFiles.BANNER] + "," + row[ScenarioFiles.FORMAT] + "," + row[ScenarioFiles.DISTRICT];
      assertEquals(storeTraitsOfOutlet.computeIfAbsent(row[ScenarioFiles.OUTLET], o -> traits), traits, row[0]);
    }
    assertEquals(14, sectionOfFamily.size());
    assertEquals(Set.of("Chilled", "Grocery", "Drinks", "Homecare", "Garden"), Set.copyOf(sectionOfFamily.values()));
    assertEquals(12, storeTraitsOfOutlet.size());
    assertEquals(250, familyOfArticle.size());
  }

  @Test
  void shouldWriteACalendarThroughTheFutureDaysWithOneSchoolBreakColumnPerDistrict(@TempDir Path dir)
      throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(10, 400, START, 5, 28, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    // Four outlets lie in two districts; a district with no outlet gets no column (ingest would warn about it).
    assertArrayEquals(new String[] {"date", "holiday", "school_break[district=Ferncombe]",
        "school_break[district=Lowbridge]"}, files.calendarHeader);
    Set<String> districts = new HashSet<>();
    for (String[] row : files.salesRows) {
      districts.add(row[ScenarioFiles.DISTRICT]);
    }
    assertEquals(Set.of("Ferncombe", "Lowbridge"), districts);
    assertEquals(428, files.calendarRows.size());
    Set<String> holidays = new HashSet<>();
    for (int day = 0; day < 428; day++) {
      String[] row = files.calendarRows.get(day);
      assertEquals(4, row.length);
      assertEquals(START.plusDays(day).toString(), row[0]);
      if (!row[1].isEmpty()) {
        holidays.add(row[1]);
      }
      for (int c = 2; c < 4; c++) {
        assertTrue(row[c].equals("0") || row[c].equals("1"), row[0] + " " + row[c]);
      }
    }
    assertEquals(9, holidays.size(), holidays.toString());
  }

  @Test
  void shouldWritePriceChangePointsPerArticleAndBannerInDateOrder(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(120, 500, START, 9, 28, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    Set<String> salesKeys = new HashSet<>();
    for (String[] row : files.salesRows) {
      salesKeys.add(files.priceKey(row));
    }
    Map<String, List<String[]>> byKey = files.pricesByKey();
    assertEquals(salesKeys, byKey.keySet(), "every article-banner has prices and every price key has a series");
    assertEquals(salesKeys, files.planByKey().keySet(), "every article-banner has a plan");
    LocalDate lastCalendarDay = START.plusDays(500 + 28 - 1);
    for (Map.Entry<String, List<String[]>> entry : byKey.entrySet()) {
      LocalDate previous = null;
      String previousPrice = null;
      for (String[] change : entry.getValue()) {
        LocalDate from = LocalDate.parse(change[0]);
        assertTrue(previous == null || from.isAfter(previous), entry.getKey() + " " + from);
        assertTrue(!from.isBefore(START) && !from.isAfter(lastCalendarDay), entry.getKey() + " " + from);
        assertEquals(0, (from.toEpochDay() - START.toEpochDay()) % 7, "changes fall on period boundaries " + from);
        assertTrue(change[1].matches("[1-9]\\d*\\.\\d9|0\\.\\d9"), entry.getKey() + " " + change[1]);
        assertTrue(!change[1].equals(previousPrice), "a change point changes the price: " + entry.getKey());
        previous = from;
        previousPrice = change[1];
      }
    }
  }

  @Test
  void shouldWriteAPlanWhosePromotionsAreThePriceCuts(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(200, 600, START, 13, 28, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    Map<String, List<String[]>> prices = files.pricesByKey();
    int promotionDays = 0;
    for (Map.Entry<String, List<String[]>> entry : files.planByKey().entrySet()) {
      List<String[]> plan = entry.getValue();
      assertEquals(START.toString(), plan.get(0)[0], "the plan starts on the first day: " + entry.getKey());
      // 600 sales days and 28 future days: the last row, on the last calendar day, states the plan's reach.
      assertEquals(START.plusDays(627).toString(), plan.get(plan.size() - 1)[0], "the plan's reach: "
          + entry.getKey());
      for (String[] row : plan) {
        assertTrue(row[1].matches("[01]") && row[3].matches("[01]") && row[4].matches("[01]"), entry.getKey());
        assertTrue(row[1].equals("0") ? row[2].equals("0") && row[3].equals("0") && row[4].equals("0")
            : row[2].matches("0\\.[1-4][05]"), entry.getKey() + " " + String.join(",", row));
      }
      String[] discount = files.valueOnDates(plan, 1);
      double[] price = files.prices(prices.get(entry.getKey()));
      // Regular prices only rise, so the highest price so far is the regular price on a day without promotion. A
      // regular rise may fall inside a promotion, so a promotion price follows the regular price before or after it.
      double regular = 0;
      for (int day = 0; day < price.length; day++) {
        if (Double.isNaN(price[day])) {
          continue;
        }
        double depth = Double.parseDouble(discount[day]);
        if (depth == 0) {
          assertTrue(price[day] >= regular, entry.getKey() + " day " + day);
          regular = price[day];
          continue;
        }
        promotionDays++;
        double after = regular;
        for (int later = day + 1; later < price.length; later++) {
          if (Double.parseDouble(discount[later]) == 0) {
            after = price[later];
            break;
          }
        }
        // Promotion prices are rounded to end in 9 and kept at least 10 cents below the regular price.
        boolean matches = false;
        for (double candidate : new double[] {regular, after}) {
          matches |= candidate == 0 || price[day] < candidate
              && Math.abs(candidate * (1 - depth) - price[day]) <= 0.10 + 1e-9;
        }
        assertTrue(matches, entry.getKey() + " day " + day + ": " + price[day] + " at " + depth + " off " + regular
            + " or " + after);
      }
    }
    assertTrue(promotionDays > 1000, "promotion days " + promotionDays);
  }

  @Test
  void shouldDeclareClosuresAsDateRangesOfKnownOutlets(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(40, 730, LocalDate.of(2023, 1, 2), 3, 28, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    Set<String> outlets = new HashSet<>();
    for (String[] row : files.salesRows) {
      outlets.add(row[ScenarioFiles.OUTLET]);
    }
    for (String[] row : files.closureRows) {
      assertTrue(outlets.contains(row[0]), row[0]);
      assertTrue(!LocalDate.parse(row[2]).isBefore(LocalDate.parse(row[1])), String.join(",", row));
      assertTrue(!row[3].isEmpty());
    }
    // Worked by hand from the rules: L138 opens in week 46 (45 % of 730 days = day 328.5, back to day 322),
    // L117 closes days 511-524 (70 % = day 511) for a refit, and Midwinter 2023 closes every outlet but the kiosk.
    assertTrue(List.of(files.closureRows.toArray(String[][]::new)).stream()
        .anyMatch(r -> String.join(",", r).equals("L138,2023-01-02,2023-11-19,not yet open")));
    assertTrue(List.of(files.closureRows.toArray(String[][]::new)).stream()
        .anyMatch(r -> String.join(",", r).equals("L117,2024-05-27,2024-06-09,refit")));
    LocalDate midwinter = LocalDate.of(2023, 12, 25);
    assertEquals(List.of(true, true, false, true), List.of(files.isClosed("L104", midwinter),
        files.isClosed("L117", midwinter), files.isClosed("L121", midwinter), files.isClosed("L138", midwinter)));
    for (int s = 0; s < files.units.length; s++) {
      String outlet = files.salesRows.get(s)[ScenarioFiles.OUTLET];
      for (int day = 0; day < files.periodCount(); day++) {
        if (files.isClosed(outlet, files.salesDates.get(day))) {
          assertEquals(0, files.units[s][day], files.salesRows.get(s)[0] + " sells on a closed day " + day);
        }
      }
    }
  }

  @Test
  void shouldLeaveNoTemporaryFilesAndReplaceEarlierOutput(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(30, 40, START, 1, 7, false), dir);
    ScenarioGenerator.write(new ScenarioSpec(12, 20, START, 1, 7, false), dir);
    try (Stream<Path> listing = Files.list(dir)) {
      assertEquals(List.of("calendar.csv", "closures.csv", "plan.csv", "prices.csv", "sales.csv"),
          listing.map(p -> p.getFileName().toString()).sorted().toList());
    }
    assertEquals(12, new ScenarioFiles(dir).salesRows.size());
  }

  @Test
  void shouldHandleOneSeriesOfOneDay(@TempDir Path dir) throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(1, 1, START, 3, 0, false), dir);
    ScenarioFiles files = new ScenarioFiles(dir);
    assertEquals(1, files.salesRows.size());
    assertEquals(ScenarioFiles.KEY_CELLS + 1, files.salesRows.get(0).length);
    assertEquals(1, files.calendarRows.size());
    assertEquals(1, files.priceRows.size());
    assertEquals(START.toString(), files.priceRows.get(0)[2]);
    assertEquals(1, files.planRows.size());
    assertEquals(0, files.closureRows.size());
  }
}
