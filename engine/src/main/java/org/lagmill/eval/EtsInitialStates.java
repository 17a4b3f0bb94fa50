package org.lagmill.eval;

/**
 * The heuristic start states of an exponential smoothing model (Hyndman, Koehler, Ord and Snyder, <i>Forecasting with
 * Exponential Smoothing</i>, 2008, section 2.6.1), computed exactly as statsmodels 0.13's {@code
 * _initialization_heuristic} does so that our fits can be checked against that library (testdata/ets):
 *
 * <ol>
 *   <li>seasonal forms: over the first {@code k = max(min(5, n / m), ceil((10 + 2⌊m/2⌋) / m))} seasons, a centred
 *       moving average of length {@code m} (a 2×m average when {@code m} is even) is the trend; each season position's
 *       start state is the mean of the detrended values at that position (value − trend, or value / trend), shifted
 *       to mean 0 (or scaled to mean 1);</li>
 *   <li>level and trend: a least-squares line through the first 10 values (of the moving average for seasonal forms,
 *       of the data otherwise) against 1..10; the start level is its value at 0 and the start trend its slope.</li>
 * </ol>
 * Unknown values (NaN) inside that span count as {@code fillValue} (the caller passes the window's mean). Scratch
 * arrays grow to the longest span seen and are reused; not thread-safe.
 */
final class EtsInitialStates {
  /** Values the level and trend regression reads (statsmodels' rule). */
  static final int REGRESSION_VALUES = 10;

  private final int seasonLength;
  private final double[] season;
  private final int[] seasonCounts;
  private double[] span = new double[0];
  private double[] movingAverage = new double[0];
  private double level;
  private double trend;

  EtsInitialStates(int seasonLength) {
    this.seasonLength = seasonLength;
    this.season = new double[seasonLength];
    this.seasonCounts = new int[seasonLength];
  }

  /** Values a seasonal form needs: two whole seasons and 10 values of the centred moving average. */
  static int minimumSeasonalValues(int seasonLength) {
    return Math.max(2 * seasonLength, REGRESSION_VALUES + 2 * (seasonLength / 2));
  }

  /**
   * Computes the start states of a form from {@code values[0 .. valueCount)}.
   *
   * @return false when the values cannot give the states: too few values, or a multiplicative season whose moving
   *     average or seasonal factors are not positive
   */
  boolean compute(double[] values, int valueCount, double fillValue, EtsForm.Season seasonKind) {
    if (valueCount < REGRESSION_VALUES) {
      return false;
    }
    if (seasonKind == EtsForm.Season.NONE) {
      fitLine(copySpan(values, Math.min(valueCount, REGRESSION_VALUES), fillValue), 0);
      return true;
    }
    int m = seasonLength;
    if (valueCount < minimumSeasonalValues(m)) {
      return false;
    }
    int minimumValues = REGRESSION_VALUES + 2 * (m / 2);
    int cycles = Math.max(Math.min(5, valueCount / m), (minimumValues + m - 1) / m);
    int spanLength = Math.min(valueCount, cycles * m);
    double[] x = copySpan(values, spanLength, fillValue);
    if (movingAverage.length < spanLength) {
      movingAverage = new double[spanLength];
    }
    int half = m / 2;
    int firstCentre = half;
    int lastCentre = spanLength - 1 - half;
    for (int t = firstCentre; t <= lastCentre; t++) {
      if (m % 2 != 0) {
        movingAverage[t] = windowMean(x, t - half, m);
      } else {
        // pandas' centred even window at t covers t−m/2 .. t+m/2−1; the 2×m average is its mean with the next one.
        movingAverage[t] = (windowMean(x, t - half, m) + windowMean(x, t - half + 1, m)) / 2;
      }
    }
    boolean multiplicative = seasonKind == EtsForm.Season.MULTIPLICATIVE;
    java.util.Arrays.fill(season, 0);
    java.util.Arrays.fill(seasonCounts, 0);
    for (int t = firstCentre; t <= lastCentre; t++) {
      if (multiplicative && !(movingAverage[t] > 0)) {
        return false;
      }
      season[t % m] += multiplicative ? x[t] / movingAverage[t] : x[t] - movingAverage[t];
      seasonCounts[t % m]++;
    }
    double mean = 0;
    for (int j = 0; j < m; j++) {
      season[j] /= seasonCounts[j];
      mean += season[j] / m;
    }
    for (int j = 0; j < m; j++) {
      if (multiplicative) {
        season[j] /= mean;
        if (!(season[j] > 0)) {
          return false;
        }
      } else {
        season[j] -= mean;
      }
    }
    fitLine(movingAverage, firstCentre);
    return true;
  }

  /** Start level (the state before the first value). */
  double level() {
    return level;
  }

  /** Start trend, per period. */
  double trend() {
    return trend;
  }

  /** Start season state of position {@code j} (the first value's position is 0). */
  double season(int j) {
    return season[j];
  }

  private double[] copySpan(double[] values, int length, double fillValue) {
    if (span.length < length) {
      span = new double[length];
    }
    for (int t = 0; t < length; t++) {
      span[t] = Double.isNaN(values[t]) ? fillValue : values[t];
    }
    return span;
  }

  private static double windowMean(double[] x, int from, int length) {
    double sum = 0;
    for (int t = from; t < from + length; t++) {
      sum += x[t];
    }
    return sum / length;
  }

  /** Least squares of {@code y[from .. from+10)} on 1..10: level = intercept, trend = slope. */
  private void fitLine(double[] y, int from) {
    double meanX = (REGRESSION_VALUES + 1) / 2.0;
    double meanY = 0;
    for (int i = 0; i < REGRESSION_VALUES; i++) {
      meanY += y[from + i] / REGRESSION_VALUES;
    }
    double sxy = 0;
    double sxx = 0;
    for (int i = 0; i < REGRESSION_VALUES; i++) {
      double dx = (i + 1) - meanX;
      sxy += dx * (y[from + i] - meanY);
      sxx += dx * dx;
    }
    trend = sxy / sxx;
    level = meanY - trend * meanX;
  }
}
