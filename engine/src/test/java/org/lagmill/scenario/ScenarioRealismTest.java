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
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Statistical checks that the scenario looks like item-store retail data, on 600 series over two years. Thresholds
 * are rules of thumb for such data (common practice, no source) and hold with a wide margin for the fixed seed.
 */
class ScenarioRealismTest {
  private static final long SEED = 42L;
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
      LocalDate firstPrice = LocalDate.parse(prices.get(row[1] + "," + row[4]).get(0)[0]);
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
  void shouldSellMoreAtWeekends() {
    double[] total = chainTotal();
    double weekend = 0;
    double weekday = 0;
    int weekendDays = 0;
    for (int day = 0; day < DAY_COUNT; day++) {
      DayOfWeek dow = files.salesDates.get(day).getDayOfWeek();
      if (dow == DayOfWeek.SATURDAY || dow == DayOfWeek.SUNDAY) {
        weekend += total[day];
        weekendDays++;
      } else {
        weekday += total[day];
      }
    }
    double ratio = (weekend / weekendDays) / (weekday / (DAY_COUNT - weekendDays));
    assertTrue(ratio > 1.1, CONTEXT + ": weekend / weekday mean " + ratio);
  }

  @Test
  void shouldSellMoreOnPromotionDays() {
    Map<String, List<String[]>> prices = files.pricesByKey();
    double promoUnits = 0;
    double regularUnits = 0;
    long promoDays = 0;
    long regularDays = 0;
    int promotedSeries = 0;
    int liftedSeries = 0;
    for (int s = 0; s < files.units.length; s++) {
      String[] row = files.salesRows.get(s);
      double[] daily = files.dailyPrices(prices.get(row[1] + "," + row[4]));
      // Regular prices only rise, so a price below the highest so far is a promotion.
      double highest = 0;
      double seriesPromo = 0;
      double seriesRegular = 0;
      int seriesPromoDays = 0;
      int seriesRegularDays = 0;
      for (int day = 0; day < DAY_COUNT; day++) {
        if (Double.isNaN(daily[day])) {
          continue;
        }
        highest = Math.max(highest, daily[day]);
        if (daily[day] < highest) {
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
    assertTrue(ratio > 1.2, CONTEXT + ": promotion / regular mean " + ratio);
    assertTrue(liftedSeries >= 0.7 * promotedSeries, CONTEXT + ": lifted " + liftedSeries + " of " + promotedSeries);
  }

  @Test
  void shouldMoveSalesOnEventDaysBothWays() {
    double[] total = chainTotal();
    Map<String, List<Double>> ratios = new HashMap<>();
    for (int day = 0; day < DAY_COUNT; day++) {
      String event = files.calendarRows.get(day)[1];
      if (!event.isEmpty()) {
        ratios.computeIfAbsent(event, k -> new ArrayList<>()).add(total[day] / sameWeekdayNeighbours(total, day));
      }
    }
    assertEquals(EventCalendar.EVENTS.length, ratios.size(), CONTEXT + ": events seen " + ratios.keySet());
    for (double ratio : ratios.get("Hearth Day")) {
      assertTrue(ratio < 0.5, CONTEXT + ": Hearth Day ratio " + ratio);
    }
    for (double ratio : ratios.get("Winter Lights")) {
      assertTrue(ratio > 1.15, CONTEXT + ": Winter Lights ratio " + ratio);
    }
    double spread = 0;
    int eventDays = 0;
    for (List<Double> eventRatios : ratios.values()) {
      for (double ratio : eventRatios) {
        spread += Math.abs(Math.log(ratio));
        eventDays++;
      }
    }
    double quietSpread = 0;
    int quietDays = 0;
    for (int day = 14; day < DAY_COUNT - 14; day++) {
      if (files.calendarRows.get(day)[1].isEmpty()) {
        quietSpread += Math.abs(Math.log(total[day] / sameWeekdayNeighbours(total, day)));
        quietDays++;
      }
    }
    assertTrue(spread / eventDays > 2 * quietSpread / quietDays,
        CONTEXT + ": event-day spread " + spread / eventDays + " vs other days " + quietSpread / quietDays);
  }

  @Test
  void shouldLiftSalesOnRegionalPaydays() {
    int column = List.of(files.calendarHeader).indexOf("payday[region=Saltmarsh]");
    double[] total = new double[DAY_COUNT];
    for (int s = 0; s < files.units.length; s++) {
      if (files.salesRows.get(s)[5].equals("Saltmarsh")) {
        for (int day = 0; day < DAY_COUNT; day++) {
          total[day] += files.units[s][day];
        }
      }
    }
    double logRatio = 0;
    int paydayCount = 0;
    for (int day = 0; day < DAY_COUNT; day++) {
      if (files.calendarRows.get(day)[column].equals("1") && files.calendarRows.get(day)[1].isEmpty()) {
        logRatio += Math.log(total[day] / sameWeekdayNeighbours(total, day));
        paydayCount++;
      }
    }
    assertTrue(paydayCount >= 20, CONTEXT + ": paydays " + paydayCount);
    assertTrue(Math.exp(logRatio / paydayCount) > 1.03,
        CONTEXT + ": payday / same-weekday mean " + Math.exp(logRatio / paydayCount));
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

  private static double[] chainTotal() {
    double[] total = new double[DAY_COUNT];
    for (int[] units : files.units) {
      for (int day = 0; day < DAY_COUNT; day++) {
        total[day] += units[day];
      }
    }
    return total;
  }

  /** Mean of the same weekday one and two weeks around a day, skipping event days. */
  private static double sameWeekdayNeighbours(double[] total, int day) {
    double sum = 0;
    int count = 0;
    for (int offset : new int[] {-14, -7, 7, 14}) {
      int other = day + offset;
      if (other >= 0 && other < DAY_COUNT && files.calendarRows.get(other)[1].isEmpty()) {
        sum += total[other];
        count++;
      }
    }
    return sum / count;
  }
}
