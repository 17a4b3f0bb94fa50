package org.lagmill.report;

import java.time.LocalDate;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Backtest scores of the model beside the baselines. RMSSE and WRMSSE are scaled errors: lower is better, 1 is the
 * in-sample error of a one-day naive forecast.
 *
 * @param referenceBaseline the baseline the skill ratio divides by, normally the seasonal naive; must be a key of
 *     {@code baselineWrmsse}, or null when there is none
 * @param levels RMSSE per aggregation level (total, region, store, item, item-store, ...), in display order
 * @param modelWrmsse the model's WRMSSE over all levels
 * @param baselineWrmsse WRMSSE of each baseline, by baseline name in display order
 * @param modelWspl the model's weighted scaled pinball loss over its quantiles, or null when not computed
 * @param baselineWspl WSPL per baseline, possibly empty
 * @param origins one row per backtest origin, in date order; empty when a single split was scored
 */
public record AccuracySummary(
    String referenceBaseline,
    List<LevelScore> levels,
    double modelWrmsse,
    Map<String, Double> baselineWrmsse,
    Double modelWspl,
    Map<String, Double> baselineWspl,
    List<OriginScore> origins) {

  public AccuracySummary {
    levels = levels == null ? List.of() : List.copyOf(levels);
    baselineWrmsse = orderedCopy(baselineWrmsse);
    baselineWspl = orderedCopy(baselineWspl);
    origins = origins == null ? List.of() : List.copyOf(origins);
    if (referenceBaseline != null && !baselineWrmsse.containsKey(referenceBaseline)) {
      throw new IllegalArgumentException("referenceBaseline \"" + referenceBaseline + "\" is not among the baselines "
          + baselineWrmsse.keySet() + "; name one of them or pass null");
    }
  }

  /** Baseline names in display order. */
  public List<String> baselineNames() {
    return List.copyOf(baselineWrmsse.keySet());
  }

  /**
   * The model's WRMSSE divided by the reference baseline's: below 1 the model beats it (0.8 = 20% less error).
   *
   * @return the ratio, or null when there is no reference baseline
   */
  public Double skillRatio() {
    return referenceBaseline == null ? null : modelWrmsse / baselineWrmsse.get(referenceBaseline);
  }

  static <V> Map<String, V> orderedCopy(Map<String, V> map) {
    return map == null ? Map.of() : Collections.unmodifiableMap(new LinkedHashMap<>(map));
  }

  /**
   * RMSSE at one aggregation level.
   *
   * @param levelName e.g. "total", "region", "store", "item-store"
   * @param aggregateCount series at this level (1 for the total)
   * @param modelRmsse the model's RMSSE averaged over the level's series
   * @param baselineRmsse each baseline's RMSSE at this level, by baseline name
   */
  public record LevelScore(String levelName, long aggregateCount, double modelRmsse,
      Map<String, Double> baselineRmsse) {
    public LevelScore {
      levelName = ReportData.requireText(levelName, "levelName");
      baselineRmsse = orderedCopy(baselineRmsse);
    }
  }

  /**
   * WRMSSE of one rolling-origin backtest split.
   *
   * @param originDate the first forecast day; the forecast saw history up to the day before it
   * @param modelWrmsse the model's WRMSSE over the following horizon
   * @param baselineWrmsse each baseline's WRMSSE over the same days, by baseline name
   */
  public record OriginScore(LocalDate originDate, double modelWrmsse, Map<String, Double> baselineWrmsse) {
    public OriginScore {
      if (originDate == null) {
        throw new IllegalArgumentException("originDate must not be null; each backtest row names its origin");
      }
      baselineWrmsse = orderedCopy(baselineWrmsse);
    }
  }
}
