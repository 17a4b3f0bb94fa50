package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.store.PlanTable;

/** The plan reader against {@link RandomPlans}' slow reference on seeded random plans of every shape. */
class PlanFileReaderReferenceTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);

  @TempDir
  Path temp;

  @Test
  void shouldMatchTheSlowReferenceOnRandomPlans() throws Exception {
    for (int round = 0; round < 40; round++) {
      long seed = MASTER_SEED * 31 + round;
      try {
        checkOne(RandomPlans.generate(new SplittableRandom(seed), round, 0, temp));
      } catch (AssertionError | RuntimeException e) {
        throw new AssertionError("seed " + seed + " (round " + round + ", -Dlagmill.seed=" + MASTER_SEED + "): "
            + e.getMessage(), e);
      }
    }
  }

  private static void checkOne(RandomPlans random) {
    PlanFileReader.PlanReadResult read = random.read();
    PlanTable plan = read.plan();
    assertEquals(random.dateForm ? PlanFileReader.Form.DATE : PlanFileReader.Form.FROM, read.form());
    assertEquals(List.of(random.columns), plan.columnNames());
    assertEquals(random.keyNames, plan.keyAttributeNames());
    long expectedUnknown = random.rows.stream().filter(r -> !r.known()).count();
    long expectedOffBoundary = random.rows.stream().filter(r -> r.known()
        && Math.floorMod(r.epochDay() - RandomPlans.FIRST.toEpochDay(), random.periodDays) != 0).count();
    assertEquals(expectedUnknown, read.unknownKeyRowCount());
    assertEquals(expectedOffBoundary, read.offBoundaryRowCount());
    assertEquals(random.reach(), plan.reachDayIndex());
    int withoutPlan = 0;
    for (int s = 0; s < random.series.size(); s++) {
      if (random.rowsOf(s).isEmpty()) {
        withoutPlan++;
        assertEquals(PlanTable.NO_KEY, plan.keyOf(s), "series " + s);
      }
      for (int p = 0; p < random.periodsSpan + 4; p++) {
        for (int c = 0; c < random.columns.length; c++) {
          assertEquals(random.slowValue(s, p, c), plan.valueAt(s, c, p), "series " + s + " "
              + Arrays.toString(random.series.get(s)) + " period " + p + " column " + random.columns[c]);
        }
      }
    }
    assertEquals(withoutPlan, read.seriesWithoutPlanCount());
  }
}
