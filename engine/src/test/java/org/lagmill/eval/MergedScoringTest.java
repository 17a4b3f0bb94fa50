package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.ShardAssignment;
import org.lagmill.store.StoreManifest;

/**
 * Shards' scoring parts merged against one evaluation of the whole store with the same forecasts: WRMSSE, WSPL and
 * every level's figures agree to 1e-9, on random shapes where the total, shop and department aggregates span shards.
 */
class MergedScoringTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);
  private static final String[] NAMES = {"dept", "sku", "shop"};
  private static final double[] QUANTILE_LEVELS = {0.1, 0.5, 0.9};
  private static final Map<String, String> PARENTS = new HashMap<>();

  static {
    PARENTS.put("sku", "dept");
    PARENTS.put("dept", null);
    PARENTS.put("shop", null);
  }

  @TempDir
  Path temp;

  @Test
  void shouldEqualTheWholeStoreEvaluationOfTheSameForecasts() throws IOException {
    for (int round = 0; round < 12; round++) {
      long seed = MASTER_SEED + 101L * round;
      Random random = new Random(seed);
      Shape shape = new Shape(random);
      int partCount = 2 + random.nextInt(3);
      Hierarchy hierarchy = Hierarchy.ofLevels(List.of(List.of(), List.of("dept"), List.of("shop"),
          List.of("dept", "shop"), List.of("sku"), List.of("sku", "shop")));
      EvaluationResult whole = evaluateWhole(shape, hierarchy);
      List<ScoringPart> parts = new ArrayList<>();
      ShardAssignment assignment = new ShardAssignment(partCount);
      boolean anySpanning = false;
      for (int part = 0; part < partCount; part++) {
        List<Integer> members = new ArrayList<>();
        for (int s = 0; s < shape.seriesCount; s++) {
          if (assignment.partOf(shape.values[s][1]) == part) {
            members.add(s);
          }
        }
        if (members.isEmpty()) {
          continue; // a split that leaves a part empty is refused by the sharder; score the others as a split
        }
        parts.add(partOf(shape, members, hierarchy, new StoreManifest.Shard(part, partCount, "sku",
            ShardAssignment.HASH_NAME, "store test", shape.seriesCount)));
      }
      if (parts.size() < partCount) {
        continue;
      }
      for (ScoringPart.LevelPart level : parts.get(0).levels()) {
        anySpanning |= !level.wholeInOneShard();
      }
      assertTrue(anySpanning);
      if (round == 0) {
        // through the file format once: doubles must round-trip exactly
        List<ScoringPart> read = new ArrayList<>();
        for (int p = 0; p < parts.size(); p++) {
          Path file = temp.resolve("part-" + p + ".json");
          parts.get(p).write(file);
          read.add(ScoringPart.read(file));
        }
        parts = read;
      }
      java.util.Collections.shuffle(parts, random);
      EvaluationResult merged = MergedScoring.merge(parts);
      assertSame(whole, merged, "seed " + seed + ", " + partCount + " parts");
    }
  }

  @Test
  void shouldRefuseAMissingShardAndPartsOfDifferentOrigins() {
    Random random = new Random(MASTER_SEED);
    Shape shape = new Shape(random);
    Hierarchy hierarchy = Hierarchy.ofLevels(List.of(List.of(), List.of("sku", "shop")));
    List<Integer> all = new ArrayList<>();
    for (int s = 0; s < shape.seriesCount; s++) {
      all.add(s);
    }
    ScoringPart part = partOf(shape, all, hierarchy, new StoreManifest.Shard(1, 3, "sku", ShardAssignment.HASH_NAME,
        "store test", shape.seriesCount));
    IllegalArgumentException missing = assertThrows(IllegalArgumentException.class,
        () -> MergedScoring.merge(List.of(part)));
    assertEquals("missing the scoring parts of shards [0, 2] of 3; a hierarchy-wide score needs every shard",
        missing.getMessage());
    IllegalArgumentException twice = assertThrows(IllegalArgumentException.class,
        () -> MergedScoring.merge(List.of(part, part)));
    assertEquals("shard 1 is given twice", twice.getMessage());
  }

  private static void assertSame(EvaluationResult expected, EvaluationResult actual, String context) {
    assertEquals(expected.wrmsse(), actual.wrmsse(), 1e-9, context);
    assertEquals(expected.wspl(), actual.wspl(), 1e-9, context);
    assertEquals(expected.weightBasis(), actual.weightBasis(), context);
    assertEquals(expected.unknownActualCount(), actual.unknownActualCount(), context);
    assertEquals(expected.unknownTrainingCount(), actual.unknownTrainingCount(), context);
    assertEquals(expected.levels().size(), actual.levels().size(), context);
    for (int l = 0; l < expected.levels().size(); l++) {
      EvaluationResult.LevelResult e = expected.levels().get(l);
      EvaluationResult.LevelResult a = actual.levels().get(l);
      String where = context + ", level " + e.name();
      assertEquals(e.name(), a.name(), where);
      assertEquals(e.aggregateCount(), a.aggregateCount(), where);
      assertEquals(e.weightedRmsse(), a.weightedRmsse(), 1e-9, where);
      assertEquals(e.weightedSpl(), a.weightedSpl(), 1e-9, where);
      assertEquals(e.mae(), a.mae(), 1e-9, where);
      assertEquals(e.bias(), a.bias(), 1e-9, where);
      assertEquals(e.excludedCount(), a.excludedCount(), where);
    }
    for (int k = 0; k < expected.horizonDays().size(); k++) {
      assertEquals(expected.horizonDays().get(k).weightedScaledError(),
          actual.horizonDays().get(k).weightedScaledError(), 1e-9, context);
    }
  }

  private static EvaluationResult evaluateWhole(Shape shape, Hierarchy hierarchy) {
    List<Integer> all = new ArrayList<>();
    for (int s = 0; s < shape.seriesCount; s++) {
      all.add(s);
    }
    SalesHistory history = shape.history(all);
    Evaluator evaluator = new Evaluator(history, hierarchy, shape.horizon);
    return evaluator.evaluate(evaluator.statistics(shape.origin), aggregate(evaluator, shape, all),
        quantiles(evaluator, shape, all));
  }

  private static ScoringPart partOf(Shape shape, List<Integer> members, Hierarchy hierarchy,
      StoreManifest.Shard shard) {
    SalesHistory history = shape.history(members);
    Evaluator evaluator = new Evaluator(history, hierarchy, shape.horizon);
    return ScoringPart.build(history, evaluator, shape.origin, aggregate(evaluator, shape, members),
        quantiles(evaluator, shape, members), shard, PARENTS);
  }

  private static AggregateTable aggregate(Evaluator evaluator, Shape shape, List<Integer> members) {
    double[][] point = new double[members.size()][];
    for (int i = 0; i < point.length; i++) {
      point[i] = shape.forecasts[members.get(i)];
    }
    return evaluator.aggregator().aggregateForecasts(evaluator.withoutUnknownActuals(point, shape.origin));
  }

  private static QuantileForecasts quantiles(Evaluator evaluator, Shape shape, List<Integer> members) {
    double[][][] bottom = new double[QUANTILE_LEVELS.length][][];
    for (int q = 0; q < QUANTILE_LEVELS.length; q++) {
      double[][] rows = new double[members.size()][];
      for (int i = 0; i < members.size(); i++) {
        rows[i] = shape.quantiles[q][members.get(i)];
      }
      bottom[q] = evaluator.withoutUnknownActuals(rows, shape.origin);
    }
    return QuantileForecasts.bottomUp(evaluator.aggregator(), QUANTILE_LEVELS, bottom);
  }

  /** A random chain: skus under departments, sold in some shops, with unknown days, pre-launch zeros and prices. */
  private static final class Shape {
    final int seriesCount;
    final int dayCount;
    final int origin;
    final int horizon;
    final String[][] values;
    final int[][] units;
    final int[][] priceDays;
    final float[][] prices;
    final boolean priced;
    final double[][] forecasts;
    final double[][][] quantiles;

    Shape(Random random) {
      horizon = 1 + random.nextInt(14);
      dayCount = horizon + 2 + random.nextInt(90);
      origin = dayCount - horizon - random.nextInt(2);
      int skuCount = 3 + random.nextInt(15);
      int shopCount = 1 + random.nextInt(5);
      List<String[]> rows = new ArrayList<>();
      for (int sku = 0; sku < skuCount; sku++) {
        for (int shop = 0; shop < shopCount; shop++) {
          if (random.nextInt(3) > 0 || shop == 0) {
            rows.add(new String[] {"dept " + (sku % 3), "sku-" + sku, "shop " + (char) ('P' + shop)});
          }
        }
      }
      seriesCount = rows.size();
      values = rows.toArray(new String[0][]);
      units = new int[seriesCount][dayCount];
      priceDays = new int[seriesCount][];
      prices = new float[seriesCount][];
      priced = random.nextBoolean();
      forecasts = new double[seriesCount][horizon];
      quantiles = new double[QUANTILE_LEVELS.length][seriesCount][horizon];
      for (int s = 0; s < seriesCount; s++) {
        int launch = random.nextInt(4) == 0 ? random.nextInt(dayCount) : 0;
        int rate = random.nextInt(20);
        for (int d = 0; d < dayCount; d++) {
          units[s][d] = random.nextInt(12) == 0 ? SalesHistory.UNKNOWN_UNITS
              : d < launch ? 0 : random.nextInt(rate + 1);
        }
        int changes = random.nextInt(3);
        priceDays[s] = new int[changes];
        prices[s] = new float[changes];
        for (int k = 0; k < changes; k++) {
          priceDays[s][k] = k * (dayCount / 2) + random.nextInt(Math.max(1, dayCount / 2));
          prices[s][k] = 0.5f + random.nextInt(500) / 100f;
        }
        for (int k = 0; k < horizon; k++) {
          forecasts[s][k] = random.nextInt(5) == 0 ? 0 : random.nextDouble() * (rate + 1);
          double spread = random.nextDouble() * 3;
          quantiles[0][s][k] = Math.max(0, forecasts[s][k] - spread);
          quantiles[1][s][k] = forecasts[s][k];
          quantiles[2][s][k] = forecasts[s][k] + spread;
        }
      }
    }

    SalesHistory history(List<Integer> members) {
      int[][] memberUnits = new int[members.size()][];
      String[][] memberValues = new String[members.size()][];
      int[][] memberDays = new int[members.size()][];
      float[][] memberPrices = new float[members.size()][];
      for (int i = 0; i < members.size(); i++) {
        int s = members.get(i);
        memberUnits[i] = units[s];
        memberValues[i] = values[s];
        memberDays[i] = priceDays[s];
        memberPrices[i] = prices[s];
      }
      PriceTable priceTable = priced ? new ArrayPriceTable(memberDays, memberPrices) : PriceTable.EMPTY;
      return new ArraySalesHistory(LocalDate.of(2025, 2, 3), 7, memberUnits,
          ArraySeriesAttributes.of(NAMES, memberValues), priceTable, new ArrayDayCalendar(0, List.of()));
    }
  }
}
