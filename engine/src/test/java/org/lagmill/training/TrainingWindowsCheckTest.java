package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.lagmill.features.FeatureSpec;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.ArraySalesHistory;

/** A validation window or lag longer than the history is a request to change, whatever its size, never a bug. */
@Tag("reliability")
class TrainingWindowsCheckTest {
  private static final ArraySalesHistory HISTORY = SmallHistories.history(3L, 2, 14, 0);

  private static String refusal(int horizonDays, int lagDays) {
    FeatureSpec spec = FeatureSpec.builder().horizonDays(horizonDays).lagDays(lagDays).rollingWindowDays(2).build();
    TrainingPlan plan = SmallHistories.plan(spec, 3, 13, horizonDays, null);
    return assertThrows(InvalidRequestException.class, () -> ModelTraining.checkWindows(HISTORY, plan))
        .getMessage();
  }

  @Test
  void shouldRefuseAValidationWindowAsLongAsTheHistoryWithoutOverflowing() {
    assertEquals("the validation window of 14 days (the horizon) leaves no day of the 14 days of history up to the"
        + " cut to train on; use a shorter ‹horizon›", refusal(14, 14));
    assertEquals("the validation window of 2147483647 days (the horizon) leaves no day of the 14 days of history up"
        + " to the cut to train on; use a shorter ‹horizon›", refusal(Integer.MAX_VALUE, Integer.MAX_VALUE));
  }

  @Test
  void shouldRefuseTheLongestLagPastTheTrainingDaysWithoutOverflowing() {
    assertEquals("the history before the validation window has 12 days, too few for the longest lag (2147483647"
        + " days) plus at least one training day; use a longer history or shorter lags",
        refusal(2,
            Integer.MAX_VALUE));
    assertEquals("the history before the validation window has 12 days, too few for the longest lag (12 days) plus"
        + " at least one training day; use a longer history or shorter lags", refusal(2, 12));
  }
}
