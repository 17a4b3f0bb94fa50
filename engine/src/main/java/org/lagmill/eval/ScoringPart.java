package org.lagmill.eval;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.StoreManifest;

/**
 * One shard's additive share of a hierarchy-wide score at one origin: everything {@link MergedScoring} adds over
 * shards before it computes scales, weights and errors. For each level and aggregate: actual and forecast sums per
 * horizon period (and quantile sums), the weight window's sales value and units, and the scale's parts. An aggregate
 * that may span shards carries its whole per-period history of actual sums before the origin, because its RMSSE
 * scale comes from the differences of the aggregate's own sums, which do not add over shards; an aggregate whose
 * series all lie in one shard (its level names the shard attribute or an attribute under it) carries its finished
 * sums of squared and absolute differences instead. Plain data, serialised with jackson (doubles round-trip exactly);
 * the file format is in docs/distributed.md.
 *
 * @param kind always {@link #KIND}
 * @param formatVersion {@link #FORMAT_VERSION}
 * @param firstDate ISO date of period index 0 of the store scored
 * @param periodDays days per period
 * @param originDay first forecast period index
 * @param horizon periods scored
 * @param weightDayCount periods before the origin that set the weights
 * @param levelSource {@code detected} or {@code declared}
 * @param levelBasis what the levels were built from ({@link EvaluationResult#levelBasis()})
 * @param shard the shard record of the store scored, or null for a whole store (one part)
 * @param priced whether the store holds prices (sales-value weights possible)
 * @param unknownTrainingCount bottom series-periods before the origin whose units were unknown
 * @param unknownActualCount bottom series-periods in the horizon whose actuals were unknown or closed
 * @param quantileLevels the quantile levels scored, empty without quantile forecasts
 */
public record ScoringPart(String kind, int formatVersion, String firstDate, int periodDays, int originDay,
    int horizon, int weightDayCount, String levelSource, String levelBasis,
    @JsonInclude(JsonInclude.Include.NON_NULL) StoreManifest.Shard shard, boolean priced, long unknownTrainingCount,
    long unknownActualCount,
    double[] quantileLevels, List<LevelPart> levels) {
  public static final String KIND = "lagmill-scoring-part";
  public static final int FORMAT_VERSION = 1;
  private static final int BLOCK_DAYS = 64;

  /**
   * @param attributeNames the level's attributes ({@code []} for the total)
   * @param wholeInOneShard true when every aggregate's series lie in one shard (finished scale sums, no history)
   */
  public record LevelPart(List<String> attributeNames, boolean wholeInOneShard, List<AggregatePart> aggregates) {}

  /**
   * @param values the aggregate's attribute values, in the level's attribute order: its identity across shards
   * @param name its display name (values joined by " / ")
   * @param history actual sums of periods {@code 0 .. originDay-1}; null when the level is whole in one shard
   * @param sumSquared sum of squared one-step differences from the first non-zero period; null unless whole
   * @param sumAbsolute sum of absolute differences; null unless whole
   * @param diffCount number of differences; null unless whole
   * @param actuals actual sums per horizon period (unknown and closed series-periods add 0)
   * @param forecasts forecast sums per horizon period (0 where the actual is unknown or closed)
   * @param quantiles {@code quantiles[q][k]}: sums of the series' quantile {@code q} per horizon period; empty
   *     without quantiles
   * @param pricedValue units × price over the weight window
   * @param unitValue units over the weight window
   */
  public record AggregatePart(List<String> values, String name,
      @JsonInclude(JsonInclude.Include.NON_NULL) double[] history,
      @JsonInclude(JsonInclude.Include.NON_NULL) Double sumSquared,
      @JsonInclude(JsonInclude.Include.NON_NULL) Double sumAbsolute,
      @JsonInclude(JsonInclude.Include.NON_NULL) Integer diffCount, double[] actuals, double[] forecasts,
      double[][] quantiles, double pricedValue, double unitValue) {}

  /**
   * Whether every aggregate of a level lies in one shard: some attribute of the level is the shard attribute or lies
   * under it along the whole store's nesting (each value of it then occurs with one value of the shard attribute,
   * and all series with that value share a shard). Conservative: a nesting the parent chain does not show counts as
   * spanning, which costs a larger part, never a wrong score.
   *
   * @param wholeStoreParents each attribute to the attribute it lies directly under, or null for a root
   */
  static boolean isWholeInOneShard(List<String> levelAttributes, StoreManifest.Shard shard,
      Map<String, String> wholeStoreParents) {
    if (shard == null || shard.partCount() == 1) {
      return true;
    }
    for (String attribute : levelAttributes) {
      String at = attribute;
      for (int steps = 0; at != null && steps <= wholeStoreParents.size(); steps++) {
        if (at.equals(shard.attribute())) {
          return true;
        }
        at = wholeStoreParents.get(at);
      }
    }
    return false;
  }

  /**
   * Builds the part of one store for an origin: reads periods {@code 0 .. originDay + horizon - 1} once, in blocks.
   *
   * <p>Memory: the spanning levels' histories (8 bytes × aggregates × periods before the origin) and 64-period blocks
   * of every aggregate.
   *
   * @param evaluator bound to {@code history} (its levels and weight window)
   * @param forecasts aggregated bottom forecasts with unknown actuals removed
   *     ({@link Evaluator#withoutUnknownActuals}, then {@link Aggregator#aggregateForecasts})
   * @param quantiles aggregated quantiles likewise, or null
   * @param shard the store's shard record, or null for a whole store
   * @param wholeStoreParents the whole store's nesting ({@link StoreManifest#nesting()} of a shard)
   */
  public static ScoringPart build(SalesHistory history, Evaluator evaluator, int originDay, AggregateTable forecasts,
      QuantileForecasts quantiles, StoreManifest.Shard shard, Map<String, String> wholeStoreParents) {
    Aggregator aggregator = evaluator.aggregator();
    List<Level> levels = aggregator.levels();
    int horizon = forecasts.dayCount();
    if (originDay < 1 || originDay + horizon > history.dayCount()) {
      throw new InvalidRequestException("horizon " + horizon + " from origin " + originDay + " needs actuals up to "
          + "period " + (originDay + horizon - 1) + ", the store ends at period " + (history.dayCount() - 1));
    }
    // Periods before the origin in blocks: whole levels keep only their scale sums, spanning levels their history.
    ScaleSums[] sums = new ScaleSums[levels.size()];
    double[][] histories = new double[levels.size()][];
    boolean[] whole = new boolean[levels.size()];
    for (int l = 0; l < levels.size(); l++) {
      whole[l] = isWholeInOneShard(levels.get(l).attributeNames(), shard, wholeStoreParents);
      sums[l] = new ScaleSums(levels.get(l).aggregateCount());
      histories[l] = whole[l] ? null : new double[Math.multiplyExact(levels.get(l).aggregateCount(), originDay)];
    }
    int blockDays = Math.min(BLOCK_DAYS, originDay);
    AggregateTable block = AggregateTable.forLevels(levels, blockDays);
    long unknownTrainingCount = 0;
    for (int from = 0; from < originDay; from += blockDays) {
      int n = Math.min(blockDays, originDay - from);
      aggregator.aggregateActualsInto(history, from, n, block);
      unknownTrainingCount += block.unknownCount();
      for (int l = 0; l < levels.size(); l++) {
        if (whole[l]) {
          sums[l].add(block.levelValues(l), blockDays, n);
        } else {
          for (int g = 0; g < levels.get(l).aggregateCount(); g++) {
            System.arraycopy(block.levelValues(l), g * blockDays, histories[l], g * originDay + from, n);
          }
        }
      }
    }
    AggregateTable actuals = aggregator.aggregateActuals(history, originDay, horizon);
    int weightDays = evaluator.weightDayCount();
    double[] pricedBySeries = OriginStatistics.weightWindowSumsBefore(history, originDay, weightDays, true);
    double[][] priced = pricedBySeries == null ? null : aggregator.aggregateValues(pricedBySeries);
    double[][] units = aggregator.aggregateValues(
        OriginStatistics.weightWindowSumsBefore(history, originDay, weightDays, false));
    SeriesAttributes attributes = history.attributes();
    List<LevelPart> levelParts = new ArrayList<>();
    for (int l = 0; l < levels.size(); l++) {
      Level level = levels.get(l);
      List<List<String>> values = aggregateValues(level, attributes);
      List<AggregatePart> aggregates = new ArrayList<>();
      for (int g = 0; g < level.aggregateCount(); g++) {
        double[][] quantileSums = new double[quantiles == null ? 0 : quantiles.quantileCount()][];
        for (int q = 0; q < quantileSums.length; q++) {
          quantileSums[q] = slice(quantiles.table(q).levelValues(l), g, horizon);
        }
        aggregates.add(new AggregatePart(values.get(g), level.aggregateName(g),
            whole[l] ? null : slice(histories[l], g, originDay), whole[l] ? sums[l].sumSquared(g) : null,
            whole[l] ? sums[l].sumAbsolute(g) : null, whole[l] ? sums[l].diffCount(g) : null,
            slice(actuals.levelValues(l), g, horizon), slice(forecasts.levelValues(l), g, horizon), quantileSums,
            priced == null ? 0 : priced[l][g], units[l][g]));
      }
      levelParts.add(new LevelPart(level.attributeNames(), whole[l], aggregates));
    }
    double[] quantileLevels = new double[quantiles == null ? 0 : quantiles.quantileCount()];
    for (int q = 0; q < quantileLevels.length; q++) {
      quantileLevels[q] = quantiles.quantileLevel(q);
    }
    return new ScoringPart(KIND, FORMAT_VERSION, history.firstDate().toString(), history.periodDays(), originDay,
        horizon, evaluator.weightDayCount(), evaluator.levelSource(), evaluator.levelBasis(), shard, priced != null,
        unknownTrainingCount,
        actuals.unknownCount(), quantileLevels, levelParts);
  }

  /** Writes the part as JSON (to a temporary sibling, renamed into place). */
  public void write(java.nio.file.Path file) throws java.io.IOException {
    org.lagmill.io.AtomicFiles.write(file, JSON.writeValueAsBytes(this));
  }

  /**
   * Reads a part written by {@link #write}.
   *
   * @throws IllegalArgumentException when the file is not a scoring part
   */
  public static ScoringPart read(java.nio.file.Path file) throws java.io.IOException {
    try {
      ScoringPart part = JSON.readValue(file.toFile(), ScoringPart.class);
      if (!KIND.equals(part.kind())) {
        throw new InvalidRequestException(file + ": kind " + part.kind() + ", expected " + KIND);
      }
      return part;
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      throw new InvalidRequestException(file + ": not a scoring part (" + e.getOriginalMessage() + ")", e);
    }
  }

  private static final com.fasterxml.jackson.databind.ObjectMapper JSON = new com.fasterxml.jackson.databind.ObjectMapper();

  private static List<List<String>> aggregateValues(Level level, SeriesAttributes attributes) {
    int[] attributeIndexes = level.attributeIndexes();
    List<List<String>> values = new ArrayList<>();
    for (int g = 0; g < level.aggregateCount(); g++) {
      values.add(null);
    }
    for (int s = 0; s < level.seriesCount(); s++) {
      int g = level.aggregateIndexOf(s);
      if (values.get(g) == null) {
        List<String> tuple = new ArrayList<>();
        for (int a : attributeIndexes) {
          tuple.add(attributes.value(a, attributes.code(s, a)));
        }
        values.set(g, List.copyOf(tuple));
      }
    }
    return values;
  }

  private static double[] slice(double[] levelValues, int aggregateIndex, int dayCount) {
    double[] result = new double[dayCount];
    System.arraycopy(levelValues, aggregateIndex * dayCount, result, 0, dayCount);
    return result;
  }
}
