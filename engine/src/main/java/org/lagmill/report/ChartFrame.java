package org.lagmill.report;

/**
 * The size of a chart and the margins around its plot area, in SVG user units (pixels at 100% zoom). The plot area
 * spans x in [leftPx, widthPx - rightPx] and y in [topPx, heightPx - bottomPx]; y grows downwards as in SVG.
 */
public record ChartFrame(int widthPx, int heightPx, int leftPx, int rightPx, int topPx, int bottomPx) {
  /** A full-width time chart. */
  public static final ChartFrame WIDE = new ChartFrame(920, 300, 64, 20, 52, 40);
  /** A shorter full-width chart for small multiples. */
  public static final ChartFrame WIDE_SHORT = new ChartFrame(920, 240, 64, 20, 52, 40);

  public ChartFrame {
    if (widthPx <= leftPx + rightPx || heightPx <= topPx + bottomPx || leftPx < 0 || rightPx < 0 || topPx < 0
        || bottomPx < 0) {
      throw new IllegalArgumentException("chart frame " + widthPx + "x" + heightPx + " with margins left " + leftPx
          + ", right " + rightPx + ", top " + topPx + ", bottom " + bottomPx
          + " leaves no plot area; margins must be >= 0 and smaller than the size");
    }
  }

  public double plotLeft() {
    return leftPx;
  }

  public double plotRight() {
    return widthPx - rightPx;
  }

  public double plotTop() {
    return topPx;
  }

  public double plotBottom() {
    return heightPx - bottomPx;
  }
}
