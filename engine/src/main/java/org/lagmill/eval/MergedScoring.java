package org.lagmill.eval;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.store.StoreManifest;

/**
 * Merges shards' {@link ScoringPart}s into one hierarchy-wide score: adds every aggregate's sums over the parts, then
 * computes scales, weights and errors with the same rules a single store's evaluation uses
 * ({@link OriginStatistics#fromSums}, {@link Evaluator#score}). Aggregates are matched across parts by their attribute
 * values and numbered in order of first appearance (part by part). Memory: the merged sums (the spanning levels'
 * histories dominate: 8 bytes × aggregates × periods before the origin).
 */
public final class MergedScoring {
  private MergedScoring() {}

  /**
   * @param parts one per shard of one split (any order), or a single part of a whole store
   * @throws IllegalArgumentException when the parts disagree (origin, horizon, dates, levels, quantiles, split) or
   *     a split's shard is missing or given twice
   */
  public static EvaluationResult merge(List<ScoringPart> parts) {
    if (parts.isEmpty()) {
      throw new InvalidRequestException("need at least one scoring part, got none");
    }
    checkAgree(parts);
    ScoringPart first = parts.get(0);
    int levelCount = first.levels().size();
    int origin = first.originDay();
    int horizon = first.horizon();
    int quantileCount = first.quantileLevels().length;
    List<Level> levels = new ArrayList<>();
    ScaleSums[] sums = new ScaleSums[levelCount];
    double[][] priced = new double[levelCount][];
    double[][] units = new double[levelCount][];
    AggregateTable actuals = null;
    List<double[][]> actualRows = new ArrayList<>();
    List<double[][]> forecastRows = new ArrayList<>();
    List<double[][][]> quantileRows = new ArrayList<>();
    for (int l = 0; l < levelCount; l++) {
      boolean whole = first.levels().get(l).wholeInOneShard();
      Map<List<String>, Integer> indexByValues = new LinkedHashMap<>();
      Map<Integer, Integer> partByIndex = new LinkedHashMap<>();
      List<String> names = new ArrayList<>();
      for (int p = 0; p < parts.size(); p++) {
        for (ScoringPart.AggregatePart aggregate : parts.get(p).levels().get(l).aggregates()) {
          Integer index = indexByValues.get(aggregate.values());
          if (index == null) {
            indexByValues.put(aggregate.values(), names.size());
            partByIndex.put(names.size(), p);
            names.add(aggregate.name());
          } else if (whole) {
            throw new InvalidRequestException("aggregate '" + aggregate.name() + "' of level '"
                + Level.nameOf(first.levels().get(l).attributeNames()) + "' appears in parts " + partByIndex.get(index)
                + " and " + p + ", but its level was scored as lying whole in one shard; were the parts split by "
                + "different attributes?");
          }
        }
      }
      int aggregateCount = names.size();
      levels.add(Level.named(first.levels().get(l).attributeNames(), names.toArray(new String[0])));
      double[] history = whole ? null : new double[Math.multiplyExact(aggregateCount, origin)];
      double[][] levelActuals = new double[aggregateCount][horizon];
      double[][] levelForecasts = new double[aggregateCount][horizon];
      double[][][] levelQuantiles = new double[quantileCount][aggregateCount][horizon];
      priced[l] = new double[aggregateCount];
      units[l] = new double[aggregateCount];
      sums[l] = new ScaleSums(aggregateCount);
      for (ScoringPart part : parts) {
        for (ScoringPart.AggregatePart aggregate : part.levels().get(l).aggregates()) {
          int g = indexByValues.get(aggregate.values());
          checkLength(aggregate.actuals(), horizon, "actuals", aggregate);
          checkLength(aggregate.forecasts(), horizon, "forecasts", aggregate);
          addInto(levelActuals[g], aggregate.actuals());
          addInto(levelForecasts[g], aggregate.forecasts());
          if (aggregate.quantiles().length != quantileCount) {
            throw new InvalidRequestException("aggregate '" + aggregate.name() + "' holds "
                + aggregate.quantiles().length + " quantile rows, expected " + quantileCount);
          }
          for (int q = 0; q < quantileCount; q++) {
            checkLength(aggregate.quantiles()[q], horizon, "quantiles", aggregate);
            addInto(levelQuantiles[q][g], aggregate.quantiles()[q]);
          }
          priced[l][g] += aggregate.pricedValue();
          units[l][g] += aggregate.unitValue();
          if (whole) {
            if (aggregate.sumSquared() == null || aggregate.sumAbsolute() == null || aggregate.diffCount() == null) {
              throw new InvalidRequestException("aggregate '" + aggregate.name() + "' lacks its scale sums");
            }
            sums[l].set(g, aggregate.sumSquared(), aggregate.sumAbsolute(), aggregate.diffCount());
          } else {
            checkLength(aggregate.history(), origin, "history", aggregate);
            for (int d = 0; d < origin; d++) {
              history[g * origin + d] += aggregate.history()[d];
            }
          }
        }
      }
      if (!whole) {
        sums[l].add(history, origin, origin);
      }
      actualRows.add(levelActuals);
      forecastRows.add(levelForecasts);
      quantileRows.add(levelQuantiles);
    }
    boolean anyPriced = parts.stream().anyMatch(ScoringPart::priced);
    long unknownTraining = parts.stream().mapToLong(ScoringPart::unknownTrainingCount).sum();
    long unknownActual = parts.stream().mapToLong(ScoringPart::unknownActualCount).sum();
    OriginStatistics statistics = OriginStatistics.fromSums(origin, first.weightDayCount(), sums,
        anyPriced ? priced : null, () -> units, unknownTraining);
    actuals = table(levels, horizon, actualRows);
    AggregateTable forecasts = table(levels, horizon, forecastRows);
    QuantileForecasts quantiles = null;
    if (quantileCount > 0) {
      AggregateTable[] tables = new AggregateTable[quantileCount];
      for (int q = 0; q < quantileCount; q++) {
        List<double[][]> rows = new ArrayList<>();
        for (double[][][] levelQuantiles : quantileRows) {
          rows.add(levelQuantiles[q]);
        }
        tables[q] = table(levels, horizon, rows);
      }
      quantiles = QuantileForecasts.ofAggregates(first.quantileLevels(), tables);
    }
    return Evaluator.score(levels, statistics, actuals, forecasts, quantiles, unknownActual, first.levelSource(),
        first.levelBasis());
  }

  private static AggregateTable table(List<Level> levels, int horizon, List<double[][]> rowsByLevel) {
    AggregateTable table = AggregateTable.forLevels(levels, horizon);
    for (int l = 0; l < levels.size(); l++) {
      double[] values = table.levelValues(l);
      double[][] rows = rowsByLevel.get(l);
      for (int g = 0; g < rows.length; g++) {
        System.arraycopy(rows[g], 0, values, g * horizon, horizon);
      }
    }
    return table;
  }

  private static void addInto(double[] sum, double[] values) {
    for (int i = 0; i < sum.length; i++) {
      sum[i] += values[i];
    }
  }

  private static void checkLength(double[] values, int expected, String what, ScoringPart.AggregatePart aggregate) {
    if (values == null || values.length != expected) {
      throw new InvalidRequestException("aggregate '" + aggregate.name() + "' holds " + (values == null ? "no"
          : values.length) + " " + what + " values, expected " + expected);
    }
  }

  /** Every part must describe the same origin, horizon, store dates, levels and quantiles, and one split whole. */
  private static void checkAgree(List<ScoringPart> parts) {
    ScoringPart first = parts.get(0);
    for (int p = 0; p < parts.size(); p++) {
      ScoringPart part = parts.get(p);
      if (!ScoringPart.KIND.equals(part.kind()) || part.formatVersion() != ScoringPart.FORMAT_VERSION) {
        throw new InvalidRequestException("part " + p + " is " + part.kind() + " version " + part.formatVersion()
            + ", expected " + ScoringPart.KIND + " version " + ScoringPart.FORMAT_VERSION);
      }
      agree(p, "origin period", first.originDay(), part.originDay());
      agree(p, "horizon", first.horizon(), part.horizon());
      agree(p, "first date", first.firstDate(), part.firstDate());
      agree(p, "days per period", first.periodDays(), part.periodDays());
      agree(p, "weight window", first.weightDayCount(), part.weightDayCount());
      agree(p, "quantile levels", Arrays.toString(first.quantileLevels()), Arrays.toString(part.quantileLevels()));
      List<List<String>> firstLevels = first.levels().stream().map(ScoringPart.LevelPart::attributeNames).toList();
      List<List<String>> levels = part.levels().stream().map(ScoringPart.LevelPart::attributeNames).toList();
      if (!firstLevels.equals(levels)) {
        throw new InvalidRequestException("part " + p + " scores levels " + levels + " but part 0 scores "
            + firstLevels + "; shards can find different default levels, so give every shard the same "
            + Setting.HIERARCHY);
      }
      for (int l = 0; l < levels.size(); l++) {
        agree(p, "level " + levels.get(l) + " lying whole in one shard", first.levels().get(l).wholeInOneShard(),
            part.levels().get(l).wholeInOneShard());
      }
    }
    StoreManifest.Shard shard = first.shard();
    if (shard == null) {
      if (parts.size() > 1) {
        throw new InvalidRequestException("part 0 scores a whole store, not a shard; only shards of one split merge");
      }
      return;
    }
    TreeSet<Integer> seen = new TreeSet<>();
    for (int p = 0; p < parts.size(); p++) {
      StoreManifest.Shard other = parts.get(p).shard();
      if (other == null || !other.sourceName().equals(shard.sourceName()) || other.partCount() != shard.partCount()
          || !other.attribute().equals(shard.attribute())) {
        throw new InvalidRequestException("part " + p + " comes from " + (other == null ? "a whole store"
            : other.sourceName() + " split in " + other.partCount() + " by " + other.attribute()) + ", part 0 from "
            + shard.sourceName() + " split in " + shard.partCount() + " by " + shard.attribute()
            + "; merge the parts of one split");
      }
      if (!seen.add(other.part())) {
        throw new InvalidRequestException("shard " + other.part() + " is given twice");
      }
    }
    if (seen.size() != shard.partCount()) {
      List<Integer> missing = new ArrayList<>();
      for (int k = 0; k < shard.partCount(); k++) {
        if (!seen.contains(k)) {
          missing.add(k);
        }
      }
      throw new InvalidRequestException("missing the scoring parts of shards " + missing + " of "
          + shard.partCount() + "; a hierarchy-wide score needs every shard");
    }
  }

  private static void agree(int part, String what, Object expected, Object actual) {
    if (!expected.equals(actual)) {
      throw new InvalidRequestException("part " + part + " has " + what + " " + actual + ", part 0 has " + expected
          + "; merge parts of the same forecast origin and horizon");
    }
  }
}
