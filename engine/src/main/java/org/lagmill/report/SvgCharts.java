package org.lagmill.report;

import java.util.List;

/**
 * Our own small SVG chart writer: line charts with bands and markers ({@link LineChart}) and horizontal bar charts
 * ({@link BarChart}), written as inline SVG text with no scripts, no fonts to embed and no network access. Output is
 * deterministic: the same data gives the same bytes. docs/report.md says why we draw our own instead of using a
 * charting library.
 *
 * <p>The palette is the Okabe–Ito set, readable by colour-blind readers; baselines also differ by dash pattern so a
 * black-and-white print keeps them apart.
 */
public final class SvgCharts {
  /** The model's forecast and its bars. */
  public static final String MODEL_COLOUR = "#0072b2";
  /** Actual units sold. */
  public static final String ACTUAL_COLOUR = "#1a1a1a";
  /** The validation curve's training twin. */
  public static final String TRAINING_COLOUR = "#e69f00";
  /** Interval bands are drawn in the model colour at this opacity. */
  public static final double BAND_OPACITY = 0.22;
  static final String MARKER_COLOUR = "#555555";
  static final String GRID_COLOUR = "#e3e3e3";
  static final String AXIS_COLOUR = "#888888";
  static final String TEXT_COLOUR = "#333333";

  // Seven distinct colours and dashes, one per default baseline, so no two baselines look alike on screen or in print.
  private static final List<String> BASELINE_COLOURS = List.of("#d55e00", "#009e73", "#cc79a7", "#e69f00",
      "#56b4e9", "#7a7a7a", "#5b3a8c");
  private static final List<String> BASELINE_DASHES = List.of("7 4", "2 3", "9 3 2 3", "4 4", "1 4", "6 2 1 2",
      "12 3");

  private SvgCharts() {}

  /** The colour of the {@code baselineIndex}-th baseline (0-based), cycling through the palette. */
  public static String baselineColour(int baselineIndex) {
    return BASELINE_COLOURS.get(Math.floorMod(baselineIndex, BASELINE_COLOURS.size()));
  }

  /** The dash pattern of the {@code baselineIndex}-th baseline (0-based), cycling. */
  public static String baselineDash(int baselineIndex) {
    return BASELINE_DASHES.get(Math.floorMod(baselineIndex, BASELINE_DASHES.size()));
  }

  /** Starts a line chart; see {@link LineChart}. */
  public static LineChart lineChart(ChartFrame frame, int pointCount) {
    return new LineChart(frame, pointCount);
  }

  /** Starts a horizontal bar chart; see {@link BarChart}. */
  public static BarChart barChart(int widthPx) {
    return new BarChart(widthPx);
  }
}
