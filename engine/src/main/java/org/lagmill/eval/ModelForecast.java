package org.lagmill.eval;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.training.PartitionReport;

/**
 * One trained model's (or combination's) forecasts at one backtest origin.
 *
 * @param point {@code [seriesIndex][dayOffset]} point forecasts
 * @param dispersion negative binomial dispersion per series (0 = Poisson)
 * @param partitions what training each partition produced; a combination lists every member's
 */
record ModelForecast(double[][] point, float[] dispersion, List<PartitionReport> partitions, double trainSeconds,
    double forecastSeconds) {

  /**
   * The plain average of several members: per series and day the mean of their point forecasts; per series the mean
   * of their dispersions (an approximation: the spread of a mixture also holds the members' disagreement, which this
   * leaves out, so its bands are somewhat narrow where members disagree). Times add up.
   */
  static ModelForecast mean(List<ModelForecast> members) {
    int seriesCount = members.get(0).point().length;
    int horizon = seriesCount == 0 ? 0 : members.get(0).point()[0].length;
    double[][] point = new double[seriesCount][horizon];
    float[] dispersion = new float[seriesCount];
    List<PartitionReport> partitions = new ArrayList<>();
    double trainSeconds = 0;
    double forecastSeconds = 0;
    for (ModelForecast member : members) {
      for (int s = 0; s < seriesCount; s++) {
        for (int d = 0; d < horizon; d++) {
          point[s][d] += member.point()[s][d] / members.size();
        }
        dispersion[s] += member.dispersion()[s] / members.size();
      }
      partitions.addAll(member.partitions());
      trainSeconds += member.trainSeconds();
      forecastSeconds += member.forecastSeconds();
    }
    return new ModelForecast(point, dispersion, List.copyOf(partitions), trainSeconds, forecastSeconds);
  }
}
