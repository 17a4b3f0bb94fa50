package org.lagmill.report;

import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads a browser screenshot of the report (1200 px wide) and decides whether the page and its charts were drawn.
 *
 * <p>Every chart of the sample report draws something in the model colour in the right-hand part of the page (a long
 * bar, the end of a curve, the forecast); legends sit on the left. So within a vertical strip on the right, the rows
 * holding model-colour pixels form one cluster per chart, far apart from the next chart's. Likewise the interval band
 * colour forms one cluster per series chart. Counting clusters therefore notices a single missing chart.
 */
final class ScreenshotCheck {
  /** The strip, in screenshot pixels at a 1200 px wide window: right of every legend, inside every plot area. */
  static final int STRIP_LEFT_PX = 700;
  static final int STRIP_RIGHT_PX = 1020;
  /** Rows closer than this belong to one chart; charts are at least about 90 px apart. */
  static final int MERGE_GAP_ROWS = 24;
  /**
   * A band is tens of rows tall; the light edge pixels of a smoothed blue line also match its colour but span a few
   * rows only, so shorter clusters are not bands.
   */
  static final int MIN_BAND_ROWS = 15;

  private static final int[] MODEL_RGB = rgb(SvgCharts.MODEL_COLOUR);
  /** The band colour: the model colour at {@link SvgCharts#BAND_OPACITY} over white. */
  private static final int[] BAND_RGB = {
      blend(MODEL_RGB[0]), blend(MODEL_RGB[1]), blend(MODEL_RGB[2])};

  record Result(double nonWhiteShare, List<int[]> chartRows, List<int[]> bandRows, boolean bottomBlank) {
    String describe() {
      return String.format(java.util.Locale.ROOT, "non-white %.2f%%, chart clusters %s, band clusters %s, "
          + "bottom blank %s", nonWhiteShare * 100, ranges(chartRows), ranges(bandRows), bottomBlank);
    }
  }

  private ScreenshotCheck() {}

  static Result analyse(BufferedImage image) {
    if (image.getWidth() < STRIP_RIGHT_PX) {
      throw new IllegalArgumentException("screenshot is " + image.getWidth() + " px wide; the check expects 1200");
    }
    long nonWhite = 0;
    boolean[] chartRow = new boolean[image.getHeight()];
    boolean[] bandRow = new boolean[image.getHeight()];
    int lastNonWhiteRow = -1;
    for (int y = 0; y < image.getHeight(); y++) {
      int model = 0;
      int band = 0;
      for (int x = 0; x < image.getWidth(); x++) {
        int p = image.getRGB(x, y);
        int r = (p >> 16) & 0xff;
        int g = (p >> 8) & 0xff;
        int b = p & 0xff;
        if (r < 245 || g < 245 || b < 245) {
          nonWhite++;
          lastNonWhiteRow = y;
        }
        if (x >= STRIP_LEFT_PX && x < STRIP_RIGHT_PX) {
          model += distance(r, g, b, MODEL_RGB) <= 60 ? 1 : 0;
          band += distance(r, g, b, BAND_RGB) <= 16 ? 1 : 0;
        }
      }
      chartRow[y] = model >= 2;
      bandRow[y] = band >= 6;
    }
    double share = (double) nonWhite / ((long) image.getWidth() * image.getHeight());
    List<int[]> bands = clusters(bandRow);
    bands.removeIf(c -> c[1] - c[0] + 1 < MIN_BAND_ROWS);
    return new Result(share, clusters(chartRow), bands, lastNonWhiteRow < image.getHeight() - 200);
  }

  /**
   * Fails unless the page is drawn (at least 1% non-white), fits the window (its last 200 rows are blank, so nothing
   * was cut off), and shows {@code chartCount} charts of which {@code bandChartCount} carry an interval band.
   */
  static void assertReportRendered(BufferedImage image, int chartCount, int bandChartCount) {
    Result r = analyse(image);
    if (r.nonWhiteShare() < 0.01) {
      throw new AssertionError("the page looks blank: " + r.describe());
    }
    if (!r.bottomBlank()) {
      throw new AssertionError("the page does not fit the window, charts may be cut off: " + r.describe());
    }
    if (r.chartRows().size() != chartCount) {
      throw new AssertionError("expected " + chartCount + " charts drawn in the model colour: " + r.describe());
    }
    if (r.bandRows().size() != bandChartCount) {
      throw new AssertionError("expected " + bandChartCount + " interval bands: " + r.describe());
    }
  }

  private static List<int[]> clusters(boolean[] rows) {
    List<int[]> out = new ArrayList<>();
    int start = -1;
    int end = -1;
    for (int y = 0; y < rows.length; y++) {
      if (!rows[y]) {
        continue;
      }
      if (start >= 0 && y - end <= MERGE_GAP_ROWS) {
        end = y;
      } else {
        if (start >= 0) {
          out.add(new int[] {start, end});
        }
        start = y;
        end = y;
      }
    }
    if (start >= 0) {
      out.add(new int[] {start, end});
    }
    return out;
  }

  private static String ranges(List<int[]> clusters) {
    StringBuilder b = new StringBuilder().append(clusters.size()).append(" [");
    for (int[] c : clusters) {
      b.append(c[0]).append('-').append(c[1]).append(' ');
    }
    return b.append(']').toString();
  }

  private static int distance(int r, int g, int b, int[] rgb) {
    return Math.abs(r - rgb[0]) + Math.abs(g - rgb[1]) + Math.abs(b - rgb[2]);
  }

  private static int blend(int channel) {
    return (int) Math.round(255 - SvgCharts.BAND_OPACITY * (255 - channel));
  }

  private static int[] rgb(String hex) {
    int v = Integer.parseInt(hex.substring(1), 16);
    return new int[] {(v >> 16) & 0xff, (v >> 8) & 0xff, v & 0xff};
  }
}
