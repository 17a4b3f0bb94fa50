package org.lagmill.report;

import java.util.ArrayList;
import java.util.List;
import java.util.function.IntFunction;

/**
 * A line chart over an index axis (days, iterations, horizon days) with several series, an optional shaded interval
 * band, an optional vertical marker, axis ticks with labels and a legend, written as inline SVG.
 *
 * <p>Point {@code i} sits at x = {@code plotLeft + i / (pointCount - 1) * plotWidth} (a single point sits in the
 * middle) and at y from a linear scale over the y domain: the given {@link #yRange} or else the nice ticks around the
 * finite values. A NaN value breaks its line: each run of two or more finite points becomes one {@code <polyline>},
 * a lone finite point a small {@code <circle>}. The band is one {@code <polygon>} per run of days where both bounds
 * are finite. Configure, then call {@link #render()} once. Not thread-safe.
 */
public final class LineChart {
  private final ChartFrame frame;
  private final int pointCount;
  private final List<Line> lines = new ArrayList<>();
  private final List<Band> bands = new ArrayList<>();
  private String accessibleTitle = "line chart";
  private IntFunction<String> xLabel = i -> Integer.toString(i);
  private int xTickStep;
  private int xTickAnchor;
  private String yTitle = "";
  private double fixedYMin = Double.NaN;
  private double fixedYMax = Double.NaN;
  private boolean includeZero;
  private double markerPosition = Double.NaN;
  private String markerLabel = "";

  private record Line(String label, double[] values, String colour, String dashArray, boolean markPoints) {}

  private record Band(String label, double[] lower, double[] upper, String colour) {}

  /**
   * @param frame size and margins
   * @param pointCount points on the x axis, at least 1; every series has this many values
   */
  public LineChart(ChartFrame frame, int pointCount) {
    if (pointCount < 1) {
      throw new IllegalArgumentException("pointCount must be >= 1, got " + pointCount);
    }
    this.frame = frame;
    this.pointCount = pointCount;
  }

  /** The text screen readers announce and the SVG {@code <title>} holds. */
  public LineChart title(String text) {
    this.accessibleTitle = text;
    return this;
  }

  /** Label of the x tick at index {@code i}; by default the index itself. */
  public LineChart xLabels(IntFunction<String> labelOfIndex) {
    this.xLabel = labelOfIndex;
    return this;
  }

  /**
   * Puts x ticks at {@code anchor + k * step} for every whole k inside the axis; without this call the step is a
   * nice number giving about eight ticks from index 0.
   */
  public LineChart xTicks(int step, int anchor) {
    if (step < 1) {
      throw new IllegalArgumentException("x tick step must be >= 1, got " + step);
    }
    this.xTickStep = step;
    this.xTickAnchor = anchor;
    return this;
  }

  /** A short unit or measure name printed above the y axis. */
  public LineChart yTitle(String text) {
    this.yTitle = text;
    return this;
  }

  /** Fixes the y domain instead of deriving it from the data; values outside it are drawn outside the plot. */
  public LineChart yRange(double min, double max) {
    if (!(max > min) || !Double.isFinite(min) || !Double.isFinite(max)) {
      throw new IllegalArgumentException("y range [" + min + ", " + max + "] must be finite with max > min");
    }
    this.fixedYMin = min;
    this.fixedYMax = max;
    return this;
  }

  /** Whether the derived y domain reaches down (or up) to zero, as unit sales should. */
  public LineChart includeZero(boolean value) {
    this.includeZero = value;
    return this;
  }

  /**
   * Adds a series drawn in order of addition (later ones on top).
   *
   * @param dashArray an SVG stroke-dasharray such as "6 3", or null for a solid line; dashes keep lines apart in a
   *     black-and-white print
   * @param markPoints whether to mark every finite point with a dot (for short curves)
   */
  public LineChart line(String label, double[] values, String colour, String dashArray, boolean markPoints) {
    requireLength(label, values);
    lines.add(new Line(label, values, colour, dashArray, markPoints));
    return this;
  }

  /** Adds a shaded band between {@code lower} and {@code upper}, drawn beneath every line. */
  public LineChart band(String label, double[] lower, double[] upper, String colour) {
    requireLength(label + " lower", lower);
    requireLength(label + " upper", upper);
    bands.add(new Band(label, lower, upper, colour));
    return this;
  }

  /** A dashed vertical marker at a fractional index (e.g. {@code originIndex - 0.5}, between two days). */
  public LineChart marker(double indexPosition, String label) {
    this.markerPosition = indexPosition;
    this.markerLabel = label;
    return this;
  }

  /** The x position of index {@code i} in this chart's frame. */
  public double xPixel(double indexPosition) {
    return xScale().toPixel(indexPosition);
  }

  /** The y scale the chart uses, from the fixed range or the data. */
  public AxisScale yScale() {
    double[] ticks = yTicks();
    return new AxisScale(ticks[0], ticks[ticks.length - 1], frame.plotBottom(), frame.plotTop());
  }

  private AxisScale xScale() {
    return pointCount == 1
        ? new AxisScale(-1, 1, frame.plotLeft(), frame.plotRight())
        : new AxisScale(0, pointCount - 1, frame.plotLeft(), frame.plotRight());
  }

  private double[] yTicks() {
    if (!Double.isNaN(fixedYMin)) {
      double[] nice = AxisScale.niceTicks(fixedYMin, fixedYMax, 6);
      List<Double> inside = new ArrayList<>();
      inside.add(fixedYMin);
      for (double t : nice) {
        if (t > fixedYMin && t < fixedYMax) {
          inside.add(t);
        }
      }
      inside.add(fixedYMax);
      return inside.stream().mapToDouble(Double::doubleValue).toArray();
    }
    double min = includeZero ? 0 : Double.POSITIVE_INFINITY;
    double max = includeZero ? 0 : Double.NEGATIVE_INFINITY;
    for (Line l : lines) {
      for (double v : l.values) {
        if (Double.isFinite(v)) {
          min = Math.min(min, v);
          max = Math.max(max, v);
        }
      }
    }
    for (Band b : bands) {
      for (int i = 0; i < pointCount; i++) {
        if (Double.isFinite(b.lower[i]) && Double.isFinite(b.upper[i])) {
          min = Math.min(min, Math.min(b.lower[i], b.upper[i]));
          max = Math.max(max, Math.max(b.lower[i], b.upper[i]));
        }
      }
    }
    if (min > max) {
      min = 0;
      max = 1;
    }
    return AxisScale.niceTicks(min, max, 6);
  }

  /** Writes the chart as one {@code <svg>} element. */
  public String render() {
    AxisScale x = xScale();
    double[] yTickValues = yTicks();
    AxisScale y = new AxisScale(yTickValues[0], yTickValues[yTickValues.length - 1], frame.plotBottom(),
        frame.plotTop());
    SvgWriter svg = new SvgWriter().open(frame.widthPx(), frame.heightPx(), "chart line-chart", accessibleTitle);
    drawYAxis(svg, y, yTickValues);
    drawXAxis(svg, x);
    for (Band b : bands) {
      drawBand(svg, b, x, y);
    }
    if (!Double.isNaN(markerPosition)) {
      double mx = Math.max(frame.plotLeft(), Math.min(frame.plotRight(), x.toPixel(markerPosition)));
      svg.line(mx, frame.plotTop() - 4, mx, frame.plotBottom(), "marker", SvgCharts.MARKER_COLOUR, 1.2, "5 4");
      boolean roomOnRight = mx + 6 + SvgWriter.textWidthPx(markerLabel, 11) < frame.plotRight();
      svg.text(roomOnRight ? mx + 5 : mx - 5, frame.plotTop() + 10, markerLabel, roomOnRight ? "start" : "end",
          "marker-label", SvgCharts.MARKER_COLOUR, 11, 0);
    }
    for (Line l : lines) {
      drawLine(svg, l, x, y);
    }
    drawLegend(svg);
    return svg.close();
  }

  private void drawYAxis(SvgWriter svg, AxisScale y, double[] ticks) {
    for (double t : ticks) {
      double py = y.toPixel(t);
      svg.line(frame.plotLeft(), py, frame.plotRight(), py, "grid", SvgCharts.GRID_COLOUR, 1, null);
      svg.text(frame.plotLeft() - 8, py + 4, ReportFormat.compact(t), "end", "tick-label", SvgCharts.TEXT_COLOUR, 11,
          0);
    }
    if (!yTitle.isEmpty()) {
      svg.text(frame.plotLeft() - 8, frame.plotTop() - 12, yTitle, "start", "axis-title", SvgCharts.TEXT_COLOUR, 11,
          0);
    }
  }

  private void drawXAxis(SvgWriter svg, AxisScale x) {
    double base = frame.plotBottom();
    svg.line(frame.plotLeft(), base, frame.plotRight(), base, "axis", SvgCharts.AXIS_COLOUR, 1, null);
    int step = xTickStep > 0 ? xTickStep : (int) Math.max(1, AxisScale.niceStep(Math.max(1, pointCount - 1) / 8.0));
    int anchor = xTickStep > 0 ? xTickAnchor : 0;
    int first = anchor - Math.floorDiv(anchor, step) * step;
    for (int i = first; i < pointCount; i += step) {
      double px = x.toPixel(i);
      svg.line(px, base, px, base + 5, "tick", SvgCharts.AXIS_COLOUR, 1, null);
      svg.text(px, base + 18, xLabel.apply(i), "middle", "tick-label", SvgCharts.TEXT_COLOUR, 11, 0);
    }
  }

  private void drawBand(SvgWriter svg, Band b, AxisScale x, AxisScale y) {
    double[] xs = new double[2 * pointCount];
    double[] ys = new double[2 * pointCount];
    int i = 0;
    while (i < pointCount) {
      if (!(Double.isFinite(b.lower[i]) && Double.isFinite(b.upper[i]))) {
        i++;
        continue;
      }
      int end = i;
      while (end < pointCount && Double.isFinite(b.lower[end]) && Double.isFinite(b.upper[end])) {
        end++;
      }
      int runLength = end - i;
      for (int k = 0; k < runLength; k++) {
        xs[k] = x.toPixel(i + k);
        ys[k] = y.toPixel(b.upper[i + k]);
        xs[2 * runLength - 1 - k] = xs[k];
        ys[2 * runLength - 1 - k] = y.toPixel(b.lower[i + k]);
      }
      if (runLength == 1) {
        svg.line(xs[0], ys[0], xs[0], ys[1], "band", b.colour, 3, null);
      } else {
        svg.polygon(xs, ys, 2 * runLength, "band", b.colour, SvgCharts.BAND_OPACITY);
      }
      i = end;
    }
  }

  private void drawLine(SvgWriter svg, Line l, AxisScale x, AxisScale y) {
    double[] xs = new double[pointCount];
    double[] ys = new double[pointCount];
    for (int i = 0; i < pointCount; i++) {
      xs[i] = x.toPixel(i);
      ys[i] = Double.isFinite(l.values[i]) ? y.toPixel(l.values[i]) : Double.NaN;
    }
    int i = 0;
    while (i < pointCount) {
      if (Double.isNaN(ys[i])) {
        i++;
        continue;
      }
      int end = i;
      while (end < pointCount && !Double.isNaN(ys[end])) {
        end++;
      }
      if (end - i >= 2) {
        svg.polyline(xs, ys, i, end - i, "series", l.colour, 2, l.dashArray);
      } else {
        svg.circle(xs[i], ys[i], 2.5, "lone-point", l.colour);
      }
      i = end;
    }
    if (l.markPoints) {
      for (int k = 0; k < pointCount; k++) {
        if (!Double.isNaN(ys[k])) {
          svg.circle(xs[k], ys[k], 2.5, "point", l.colour);
        }
      }
    }
  }

  private void drawLegend(SvgWriter svg) {
    double lx = frame.plotLeft();
    double ly = 16;
    // Legend entries run left to right from the plot's left edge; an entry that would cross the chart's right edge
    // starts a new row, so no label is cut off however many baselines are drawn.
    double rightEdge = frame.widthPx() - 4;
    for (Line l : lines) {
      double entryWidth = 28 + SvgWriter.textWidthPx(l.label, 12);
      if (lx + entryWidth > rightEdge && lx > frame.plotLeft()) {
        lx = frame.plotLeft();
        ly += 16;
      }
      svg.line(lx, ly - 4, lx + 22, ly - 4, "legend-swatch", l.colour, 2.5, l.dashArray);
      svg.text(lx + 28, ly, l.label, "start", "legend-label", SvgCharts.TEXT_COLOUR, 12, 0);
      lx += entryWidth + 18;
    }
    for (Band b : bands) {
      svg.polygon(new double[] {lx, lx + 22, lx + 22, lx}, new double[] {ly - 10, ly - 10, ly + 2, ly + 2}, 4,
          "legend-swatch", b.colour, SvgCharts.BAND_OPACITY);
      svg.text(lx + 28, ly, b.label, "start", "legend-label", SvgCharts.TEXT_COLOUR, 12, 0);
      lx += 28 + SvgWriter.textWidthPx(b.label, 12) + 18;
    }
  }

  private void requireLength(String label, double[] values) {
    if (values == null || values.length != pointCount) {
      throw new IllegalArgumentException("series " + label + " has " + (values == null ? "no" : values.length)
          + " values but the chart has " + pointCount + " points; use NaN for missing points");
    }
  }
}
