package org.lagmill.eval;

import org.lagmill.store.Periods;
import org.lagmill.store.SalesHistory;

/**
 * Simple per-series forecasts that a model must beat. Every kernel reads days {@code firstUsableDay .. originDay-1} of
 * a unit array, skips unknown days (negative values, {@link org.lagmill.store.SalesHistory#UNKNOWN_UNITS}), starts at
 * the first day with a sale (pre-launch zeros are not demand), and forecasts 0 when nothing sold. Forecasts are never
 * negative. Rules and parameters: docs/metrics.md, section "Baselines".
 */
public enum BaselineKind {
  /** Last known value. */
  NAIVE,
  /**
   * Value of the same position in the latest season with a known value (the same weekday of a daily store, the same
   * week of the year of a weekly one); the naive value when there is none.
   */
  SEASONAL_NAIVE,
  /** Mean of the known periods among the last {@link BaselineKernels#MOVING_AVERAGE_DAYS} periods. */
  MOVING_AVERAGE,
  /** Simple exponential smoothing, alpha chosen per series from a small grid by in-sample one-step squared error. */
  SES,
  /** Croston's method, alpha {@link BaselineKernels#CROSTON_ALPHA} for sizes and intervals. */
  CROSTON,
  /** Croston with the Syntetos–Boylan bias correction (1 − alpha/2). */
  SBA,
  /**
   * Exponential smoothing with trend and season (ETS), the form (additive or multiplicative season, trend, damped
   * trend) chosen per series by AICc and fitted by maximum likelihood; see {@link EtsFitter}.
   */
  ETS;

  /**
   * As {@link #forecast(int[], int, int, int, int, double[], int)} for daily units (season length
   * {@code Periods.seasonLength(Periods.DAILY)}).
   */
  public void forecast(int[] units, int firstUsableDay, int originDay, int horizon, double[] dst, int dstOffset) {
    forecast(units, firstUsableDay, originDay, horizon, Periods.seasonLength(Periods.DAILY), dst, dstOffset);
  }

  /**
   * Writes {@code horizon} forecasts for periods {@code originDay ..} into {@code dst[dstOffset ..]}; allocates
   * nothing (except {@link #ETS}, which builds its fitter's scratch; {@link BaselineForecaster} reuses one per run).
   *
   * @param units units per period from index 0, at least {@code originDay} long; negative values are unknown
   * @param firstUsableDay first period the kernel may read, {@code 0 .. originDay}
   * @param seasonLength periods per season ({@link SalesHistory#seasonLength()}: 7 daily, 52 weekly); read by
   *     {@link #SEASONAL_NAIVE} and {@link #ETS}
   */
  public void forecast(int[] units, int firstUsableDay, int originDay, int horizon, int seasonLength, double[] dst,
      int dstOffset) {
    if (seasonLength < 1) {
      throw new IllegalArgumentException("seasonLength must be >= 1, got " + seasonLength);
    }
    if (firstUsableDay < 0 || firstUsableDay > originDay || originDay > units.length) {
      throw new IllegalArgumentException("need 0 <= firstUsableDay (" + firstUsableDay + ") <= originDay ("
          + originDay + ") <= units.length (" + units.length + ")");
    }
    if (horizon < 0 || dstOffset < 0 || dstOffset + horizon > dst.length) {
      throw new IllegalArgumentException("horizon " + horizon + " at offset " + dstOffset + " does not fit dst of "
          + dst.length);
    }
    switch (this) {
      case NAIVE -> BaselineKernels.naive(units, firstUsableDay, originDay, horizon, dst, dstOffset);
      case SEASONAL_NAIVE -> BaselineKernels.seasonalNaive(units, firstUsableDay, originDay, horizon, seasonLength, dst,
          dstOffset);
      case MOVING_AVERAGE -> BaselineKernels.movingAverage(units, firstUsableDay, originDay, horizon, dst, dstOffset);
      case SES -> BaselineKernels.ses(units, firstUsableDay, originDay, horizon, dst, dstOffset);
      case CROSTON -> BaselineKernels.croston(units, firstUsableDay, originDay, horizon, dst, dstOffset, false);
      case SBA -> BaselineKernels.croston(units, firstUsableDay, originDay, horizon, dst, dstOffset, true);
      case ETS -> new EtsFitter(seasonLength).forecastUnits(units, firstUsableDay, originDay, horizon,
          dst, dstOffset);
    }
  }

  /** As {@link #forecast(int[], int, int, int, double[], int)} into a new array. */
  public double[] forecast(int[] units, int firstUsableDay, int originDay, int horizon) {
    double[] result = new double[horizon];
    forecast(units, firstUsableDay, originDay, horizon, result, 0);
    return result;
  }
}
