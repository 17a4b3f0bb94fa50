package org.lagmill.eval;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.forecast.MemberAverage;
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

  /** The plain average of several members ({@link MemberAverage}); times add up. */
  static ModelForecast mean(List<ModelForecast> members) {
    double[][] point = MemberAverage.point(members.stream().map(ModelForecast::point).toList());
    float[] dispersion = MemberAverage.dispersion(members.stream().map(ModelForecast::dispersion).toList());
    List<PartitionReport> partitions = new ArrayList<>();
    double trainSeconds = 0;
    double forecastSeconds = 0;
    for (ModelForecast member : members) {
      partitions.addAll(member.partitions());
      trainSeconds += member.trainSeconds();
      forecastSeconds += member.forecastSeconds();
    }
    return new ModelForecast(point, dispersion, List.copyOf(partitions), trainSeconds, forecastSeconds);
  }
}
