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

  RollingKernel(int[] windowDays, int shiftDays, List<FeatureSpec.RollingStat> stats) {
    this.shiftDays = shiftDays;
    this.statCodes = new int[stats.size()];
    this.statNames = new String[stats.size()];
    boolean trackMin = false;
    boolean trackMax = false;
    for (int i = 0; i < stats.size(); i++) {
      statCodes[i] = stats.get(i).ordinal();
      statNames[i] = stats.get(i).configName();
      trackMin |= statCodes[i] == MIN;
      trackMax |= statCodes[i] == MAX;
    }
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

  @Override
  public void beginSeries(SeriesContext series) {
    for (Window window : windows) {
      window.started = false;
    }
  }

  @Override
  public void compute(SeriesContext series, float[] rows, int rowStride, int[] dayIndexes, int dayOffset,
      int rowCount, int firstFeatureIndex) {
    int statCount = statCodes.length;
    int[] readable = series.readableUnits;
    // windows move in the padded day coordinates of readableUnits, where every day a window covers is >= 0
    int endOffset = series.lookbackDays - shiftDays;
    for (int w = 0; w < windows.length; w++) {
      Window window = windows[w];
      int out = firstFeatureIndex + w * statCount;
      for (int i = 0; i < rowCount; i++) {
        window.moveTo(readable, dayIndexes[dayOffset + i] + endOffset);
        for (int k = 0; k < statCount; k++) {
          rows[out + k] = window.value(readable, statCodes[k]);
        }
        out += rowStride;
      }
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

  /** Running state of one window length. */
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
     * Slides the window to end on {@code newLastDayIndex}; days are indexes into {@code readable} (units, or −1 for a
     * day that is not readable).
     */
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
      if (u < 0) {
        return;
      }
      count++;
      sum += u;
      sumSquares += (long) u * u;
      if (u == 0) {
        zeroCount++;
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

    private void remove(int[] readable, int dayIndex) {
      int u = readable[dayIndex];
      if (u < 0) {
        return;
      }
      count--;
      sum -= u;
      sumSquares -= (long) u * u;
      if (u == 0) {
        zeroCount--;
      }
      if (trackMin && minTail > minHead && minDeque[minHead & mask] == dayIndex) {
        minHead++;
      }
      if (trackMax && maxTail > maxHead && maxDeque[maxHead & mask] == dayIndex) {
        maxHead++;
      }
    }

    float value(int[] readable, int statCode) {
      if (count == 0) {
        return Float.NaN;
      }
      switch (statCode) {
        case MEAN:
          return (float) ((double) sum / count);
        case STD: {
          if (count < 2) {
            return Float.NaN;
          }
          double s = sum;
          double variance = (sumSquares - s * s / count) / (count - 1);
          return (float) Math.sqrt(Math.max(0.0, variance));
        }
        case MIN:
          return readable[minDeque[minHead & mask]];
        case MAX:
          return readable[maxDeque[maxHead & mask]];
        case ZERO_SHARE:
          return (float) zeroCount / count;
        default:
          throw new AssertionError(statCode);
      }
    }
  }
}
