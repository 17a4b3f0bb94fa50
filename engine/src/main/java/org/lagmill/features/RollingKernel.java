package org.lagmill.features;

import java.util.List;

/**
 * Rolling statistics of units over windows of {@code w} days ending {@code shift} days before the row's day:
 * days {@code [day - shift - w + 1, day - shift]}, named {@code roll_<stat>_<w>_shift_<shift>}.
 *
 * <p>A statistic covers only the readable days of its window (known, on or after the first sale, before the end of
 * the history); unknown and pre-launch days are left out rather than read as zero. With no readable day every
 * statistic is NaN; the standard deviation is the sample one (divisor n − 1) and NaN with fewer than two days.
 *
 * <p>Window totals (readable days, sum, sum of squares, zero days) come from one algorithm: running totals of the
 * series up to each day, computed once per series, so a window's total is one subtraction per row, O(1) for any
 * window length and without branches the compiler can vectorise. The totals are {@code long}s: a difference of two
 * running totals is exact whenever the window's own total fits in a long, even after the running total has wrapped
 * around (two's-complement arithmetic is exact modulo 2^64), so the sum of squares is exact while a window of w days
 * sells under sqrt(2^63 / w) units a day (159 million a day for a 364-day window). Min and max are not sums: a
 * window that asks for them also slides monotonic deques of day indexes (O(1) amortised per row). Each statistic is
 * then computed over the chunk's column in a loop the compiler can vectorise (the divisions and square roots
 * dominate).
 */
final class RollingKernel implements FeatureKernel {
  private static final int MEAN = 0;
  private static final int STD = 1;
  private static final int MIN = 2;
  private static final int MAX = 3;
  private static final int ZERO_SHARE = 4;

  private final int shiftDays;
  private final int[] statCodes;
  private final String[] statNames;
  private final Window[] windows;
  private final boolean trackZeros;
  /** Per row of a chunk, as doubles so the statistic loops need no conversion: readable days, sum, sum of squares. */
  private final double[] counts = new double[FeaturePass.STRIP_ROWS];
  private final double[] sums = new double[FeaturePass.STRIP_ROWS];
  private final double[] sumSquares = new double[FeaturePass.STRIP_ROWS];
  private final double[] statValues = new double[FeaturePass.STRIP_ROWS];
  private final int[] zeroCounts;
  private final int[] minUnits;
  private final int[] maxUnits;
  /**
   * Running totals of the current series' readable days, units, squared units and zero days up to each padded day
   * (entry {@code d} covers days before {@code d}).
   */
  private int[] prefixCounts = new int[0];
  private long[] prefixSums = new long[0];
  private long[] prefixSquares = new long[0];
  private int[] prefixZeros = new int[0];

  RollingKernel(int[] windowDays, int shiftDays, List<FeatureSpec.RollingStat> stats) {
    this.shiftDays = shiftDays;
    this.statCodes = new int[stats.size()];
    this.statNames = new String[stats.size()];
    boolean trackMin = false;
    boolean trackMax = false;
    boolean trackZeros = false;
    for (int i = 0; i < stats.size(); i++) {
      statCodes[i] = stats.get(i).ordinal();
      statNames[i] = stats.get(i).configName();
      trackMin |= statCodes[i] == MIN;
      trackMax |= statCodes[i] == MAX;
      trackZeros |= statCodes[i] == ZERO_SHARE;
    }
    this.trackZeros = trackZeros;
    this.zeroCounts = new int[trackZeros ? FeaturePass.STRIP_ROWS : 0];
    this.minUnits = new int[trackMin ? FeaturePass.STRIP_ROWS : 0];
    this.maxUnits = new int[trackMax ? FeaturePass.STRIP_ROWS : 0];
    this.windows = new Window[windowDays.length];
    for (int w = 0; w < windowDays.length; w++) {
      windows[w] = new Window(windowDays[w], trackMin, trackMax);
    }
  }

  @Override
  public int featureCount() {
    return windows.length * statCodes.length;
  }

  @Override
  public void describe(List<String> names, List<Boolean> categorical) {
    for (Window window : windows) {
      for (String stat : statNames) {
        names.add("roll_" + stat + "_" + window.lengthDays + "_shift_" + shiftDays);
        categorical.add(false);
      }
    }
  }

  /** Sizes the per-series prefix totals for the pass's padded day count; returns their heap bytes. */
  long allocate(int paddedDayCount) {
    if (windows.length == 0) {
      return 0;
    }
    prefixCounts = new int[paddedDayCount + 1];
    prefixSums = new long[paddedDayCount + 1];
    prefixSquares = new long[paddedDayCount + 1];
    prefixZeros = new int[trackZeros ? paddedDayCount + 1 : 0];
    return 20L * (paddedDayCount + 1) + 4L * prefixZeros.length;
  }

  @Override
  public void beginSeries(SeriesContext series) {
    for (Window window : windows) {
      window.started = false;
    }
    if (windows.length > 0) {
      accumulate(series.readableUnits);
    }
  }

  /** Fills the running totals; a day that is not readable (u = -1) adds 0 to every total, without a branch. */
  private void accumulate(int[] readable) {
    int c = 0;
    long s = 0;
    long q = 0;
    int z = 0;
    int[] pc = prefixCounts;
    long[] ps = prefixSums;
    long[] pq = prefixSquares;
    boolean zeros = trackZeros;
    int dayCount = Math.min(readable.length, pc.length - 1);
    for (int d = 0; d < dayCount; d++) {
      int u = readable[d];
      int valid = ~u >>> 31;
      int v = u & ~(u >> 31);
      c += valid;
      s += v;
      q += (long) v * v;
      pc[d + 1] = c;
      ps[d + 1] = s;
      pq[d + 1] = q;
      if (zeros) {
        z += valid & ((v - 1) >>> 31);
        prefixZeros[d + 1] = z;
      }
    }
  }

  @Override
  public void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    assert rowCount <= FeaturePass.STRIP_ROWS : rowCount;
    int statCount = statCodes.length;
    int[] readable = series.readableUnits;
    // windows move in the padded day coordinates of readableUnits, where every day a window covers is >= 0
    int endOffset = series.lookbackDays - shiftDays;
    for (int w = 0; w < windows.length; w++) {
      Window window = windows[w];
      windowTotals(window.lengthDays, dayIndexes, dayOffset, rowCount, endOffset + 1);
      if (window.trackMin || window.trackMax) {
        slideExtremes(window, readable, dayIndexes, dayOffset, rowCount, endOffset);
      }
      for (int k = 0; k < statCount; k++) {
        writeStatistic(statCodes[k], rows, rowStride, firstFeatureIndex + w * statCount + k, rowCount);
      }
    }
  }

  /** Totals of each row's window from the prefix totals; {@code endOffset} maps a day to its window's padded end. */
  private void windowTotals(int lengthDays, int[] dayIndexes, int dayOffset, int rowCount, int endOffset) {
    int[] pc = prefixCounts;
    long[] ps = prefixSums;
    long[] pq = prefixSquares;
    int firstEnd = dayIndexes[dayOffset] + endOffset;
    if (dayIndexes[dayOffset + rowCount - 1] + endOffset - firstEnd == rowCount - 1) {
      // consecutive days (ascending and distinct): contiguous reads the compiler can vectorise
      int firstStart = firstEnd - lengthDays;
      for (int i = 0; i < rowCount; i++) {
        counts[i] = pc[firstEnd + i] - pc[firstStart + i];
        sums[i] = ps[firstEnd + i] - ps[firstStart + i];
        sumSquares[i] = pq[firstEnd + i] - pq[firstStart + i];
      }
      if (trackZeros) {
        for (int i = 0; i < rowCount; i++) {
          zeroCounts[i] = prefixZeros[firstEnd + i] - prefixZeros[firstStart + i];
        }
      }
      return;
    }
    for (int i = 0; i < rowCount; i++) {
      int end = dayIndexes[dayOffset + i] + endOffset;
      int start = end - lengthDays;
      counts[i] = pc[end] - pc[start];
      sums[i] = ps[end] - ps[start];
      sumSquares[i] = pq[end] - pq[start];
      if (trackZeros) {
        zeroCounts[i] = prefixZeros[end] - prefixZeros[start];
      }
    }
  }

  /** Each row's window minimum and maximum from the deques; rows whose window has no readable day keep stale values
   * that the statistics never read (they are NaN for a count of 0). */
  private void slideExtremes(Window window, int[] readable, int[] dayIndexes, int dayOffset, int rowCount,
      int endOffset) {
    for (int i = 0; i < rowCount; i++) {
      window.moveTo(readable, dayIndexes[dayOffset + i] + endOffset);
      if (counts[i] > 0) {
        if (window.trackMin) {
          minUnits[i] = readable[window.minDeque[window.minHead & window.mask]];
        }
        if (window.trackMax) {
          maxUnits[i] = readable[window.maxDeque[window.maxHead & window.mask]];
        }
      }
    }
  }

  private void writeStatistic(int statCode, float[] rows, int rowStride, int out, int rowCount) {
    double[] n = counts;
    double[] values = statValues;
    switch (statCode) {
      case MEAN :
        for (int i = 0; i < rowCount; i++) {
          values[i] = sums[i] / n[i];
        }
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : (float) values[i];
        }
        break;
      case STD :
        for (int i = 0; i < rowCount; i++) {
          double s = sums[i];
          double variance = (sumSquares[i] - s * s / n[i]) / (n[i] - 1);
          values[i] = Math.sqrt(Math.max(0.0, variance));
        }
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] < 2 ? Float.NaN : (float) values[i];
        }
        break;
      case MIN :
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : minUnits[i];
        }
        break;
      case MAX :
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : maxUnits[i];
        }
        break;
      case ZERO_SHARE :
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : (float) zeroCounts[i] / (float) n[i];
        }
        break;
      default :
        throw new AssertionError(statCode);
    }
  }

  /** The farthest day before a row's day this kernel reads: the first day of the longest window. */
  int lookbackDays() {
    int longest = 0;
    for (Window window : windows) {
      longest = Math.max(longest, shiftDays + window.lengthDays - 1);
    }
    return longest;
  }

  /**
   * Monotonic deques of one window length over a series' readable units (units, or −1 for a day that is not
   * readable), by padded day index: the front of {@code minDeque} is the day of the window's minimum, of
   * {@code maxDeque} its maximum.
   */
  private static final class Window {
    final int lengthDays;
    final boolean trackMin;
    final boolean trackMax;
    final int[] minDeque;
    final int[] maxDeque;
    final int mask;
    boolean started;
    int firstDayIndex;
    int lastDayIndex;
    int minHead;
    int minTail;
    int maxHead;
    int maxTail;

    Window(int lengthDays, boolean trackMin, boolean trackMax) {
      this.lengthDays = lengthDays;
      this.trackMin = trackMin;
      this.trackMax = trackMax;
      // a ring of a power of two >= lengthDays holds every day a window can contain
      int capacity = Integer.highestOneBit(Math.max(1, lengthDays - 1)) << 1;
      this.mask = capacity - 1;
      this.minDeque = new int[trackMin ? capacity : 0];
      this.maxDeque = new int[trackMax ? capacity : 0];
    }

    void moveTo(int[] readable, int newLastDayIndex) {
      int newFirstDayIndex = newLastDayIndex - lengthDays + 1;
      if (!started || newFirstDayIndex > lastDayIndex || newLastDayIndex < lastDayIndex) {
        minHead = minTail = maxHead = maxTail = 0;
        for (int d = newFirstDayIndex; d <= newLastDayIndex; d++) {
          add(readable, d);
        }
      } else {
        for (int d = firstDayIndex; d < newFirstDayIndex; d++) {
          remove(d);
        }
        for (int d = lastDayIndex + 1; d <= newLastDayIndex; d++) {
          add(readable, d);
        }
      }
      firstDayIndex = newFirstDayIndex;
      lastDayIndex = newLastDayIndex;
      started = true;
    }

    private void add(int[] readable, int dayIndex) {
      int u = readable[dayIndex];
      if (u < 0) {
        return;
      }
      if (trackMin) {
        while (minTail > minHead && readable[minDeque[(minTail - 1) & mask]] >= u) {
          minTail--;
        }
        minDeque[minTail++ & mask] = dayIndex;
      }
      if (trackMax) {
        while (maxTail > maxHead && readable[maxDeque[(maxTail - 1) & mask]] <= u) {
          maxTail--;
        }
        maxDeque[maxTail++ & mask] = dayIndex;
      }
    }

    private void remove(int dayIndex) {
      if (trackMin && minTail > minHead && minDeque[minHead & mask] == dayIndex) {
        minHead++;
      }
      if (trackMax && maxTail > maxHead && maxDeque[maxHead & mask] == dayIndex) {
        maxHead++;
      }
    }
  }
}
