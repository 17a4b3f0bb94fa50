package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.lagmill.features.FeatureSpec.Strategy;
import org.lagmill.store.Periods;

class FeatureSpecDefaultsTest {
  @Test
  void shouldShipRecursiveShortLagsForADailyStore() {
    FeatureSpec spec = FeatureSpec.defaultsFor(Periods.DAILY);
    assertEquals(Strategy.RECURSIVE, spec.strategy());
    assertEquals(28, spec.horizonDays());
    assertArrayEquals(new int[] {1, 2, 3, 4, 5, 6, 7, 14, 21, 28, 35}, spec.lagDays());
    assertEquals(1, spec.rollingShiftDays());
    assertEquals(FeatureSpec.defaults(), FeatureSpec.defaultsFor(Periods.DAILY, Strategy.DIRECT));
  }

  @ParameterizedTest
  @ValueSource(ints = {7, 14, 28})
  void shouldSizeLongerPeriodsInPeriodsAndKeepTheLaunchSkipUnderAYear(int periodDays) {
    for (Strategy strategy : Strategy.values()) {
      FeatureSpec spec = FeatureSpec.defaultsFor(periodDays, strategy);
      assertEquals(strategy, spec.strategy());
      assertEquals(8, spec.horizonDays());
      assertArrayEquals(new int[] {4, 13, 26}, spec.rollingWindowDays());
      // The launch skip is the longest lag: 26 weeks is half a weekly year, so a series keeps most of its rows.
      assertTrue(spec.launchSkipDays() <= 26, spec.toString());
      if (strategy == Strategy.DIRECT) {
        assertTrue(Arrays.stream(spec.lagDays()).allMatch(lag -> lag >= spec.horizonDays()), spec.toString());
        assertEquals(spec.horizonDays(), spec.rollingShiftDays());
      } else {
        assertEquals(1, spec.rollingShiftDays());
      }
    }
  }
}
