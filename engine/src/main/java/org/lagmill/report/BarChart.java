package org.lagmill.report;

import java.util.ArrayList;
import java.util.List;

/**
 * A horizontal bar chart: one labelled bar per row, longest value on a nice scale from zero, the value printed at
 * the end of each bar. Each bar is one {@code <rect class="bar">}. The height follows the number of bars. Configure,
 * then call {@link #render()} once. Not thread-safe.
 */
public final class BarChart {
  private static final int ROW_HEIGHT_PX = 22;
  private static final int BAR_HEIGHT_PX = 14;
  private static final int TOP_PX = 8;
  private static final int BOTTOM_PX = 34;

  private final int widthPx;
  private final List<Bar> bars = new ArrayList<>();
  private String accessibleTitle = "bar chart";
  private String colour = SvgCharts.MODEL_COLOUR;
  private String axisTitle = "";

  private record Bar(String label, double value, String valueLabel) {}

  /** @param widthPx total width in SVG user units, at least 200 */
  public BarChart(int widthPx) {
    if (widthPx < 200) {
      throw new IllegalArgumentException("bar chart width must be >= 200 px, got " + widthPx);
    }
    this.widthPx = widthPx;
  }

  public BarChart title(String text) {
    this.accessibleTitle = text;
    return this;
  }

  /** Fill colour of every bar, an SVG colour such as "#0072b2". */
  public BarChart colour(String value) {
    this.colour = value;
    return this;
  }

  /** What the bar length measures, printed under the axis. */
  public BarChart axisTitle(String text) {
    this.axisTitle = text;
    return this;
  }

  /**
   * Adds a bar below the previous ones.
   *
   * @param value the bar length in data units, finite and at least 0
   * @param valueLabel the text at the bar's end, e.g. the value formatted with its unit
   */
  public BarChart bar(String label, double value, String valueLabel) {
    if (!(value >= 0) || !Double.isFinite(value)) {
      throw new IllegalArgumentException("bar " + label + " has value " + value + "; bars need a finite value >= 0");
    }
    bars.add(new Bar(label, value, valueLabel));
    return this;
  }

  /** Total height in SVG user units for the bars added so far. */
  public int heightPx() {
    return TOP_PX + Math.max(1, bars.size()) * ROW_HEIGHT_PX + BOTTOM_PX;
  }

  /** The left edge of the bars: room for the longest label, at most 40% of the width. */
  public double barLeftPx() {
    double longest = 0;
    for (Bar b : bars) {
      longest = Math.max(longest, SvgWriter.textWidthPx(b.label, 12));
    }
    return Math.min(widthPx * 0.4, longest + 16);
  }

  /** The scale from values to x pixels, zero at {@link #barLeftPx()}. */
  public AxisScale xScale() {
    double[] ticks = ticks();
    return new AxisScale(0, ticks[ticks.length - 1], barLeftPx(), widthPx - 70);
  }

  private double[] ticks() {
    double max = 0;
    for (Bar b : bars) {
      max = Math.max(max, b.value);
    }
    return AxisScale.niceTicks(0, max > 0 ? max : 1, 5);
  }

  /** Writes the chart as one {@code <svg>} element. */
  public String render() {
    int heightPx = heightPx();
    AxisScale x = xScale();
    double left = barLeftPx();
    double bottom = heightPx - BOTTOM_PX;
    SvgWriter svg = new SvgWriter().open(widthPx, heightPx, "chart bar-chart", accessibleTitle);
    for (double t : ticks()) {
      double px = x.toPixel(t);
      svg.line(px, TOP_PX, px, bottom, "grid", SvgCharts.GRID_COLOUR, 1, null);
      svg.text(px, bottom + 16, ReportFormat.compact(t), "middle", "tick-label", SvgCharts.TEXT_COLOUR, 11, 0);
    }
    for (int i = 0; i < bars.size(); i++) {
      Bar b = bars.get(i);
      double rowTop = TOP_PX + i * ROW_HEIGHT_PX;
      double barTop = rowTop + (ROW_HEIGHT_PX - BAR_HEIGHT_PX) / 2.0;
      double end = x.toPixel(b.value);
      svg.text(left - 8, barTop + BAR_HEIGHT_PX - 3, b.label, "end", "bar-label", SvgCharts.TEXT_COLOUR, 12, 0);
      svg.rect(left, barTop, end - left, BAR_HEIGHT_PX, "bar", colour);
      svg.text(end + 5, barTop + BAR_HEIGHT_PX - 3, b.valueLabel, "start", "bar-value", SvgCharts.TEXT_COLOUR, 11,
          0);
    }
    svg.line(left, TOP_PX, left, bottom, "axis", SvgCharts.AXIS_COLOUR, 1, null);
    if (!axisTitle.isEmpty()) {
      svg.text(widthPx - 70, heightPx - 4, axisTitle, "end", "axis-title", SvgCharts.TEXT_COLOUR, 11, 0);
    }
    return svg.close();
  }
}
