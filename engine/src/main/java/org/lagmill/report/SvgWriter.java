package org.lagmill.report;

import java.util.Locale;

/**
 * Appends SVG elements to a string, escaping every text and attribute value and writing coordinates with at most one
 * decimal so the output is small and byte-for-byte deterministic. Not thread-safe; one writer per chart.
 */
final class SvgWriter {
  static final String NAMESPACE = "http://www.w3.org/2000/svg";
  static final String FONT_FAMILY = "'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif";

  private final StringBuilder out = new StringBuilder(4096);

  SvgWriter open(int widthPx, int heightPx, String cssClass, String accessibleTitle) {
    out.append("<svg xmlns=\"").append(NAMESPACE).append("\" class=\"").append(ReportFormat.escape(cssClass))
        .append("\" width=\"").append(widthPx).append("\" height=\"").append(heightPx)
        .append("\" viewBox=\"0 0 ").append(widthPx).append(' ').append(heightPx)
        .append("\" role=\"img\" aria-label=\"").append(ReportFormat.escape(accessibleTitle))
        .append("\" font-family=\"").append(ReportFormat.escape(FONT_FAMILY)).append("\" font-size=\"12\">");
    out.append("<title>").append(ReportFormat.escape(accessibleTitle)).append("</title>");
    return this;
  }

  String close() {
    out.append("</svg>");
    return out.toString();
  }

  SvgWriter line(double x1, double y1, double x2, double y2, String cssClass, String stroke, double strokeWidth,
      String dashArray) {
    out.append("<line class=\"").append(cssClass).append("\" x1=\"").append(num(x1)).append("\" y1=\"")
        .append(num(y1)).append("\" x2=\"").append(num(x2)).append("\" y2=\"").append(num(y2))
        .append("\" stroke=\"").append(stroke).append("\" stroke-width=\"").append(num(strokeWidth)).append('"');
    dash(dashArray);
    out.append("/>");
    return this;
  }

  /** A polyline through the given points; xs and ys hold at least {@code count} values from {@code start}. */
  SvgWriter polyline(double[] xs, double[] ys, int start, int count, String cssClass, String stroke,
      double strokeWidth, String dashArray) {
    out.append("<polyline class=\"").append(cssClass).append("\" fill=\"none\" stroke=\"").append(stroke)
        .append("\" stroke-width=\"").append(num(strokeWidth))
        .append("\" stroke-linejoin=\"round\" stroke-linecap=\"round\"");
    dash(dashArray);
    out.append(" points=\"");
    points(xs, ys, start, count);
    out.append("\"/>");
    return this;
  }

  /** A closed polygon; the caller orders the points around the outline. */
  SvgWriter polygon(double[] xs, double[] ys, int count, String cssClass, String fill, double fillOpacity) {
    out.append("<polygon class=\"").append(cssClass).append("\" fill=\"").append(fill).append("\" fill-opacity=\"")
        .append(num2(fillOpacity)).append("\" stroke=\"none\" points=\"");
    points(xs, ys, 0, count);
    out.append("\"/>");
    return this;
  }

  SvgWriter rect(double x, double y, double width, double height, String cssClass, String fill) {
    out.append("<rect class=\"").append(cssClass).append("\" x=\"").append(num(x)).append("\" y=\"").append(num(y))
        .append("\" width=\"").append(num(Math.max(0, width))).append("\" height=\"")
        .append(num(Math.max(0, height))).append("\" fill=\"").append(fill).append("\"/>");
    return this;
  }

  SvgWriter circle(double cx, double cy, double radius, String cssClass, String fill) {
    out.append("<circle class=\"").append(cssClass).append("\" cx=\"").append(num(cx)).append("\" cy=\"")
        .append(num(cy)).append("\" r=\"").append(num(radius)).append("\" fill=\"").append(fill).append("\"/>");
    return this;
  }

  /**
   * A text label.
   *
   * @param anchor "start", "middle" or "end"
   * @param rotateDegrees rotation about the anchor point, 0 for none
   */
  SvgWriter text(double x, double y, String text, String anchor, String cssClass, String fill, int fontSizePx,
      double rotateDegrees) {
    out.append("<text class=\"").append(cssClass).append("\" x=\"").append(num(x)).append("\" y=\"").append(num(y))
        .append("\" text-anchor=\"").append(anchor).append("\" fill=\"").append(fill).append('"');
    if (fontSizePx != 12) {
      out.append(" font-size=\"").append(fontSizePx).append('"');
    }
    if (rotateDegrees != 0) {
      out.append(" transform=\"rotate(").append(num(rotateDegrees)).append(' ').append(num(x)).append(' ')
          .append(num(y)).append(")\"");
    }
    out.append('>').append(ReportFormat.escape(text)).append("</text>");
    return this;
  }

  private void dash(String dashArray) {
    if (dashArray != null && !dashArray.isEmpty()) {
      out.append(" stroke-dasharray=\"").append(ReportFormat.escape(dashArray)).append('"');
    }
  }

  private void points(double[] xs, double[] ys, int start, int count) {
    for (int i = start; i < start + count; i++) {
      if (i > start) {
        out.append(' ');
      }
      out.append(num(xs[i])).append(',').append(num(ys[i]));
    }
  }

  /** A coordinate rounded to 0.1 px: finer than any screen or printer needs, and stable across platforms. */
  static String num(double value) {
    double rounded = Math.round(value * 10) / 10.0;
    if (rounded == Math.rint(rounded)) {
      return Long.toString((long) rounded);
    }
    return String.format(Locale.ROOT, "%.1f", rounded);
  }

  private static String num2(double value) {
    return String.format(Locale.ROOT, "%.2f", value);
  }

  /** Rough width of a label in pixels, for layout; assumes an average glyph of 0.6 em. */
  static double textWidthPx(String text, int fontSizePx) {
    return text == null ? 0 : text.length() * fontSizePx * 0.6;
  }
}
