package org.lagmill.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.w3c.dom.Element;

/** The SVG charts against direct formulas: where points land, how NaN splits a line, what the ticks are. */
class SvgChartsTest {
  private static final long MASTER_SEED = TestSeeds.master(0x5EEDL);
  private static final double HALF_ROUNDING_PX = 0.05 + 1e-9;

  @Test
  void shouldPlacePointsWhereTheLinearFormulaPutsThem() throws Exception {
    Random rnd = new Random(MASTER_SEED);
    ChartFrame frame = ChartFrame.WIDE;
    for (int trial = 0; trial < 200; trial++) {
      int n = 2 + rnd.nextInt(200);
      double yMin = -50 + 100 * rnd.nextDouble();
      double yMax = yMin + 0.5 + 500 * rnd.nextDouble();
      double[] values = new double[n];
      for (int i = 0; i < n; i++) {
        values[i] = yMin + (yMax - yMin) * rnd.nextDouble();
      }
      String svg = SvgCharts.lineChart(frame, n).yRange(yMin, yMax).line("v", values, "#000000", null, false)
          .render();
      List<double[]> lines = polylines(svg);
      assertEquals(1, lines.size(), "trial " + trial + ", seed " + MASTER_SEED);
      double[] points = lines.get(0);
      assertEquals(2 * n, points.length);
      for (int i = 0; i < n; i++) {
        double x = frame.leftPx() + (double) i / (n - 1) * (frame.widthPx() - frame.rightPx() - frame.leftPx());
        double bottom = frame.heightPx() - frame.bottomPx();
        double y = bottom - (values[i] - yMin) / (yMax - yMin) * (bottom - frame.topPx());
        String where = "trial " + trial + ", point " + i + ", seed " + MASTER_SEED;
        assertEquals(x, points[2 * i], HALF_ROUNDING_PX, where);
        assertEquals(y, points[2 * i + 1], HALF_ROUNDING_PX, where);
      }
    }
  }

  @Test
  void shouldBreakTheLineAtEveryUnknownPoint() throws Exception {
    Random rnd = new Random(MASTER_SEED + 1);
    for (int trial = 0; trial < 300; trial++) {
      int n = 1 + rnd.nextInt(60);
      double nanShare = rnd.nextDouble();
      double[] values = new double[n];
      for (int i = 0; i < n; i++) {
        values[i] = rnd.nextDouble() < nanShare ? Double.NaN : rnd.nextInt(20);
      }
      String svg = SvgCharts.lineChart(ChartFrame.WIDE, n).line("v", values, "#000000", null, false).render();
      AxisScale x = new AxisScale(n == 1 ? -1 : 0, n == 1 ? 1 : n - 1, ChartFrame.WIDE.plotLeft(),
          ChartFrame.WIDE.plotRight());
      // the slow obvious reference: walk the values and cut a run at each NaN
      List<List<Integer>> runs = new ArrayList<>();
      List<Integer> run = new ArrayList<>();
      for (int i = 0; i <= n; i++) {
        if (i < n && !Double.isNaN(values[i])) {
          run.add(i);
        } else if (!run.isEmpty()) {
          runs.add(run);
          run = new ArrayList<>();
        }
      }
      List<double[]> lines = polylines(svg);
      List<List<Integer>> longRuns = runs.stream().filter(r -> r.size() >= 2).toList();
      String where = "trial " + trial + ", seed " + MASTER_SEED;
      assertEquals(longRuns.size(), lines.size(), where);
      for (int k = 0; k < lines.size(); k++) {
        List<Integer> expected = longRuns.get(k);
        double[] points = lines.get(k);
        assertEquals(2 * expected.size(), points.length, where);
        for (int j = 0; j < expected.size(); j++) {
          assertEquals(x.toPixel(expected.get(j)), points[2 * j], HALF_ROUNDING_PX, where);
        }
      }
      long lone = runs.stream().filter(r -> r.size() == 1).count();
      assertEquals(lone, count(svg, "<circle class=\"lone-point\""), where);
    }
  }

  @Test
  void shouldKeepEveryValueInsideTheDerivedAxis() throws Exception {
    Random rnd = new Random(MASTER_SEED + 2);
    for (int trial = 0; trial < 200; trial++) {
      int n = 2 + rnd.nextInt(50);
      double offset = rnd.nextGaussian() * Math.pow(10, rnd.nextInt(7) - 2);
      double spread = Math.pow(10, rnd.nextInt(8) - 3);
      double[] values = new double[n];
      double[] lower = new double[n];
      double[] upper = new double[n];
      for (int i = 0; i < n; i++) {
        values[i] = offset + spread * rnd.nextDouble();
        lower[i] = values[i] - spread * rnd.nextDouble();
        upper[i] = values[i] + spread * rnd.nextDouble();
      }
      LineChart chart = SvgCharts.lineChart(ChartFrame.WIDE, n).line("v", values, "#000000", null, false)
          .band("b", lower, upper, "#0072b2");
      AxisScale y = chart.yScale();
      String where = "trial " + trial + ", seed " + MASTER_SEED;
      for (int i = 0; i < n; i++) {
        assertTrue(y.domainMin() <= lower[i] && upper[i] <= y.domainMax(), where);
      }
      List<double[]> polygons = shapes(chart.render(), "polygon", "band");
      assertEquals(1, polygons.size(), where);
      for (double[] polygon : polygons) {
        for (int j = 1; j < polygon.length; j += 2) {
          assertTrue(polygon[j] >= ChartFrame.WIDE.plotTop() - 0.05 && polygon[j] <= ChartFrame.WIDE.plotBottom()
              + 0.05, where);
        }
      }
    }
  }

  @Test
  void shouldChooseRoundTicksCoveringTheInterval() {
    Random rnd = new Random(MASTER_SEED + 3);
    for (int trial = 0; trial < 2_000; trial++) {
      double min = rnd.nextGaussian() * Math.pow(10, rnd.nextInt(10) - 4);
      double max = min + Math.abs(rnd.nextGaussian()) * Math.pow(10, rnd.nextInt(10) - 4);
      int target = 2 + rnd.nextInt(9);
      double[] ticks = AxisScale.niceTicks(min, max, target);
      String where = "trial " + trial + " [" + min + ", " + max + "], seed " + MASTER_SEED;
      assertTrue(ticks.length >= 2, where);
      double step = ticks[1] - ticks[0];
      assertTrue(ticks[0] <= min && ticks[ticks.length - 1] >= max, where);
      assertTrue(min == max || (ticks[0] > min - step * 1.0001 && ticks[ticks.length - 1] < max + step * 1.0001),
          where);
      for (int i = 1; i < ticks.length; i++) {
        // a difference of two large neighbours is exact only to a few units in the last place of their magnitude
        double tolerance = 4 * Math.ulp(Math.max(Math.abs(ticks[i]), Math.abs(ticks[i - 1]))) + step * 1e-9;
        assertEquals(step, ticks[i] - ticks[i - 1], tolerance, where);
      }
      double mantissa = step / Math.pow(10, Math.floor(Math.log10(step) + 1e-5));
      assertTrue(Math.abs(mantissa - 1) < 1e-5 || Math.abs(mantissa - 2) < 1e-5 || Math.abs(mantissa - 5) < 1e-5,
          where + " step " + step);
      if (min != max) {
        assertTrue(ticks.length <= 2 * target + 2, where + " has " + ticks.length + " ticks for target " + target);
      }
    }
  }

  @Test
  void shouldMatchHandCheckedTicks() {
    assertArrayEquals(new double[] {0, 20, 40, 60, 80, 100}, AxisScale.niceTicks(0, 97, 6));
    assertArrayEquals(new double[] {0, 0.2, 0.4, 0.6, 0.8, 1.0}, AxisScale.niceTicks(0.13, 0.87, 5));
    assertArrayEquals(new double[] {1.5, 2, 2.5, 3, 3.5, 4, 4.5}, AxisScale.niceTicks(1.71, 4.2, 6));
    assertArrayEquals(new double[] {0, 1}, AxisScale.niceTicks(0, 0, 2));
    assertEquals(0.3, AxisScale.niceTicks(0.25, 0.35, 3)[1], 0.0, "no drift from 3 x 0.1");
    assertEquals(5.0, AxisScale.niceStep(3.2));
    assertEquals(10.0, AxisScale.niceStep(5.01));
    assertEquals(0.002, AxisScale.niceStep(0.0011), 1e-18);
  }

  @Test
  void shouldDrawBarsProportionalToTheirValues() throws Exception {
    Random rnd = new Random(MASTER_SEED + 4);
    BarChart chart = SvgCharts.barChart(920);
    double[] values = new double[25];
    for (int i = 0; i < values.length; i++) {
      values[i] = rnd.nextDouble() * 1e6;
      chart.bar("feature " + i, values[i], ReportFormat.compact(values[i]));
    }
    AxisScale x = chart.xScale();
    List<Element> rects = XmlPage.parse(chart.render()).all("//rect[@class='bar']");
    assertEquals(values.length, rects.size());
    for (int i = 0; i < values.length; i++) {
      double width = Double.parseDouble(rects.get(i).getAttribute("width"));
      double expected = values[i] / x.domainMax() * (920 - 70 - chart.barLeftPx());
      assertEquals(expected, width, 0.05 + 1e-9, "bar " + i + ", seed " + MASTER_SEED);
    }
  }

  @Test
  void shouldEscapeLabelsAndStayWellFormed() throws Exception {
    String label = "<a href='x'>&\"</a>";
    String svg = SvgCharts.lineChart(ChartFrame.WIDE, 3).title(label).yTitle(label).marker(1, label)
        .xLabels(i -> label).line(label, new double[] {1, 2, 3}, "#000000", "4 2", false).render();
    assertTrue(!svg.contains("<a "), svg);
    XmlPage page = XmlPage.parse(svg);
    assertEquals(label, page.text("/svg/title"));
    String bars = SvgCharts.barChart(400).title(label).bar(label, 1, label).render();
    assertEquals(label, XmlPage.parse(bars).text("//text[@class='bar-label']"));
  }

  @Test
  void shouldWriteTheSameBytesForTheSameData() {
    double[] v = {1.25, Double.NaN, 3, 4, 5};
    String a = SvgCharts.lineChart(ChartFrame.WIDE, 5).line("v", v, "#000000", null, true).marker(2.5, "m").render();
    String b = SvgCharts.lineChart(ChartFrame.WIDE, 5).line("v", v, "#000000", null, true).marker(2.5, "m").render();
    assertEquals(a, b);
  }

  private static List<double[]> polylines(String svg) {
    return shapes(svg, "polyline", "series");
  }

  private static List<double[]> shapes(String svg, String tag, String cssClass) {
    List<double[]> out = new ArrayList<>();
    Matcher m = Pattern.compile("<" + tag + " class=\"" + cssClass + "\"[^>]* points=\"([^\"]*)\"").matcher(svg);
    while (m.find()) {
      String[] pairs = m.group(1).split(" ");
      double[] coordinates = new double[2 * pairs.length];
      for (int i = 0; i < pairs.length; i++) {
        String[] xy = pairs[i].split(",");
        coordinates[2 * i] = Double.parseDouble(xy[0]);
        coordinates[2 * i + 1] = Double.parseDouble(xy[1]);
      }
      out.add(coordinates);
    }
    return out;
  }

  private static int count(String text, String part) {
    int n = 0;
    for (int i = text.indexOf(part); i >= 0; i = text.indexOf(part, i + 1)) {
      n++;
    }
    return n;
  }
}
