package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

class AggregatorTest {
  private static final long SEED = TestSeeds.master(0x5eed_a66L);

  /** Slow reference: for every aggregate, loop over all series and keep those whose attribute values match. */
  private static double referenceSum(SalesHistory history, Level level, int aggregateIndex, int dayIndex,
      double[][] forecasts) {
    SeriesAttributes attributes = history.attributes();
    double sum = 0;
    for (int s = 0; s < history.seriesCount(); s++) {
      boolean member = true;
      String[] wanted = level.aggregateName(aggregateIndex).split(" / ");
      for (int k = 0; k < level.attributeNames().size(); k++) {
        int a = attributes.attributeIndex(level.attributeNames().get(k));
        if (!attributes.value(a, attributes.code(s, a)).equals(wanted[k])) {
          member = false;
        }
      }
      if (member) {
        sum += forecasts != null ? forecasts[s][dayIndex] : Math.max(0, history.units(s, dayIndex));
      }
    }
    return sum;
  }

  @Test
  void shouldMatchSlowReferenceOnRandomHistories() {
    for (int round = 0; round < 3; round++) {
      SplittableRandom random = new SplittableRandom(SEED + round);
      ArraySalesHistory history = RandomHistories.history(random, 40, false);
      List<Level> levels = Hierarchy.parse(List.of("region>store", "category>department>item")).bind(history);
      Aggregator aggregator = new Aggregator(levels);
      int firstDay = random.nextInt(30);
      int dayCount = history.dayCount() - firstDay;
      AggregateTable table = aggregator.aggregateActuals(history, firstDay, dayCount);
      long unknown = 0;
      for (int s = 0; s < history.seriesCount(); s++) {
        for (int d = firstDay; d < history.dayCount(); d++) {
          unknown += history.units(s, d) < 0 ? 1 : 0;
        }
      }
      assertEquals(unknown, table.unknownCount(), "seed " + SEED + " round " + round);
      for (int l = 0; l < levels.size(); l++) {
        for (int g = 0; g < levels.get(l).aggregateCount(); g++) {
          for (int d = 0; d < dayCount; d++) {
            assertEquals(referenceSum(history, levels.get(l), g, firstDay + d, null), table.get(l, g, d), 1e-9,
                "seed " + SEED + " round " + round + " level " + levels.get(l).name() + " aggregate " + g);
          }
        }
      }
    }
  }

  @Test
  void shouldSumForecastsBottomUpFromEitherLayout() {
    SplittableRandom random = new SplittableRandom(SEED);
    ArraySalesHistory history = RandomHistories.history(random, 10, false);
    List<Level> levels = Hierarchy.parse(List.of("region>store", "category>department>item")).bind(history);
    Aggregator aggregator = new Aggregator(levels);
    int horizon = 5;
    double[][] forecasts = new double[120][horizon];
    double[] flat = new double[120 * horizon];
    for (int s = 0; s < 120; s++) {
      for (int k = 0; k < horizon; k++) {
        forecasts[s][k] = random.nextDouble() * 5;
        flat[s * horizon + k] = forecasts[s][k];
      }
    }
    AggregateTable fromRows = aggregator.aggregateForecasts(forecasts);
    AggregateTable fromFlat = aggregator.aggregateForecasts(flat, horizon);
    for (int l = 0; l < levels.size(); l++) {
      for (int g = 0; g < levels.get(l).aggregateCount(); g++) {
        for (int k = 0; k < horizon; k++) {
          double expected = referenceSum(history, levels.get(l), g, k, forecasts);
          assertEquals(expected, fromRows.get(l, g, k), 1e-9, "seed " + SEED);
          assertEquals(expected, fromFlat.get(l, g, k), 1e-9, "seed " + SEED);
        }
      }
    }
  }

  @Test
  void shouldCountUnknownAsZeroUpToTheLastDay() {
    int[][] units = {{2, SalesHistory.UNKNOWN_UNITS, 4}, {1, 1, SalesHistory.UNKNOWN_UNITS}};
    ArraySalesHistory history = ArraySalesHistory.ofUnits(java.time.LocalDate.of(2022, 1, 3), units);
    Aggregator aggregator = new Aggregator(Hierarchy.ofLevels(List.of(List.of())).bind(history));
    AggregateTable table = aggregator.aggregateActuals(history, 0, 3);
    assertEquals(3.0, table.get(0, 0, 0));
    assertEquals(1.0, table.get(0, 0, 1));
    assertEquals(4.0, table.get(0, 0, 2));
    assertEquals(2, table.unknownCount());
  }

  @Test
  void shouldRejectNonFiniteForecastsAndWrongShapes() {
    ArraySalesHistory history = ArraySalesHistory.ofUnits(java.time.LocalDate.of(2022, 1, 3), new int[][] {{1, 2}});
    Aggregator aggregator = new Aggregator(Hierarchy.ofLevels(List.of(List.of())).bind(history));
    assertEquals("forecast of series 0 day 1 is NaN; expected a finite number",
        assertThrows(IllegalArgumentException.class,
            () -> aggregator.aggregateForecasts(new double[][] {{1, Double.NaN}})).getMessage());
    assertEquals("need 1 series x 3 days = 3 forecasts, got 2", assertThrows(IllegalArgumentException.class,
        () -> aggregator.aggregateForecasts(new double[2], 3)).getMessage());
    assertEquals("day range 1 + 2 outside 0..2 of the history", assertThrows(IllegalArgumentException.class,
        () -> aggregator.aggregateActuals(history, 1, 2)).getMessage());
  }
}
