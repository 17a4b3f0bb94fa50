package org.lagmill.eval;

import java.util.Arrays;

/** The arithmetic of each {@link BaselineKind}; arguments are checked by the caller. */
public final class BaselineKernels {
  /** Window of {@link BaselineKind#MOVING_AVERAGE}, in periods (days of a daily store, weeks of a weekly one). */
  public static final int MOVING_AVERAGE_DAYS = 28;
  /** Smoothing constant of Croston and SBA (a common choice for daily retail data; common practice, no source). */
  public static final double CROSTON_ALPHA = 0.1;
  /** Alphas {@link BaselineKind#SES} chooses from; ties go to the smaller alpha. */
  private static final double[] SES_ALPHAS = {0.05, 0.1, 0.2, 0.3, 0.5};

  private BaselineKernels() {}

  /** Alphas that {@link BaselineKind#SES} chooses from; a copy. */
  public static double[] sesAlphaGrid() {
    return SES_ALPHAS.clone();
  }

  /** First day in {@code [from, to)} with a sale, or -1. */
  static int firstSale(int[] units, int from, int to) {
    for (int d = from; d < to; d++) {
      if (units[d] > 0) {
        return d;
      }
    }
    return -1;
  }

  static void naive(int[] units, int from, int origin, int horizon, double[] dst, int offset) {
    Arrays.fill(dst, offset, offset + horizon, lastKnown(units, from, origin));
  }

  private static double lastKnown(int[] units, int from, int origin) {
    int start = firstSale(units, from, origin);
    if (start < 0) {
      return 0;
    }
    for (int d = origin - 1; d >= start; d--) {
      if (units[d] >= 0) {
        return units[d];
      }
    }
    return 0;
  }

  /** @param seasonLength periods per season, {@link org.lagmill.store.Periods#seasonLength}: 7 daily, 52 weekly */
  static void seasonalNaive(int[] units, int from, int origin, int horizon, int seasonLength, double[] dst,
      int offset) {
    int start = firstSale(units, from, origin);
    if (start < 0) {
      Arrays.fill(dst, offset, offset + horizon, 0.0);
      return;
    }
    double fallback = lastKnown(units, from, origin);
    for (int k = 0; k < horizon; k++) {
      // The latest period before the origin in the same season position as origin + k (same weekday when daily).
      int day = origin + k - seasonLength * ((k / seasonLength) + 1);
      while (day >= start && units[day] < 0) {
        day -= seasonLength;
      }
      dst[offset + k] = day >= start ? units[day] : fallback;
    }
  }

  static void movingAverage(int[] units, int from, int origin, int horizon, double[] dst, int offset) {
    int start = firstSale(units, from, origin);
    double mean = 0;
    if (start >= 0) {
      long sum = 0;
      int known = 0;
      for (int d = Math.max(start, origin - MOVING_AVERAGE_DAYS); d < origin; d++) {
        if (units[d] >= 0) {
          sum += units[d];
          known++;
        }
      }
      mean = known == 0 ? 0 : (double) sum / known;
    }
    Arrays.fill(dst, offset, offset + horizon, mean);
  }

  static void ses(int[] units, int from, int origin, int horizon, double[] dst, int offset) {
    int start = firstSale(units, from, origin);
    double bestLevel = 0;
    if (start >= 0) {
      double bestError = Double.POSITIVE_INFINITY;
      for (double alpha : SES_ALPHAS) {
        double level = units[start];
        double squaredError = 0;
        for (int d = start + 1; d < origin; d++) {
          if (units[d] < 0) {
            continue;
          }
          double error = units[d] - level;
          squaredError += error * error;
          level += alpha * error;
        }
        if (squaredError < bestError) {
          bestError = squaredError;
          bestLevel = level;
        }
      }
    }
    Arrays.fill(dst, offset, offset + horizon, Math.max(0, bestLevel));
  }

  static void croston(int[] units, int from, int origin, int horizon, double[] dst, int offset, boolean biasCorrected) {
    int start = firstSale(units, from, origin);
    double forecast = 0;
    if (start >= 0) {
      double size = units[start];
      // The first sale's interval is unknown (earlier days are pre-launch); 1 is a neutral start.
      double interval = 1;
      int daysSinceSale = 0;
      for (int d = start + 1; d < origin; d++) {
        if (units[d] < 0) {
          continue;
        }
        daysSinceSale++;
        if (units[d] > 0) {
          size += CROSTON_ALPHA * (units[d] - size);
          interval += CROSTON_ALPHA * (daysSinceSale - interval);
          daysSinceSale = 0;
        }
      }
      forecast = (biasCorrected ? 1 - CROSTON_ALPHA / 2 : 1) * size / interval;
    }
    Arrays.fill(dst, offset, offset + horizon, Math.max(0, forecast));
  }
}
