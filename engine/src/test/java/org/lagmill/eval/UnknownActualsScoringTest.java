package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.time.LocalDate;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.SalesHistory;

/** An unknown (or closed) actual in the horizon is removed from both the actual and the forecast side. */
class UnknownActualsScoringTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20_261_202L);

  @Test
  void shouldIgnoreTheForecastOfADayWhoseActualIsUnknown() {
    Random random = new Random(MASTER_SEED);
    int[][] units = new int[4][30];
    for (int[] row : units) {
      for (int d = 0; d < row.length; d++) {
        row[d] = random.nextInt(6);
      }
    }
    units[1][25] = SalesHistory.UNKNOWN_UNITS;
    units[3][22] = SalesHistory.UNKNOWN_UNITS;
    SalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2025, 1, 6), units);
    Evaluator evaluator = new Evaluator(history, Hierarchy.parse(List.of("series_id")));
    double[][] forecast = new double[4][8];
    for (double[] row : forecast) {
      java.util.Arrays.fill(row, 2.5);
    }
    double[][] wild = new double[4][];
    for (int s = 0; s < 4; s++) {
      wild[s] = forecast[s].clone();
    }
    wild[1][25 - 22] = 400;
    wild[3][0] = 900;
    EvaluationResult a = evaluator.evaluate(22, forecast);
    EvaluationResult b = evaluator.evaluate(22, wild);
    String where = "master seed " + MASTER_SEED + " (-Dlagmill.seed)";
    assertEquals(a.wrmsse(), b.wrmsse(), 1e-12, where);
    for (int l = 0; l < a.levels().size(); l++) {
      assertEquals(a.levels().get(l).mae(), b.levels().get(l).mae(), 1e-12, where);
      assertEquals(a.levels().get(l).bias(), b.levels().get(l).bias(), 1e-12, where);
    }
    assertEquals(2, a.unknownActualCount());
    // The same change on a known day does change the score, so the check above can fail.
    wild[2][1] = 400;
    assertNotEquals(a.wrmsse(), evaluator.evaluate(22, wild).wrmsse(), where);
  }
}
