package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.time.LocalDate;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;

/**
 * Rolling sums come from running totals per series; with units near the top of the int range the running sum of
 * squares passes 2^63 within a few days and wraps around. The window totals must stay exact (a difference of two
 * wrapped totals is exact while the window's own total fits in a long); the reference here sums each window in
 * {@link BigInteger} and takes the mean and sample standard deviation in {@link BigDecimal}.
 */
class RollingWrapAroundTest {
  private static final long SEED = TestSeeds.master(73_019L);

  @Test
  void shouldKeepWindowStatisticsExactWhenRunningTotalsWrap() {
    SplittableRandom random = new SplittableRandom(SEED);
    int dayCount = 60;
    int[][] units = new int[3][dayCount];
    for (int s = 0; s < units.length; s++) {
      for (int d = 0; d < dayCount; d++) {
        // 1.0e9 .. 2.1e9 units: a square is ~2^60 .. 2^62, so the running sum of squares wraps every few days,
        // while a window of 2 days stays below 2^63 (the documented exactness bound for w = 2)
        units[s][d] = random.nextInt(20) == 0 ? SalesHistory.UNKNOWN_UNITS : 1_000_000_000
            + random.nextInt(1_000_000_000);
      }
    }
    SalesHistory history = new ArraySalesHistory(LocalDate.of(2024, 1, 1), units,
        ArraySeriesAttributes.of(new String[] {"series_id"}, new String[][] {{"a"}, {"b"}, {"c"}}), PriceTable.EMPTY,
        new ArrayDayCalendar(dayCount, List.of()));
    FeatureSpec spec = FeatureSpec.builder().lagDays(1).rollingWindowDays(2).rollingShiftDays(1)
        .rollingStatNames(List.of("mean", "std", "min", "max")).calendarFeatures(List.of()).priceFeatures(List.of())
        .seriesFeatures(List.of()).categoricalAttributes(List.of()).strategy(FeatureSpec.Strategy.RECURSIVE)
        .build();
    FeaturePass pass = FeaturePass.training(history, spec);
    List<String> names = pass.schema().names();
    int mean = names.indexOf("roll_mean_2_shift_1");
    int std = names.indexOf("roll_std_2_shift_1");
    int min = names.indexOf("roll_min_2_shift_1");
    int max = names.indexOf("roll_max_2_shift_1");
    assertTrue(mean >= 0 && std >= 0 && min >= 0 && max >= 0, names.toString());
    int checked = 0;
    for (StreamedRows.Row row : StreamedRows.of(pass, 7).rows) {
      int s = row.seriesIndex();
      int last = row.dayIndex() - 1;
      BigInteger sum = BigInteger.ZERO;
      BigInteger squares = BigInteger.ZERO;
      int n = 0;
      int lowest = Integer.MAX_VALUE;
      int highest = Integer.MIN_VALUE;
      for (int d = Math.max(0, last - 1); d <= last; d++) {
        if (units[s][d] >= 0) {
          sum = sum.add(BigInteger.valueOf(units[s][d]));
          squares = squares.add(BigInteger.valueOf(units[s][d]).pow(2));
          n++;
          lowest = Math.min(lowest, units[s][d]);
          highest = Math.max(highest, units[s][d]);
        }
      }
      String context = "series " + s + " day " + row.dayIndex() + ", seed " + SEED;
      float[] v = row.values();
      if (n == 0) {
        assertTrue(Float.isNaN(v[mean]), context);
        continue;
      }
      MathContext mc = MathContext.DECIMAL128;
      BigDecimal exactMean = new BigDecimal(sum).divide(BigDecimal.valueOf(n), mc);
      assertEquals(exactMean.floatValue(), v[mean], Math.ulp(exactMean.floatValue()), context);
      assertEquals(lowest, v[min], context);
      assertEquals(highest, v[max], context);
      if (n == 2) {
        BigDecimal variance = new BigDecimal(squares).subtract(new BigDecimal(sum.pow(2)).divide(BigDecimal.valueOf(n),
            mc)).divide(BigDecimal.valueOf(n - 1), mc);
        double exactStd = Math.sqrt(variance.doubleValue());
        // the kernel forms the variance in double from exact integer totals: s² / n loses digits near 2^62, so
        // allow the double rounding of terms of that size (relative 2^-52 of the sum of squares)
        double tolerance = Math.sqrt(new BigDecimal(squares).doubleValue() * 0x1p-50) + Math.ulp((float) exactStd);
        assertEquals(exactStd, v[std], tolerance, context);
        checked++;
      }
    }
    assertTrue(checked > 50, "windows with two readable days checked: " + checked);
  }
}
