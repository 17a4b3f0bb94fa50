package org.lagmill.report;

/**
 * A linear map from a data interval to a pixel interval, with the "nice" tick values (1, 2 or 5 times a power of ten)
 * that axis labels use. Immutable.
 */
public final class AxisScale {
  private final double domainMin;
  private final double domainMax;
  private final double pixelStart;
  private final double pixelEnd;

  /**
   * Maps {@code domainMin} to {@code pixelStart} and {@code domainMax} to {@code pixelEnd}; {@code pixelEnd} may be
   * smaller than {@code pixelStart} (a y axis, which grows downwards in SVG).
   */
  public AxisScale(double domainMin, double domainMax, double pixelStart, double pixelEnd) {
    if (!(domainMax > domainMin) || !Double.isFinite(domainMin) || !Double.isFinite(domainMax)) {
      throw new IllegalArgumentException("axis domain [" + domainMin + ", " + domainMax
          + "] must be finite with max > min; widen a single-valued domain before scaling");
    }
    this.domainMin = domainMin;
    this.domainMax = domainMax;
    this.pixelStart = pixelStart;
    this.pixelEnd = pixelEnd;
  }

  /** The pixel of {@code value}; values outside the domain map outside the pixel interval. */
  public double toPixel(double value) {
    return pixelStart + (value - domainMin) / (domainMax - domainMin) * (pixelEnd - pixelStart);
  }

  public double domainMin() {
    return domainMin;
  }

  public double domainMax() {
    return domainMax;
  }

  /**
   * Evenly spaced round tick values covering [min, max]: the step is 1, 2 or 5 times a power of ten chosen so about
   * {@code targetCount} ticks result; the first tick is at or below {@code min}, the last at or above {@code max}.
   * A single-valued interval is widened first.
   *
   * @param targetCount wished-for number of ticks, at least 2
   */
  public static double[] niceTicks(double min, double max, int targetCount) {
    if (!Double.isFinite(min) || !Double.isFinite(max) || min > max) {
      throw new IllegalArgumentException("tick interval [" + min + ", " + max + "] must be finite with min <= max");
    }
    if (targetCount < 2) {
      throw new IllegalArgumentException("targetCount must be >= 2, got " + targetCount);
    }
    if (min == max) {
      // an all-zero series (common for a slow item) reads best on [0, 1]
      double pad = min == 0 ? 0 : Math.abs(min) * 0.5;
      min -= pad;
      max += min == 0 && max == 0 ? 1 : pad;
    }
    double step = niceStep((max - min) / (targetCount - 1));
    // the quotient may land a hair off a whole number (0.3 / 0.1 = 2.9999999999999996): settle on the tick values
    long first = (long) Math.floor(min / step);
    if (roundToStep((first + 1) * step, step) <= min) {
      first++;
    } else if (roundToStep(first * step, step) > min) {
      first--;
    }
    long last = (long) Math.ceil(max / step);
    if (roundToStep((last - 1) * step, step) >= max) {
      last--;
    } else if (roundToStep(last * step, step) < max) {
      last++;
    }
    double[] ticks = new double[(int) (last - first + 1)];
    for (int i = 0; i < ticks.length; i++) {
      // multiplying the integer index avoids drift from repeated addition of a step such as 0.1
      ticks[i] = roundToStep((first + i) * step, step);
    }
    return ticks;
  }

  /** The smallest value of the form 1, 2 or 5 times a power of ten that is at least {@code roughStep}. */
  public static double niceStep(double roughStep) {
    if (!(roughStep > 0) || !Double.isFinite(roughStep)) {
      throw new IllegalArgumentException("roughStep must be finite and > 0, got " + roughStep);
    }
    double power = Math.pow(10, Math.floor(Math.log10(roughStep)));
    for (double m : new double[] {1, 2, 5, 10}) {
      if (m * power >= roughStep * (1 - 1e-12)) {
        return m * power;
      }
    }
    return 10 * power;
  }

  private static double roundToStep(double value, double step) {
    int decimals = Math.max(0, (int) -Math.floor(Math.log10(step)) + 1);
    double rounded = Double.parseDouble(String.format(java.util.Locale.ROOT, "%." + decimals + "f", value));
    return rounded == 0 ? 0 : rounded;
  }
}
