package org.lagmill.report;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.time.LocalDate;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.io.InvalidRequestException;

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
 * @param worstAggregates where the forecast fails: per level, the aggregates with the largest share of the WRMSSE,
 *     averaged over origins, largest first; empty when not recorded
 * @param levelSource where the scored levels came from: {@code detected} (the nesting found in the data, the default)
 *     or {@code declared} ({@code --hierarchy} or {@code --level}); null when not recorded
 * @param levelBasis what they were built from: the detected chains ({@code dept > grp > sku; shop}) or the option as
 *     given; null when not recorded
 */
public record AccuracySummary(
    String referenceBaseline,
    List<LevelScore> levels,
    double modelWrmsse,
    Map<String, Double> baselineWrmsse,
    Double modelWspl,
    Map<String, Double> baselineWspl,
    List<OriginScore> origins,
    List<WorstAggregate> worstAggregates,
    @JsonInclude(JsonInclude.Include.NON_NULL) String levelSource,
    @JsonInclude(JsonInclude.Include.NON_NULL) String levelBasis) {

  /** As the canonical constructor, without where the levels came from. */
  public AccuracySummary(String referenceBaseline, List<LevelScore> levels, double modelWrmsse,
      Map<String, Double> baselineWrmsse, Double modelWspl, Map<String, Double> baselineWspl,
      List<OriginScore> origins, List<WorstAggregate> worstAggregates) {
    this(referenceBaseline, levels, modelWrmsse, baselineWrmsse, modelWspl, baselineWspl, origins, worstAggregates,
        null, null);
  }

  /** As the canonical constructor, without the worst aggregates. */
  public AccuracySummary(String referenceBaseline, List<LevelScore> levels, double modelWrmsse,
      Map<String, Double> baselineWrmsse, Double modelWspl, Map<String, Double> baselineWspl,
      List<OriginScore> origins) {
    this(referenceBaseline, levels, modelWrmsse, baselineWrmsse, modelWspl, baselineWspl, origins, null);
  }

  public AccuracySummary {
    levels = levels == null ? List.of() : List.copyOf(levels);
    baselineWrmsse = orderedCopy(baselineWrmsse);
    baselineWspl = orderedCopy(baselineWspl);
    origins = origins == null ? List.of() : List.copyOf(origins);
    worstAggregates = worstAggregates == null ? List.of() : List.copyOf(worstAggregates);
    if (referenceBaseline != null && !baselineWrmsse.containsKey(referenceBaseline)) {
      throw new InvalidRequestException("referenceBaseline \"" + referenceBaseline + "\" is not among the baselines "
          + baselineWrmsse.keySet() + "; name one of them or pass null");
    }
  }

  /**
   * The baseline with the lowest WRMSSE: the strongest simple method the model is measured against.
   *
   * @return its name, or null when no baseline was scored
   */
  public String bestBaseline() {
    String best = null;
    for (Map.Entry<String, Double> e : baselineWrmsse.entrySet()) {
      if (e.getValue() != null && Double.isFinite(e.getValue())
          && (best == null || e.getValue() < baselineWrmsse.get(best))) {
        best = e.getKey();
      }
    }
    return best;
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
   * @param modelMae the model's mean absolute error in units per period over the level's aggregates, or null
   * @param modelBias the model's mean of (forecast − actual) in units per period (above 0: too high), or null
   */
  public record LevelScore(String levelName, long aggregateCount, double modelRmsse,
      Map<String, Double> baselineRmsse, Double modelMae, Double modelBias) {
    /** A level without errors in units. */
    public LevelScore(String levelName, long aggregateCount, double modelRmsse, Map<String, Double> baselineRmsse) {
      this(levelName, aggregateCount, modelRmsse, baselineRmsse, null, null);
    }

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

  /**
   * One aggregate with a large share of the error.
   *
   * @param levelName the aggregate's level, e.g. "store"
   * @param aggregateName its attribute values joined by " / "
   * @param wrmsseContribution its share of the WRMSSE (weight × RMSSE / level count), mean over origins
   * @param mae mean absolute error in units per period
   * @param bias mean of (forecast − actual) in units per period; above 0 the forecast ran high
   * @param actualMean mean actual units per period
   */
  public record WorstAggregate(String levelName, String aggregateName, double wrmsseContribution, double mae,
      double bias, double actualMean) {}
}
