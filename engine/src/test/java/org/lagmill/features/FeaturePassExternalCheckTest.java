package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.LocalDate;
import java.time.temporal.IsoFields;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureSpec.RollingStat;
import org.lagmill.features.FeatureSpec.Strategy;
import org.lagmill.store.ArraySalesHistory;

/** Checks against sources outside this code base. */
class FeaturePassExternalCheckTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);

  @Test
  void shouldMatchCommonsMathRollingMeanAndSampleStandardDeviation() {
    // Outside source: commons-math3 DescriptiveStatistics with a rolling window (setWindowSize). Its
    // getStandardDeviation() is the bias-corrected sample standard deviation (divisor n - 1), per its Javadoc (from
    // memory); our roll_std is the sample one too.
    Random random = new Random(MASTER_SEED);
    int dayCount = 300;
    int[] units = new int[dayCount];
    units[0] = 1;
    for (int d = 1; d < dayCount; d++) {
      units[d] = random.nextInt(4) == 0 ? 0 : random.nextInt(60);
    }
    ArraySalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2023, 5, 1), new int[][] {units});
    int window = 28;
    int shift = 1;
    FeatureSpec spec = FeatureSpec.builder().strategy(Strategy.RECURSIVE).lagDays(1).rollingWindowDays(window)
        .rollingShiftDays(shift).rollingStats(List.of(RollingStat.MEAN, RollingStat.STD)).skipPreLaunch(false)
        .build();
    FeaturePass pass = FeaturePass.training(history, spec);
    int meanColumn = pass.schema().names().indexOf("roll_mean_28_shift_1");
    int stdColumn = pass.schema().names().indexOf("roll_std_28_shift_1");
    StreamedRows rows = StreamedRows.of(pass, 64);
    DescriptiveStatistics statistics = new DescriptiveStatistics(window);
    int checked = 0;
    for (StreamedRows.Row row : rows.rows) {
      int end = row.dayIndex() - shift;
      if (end < window - 1) {
        continue;
      }
      statistics.clear();
      for (int d = end - window + 1; d <= end; d++) {
        statistics.addValue(units[d]);
      }
      String where = "seed " + MASTER_SEED + " day " + row.dayIndex();
      assertEquals(statistics.getMean(), row.values()[meanColumn], 1e-4, where);
      assertEquals(statistics.getStandardDeviation(), row.values()[stdColumn], 1e-4, where);
      checked++;
    }
    assertEquals(dayCount - window - shift + 1, checked);
  }

  @Test
  void shouldMatchJavaTimeIsoWeekOfYear() {
    // Outside source: java.time IsoFields.WEEK_OF_WEEK_BASED_YEAR (ISO-8601 week numbering).
    for (LocalDate date = LocalDate.of(1995, 1, 1); date.getYear() < 2035; date = date.plusDays(1)) {
      assertEquals(date.get(IsoFields.WEEK_OF_WEEK_BASED_YEAR), CalendarKernel.isoWeekOfYear(date), date.toString());
    }
  }

  @Test
  void shouldMatchHandCheckedIsoWeeks() {
    // Hand-checked: 2020-12-31 is a Thursday in ISO week 53 of 2020; 2021-01-03 (Sunday) is still week 53;
    // 2019-12-30 (Monday) starts week 1 of 2020.
    assertEquals(53, CalendarKernel.isoWeekOfYear(LocalDate.of(2020, 12, 31)));
    assertEquals(53, CalendarKernel.isoWeekOfYear(LocalDate.of(2021, 1, 3)));
    assertEquals(1, CalendarKernel.isoWeekOfYear(LocalDate.of(2019, 12, 30)));
  }
}
