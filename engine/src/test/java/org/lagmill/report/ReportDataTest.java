package org.lagmill.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The data model's validation messages, its value equality over arrays and the skill ratio. */
class ReportDataTest {

  @Test
  void shouldRequireTitleAndCaution() {
    assertEquals("title must be a non-blank text, got \" \"; every report needs a title",
        assertThrows(IllegalArgumentException.class, () -> ReportData.builder(" ").build()).getMessage());
    assertEquals("caution must be a non-blank text, got null; every report needs a caution",
        assertThrows(IllegalArgumentException.class, () -> ReportData.builder("t").caution(null).build())
            .getMessage());
    assertEquals(ReportData.DEFAULT_CAUTION, ReportData.builder("t").build().caution());
  }

  @Test
  void shouldRejectSeriesOfTheWrongLength() {
    List<LocalDate> dates = List.of(LocalDate.of(2024, 1, 1), LocalDate.of(2024, 1, 2));
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new SeriesChart("total", dates,
        new double[] {1, 2}, new double[] {1}, null, null, null, null, 1));
    assertEquals("chart total: forecast has 1 values but there are 2 dates; give one value per date (NaN where "
        + "unknown)", e.getMessage());
    e = assertThrows(IllegalArgumentException.class, () -> new SeriesChart("total", dates, new double[2],
        new double[2], new double[2], null, null, null, 1));
    assertEquals("chart total: give both lower and upper band bounds or neither", e.getMessage());
    e = assertThrows(IllegalArgumentException.class, () -> new SeriesChart("total", dates, new double[2],
        new double[2], null, null, null, null, 2));
    assertEquals("chart total: originIndex must be in [-1, 1], got 2 (-1 means no origin marker)", e.getMessage());
  }

  @Test
  void shouldRejectAReferenceBaselineThatWasNotScored() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new AccuracySummary(
        "seasonal naive", List.of(), 0.7, Map.of("naive", 0.9), null, null, List.of()));
    assertEquals("referenceBaseline \"seasonal naive\" is not among the baselines [naive]; name one of them or pass "
        + "null", e.getMessage());
  }

  @Test
  void shouldRejectABestIterationOutsideTheCurve() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new TrainingSummary.ValidationCurve("rmse", new double[3], null, 4));
    assertEquals("bestIteration must be in [0, 3], got 4 (1-based; 0 means no best iteration)", e.getMessage());
  }

  @Test
  void shouldCompareArraysByValueWithNanEqualToNan() {
    List<LocalDate> dates = List.of(LocalDate.of(2024, 1, 1));
    SeriesChart a = new SeriesChart("x", dates, new double[] {Double.NaN}, new double[] {2}, null, null, null, null,
        -1);
    SeriesChart b = new SeriesChart("x", dates, new double[] {Double.NaN}, new double[] {2}, null, null, null, null,
        -1);
    SeriesChart c = new SeriesChart("x", dates, new double[] {Double.NaN}, new double[] {3}, null, null, null, null,
        -1);
    assertEquals(a, b);
    assertEquals(a.hashCode(), b.hashCode());
    assertNotEquals(a, c);
  }

  @Test
  void shouldDivideTheModelByTheReferenceForSkill() {
    AccuracySummary a = new AccuracySummary("seasonal naive", List.of(), 0.6,
        Map.of("seasonal naive", 0.8), null, null, List.of());
    assertEquals(0.75, a.skillRatio(), 1e-15);
    assertNull(new AccuracySummary(null, List.of(), 0.6, Map.of("naive", 0.8), null, null, List.of()).skillRatio());
  }
}
