package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.features.FeatureSpec.RollingStat;
import org.lagmill.features.FeatureSpec.Strategy;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.SalesHistory;

class FeaturePassBehaviourTest {
  private static final long MASTER_SEED = TestSeeds.master(20240611L);
  private static final int U = SalesHistory.UNKNOWN_UNITS;

  @Test
  void shouldComputeHandCheckedValuesOnASmallSeries() {
    // day:    0  1  2  3  4  5  6  7
    // units:  0  0  3  U  0  0  2  5   first sale on day 2; days 0 and 1 are pre-launch
    ArraySalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2024, 1, 1),
        new int[][] {{0, 0, 3, U, 0, 0, 2, 5}});
    FeatureSpec spec = FeatureSpec.builder().strategy(Strategy.RECURSIVE).lagDays(1, 2).rollingWindowDays(3)
        .rollingShiftDays(1).rollingStats(List.of(RollingStat.values())).calendarFeatures(List.of())
        .skipPreLaunch(false).build();
    FeaturePass pass = FeaturePass.training(history, spec);
    assertEquals(List.of("lag_1", "lag_2", "roll_mean_3_shift_1", "roll_std_3_shift_1", "roll_min_3_shift_1",
        "roll_max_3_shift_1", "roll_zero_share_3_shift_1", "days_since_first_sale", "zero_run_shift_1"),
        pass.schema().names());
    assertEquals(7, pass.rowCount(), "day 3 has no label");
    StreamedRows rows = StreamedRows.of(pass, 3);
    float n = Float.NaN;
    float[][] expected = {
        // day 0: nothing readable before it
        {n, n, n, n, n, n, n, n, n},
        // day 1: day 0 is pre-launch
        {n, n, n, n, n, n, n, n, n},
        // day 2: days 0, 1 pre-launch
        {n, n, n, n, n, n, n, n, n},
        // day 4: lag 1 reads unknown day 3; window [1,3] holds only day 2 (3 units)
        {n, 3, 3, n, 3, 3, 0, 2, n},
        // day 5: window [2,4] = {3, U, 0}: mean 1.5, sample std sqrt(4.5)
        {0, n, 1.5f, (float) Math.sqrt(4.5), 0, 3, 0.5f, 3, 1},
        // day 6: window [3,5] = {U, 0, 0}
        {0, 0, 0, 0, 0, 0, 1, 4, 2},
        // day 7: window [4,6] = {0, 0, 2}: mean 2/3, std sqrt(4/3)
        {2, 0, 2f / 3, (float) Math.sqrt(4.0 / 3), 0, 2, 2f / 3, 5, 0}};
    int[] days = {0, 1, 2, 4, 5, 6, 7};
    for (int r = 0; r < days.length; r++) {
      StreamedRows.Row row = rows.rows.get(r);
      assertEquals(days[r], row.dayIndex());
      for (int f = 0; f < expected[r].length; f++) {
        FeaturePassReferenceTest.assertClose(expected[r][f], row.values()[f],
            pass.schema().names().get(f) + " on day " + days[r]);
      }
    }
  }

  @Test
  void shouldSkipRowsBeforeFirstSalePlusLongestLag() {
    int[] units = new int[100];
    units[10] = 4;
    units[70] = U;
    ArraySalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2024, 1, 1), new int[][] {units, new int[100]});
    FeaturePass pass = FeaturePass.training(history, FeatureSpec.defaults().withRollingWindowDays(7));
    // first sale 10 + longest lag 56 = day 66; days 66..99 minus unknown day 70; series 1 never sold
    assertEquals(33, pass.rowCount());
    StreamedRows rows = StreamedRows.of(pass, 10);
    assertEquals(66, rows.rows.get(0).dayIndex());
    assertTrue(rows.rows.stream().allMatch(r -> r.seriesIndex() == 0 && r.dayIndex() != 70));
  }

  @Test
  void shouldStreamTheSameRowsTwice() {
    RandomStore store = new RandomStore(MASTER_SEED, 20, 160, 0, true);
    FeaturePass pass = FeaturePass.training(store.history, FeatureSpec.defaults());
    StreamedRows first = StreamedRows.of(pass, 50);
    StreamedRows second = StreamedRows.of(pass, 50);
    assertEquals(pass.rowCount(), first.rows.size());
    assertEquals(first.rows.size(), second.rows.size());
    for (int i = 0; i < first.rows.size(); i++) {
      StreamedRows.Row a = first.rows.get(i);
      StreamedRows.Row b = second.rows.get(i);
      assertEquals(a.rowIndex(), b.rowIndex());
      assertEquals(a.seriesIndex(), b.seriesIndex());
      assertEquals(a.dayIndex(), b.dayIndex());
      assertEquals(Float.floatToRawIntBits(a.label()), Float.floatToRawIntBits(b.label()));
      assertArrayEquals(a.values(), b.values(), "seed " + MASTER_SEED + " row " + i);
    }
  }

  @Test
  void shouldCopySeriesWeightsIntoTheBatch() {
    RandomStore store = new RandomStore(MASTER_SEED + 1, 6, 120, 0, true);
    float[] weights = {0.5f, 1.5f, 2f, 3f, 4f, 5f};
    FeaturePass pass = FeaturePass.training(store.history, FeatureSpec.defaults()).withSeriesWeights(weights);
    for (StreamedRows.Row row : StreamedRows.of(pass, 7).rows) {
      assertEquals(weights[row.seriesIndex()], row.weight());
    }
  }

  @Test
  void shouldReadOnlyKnownDaysPastTheEndUnlessARecursiveCallerWroteThem() {
    RandomStore store = new RandomStore(MASTER_SEED + 2, 5, 100, 30, true);
    FeatureSpec spec = FeatureSpec.builder().strategy(Strategy.RECURSIVE).lagDays(1, 28).rollingWindowDays(7)
        .rollingShiftDays(1).build();
    int lag1 = 0;
    FeaturePass plain = FeaturePass.prediction(store.history, spec, null, 100, 28);
    for (StreamedRows.Row row : StreamedRows.of(plain, 16).rows) {
      if (row.dayIndex() > 100) {
        assertTrue(Float.isNaN(row.values()[lag1]), "lag_1 past the end must be NaN, day " + row.dayIndex());
      }
      assertTrue(Float.isNaN(row.label()));
    }
    ArraySalesHistory scratch = ArraySalesHistory.copyOf(store.history, 28);
    FeaturePass unwritten = FeaturePass.prediction(scratch, spec, null, 100, 28);
    List<StreamedRows.Row> a = StreamedRows.of(plain, 16).rows;
    List<StreamedRows.Row> b = StreamedRows.of(unwritten, 16).rows;
    for (int i = 0; i < a.size(); i++) {
      assertArrayEquals(a.get(i).values(), b.get(i).values(), "unknown extra days read as the end of the history");
    }
    int firstSale = scratch.firstSaleDayIndex(2);
    scratch.setUnits(2, 100, 9);
    StreamedRows.Row written = StreamedRows.of(FeaturePass.prediction(scratch, spec, new int[] {2}, 101, 1), 4).rows
        .get(0);
    assertEquals(firstSale == SalesHistory.NO_SALE ? Float.NaN : 9f, written.values()[lag1]);
  }

  @Test
  void shouldNameTheDefaultFeatures() {
    RandomStore store = new RandomStore(MASTER_SEED, 6, 120, 0, true);
    FeaturePass pass = FeaturePass.training(store.history, FeatureSpec.defaults());
    assertEquals(List.of("lag_28", "lag_35", "lag_42", "lag_49", "lag_56",
        "roll_mean_7_shift_28", "roll_std_7_shift_28", "roll_mean_28_shift_28", "roll_std_28_shift_28",
        "roll_mean_56_shift_28", "roll_std_56_shift_28",
        "day_of_week", "day_of_month", "month", "week_of_year", "day_of_year", "cal_event", "cal_event_type",
        "cal_payday", "price", "price_to_mean", "price_to_max", "price_change_7", "promo", "price_to_group",
        "attr_item", "attr_department", "attr_store", "attr_region", "days_since_first_sale", "zero_run_shift_28"),
        pass.schema().names());
    assertArrayEquals(new int[] {17, 25, 26, 27, 28}, pass.schema().categoricalIndexes());
    FeaturePass noPrices = FeaturePass.training(new RandomStore(MASTER_SEED, 6, 120, 0, false).history,
        FeatureSpec.defaults());
    assertTrue(noPrices.schema().names().stream().noneMatch(name -> name.startsWith("price") || name.equals("promo")));
  }
}
