package org.lagmill.report;

import java.util.ArrayList;
import java.util.List;
import java.util.function.IntFunction;

/**
 * Vertical stacked bars, one per period: the positive parts of each period stack upward from zero and the negative
 * parts downward, so what pushes the total up and what pulls it down read apart; the total is drawn as a line with a
 * dot per period, and it equals the bar's signed sum. Each segment is one {@code <rect class="segment">}, each total
 * dot one {@code <circle class="total-dot">}. A legend names the series above the plot. Configure, then call
 * {@link #render()} once. Not thread-safe.
 */
public final class StackedBarChart {
  private static final int LEGEND_ROW_PX = 16;

  private final ChartFrame frame;
  private final int periodCount;
  private final List<Part> parts = new ArrayList<>();
  private String accessibleTitle = "stacked bar chart";
  private String yTitle = "";
  private IntFunction<String> xLabels = Integer::toString;
  private double[] total;
  private String totalLabel = "total";

  private record Part(String label, double[] values, String colour) {}

  /** @param periodCount bars across the plot, at least 1 */
  public StackedBarChart(ChartFrame frame, int periodCount) {
    if (periodCount < 1) {
      throw new IllegalArgumentException("a stacked bar chart needs at least 1 period, got " + periodCount);
    }
    this.frame = frame;
    this.periodCount = periodCount;
  }

  public StackedBarChart title(String text) {
    accessibleTitle = text;
    return this;
  }

  public StackedBarChart yTitle(String text) {
    yTitle = text;
    return this;
  }

  /** Label of the bar at each period index; every bar is labelled when there are at most 14, else every 7th. */
  public StackedBarChart xLabels(IntFunction<String> labels) {
    xLabels = labels;
    return this;
  }

  /**
   * Adds a part; parts stack in the order added (each sign from zero outward).
   *
   * @param values one finite value per period, in the chart's unit
   */
  public StackedBarChart part(String label, double[] values, String colour) {
    if (values.length != periodCount) {
      throw new IllegalArgumentException("part " + label + " has " + values.length + " values for " + periodCount
          + " periods");
    }
    parts.add(new Part(label, values, colour));
    return this;
  }

  /** The line of totals drawn over the bars. */
  public StackedBarChart total(String label, double[] values) {
    if (values.length != periodCount) {
      throw new IllegalArgumentException("total has " + values.length + " values for " + periodCount + " periods");
    }
    totalLabel = label;
    total = values;
    return this;
  }

  /** Scale from values to y pixels: spans the lowest negative stack and the highest positive stack (and total). */
  public AxisScale yScale() {
    double low = 0;
    double high = 0;
    for (int p = 0; p < periodCount; p++) {
      double up = 0;
      double down = 0;
      for (Part part : parts) {
        double v = part.values[p];
        if (v > 0) {
          up += v;
        } else if (v < 0) {
          down += v;
        }
      }
      high = Math.max(high, Math.max(up, total == null ? 0 : total[p]));
      low = Math.min(low, down);
    }
    double[] ticks = AxisScale.niceTicks(low, high > low ? high : low + 1, 5);
    return new AxisScale(ticks[0], ticks[ticks.length - 1], frame.plotBottom() + legendHeightPx(),
        frame.plotTop() + legendHeightPx());
  }

  private int legendHeightPx() {
    return (legendRows() - 1) * LEGEND_ROW_PX;
  }

  private int legendRows() {
    double width = 0;
    int rows = 1;
    double available = frame.plotRight() - frame.plotLeft();
    for (String label : legendLabels()) {
      double w = SvgWriter.textWidthPx(label, 11) + 28;
      if (width + w > available) {
        rows++;
        width = 0;
      }
      width += w;
    }
    return rows;
  }

  private List<String> legendLabels() {
    List<String> labels = new ArrayList<>();
    parts.forEach(p -> labels.add(p.label));
    if (total != null) {
      labels.add(totalLabel);
    }
    return labels;
  }

  /** Writes the chart as one {@code <svg>} element. */
  public String render() {
    int heightPx = frame.heightPx() + legendHeightPx();
    AxisScale y = yScale();
    double left = frame.plotLeft();
    double right = frame.plotRight();
    double slot = (right - left) / periodCount;
    double barWidth = Math.max(1, slot * 0.7);
    SvgWriter svg = new SvgWriter().open(frame.widthPx(), heightPx, "chart stacked-chart", accessibleTitle);
    double[] ticks = AxisScale.niceTicks(y.domainMin(), y.domainMax(), 5);
    for (double t : ticks) {
      double py = y.toPixel(t);
      svg.line(left, py, right, py, "grid", SvgCharts.GRID_COLOUR, 1, null);
      svg.text(left - 6, py + 4, ReportFormat.compact(t), "end", "tick-label", SvgCharts.TEXT_COLOUR, 11, 0);
    }
    int labelStep = periodCount <= 14 ? 1 : 7;
    for (int p = 0; p < periodCount; p++) {
      double x = left + p * slot + (slot - barWidth) / 2;
      double up = 0;
      double down = 0;
      for (Part part : parts) {
        double v = part.values[p];
        if (!(v != 0) || !Double.isFinite(v)) {
          continue;
        }
        double from = v > 0 ? up : down;
        double to = from + v;
        if (v > 0) {
          up = to;
        } else {
          down = to;
        }
        double top = Math.min(y.toPixel(from), y.toPixel(to));
        svg.rect(x, top, barWidth, Math.abs(y.toPixel(to) - y.toPixel(from)), "segment", part.colour);
      }
      if (p % labelStep == 0) {
        svg.text(x + barWidth / 2, frame.plotBottom() + legendHeightPx() + 16, xLabels.apply(p), "middle",
            "tick-label", SvgCharts.TEXT_COLOUR, 11, 0);
      }
    }
    double zero = y.toPixel(0);
    svg.line(left, zero, right, zero, "axis", SvgCharts.AXIS_COLOUR, 1, null);
    if (total != null) {
      double[] xs = new double[periodCount];
      double[] ys = new double[periodCount];
      for (int p = 0; p < periodCount; p++) {
        xs[p] = left + (p + 0.5) * slot;
        ys[p] = y.toPixel(total[p]);
      }
      svg.polyline(xs, ys, 0, periodCount, "total", TOTAL_COLOUR, 1.5, null);
      for (int p = 0; p < periodCount; p++) {
        svg.circle(xs[p], ys[p], 2.5, "total-dot", TOTAL_COLOUR);
      }
    }
    legend(svg);
    if (!yTitle.isEmpty()) {
      double mid = (frame.plotTop() + frame.plotBottom()) / 2 + legendHeightPx();
      svg.text(14, mid, yTitle, "middle", "axis-title", SvgCharts.TEXT_COLOUR, 11, -90);
    }
    return svg.close();
  }

  private void legend(SvgWriter svg) {
    double x = frame.plotLeft();
    double yPx = frame.plotTop() - 20;
    double available = frame.plotRight() - frame.plotLeft();
    for (int i = 0; i < parts.size() + (total == null ? 0 : 1); i++) {
      boolean isTotal = i == parts.size();
      String label = isTotal ? totalLabel : parts.get(i).label;
      double w = SvgWriter.textWidthPx(label, 11) + 28;
      if (x + w > frame.plotLeft() + available) {
        x = frame.plotLeft();
        yPx += LEGEND_ROW_PX;
      }
      if (isTotal) {
        svg.line(x, yPx - 4, x + 14, yPx - 4, "legend-total", TOTAL_COLOUR, 1.5, null);
      } else {
        svg.rect(x, yPx - 10, 12, 10, "legend-swatch", parts.get(i).colour);
      }
      svg.text(x + 18, yPx, label, "start", "legend-label", SvgCharts.TEXT_COLOUR, 11, 0);
      x += w;
    }
  }

  /** The total line: black, apart from every part's colour. */
  static final String TOTAL_COLOUR = "#000000";
}
