package org.lagmill.eval;

/**
 * The additive parts of each aggregate's RMSSE and SPL scales for one level: from the aggregate's first non-zero
 * period on, the sums of squared and of absolute one-step differences and their count. Fed period by period in order
 * ({@link #add}); or, for an aggregate whose series all lie in one shard, taken whole from that shard's scoring part
 * ({@link #set}). Not thread-safe.
 */
final class ScaleSums {
  private final double[] previous;
  private final boolean[] started;
  private final double[] sumSquared;
  private final double[] sumAbsolute;
  private final int[] diffCounts;

  ScaleSums(int aggregateCount) {
    previous = new double[aggregateCount];
    started = new boolean[aggregateCount];
    sumSquared = new double[aggregateCount];
    sumAbsolute = new double[aggregateCount];
    diffCounts = new int[aggregateCount];
  }

  int aggregateCount() {
    return diffCounts.length;
  }

  /**
   * Adds the next {@code dayCount} periods of every aggregate.
   *
   * @param values aggregate-major, {@code values[g * stride + d]}
   */
  void add(double[] values, int stride, int dayCount) {
    for (int g = 0; g < diffCounts.length; g++) {
      int base = g * stride;
      for (int d = 0; d < dayCount; d++) {
        double y = values[base + d];
        if (started[g]) {
          double diff = y - previous[g];
          sumSquared[g] += diff * diff;
          sumAbsolute[g] += Math.abs(diff);
          diffCounts[g]++;
          previous[g] = y;
        } else if (y > 0) {
          started[g] = true;
          previous[g] = y;
        }
      }
    }
  }

  /** Sets one aggregate's finished sums (all its periods already added elsewhere). */
  void set(int aggregateIndex, double squared, double absolute, int diffCount) {
    sumSquared[aggregateIndex] = squared;
    sumAbsolute[aggregateIndex] = absolute;
    diffCounts[aggregateIndex] = diffCount;
  }

  double sumSquared(int aggregateIndex) {
    return sumSquared[aggregateIndex];
  }

  double sumAbsolute(int aggregateIndex) {
    return sumAbsolute[aggregateIndex];
  }

  int diffCount(int aggregateIndex) {
    return diffCounts[aggregateIndex];
  }

  /** Mean squared difference per aggregate, NaN where no difference was seen. */
  double[] squaredScales() {
    double[] result = new double[diffCounts.length];
    for (int g = 0; g < result.length; g++) {
      result[g] = diffCounts[g] == 0 ? Double.NaN : sumSquared[g] / diffCounts[g];
    }
    return result;
  }

  /** Mean absolute difference per aggregate, NaN where no difference was seen. */
  double[] absoluteScales() {
    double[] result = new double[diffCounts.length];
    for (int g = 0; g < result.length; g++) {
      result[g] = diffCounts[g] == 0 ? Double.NaN : sumAbsolute[g] / diffCounts[g];
    }
    return result;
  }
}
