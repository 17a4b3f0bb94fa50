package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class MemberAverageTest {
  @Test
  void shouldAverageEverySeriesAndPeriodAndKeepUnforecastRowsNaN() {
    double[][] a = {{1, 2, 3}, {Double.NaN, Double.NaN, Double.NaN}};
    double[][] b = {{3, 0, 4}, {Double.NaN, Double.NaN, Double.NaN}};
    double[][] c = {{2, 1, 2}, {Double.NaN, Double.NaN, Double.NaN}};
    double[][] mean = MemberAverage.point(List.of(a, b, c));
    assertArrayEquals(new double[] {2, 1, 3}, mean[0], 1e-12);
    assertTrue(Double.isNaN(mean[1][0]) && Double.isNaN(mean[1][2]));
    assertArrayEquals(new float[] {0.25f, 1f}, MemberAverage.dispersion(List.of(new float[] {0f, 0.5f},
        new float[] {0.5f, 1.5f})), 1e-7f);
  }

  @Test
  void shouldRefuseMembersOfDifferentShapes() {
    assertThrows(IllegalArgumentException.class, () -> MemberAverage.point(List.of(new double[][] {{1, 2}},
        new double[][] {{1, 2, 3}})));
    assertThrows(IllegalArgumentException.class, () -> MemberAverage.point(List.of()));
  }
}
