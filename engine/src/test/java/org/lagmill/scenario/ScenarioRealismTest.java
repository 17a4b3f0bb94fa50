package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Predicate;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;

/**
 * Statistical checks that the scenario looks like article-outlet retail data, on 600 series over two years (four
 * outlets: two superstores, a neighbourhood store that opens part-way and a kiosk). Thresholds are rules of thumb for
 * such data (common practice, no source) and hold with a margin for the fixed seed.
 */
class ScenarioRealismTest {
  private static final long SEED = TestSeeds.master(42L);
  private static final int SERIES_COUNT = 600;
  private static final int DAY_COUNT = 730;
  private static final String CONTEXT = "seed " + SEED + ", " + SERIES_COUNT + " series x " + DAY_COUNT + " days";

  @TempDir
  static Path dir;
  private static ScenarioFiles files;

  @BeforeAll
  static void generate() throws IOException {
    ScenarioGenerator.write(new ScenarioSpec(SERIES_COUNT, DAY_COUNT, ScenarioSpec.DEFAULT_START_DATE, SEED, 28,
        false), dir);
    files = new ScenarioFiles(dir);
  }

  @Test
  void shouldBeMostlyIntermittentWithAFewFastMovers() {
    long zeroCount = 0;
    int fastCount = 0;
    int boundedCount = 0;
    double[] seriesMeans = new double[files.units.length];
    for (int s = 0; s < files.units.length; s++) {
      int max = 0;
      long sum = 0;
      for (int units : files.units[s]) {
        zeroCount += units == 0 ? 1 : 0;
        max = Math.max(max, units);
        sum += units;
      }
      fastCount += max >= 100 ? 1 : 0;
      boundedCount += max <= 254 ? 1 : 0;
      seriesMeans[s] = (double) sum / DAY_COUNT;
    }
    double zeroShare = (double) zeroCount / ((long) SERIES_COUNT * DAY_COUNT);
    assertTrue(zeroShare >= 0.5 && zeroShare <= 0.8, CONTEXT + ": zero share " + zeroShare);
    assertTrue(fastCount >= 1, CONTEXT + ": no series reaches 100 units a day");
    assertTrue(boundedCount >= 0.85 * SERIES_COUNT, CONTEXT + ": series with max <= 254: " + boundedCount);
    Arrays.sort(seriesMeans);
    assertTrue(seriesMeans[SERIES_COUNT / 2] < 1.0, CONTEXT + ": median units a day " + seriesMeans[SERIES_COUNT / 2]);
  }

  @Test
  void shouldSellNothingAndHaveNoPriceBeforeLaunch() {
    Map<String, List<String[]>> prices = files.pricesByKey();
    int launchedCount = 0;
    for (int s = 0; s < files.units.length; s++) {
      String[] row = files.salesRows.get(s);
      LocalDate firstPrice = LocalDate.parse(prices.get(files.priceKey(row)).get(0)[0]);
      int launchDay = (int) (firstPrice.toEpochDay() - files.salesDates.get(0).toEpochDay());
      if (launchDay > 0) {
        launchedCount++;
        for (int day = 0; day < Math.min(launchDay, DAY_COUNT); day++) {
          assertEquals(0, files.units[s][day], CONTEXT + ": " + row[0] + " sells before launch on day " + day);
        }
      }
    }
    double launchedShare = (double) launchedCount / SERIES_COUNT;
    assertTrue(launchedShare >= 0.10 && launchedShare <= 0.30, CONTEXT + ": launched share " + launchedShare);
  }

  @Test
  void shouldSellAtWeekendsInSuperstoresAndOnWeekdaysInKiosks() {
    double superstore = weekendToWeekdayRatio("superstore");
    double kiosk = weekendToWeekdayRatio("kiosk");
    assertTrue(superstore > 1.2, CONTEXT + ": superstore weekend / weekday mean " + superstore);
    assertTrue(kiosk < 0.95, CONTEXT + ": kiosk weekend / weekday mean " + kiosk);
  }

  @Test
  void shouldSellMoreInPlannedPromotions() {
    Map<String, List<String[]>> plans = files.planByKey();
    double promoUnits = 0;
    double regularUnits = 0;
    long promoDays = 0;
    long regularDays = 0;
    int promotedSeries = 0;
    int liftedSeries = 0;
    for (int s = 0; s < files.units.length; s++) {
      String[] row = files.salesRows.get(s);
      String[] promo = files.valueOnDates(plans.get(row[ScenarioFiles.ARTICLE] + "," + row[ScenarioFiles.BANNER]), 0);
      double seriesPromo = 0;
      double seriesRegular = 0;
      int seriesPromoDays = 0;
      int seriesRegularDays = 0;
      for (int day = 0; day < DAY_COUNT; day++) {
        if (files.isClosed(row[ScenarioFiles.OUTLET], files.salesDates.get(day))) {
          continue;
        }
        if (promo[day].equals("1")) {
          seriesPromo += files.units[s][day];
          seriesPromoDays++;
        } else {
          seriesRegular += files.units[s][day];
          seriesRegularDays++;
        }
      }
      if (seriesPromoDays > 0 && seriesRegularDays > 0 && seriesPromo + seriesRegular >= 100) {
        promotedSeries++;
        liftedSeries += seriesPromo / seriesPromoDays > seriesRegular / seriesRegularDays ? 1 : 0;
        promoUnits += seriesPromo;
        regularUnits += seriesRegular;
        promoDays += seriesPromoDays;
        regularDays += seriesRegularDays;
      }
    }
    assertTrue(promotedSeries >= 50, CONTEXT + ": promoted series " + promotedSeries);
    double ratio = (promoUnits / promoDays) / (regularUnits / regularDays);
    assertTrue(ratio > 1.5, CONTEXT + ": promotion / regular mean " + ratio);
    assertTrue(liftedSeries >= 0.8 * promotedSeries, CONTEXT + ": lifted " + liftedSeries + " of " + promotedSeries);
  }

  @Test
  void shouldMoveSalesOnHolidaysAndTheirEves() {
    double[] total = chainTotal(null);
    Map<String, List<Double>> ratios = new HashMap<>();
    for (int day = 0; day < DAY_COUNT; day++) {
      String holiday = files.calendarRows.get(day)[1];
      if (!holiday.isEmpty()) {
        ratios.computeIfAbsent(holiday, k -> new ArrayList<>()).add(total[day] / sameWeekdayNeighbours(total, day));
      }
    }
    assertEquals(HolidayCalendar.HOLIDAYS.length, ratios.size(), CONTEXT + ": holidays seen " + ratios.keySet());
    // Midwinter closes every outlet but the kiosk; its eve is the year's big food shop.
    for (double ratio : ratios.get("Midwinter")) {
      assertTrue(ratio < 0.3, CONTEXT + ": Midwinter ratio " + ratio);
    }
    for (int year : new int[] {2023, 2024}) {
      int eve = (int) (LocalDate.of(year, 12, 24).toEpochDay() - files.salesDates.get(0).toEpochDay());
      double ratio = total[eve] / sameWeekdayNeighbours(total, eve);
      assertTrue(ratio > 1.1, CONTEXT + ": Midwinter eve " + year + " ratio " + ratio);
    }
    double spread = 0;
    int holidayDays = 0;
    for (List<Double> holidayRatios : ratios.values()) {
      for (double ratio : holidayRatios) {
        spread += Math.abs(Math.log(ratio));
        holidayDays++;
      }
    }
    double quietSpread = 0;
    int quietDays = 0;
    for (int day = 14; day < DAY_COUNT - 14; day++) {
      if (files.calendarRows.get(day)[1].isEmpty() && files.calendarRows.get(day + 1)[1].isEmpty()) {
        quietSpread += Math.abs(Math.log(total[day] / sameWeekdayNeighbours(total, day)));
        quietDays++;
      }
    }
    assertTrue(spread / holidayDays > 2 * quietSpread / quietDays,
        CONTEXT + ": holiday spread " + spread / holidayDays + " vs other days " + quietSpread / quietDays);
  }

  @Test
  void shouldLiftDrinksInADistrictOnItsOwnSchoolBreak() {
    // Breaks are staggered: on days when Ferncombe is on break and Lowbridge is not (or the reverse), the ratio of
    // the two districts' drinks sales moves against the days when both or neither are on break.
    double[] ferncombe = chainTotal(row -> row[ScenarioFiles.DISTRICT].equals("Ferncombe")
        && row[ScenarioFiles.SECTION].equals("Drinks") && !row[ScenarioFiles.FORMAT].equals("neighbourhood"));
    double[] lowbridge = chainTotal(row -> row[ScenarioFiles.DISTRICT].equals("Lowbridge")
        && row[ScenarioFiles.SECTION].equals("Drinks") && row[ScenarioFiles.FORMAT].equals("superstore"));
    int ferncombeColumn = files.calendarColumn("school_break[district=Ferncombe]");
    int lowbridgeColumn = files.calendarColumn("school_break[district=Lowbridge]");
    double[] sums = new double[6];
    for (int day = 0; day < DAY_COUNT; day++) {
      String[] row = files.calendarRows.get(day);
      if (!row[1].isEmpty() || ferncombe[day] == 0 || lowbridge[day] == 0) {
        continue;
      }
      boolean f = row[ferncombeColumn].equals("1");
      boolean l = row[lowbridgeColumn].equals("1");
      int group = f == l ? 0 : f ? 2 : 4;
      sums[group] += ferncombe[day];
      sums[group + 1] += lowbridge[day];
    }
    double same = sums[0] / sums[1];
    double ferncombeOnly = sums[2] / sums[3] / same;
    double lowbridgeOnly = sums[4] / sums[5] / same;
    assertTrue(ferncombeOnly > 1.04, CONTEXT + ": Ferncombe-only break ratio " + ferncombeOnly);
    assertTrue(lowbridgeOnly < 0.96, CONTEXT + ": Lowbridge-only break ratio " + lowbridgeOnly);
  }

  @Test
  void shouldHaveStockOutRunsInBusySeries() {
    int runCount = 0;
    for (int[] units : files.units) {
      double mean = Arrays.stream(units).average().orElse(0);
      if (mean < 8) {
        continue;
      }
      int first = 0;
      while (first < units.length && units[first] == 0) {
        first++;
      }
      int run = 0;
      for (int day = first; day < units.length; day++) {
        run = units[day] == 0 ? run + 1 : 0;
        runCount += run == 2 ? 1 : 0;
      }
    }
    assertTrue(runCount >= 3, CONTEXT + ": zero runs in busy series " + runCount);
  }

  private static double weekendToWeekdayRatio(String format) {
    double[] total = chainTotal(row -> row[ScenarioFiles.FORMAT].equals(format));
    double weekend = 0;
    double weekday = 0;
    int weekendDays = 0;
    int weekdayDays = 0;
    for (int day = 0; day < DAY_COUNT; day++) {
      if (!files.calendarRows.get(day)[1].isEmpty() || total[day] == 0) {
        continue;
      }
      DayOfWeek dow = files.salesDates.get(day).getDayOfWeek();
      if (dow == DayOfWeek.SATURDAY || dow == DayOfWeek.SUNDAY) {
        weekend += total[day];
        weekendDays++;
      } else {
        weekday += total[day];
        weekdayDays++;
      }
    }
    return (weekend / weekendDays) / (weekday / weekdayDays);
  }

  private static double[] chainTotal(Predicate<String[]> seriesFilter) {
    double[] total = new double[DAY_COUNT];
    for (int s = 0; s < files.units.length; s++) {
      if (seriesFilter != null && !seriesFilter.test(files.salesRows.get(s))) {
        continue;
      }
      for (int day = 0; day < DAY_COUNT; day++) {
        total[day] += files.units[s][day];
      }
    }
    return total;
  }

  /** Mean of the same weekday one and two weeks around a day, skipping holidays and their eves. */
  private static double sameWeekdayNeighbours(double[] total, int day) {
    double sum = 0;
    int count = 0;
    for (int offset : new int[] {-14, -7, 7, 14}) {
      int other = day + offset;
      if (other >= 0 && other + 1 < DAY_COUNT && files.calendarRows.get(other)[1].isEmpty()
          && files.calendarRows.get(other + 1)[1].isEmpty()) {
        sum += total[other];
        count++;
      }
    }
    return sum / count;
  }
}
