package org.lagmill.forecast;

import java.util.List;

/**
 * The one rule for combining several models' forecasts of the same series and periods, used by the backtest's scoring
 * of a combination and by the forecast of a combined model directory alike: per series and period the plain mean of
 * the members' point forecasts, and per series the mean of their negative binomial dispersions. The second is an
 * approximation: the spread of a mixture also holds the members' disagreement, which this leaves out, so the bands
 * are somewhat narrow where members disagree.
 */
public final class MemberAverage {
  private MemberAverage() {}

  /**
   * @param members each member's {@code [seriesIndex][periodOffset]} point forecasts, all of one shape; a NaN row (a
   *     series not forecast) stays NaN
   * @return a new array of the same shape
   */
  public static double[][] point(List<double[][]> members) {
    requireMembers(members.size());
    int seriesCount = members.get(0).length;
    double[][] mean = new double[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      int periodCount = members.get(0)[s].length;
      mean[s] = new double[periodCount];
      for (double[][] member : members) {
        if (member.length != seriesCount || member[s].length != periodCount) {
          throw new IllegalArgumentException("members forecast different shapes: " + seriesCount + " x "
              + periodCount + " against " + member.length + " x " + member[s].length);
        }
        for (int d = 0; d < periodCount; d++) {
          mean[s][d] += member[s][d];
        }
      }
      for (int d = 0; d < periodCount; d++) {
        mean[s][d] /= members.size();
      }
    }
    return mean;
  }

  /** @param members each member's dispersion per series, all of one length */
  public static float[] dispersion(List<float[]> members) {
    requireMembers(members.size());
    float[] mean = new float[members.get(0).length];
    for (float[] member : members) {
      if (member.length != mean.length) {
        throw new IllegalArgumentException("members hold " + mean.length + " and " + member.length + " series");
      }
      for (int s = 0; s < mean.length; s++) {
        mean[s] += member[s] / members.size();
      }
    }
    return mean;
  }

  private static void requireMembers(int count) {
    if (count == 0) {
      throw new IllegalArgumentException("a combination needs at least one member");
    }
  }
}
