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
 * <p>Each window slides with the rows: a day entering or leaving updates a running count, sum and sum of squares
 * (exact in {@code long}) and monotonic deques of day indexes for min and max, so each row costs O(1) amortised.
 * A chunk of rows is done in two steps: the window slides over every row, keeping each row's count and sums in
 * scratch columns, then each statistic is computed over the whole column in a loop without branches the compiler can
 * vectorise (the divisions and square roots dominate). The formulas are the same double-precision expressions either
 * way, so the values are identical.
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
   * Running totals of the current series' readable units up to each padded day (entry {@code d} covers days before
   * {@code d}), as doubles: a window's total is then one subtraction, exact while every total stays below 2^53
   * ({@link #prefixExact}); a series past that slides its windows instead.
   */
  private double[] prefixCounts = new double[0];
  private double[] prefixSums = new double[0];
  private double[] prefixSquares = new double[0];
  private int[] prefixZeros = new int[0];
  private boolean prefixExact;

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
    prefixCounts = new double[paddedDayCount + 1];
    prefixSums = new double[paddedDayCount + 1];
    prefixSquares = new double[paddedDayCount + 1];
    prefixZeros = new int[trackZeros ? paddedDayCount + 1 : 0];
    return 28L * (paddedDayCount + 1) + 4L * prefixZeros.length;
  }

  @Override
  public void beginSeries(SeriesContext series) {
    for (Window window : windows) {
      window.started = false;
    }
    prefixExact = windows.length > 0 && accumulate(series.readableUnits);
  }

  /** Fills the prefix totals; false when a total reaches 2^53 (or the long sum of squares wraps). */
  private boolean accumulate(int[] readable) {
    long c = 0;
    long s = 0;
    long q = 0;
    long signs = 0;
    int z = 0;
    double[] pc = prefixCounts;
    double[] ps = prefixSums;
    double[] pq = prefixSquares;
    boolean zeros = trackZeros;
    int dayCount = Math.min(readable.length, pc.length - 1);
    for (int d = 0; d < dayCount; d++) {
      int u = readable[d];
      int valid = ~u >>> 31;
      int v = u & ~(u >> 31);
      c += valid;
      s += v;
      q += (long) v * v;
      signs |= q;
      pc[d + 1] = c;
      ps[d + 1] = s;
      pq[d + 1] = q;
      if (zeros) {
        z += valid & ((v - 1) >>> 31);
        prefixZeros[d + 1] = z;
      }
    }
    // terms are < 2^62, so a wrapped sum of squares passes through negative values first
    long exactLimit = 1L << 53;
    return signs >= 0 && q < exactLimit && s < exactLimit;
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
      if (window.trackMin || window.trackMax) {
        slideWithDeques(window, readable, dayIndexes, dayOffset, rowCount, endOffset);
      } else if (prefixExact) {
        windowTotals(window.lengthDays, dayIndexes, dayOffset, rowCount, endOffset + 1);
      } else {
        window.slideTotals(readable, dayIndexes, dayOffset, rowCount, endOffset, counts, sums, sumSquares,
            trackZeros ? zeroCounts : null);
      }
      for (int k = 0; k < statCount; k++) {
        writeStatistic(statCodes[k], rows, rowStride, firstFeatureIndex + w * statCount + k, rowCount);
      }
    }
  }

  /** Totals of each row's window from the prefix totals; {@code endOffset} maps a day to its window's padded end. */
  private void windowTotals(int lengthDays, int[] dayIndexes, int dayOffset, int rowCount, int endOffset) {
    double[] pc = prefixCounts;
    double[] ps = prefixSums;
    double[] pq = prefixSquares;
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

  private void slideWithDeques(Window window, int[] readable, int[] dayIndexes, int dayOffset, int rowCount,
      int endOffset) {
    for (int i = 0; i < rowCount; i++) {
      window.moveTo(readable, dayIndexes[dayOffset + i] + endOffset);
      counts[i] = window.count;
      sums[i] = window.sum;
      sumSquares[i] = window.sumSquares;
      if (trackZeros) {
        zeroCounts[i] = window.zeroCount;
      }
      if (window.trackMin && window.count > 0) {
        minUnits[i] = readable[window.minDeque[window.minHead & window.mask]];
      }
      if (window.trackMax && window.count > 0) {
        maxUnits[i] = readable[window.maxDeque[window.maxHead & window.mask]];
      }
    }
  }

  private void writeStatistic(int statCode, float[] rows, int rowStride, int out, int rowCount) {
    double[] n = counts;
    double[] values = statValues;
    switch (statCode) {
      case MEAN:
        for (int i = 0; i < rowCount; i++) {
          values[i] = sums[i] / n[i];
        }
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : (float) values[i];
        }
        break;
      case STD:
        for (int i = 0; i < rowCount; i++) {
          double s = sums[i];
          double variance = (sumSquares[i] - s * s / n[i]) / (n[i] - 1);
          values[i] = Math.sqrt(Math.max(0.0, variance));
        }
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] < 2 ? Float.NaN : (float) values[i];
        }
        break;
      case MIN:
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : minUnits[i];
        }
        break;
      case MAX:
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : maxUnits[i];
        }
        break;
      case ZERO_SHARE:
        for (int i = 0; i < rowCount; i++, out += rowStride) {
          rows[out] = n[i] == 0 ? Float.NaN : (float) zeroCounts[i] / (float) n[i];
        }
        break;
      default:
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
   * Running state of one window length over a series' readable units (units, or −1 for a day that is not readable),
   * by padded day index.
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
    int count;
    long sum;
    long sumSquares;
    int zeroCount;
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

    /**
     * {@link #moveTo} for each row of a chunk when no deque is kept, recording each row's totals; the running totals
     * stay in locals for the whole chunk. A day that is not readable (u = -1) adds 0 to every total, without a branch.
     *
     * @param zeroCountsOut null when zero days are not counted
     */
    void slideTotals(int[] readable, int[] dayIndexes, int dayOffset, int rowCount, int endOffset,
        double[] countsOut, double[] sumsOut, double[] sumSquaresOut, int[] zeroCountsOut) {
      int first = firstDayIndex;
      int last = lastDayIndex;
      int c = count;
      long s = sum;
      long q = sumSquares;
      int z = zeroCount;
      boolean moved = started;
      for (int i = 0; i < rowCount; i++) {
        int newLast = dayIndexes[dayOffset + i] + endOffset;
        int newFirst = newLast - lengthDays + 1;
        if (newLast == last + 1 && moved) {
          // the common step, one day on: one day leaves, one enters, with no loop to set up
          int out = readable[first];
          int in = readable[newLast];
          int validOut = ~out >>> 31;
          int validIn = ~in >>> 31;
          int vOut = out & ~(out >> 31);
          int vIn = in & ~(in >> 31);
          c += validIn - validOut;
          s += vIn - vOut;
          q += (long) vIn * vIn - (long) vOut * vOut;
          z += (validIn & ((vIn - 1) >>> 31)) - (validOut & ((vOut - 1) >>> 31));
          first = newFirst;
          last = newLast;
          countsOut[i] = c;
          sumsOut[i] = s;
          sumSquaresOut[i] = q;
          if (zeroCountsOut != null) {
            zeroCountsOut[i] = z;
          }
          continue;
        }
        int addFrom = last + 1;
        if (!moved || newFirst > last || newLast < last) {
          c = 0;
          s = 0;
          q = 0;
          z = 0;
          addFrom = newFirst;
          moved = true;
        } else {
          for (int d = first; d < newFirst; d++) {
            int u = readable[d];
            int valid = ~u >>> 31;
            int v = u & ~(u >> 31);
            c -= valid;
            s -= v;
            q -= (long) v * v;
            z -= valid & ((v - 1) >>> 31);
          }
        }
        for (int d = addFrom; d <= newLast; d++) {
          int u = readable[d];
          int valid = ~u >>> 31;
          int v = u & ~(u >> 31);
          c += valid;
          s += v;
          q += (long) v * v;
          z += valid & ((v - 1) >>> 31);
        }
        first = newFirst;
        last = newLast;
        countsOut[i] = c;
        sumsOut[i] = s;
        sumSquaresOut[i] = q;
        if (zeroCountsOut != null) {
          zeroCountsOut[i] = z;
        }
      }
      firstDayIndex = first;
      lastDayIndex = last;
      count = c;
      sum = s;
      sumSquares = q;
      zeroCount = z;
      started = moved;
    }

    void moveTo(int[] readable, int newLastDayIndex) {
      int newFirstDayIndex = newLastDayIndex - lengthDays + 1;
      if (!started || newFirstDayIndex > lastDayIndex || newLastDayIndex < lastDayIndex) {
        count = 0;
        sum = 0;
        sumSquares = 0;
        zeroCount = 0;
        minHead = minTail = maxHead = maxTail = 0;
        for (int d = newFirstDayIndex; d <= newLastDayIndex; d++) {
          add(readable, d);
        }
      } else {
        for (int d = firstDayIndex; d < newFirstDayIndex; d++) {
          remove(readable, d);
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
      // without branches: a day that is not readable (u = -1) adds 0 to every running total
      int valid = ~u >>> 31;
      int v = u & ~(u >> 31);
      count += valid;
      sum += v;
      sumSquares += (long) v * v;
      zeroCount += valid & ((v - 1) >>> 31);
      if (trackMin && valid != 0) {
        while (minTail > minHead && readable[minDeque[(minTail - 1) & mask]] >= u) {
          minTail--;
        }
        minDeque[minTail++ & mask] = dayIndex;
      }
      if (trackMax && valid != 0) {
        while (maxTail > maxHead && readable[maxDeque[(maxTail - 1) & mask]] <= u) {
          maxTail--;
        }
        maxDeque[maxTail++ & mask] = dayIndex;
      }
    }

    private void remove(int[] readable, int dayIndex) {
      int u = readable[dayIndex];
      int valid = ~u >>> 31;
      int v = u & ~(u >> 31);
      count -= valid;
      sum -= v;
      sumSquares -= (long) v * v;
      zeroCount -= valid & ((v - 1) >>> 31);
      if (trackMin && minTail > minHead && minDeque[minHead & mask] == dayIndex) {
        minHead++;
      }
      if (trackMax && maxTail > maxHead && maxDeque[maxHead & mask] == dayIndex) {
        maxHead++;
      }
    }
  }
}
