package org.lagmill.eval;

import java.util.List;

/**
 * The scores of one forecast at one origin, as plain records that serialise with jackson. Formulas: docs/metrics.md.
 *
 * @param originDay first forecast day (day index)
 * @param horizon forecast days scored
 * @param weightBasis how weights were measured: sales value or, lacking prices, unit volume
 * @param wrmsse mean over levels of the weighted RMSSE
 * @param wspl mean over levels of the weighted scaled pinball loss; null when no quantile forecasts were given
 * @param unknownActualCount bottom series-days in the horizon whose actual units were unknown or closed (removed from
 *     both the actual and the forecast side of every aggregate)
 * @param unknownTrainingCount bottom series-days before the origin whose units were unknown (counted as 0)
 * @param levelSource where the levels came from: {@code detected} (the nesting found in the data) or
 *     {@code declared} ({@code --hierarchy} or {@code --level})
 * @param levelBasis what the levels were built from: the detected chains ({@code dept > grp > sku; shop}) or the
 *     option as given ({@link Hierarchy#basis()})
 */
public record EvaluationResult(int originDay, int horizon, String weightBasis, double wrmsse, Double wspl,
    List<LevelResult> levels, List<HorizonDayError> horizonDays, long unknownActualCount, long unknownTrainingCount,
    String levelSource, String levelBasis) {

  public EvaluationResult {
    levels = List.copyOf(levels);
    horizonDays = List.copyOf(horizonDays);
  }

  /** "levels scored (8): total, dept, …; detected from how the attributes nest (the default): dept > grp > sku; shop". */
  public String scoredLevelsLine() {
    String from = "detected".equals(levelSource)
        ? "detected from how the attributes nest (the default): " + levelBasis
        : "declared with " + levelBasis;
    return "levels scored (" + levels.size() + "): " + String.join(", ", levels.stream().map(LevelResult::name)
        .toList()) + "; " + from;
  }

  /**
   * One level's scores.
   *
   * @param wrmsseContribution {@code weightedRmsse / levelCount}: this level's share of {@code wrmsse}
   * @param weightedRmsse Σ weight × RMSSE over the level's aggregates
   * @param mae mean absolute error in units over aggregates and horizon days
   * @param bias mean of (forecast − actual) in units over aggregates and horizon days
   * @param excludedCount aggregates given weight 0 because their scale is 0 or undefined
   * @param weightedSpl Σ weight × SPL, null without quantile forecasts
   * @param worstAggregates the level's aggregates with the largest share of the WRMSSE, largest first, at most
   *     {@link #WORST_AGGREGATE_COUNT} (all of them in a smaller level): where the forecast fails
   */
  public record LevelResult(String name, int aggregateCount, double wrmsseContribution, double weightedRmsse,
      double mae, double bias, int excludedCount, Double weightedSpl, List<AggregateError> worstAggregates) {
    public LevelResult {
      worstAggregates = worstAggregates == null ? List.of() : List.copyOf(worstAggregates);
    }
  }

  /** Aggregates kept per level in {@link LevelResult#worstAggregates}. */
  public static final int WORST_AGGREGATE_COUNT = 25;

  /**
   * One aggregate's errors over the horizon.
   *
   * @param name the aggregate's attribute values joined by " / " (the series id's values at the bottom level)
   * @param wrmsseContribution weight × RMSSE / level count: the aggregate's share of the WRMSSE
   * @param mae mean absolute error in units per period
   * @param bias mean of (forecast − actual) in units per period: above 0 the forecast was too high
   * @param actualMean mean actual units per period over the horizon
   */
  public record AggregateError(String name, double wrmsseContribution, double mae, double bias, double actualMean) {}

  /**
   * Errors on one horizon day.
   *
   * @param dayOffset 0 for the origin day
   * @param weightedScaledError mean over levels of Σ weight × |actual − forecast| / sqrt(squared scale): the RMSSE of
   *     that single day, weighted as WRMSSE is
   * @param finestLevelMae mean absolute error in units over the aggregates of the level with the most aggregates
   */
  public record HorizonDayError(int dayOffset, double weightedScaledError, double finestLevelMae) {}
}
