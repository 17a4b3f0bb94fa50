package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Weekly output against the daily output of the same spec, read back the slow way. */
class ScenarioWeeklyTest {
  private static final LocalDate START = LocalDate.of(2023, 3, 1);
  private static final int DAYS = 420;
  private static final int FUTURE_DAYS = 28;

  @TempDir
  static Path dir;
  private static ScenarioFiles daily;
  private static ScenarioFiles weekly;

  @BeforeAll
  static void generate() throws IOException {
    ScenarioSpec spec = new ScenarioSpec(90, DAYS, START, 17, FUTURE_DAYS, false);
    ScenarioGenerator.write(spec, dir.resolve("daily"));
    ScenarioSummary summary = ScenarioGenerator.write(spec.withPeriodDays(7), dir.resolve("weekly"));
    assertEquals(7, summary.periodDays());
    daily = new ScenarioFiles(dir.resolve("daily"));
    weekly = new ScenarioFiles(dir.resolve("weekly"));
  }

  @Test
  void shouldSumSevenDailyCountsIntoEachWeek() {
    assertEquals(DAYS / 7, weekly.periodCount());
    for (int week = 0; week < weekly.periodCount(); week++) {
      assertEquals(START.plusDays(7L * week), weekly.salesDates.get(week));
    }
    for (int s = 0; s < daily.units.length; s++) {
      assertArrayEquals(List.of(daily.salesRows.get(s)).subList(0, ScenarioFiles.KEY_CELLS).toArray(),
          List.of(weekly.salesRows.get(s)).subList(0, ScenarioFiles.KEY_CELLS).toArray());
      int[] sums = new int[DAYS / 7];
      for (int day = 0; day < DAYS; day++) {
        sums[day / 7] += daily.units[s][day];
      }
      assertArrayEquals(sums, weekly.units[s], daily.salesRows.get(s)[0]);
    }
  }

  @Test
  void shouldWriteOnePriceRowPerArticleOutletWeekMatchingTheDailyPrices() {
    assertEquals("article,outlet,from,price", weekly.pricesHeader);
    Map<String, List<String[]>> weeklyPrices = weekly.pricesByKey();
    Map<String, List<String[]>> dailyPrices = daily.pricesByKey();
    int calendarWeeks = (DAYS + FUTURE_DAYS) / 7;
    for (String[] row : daily.salesRows) {
      List<String[]> rows = weeklyPrices.get(weekly.priceKey(row));
      double[] dayPrices = daily.prices(dailyPrices.get(daily.priceKey(row)));
      int firstWeek = 0;
      while (Double.isNaN(dayPrices[7 * firstWeek])) {
        firstWeek++;
      }
      assertEquals(calendarWeeks - firstWeek, rows.size(), row[0]);
      for (int i = 0; i < rows.size(); i++) {
        int week = firstWeek + i;
        assertEquals(START.plusDays(7L * week).toString(), rows.get(i)[0], row[0]);
        if (7 * week < DAYS) {
          for (int day = 7 * week; day < 7 * week + 7; day++) {
            assertEquals(dayPrices[day], Double.parseDouble(rows.get(i)[1]), 1e-9, row[0] + " day " + day);
          }
        }
      }
    }
  }

  @Test
  void shouldKeepThePlanAndDeclareOnlyWholeWeekClosures() {
    // The same plan, except the row stating each key's reach: on the last calendar day in daily output, on the last
    // week's first day in weekly output. Every change falls on a week boundary, so the rows before that week agree.
    LocalDate lastDay = START.plusDays(DAYS + FUTURE_DAYS - 1);
    LocalDate lastWeek = START.plusDays((DAYS + FUTURE_DAYS - 1) / 7 * 7L);
    List<String[]> dailyBefore = daily.planRows.stream().filter(r -> LocalDate.parse(r[2]).isBefore(lastWeek)).toList();
    List<String[]> weeklyBefore = weekly.planRows.stream().filter(r -> LocalDate.parse(r[2]).isBefore(lastWeek))
        .toList();
    assertEquals(dailyBefore.size(), weeklyBefore.size());
    for (int i = 0; i < dailyBefore.size(); i++) {
      assertArrayEquals(dailyBefore.get(i), weeklyBefore.get(i));
    }
    assertEquals(lastDay.toString(), daily.planRows.get(daily.planRows.size() - 1)[2]);
    assertEquals(lastWeek.toString(), weekly.planRows.get(weekly.planRows.size() - 1)[2]);
    assertTrue(weekly.closureRows.size() >= 2, "opening and refit");
    for (String[] row : weekly.closureRows) {
      long from = LocalDate.parse(row[1]).toEpochDay() - START.toEpochDay();
      long until = LocalDate.parse(row[2]).toEpochDay() - START.toEpochDay();
      assertEquals(0, from % 7, String.join(",", row));
      assertEquals(6, until % 7, String.join(",", row));
    }
    assertEquals("date,holiday_days,school_break[district=Ferncombe],school_break[district=Lowbridge]",
        String.join(",", weekly.calendarHeader));
    assertEquals((DAYS + FUTURE_DAYS) / 7, weekly.calendarRows.size());
  }
}
