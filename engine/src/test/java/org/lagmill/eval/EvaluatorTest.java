package org.lagmill.eval;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

class EvaluatorTest {
  private static final long SEED = TestSeeds.master(0xe7a1_2024L);
  private static final List<String> HIERARCHIES = List.of("region>store", "category>department>item");

  /** Name of the aggregate a series belongs to, from its attribute texts (independent of Level's map). */
  private static String aggregateKey(SeriesAttributes attributes, List<String> names, int seriesIndex) {
    if (names.isEmpty()) {
      return "total";
    }
    StringBuilder key = new StringBuilder();
    for (String name : names) {
      int a = attributes.attributeIndex(name);
      key.append(key.length() == 0 ? "" : " / ").append(attributes.value(a, attributes.code(seriesIndex, a)));
    }
    return key.toString();
  }

  /** Slow reference of WRMSSE, per-level MAE/bias, WSPL and the per-day errors, straight from the definitions. */
  private static EvaluationResult reference(SalesHistory history, List<Level> levels, int origin, double[][] forecasts,
      double[][][] quantiles, double[] taus) {
    int horizon = forecasts[0].length;
    int seriesCount = history.seriesCount();
    int window = Evaluator.DEFAULT_WEIGHT_DAYS;
    double[] value = new double[seriesCount];
    double[] volume = new double[seriesCount];
    for (int s = 0; s < seriesCount; s++) {
      for (int d = Math.max(0, origin - window); d < origin; d++) {
        int u = history.units(s, d);
        if (u > 0) {
          volume[s] += u;
          float price = history.prices().priceAt(s, d);
          value[s] += Float.isNaN(price) ? 0 : u * (double) price;
        }
      }
    }
    boolean byValue = !history.prices().isEmpty() && Arrays.stream(value).sum() > 0;
    double[] weightBase = byValue ? value : volume;
    double wrmsse = 0;
    double wspl = 0;
    double[] dayError = new double[horizon];
    double[] finestDay = new double[horizon];
    List<EvaluationResult.LevelResult> rows = new java.util.ArrayList<>();
    int finestCount = levels.stream().mapToInt(Level::aggregateCount).max().orElseThrow();
    for (Level level : levels) {
      Map<String, double[]> series = new LinkedHashMap<>();
      Map<String, double[]> forecast = new LinkedHashMap<>();
      Map<String, double[][]> quantile = new LinkedHashMap<>();
      Map<String, Double> rawWeight = new LinkedHashMap<>();
      for (int s = 0; s < seriesCount; s++) {
        String key = aggregateKey(history.attributes(), level.attributeNames(), s);
        double[] y = series.computeIfAbsent(key, k -> new double[history.dayCount()]);
        double[] f = forecast.computeIfAbsent(key, k -> new double[horizon]);
        double[][] q = quantile.computeIfAbsent(key, k -> new double[taus.length][horizon]);
        for (int d = 0; d < history.dayCount(); d++) {
          y[d] += Math.max(0, history.units(s, d));
        }
        for (int k = 0; k < horizon; k++) {
          // An unknown actual is left out of both sides of every aggregate.
          if (history.units(s, origin + k) < 0) {
            continue;
          }
          f[k] += forecasts[s][k];
          for (int t = 0; t < taus.length; t++) {
            q[t][k] += quantiles == null ? 0 : quantiles[t][s][k];
          }
        }
        rawWeight.merge(key, weightBase[s], Double::sum);
      }
      double weightSum = 0;
      Map<String, Double> scales = new LinkedHashMap<>();
      Map<String, Double> absScales = new LinkedHashMap<>();
      int excluded = 0;
      for (String key : series.keySet()) {
        double[] y = series.get(key);
        int first = 0;
        while (first < origin && y[first] <= 0) {
          first++;
        }
        double sq = 0;
        double ab = 0;
        int n = 0;
        for (int t = first + 1; t < origin; t++) {
          sq += (y[t] - y[t - 1]) * (y[t] - y[t - 1]);
          ab += Math.abs(y[t] - y[t - 1]);
          n++;
        }
        scales.put(key, n == 0 ? 0 : sq / n);
        absScales.put(key, n == 0 ? 0 : ab / n);
        if (scales.get(key) > 0) {
          weightSum += rawWeight.get(key);
        } else {
          excluded++;
        }
      }
      double levelRmsse = 0;
      double levelSpl = 0;
      double abs = 0;
      double bias = 0;
      List<EvaluationResult.AggregateError> all = new java.util.ArrayList<>();
      for (String key : series.keySet()) {
        double[] y = series.get(key);
        double[] f = forecast.get(key);
        double w = scales.get(key) > 0 && weightSum > 0 ? rawWeight.get(key) / weightSum : 0;
        double mse = 0;
        double keyAbs = 0;
        double keyBias = 0;
        double keyActual = 0;
        for (int k = 0; k < horizon; k++) {
          double e = f[k] - y[origin + k];
          keyAbs += Math.abs(e) / horizon;
          keyBias += e / horizon;
          keyActual += y[origin + k] / horizon;
        }
        all.add(new EvaluationResult.AggregateError(key, w > 0 ? w * Math.sqrt(
            java.util.stream.IntStream.range(0, horizon).mapToDouble(k -> (f[k] - y[origin + k]) * (f[k]
                - y[origin + k])).sum() / horizon / scales.get(key))
            / levels.size() : 0, keyAbs, keyBias, keyActual));
        for (int k = 0; k < horizon; k++) {
          double e = f[k] - y[origin + k];
          mse += e * e / horizon;
          abs += Math.abs(e);
          bias += e;
          if (w > 0) {
            dayError[k] += w * Math.abs(e) / Math.sqrt(scales.get(key)) / levels.size();
          }
          if (level.aggregateCount() == finestCount) {
            finestDay[k] += Math.abs(e) / finestCount;
          }
        }
        if (w > 0) {
          levelRmsse += w * Math.sqrt(mse / scales.get(key));
          double spl = 0;
          for (int t = 0; t < taus.length; t++) {
            for (int k = 0; k < horizon; k++) {
              double u = y[origin + k] - quantile.get(key)[t][k];
              spl += u * (taus[t] - (u < 0 ? 1 : 0)) / horizon / absScales.get(key) / taus.length;
            }
          }
          levelSpl += w * spl;
        }
      }
      double cells = series.size() * (double) horizon;
      rows.add(new EvaluationResult.LevelResult(level.name(), series.size(), levelRmsse / levels.size(), levelRmsse,
          abs / cells, bias / cells, excluded, quantiles == null ? null : levelSpl, slowWorst(all)));
      wrmsse += levelRmsse / levels.size();
      wspl += levelSpl / levels.size();
    }
    List<EvaluationResult.HorizonDayError> days = new java.util.ArrayList<>();
    for (int k = 0; k < horizon; k++) {
      days.add(new EvaluationResult.HorizonDayError(k, dayError[k], finestDay[k]));
    }
    long unknownActual = 0;
    long unknownTraining = 0;
    for (int s = 0; s < seriesCount; s++) {
      for (int d = 0; d < origin + horizon; d++) {
        if (history.units(s, d) < 0) {
          if (d < origin) {
            unknownTraining++;
          } else {
            unknownActual++;
          }
        }
      }
    }
    return new EvaluationResult(origin, horizon, byValue ? "SALES_VALUE" : "UNIT_VOLUME", wrmsse,
        quantiles == null ? null : wspl, rows, days, unknownActual, unknownTraining, "declared",
        "levels given by the caller");
  }

  /** Sort everything, keep the first ones: largest share first, ties by name. */
  private static List<EvaluationResult.AggregateError> slowWorst(List<EvaluationResult.AggregateError> all) {
    List<EvaluationResult.AggregateError> sorted = new java.util.ArrayList<>(all);
    sorted.sort((a, b) -> a.wrmsseContribution() != b.wrmsseContribution()
        ? Double.compare(b.wrmsseContribution(), a.wrmsseContribution()) : a.name().compareTo(b.name()));
    return sorted.subList(0, Math.min(EvaluationResult.WORST_AGGREGATE_COUNT, sorted.size()));
  }

  private static void assertClose(EvaluationResult expected, EvaluationResult actual, String message) {
    assertEquals(expected.weightBasis(), actual.weightBasis(), message);
    assertEquals(expected.wrmsse(), actual.wrmsse(), 1e-9, message);
    assertEquals(expected.wspl() == null, actual.wspl() == null, message);
    if (expected.wspl() != null) {
      assertEquals(expected.wspl(), actual.wspl(), 1e-9, message);
    }
    assertEquals(expected.unknownActualCount(), actual.unknownActualCount(), message);
    assertEquals(expected.unknownTrainingCount(), actual.unknownTrainingCount(), message);
    for (int l = 0; l < expected.levels().size(); l++) {
      EvaluationResult.LevelResult e = expected.levels().get(l);
      EvaluationResult.LevelResult a = actual.levels().get(l);
      String where = message + " level " + e.name();
      assertEquals(e.name(), a.name(), where);
      assertEquals(e.aggregateCount(), a.aggregateCount(), where);
      assertEquals(e.excludedCount(), a.excludedCount(), where);
      assertEquals(e.weightedRmsse(), a.weightedRmsse(), 1e-9, where);
      assertEquals(e.wrmsseContribution(), a.wrmsseContribution(), 1e-9, where);
      assertEquals(e.mae(), a.mae(), 1e-9, where);
      assertEquals(e.bias(), a.bias(), 1e-9, where);
      if (e.weightedSpl() != null) {
        assertEquals(e.weightedSpl(), a.weightedSpl(), 1e-9, where);
      }
      assertEquals(e.worstAggregates().size(), a.worstAggregates().size(), where);
      for (int i = 0; i < e.worstAggregates().size(); i++) {
        EvaluationResult.AggregateError ew = e.worstAggregates().get(i);
        EvaluationResult.AggregateError aw = a.worstAggregates().get(i);
        String at = where + ", worst #" + (i + 1);
        assertEquals(ew.wrmsseContribution(), aw.wrmsseContribution(), 1e-9, at);
        if (i + 1 < e.worstAggregates().size()
            && e.worstAggregates().get(i + 1).wrmsseContribution() < ew.wrmsseContribution() - 1e-9
            && (i == 0 || e.worstAggregates().get(i - 1).wrmsseContribution() > ew.wrmsseContribution() + 1e-9)) {
          // the name is compared only where the share is clearly unique; near-ties may order either way
          assertEquals(ew.name(), aw.name(), at);
          assertEquals(ew.mae(), aw.mae(), 1e-9, at);
          assertEquals(ew.bias(), aw.bias(), 1e-9, at);
          assertEquals(ew.actualMean(), aw.actualMean(), 1e-9, at);
        }
      }
    }
    for (int k = 0; k < expected.horizonDays().size(); k++) {
      assertEquals(expected.horizonDays().get(k).weightedScaledError(),
          actual.horizonDays().get(k).weightedScaledError(), 1e-9, message + " day " + k);
      assertEquals(expected.horizonDays().get(k).finestLevelMae(), actual.horizonDays().get(k).finestLevelMae(), 1e-9,
          message + " day " + k);
    }
  }

  private static double[][] randomForecasts(SplittableRandom random, int seriesCount, int horizon) {
    double[][] f = new double[seriesCount][horizon];
    for (double[] row : f) {
      for (int k = 0; k < horizon; k++) {
        row[k] = random.nextInt(4) == 0 ? 0 : random.nextDouble() * 6;
      }
    }
    return f;
  }

  @Test
  void shouldMatchSlowReferenceOnRandomHistories() {
    for (int round = 0; round < 6; round++) {
      String message = "seed " + SEED + " round " + round;
      SplittableRandom random = new SplittableRandom(SEED + round);
      // Origins from 1 day (shorter than the 28-day weight window and a 64-day scale block) to the last day.
      int dayCount = 20 + random.nextInt(150);
      ArraySalesHistory history = RandomHistories.history(random, dayCount, round % 3 != 2);
      int horizon = 1 + random.nextInt(Math.min(14, dayCount - 1));
      int origin = round == 0 ? 1 : dayCount - horizon - random.nextInt(Math.max(1, dayCount - horizon - 1));
      origin = Math.max(1, origin);
      Evaluator evaluator = new Evaluator(history, Hierarchy.parse(HIERARCHIES));
      double[][] forecasts = randomForecasts(random, history.seriesCount(), horizon);
      double[] taus = SeriesMetrics.publishedQuantiles();
      double[][][] bottomQuantiles = new double[taus.length][][];
      for (int t = 0; t < taus.length; t++) {
        bottomQuantiles[t] = new double[history.seriesCount()][horizon];
        for (int s = 0; s < history.seriesCount(); s++) {
          for (int k = 0; k < horizon; k++) {
            bottomQuantiles[t][s][k] = forecasts[s][k] * (0.2 + 1.6 * taus[t]);
          }
        }
      }
      List<Level> levels = evaluator.aggregator().levels();
      double[][][] knownQuantiles = new double[taus.length][][];
      for (int t = 0; t < taus.length; t++) {
        knownQuantiles[t] = evaluator.withoutUnknownActuals(bottomQuantiles[t], origin);
      }
      EvaluationResult actual = evaluator.evaluate(evaluator.statistics(origin),
          evaluator.aggregator().aggregateForecasts(evaluator.withoutUnknownActuals(forecasts, origin)),
          QuantileForecasts.bottomUp(evaluator.aggregator(), taus, knownQuantiles));
      assertClose(reference(history, levels, origin, forecasts, bottomQuantiles, taus), actual,
          message + " origin " + origin + " horizon " + horizon);
      EvaluationResult pointOnly = evaluator.evaluate(origin, forecasts);
      assertNull(pointOnly.wspl());
      assertClose(reference(history, levels, origin, forecasts, null, taus), pointOnly, message);
    }
  }

  @Test
  void shouldUseOnlyDaysBeforeTheOriginForScalesAndWeights() {
    SplittableRandom random = new SplittableRandom(SEED);
    ArraySalesHistory history = RandomHistories.history(random, 90, true);
    int origin = 61;
    ArraySalesHistory changed = ArraySalesHistory.copyOf(history, 0);
    for (int s = 0; s < changed.seriesCount(); s++) {
      for (int d = origin; d < changed.dayCount(); d++) {
        changed.setUnits(s, d, random.nextInt(5) == 0 ? SalesHistory.UNKNOWN_UNITS : random.nextInt(50));
      }
    }
    OriginStatistics before = new Evaluator(history, Hierarchy.parse(HIERARCHIES)).statistics(origin);
    OriginStatistics after = new Evaluator(changed, Hierarchy.parse(HIERARCHIES)).statistics(origin);
    for (int l = 0; l < before.levelCount(); l++) {
      assertArrayEquals(before.squaredScales(l), after.squaredScales(l), "seed " + SEED + " level " + l);
      assertArrayEquals(before.absoluteScales(l), after.absoluteScales(l), "seed " + SEED + " level " + l);
      assertArrayEquals(before.weights(l), after.weights(l), "seed " + SEED + " level " + l);
    }
    assertEquals(before.unknownTrainingCount(), after.unknownTrainingCount());
    for (BaselineKind kind : BaselineKind.values()) {
      double[][] a = BaselineForecaster.forecastAll(history, origin, 28, kind);
      double[][] b = BaselineForecaster.forecastAll(changed, origin, 28, kind);
      for (int s = 0; s < a.length; s++) {
        assertArrayEquals(a[s], b[s], kind + " series " + s);
      }
    }
  }

  @Test
  void shouldExcludeZeroAndUndefinedScalesAndRenormalise() {
    // a: first sale on the last training day (no difference: undefined); b: flat after launch (scale 0);
    // c: 1, 3, 2, 4 -> differences 2, -1, 2 -> squared scale 3. Only c keeps weight, renormalised to 1.
    int[][] units = {{0, 0, 0, 5, 5}, {2, 2, 2, 2, 2}, {1, 3, 2, 4, 1}};
    ArraySalesHistory history = ArraySalesHistory.ofUnits(LocalDate.of(2022, 5, 2), units);
    Evaluator evaluator = new Evaluator(history, Hierarchy.parse(List.of("series_id")));
    OriginStatistics statistics = evaluator.statistics(4);
    assertEquals("UNIT_VOLUME", statistics.weightBasis().name());
    assertArrayEquals(new double[] {0, 0, 1}, statistics.weights(1), 1e-15);
    assertEquals(2, statistics.excludedCount(1));
    assertTrue(Double.isNaN(statistics.squaredScales(1)[0]));
    assertEquals(0.0, statistics.squaredScales(1)[1]);
    assertEquals(3.0, statistics.squaredScales(1)[2], 1e-12);
    // Total 3, 5, 4, 11 -> differences 2, -1, 7 -> (4 + 1 + 49) / 3 = 18.
    assertEquals(18.0, statistics.squaredScales(0)[0], 1e-12);
    // Forecast c = 3 against 1: RMSSE sqrt(4 / 3); total 5 + 2 + 3 = 10 against 8: sqrt(4 / 18).
    EvaluationResult result = evaluator.evaluate(4, new double[][] {{5}, {2}, {3}});
    assertEquals(Math.sqrt(4.0 / 3), result.levels().get(1).weightedRmsse(), 1e-12);
    assertEquals(Math.sqrt(4.0 / 18), result.levels().get(0).weightedRmsse(), 1e-12);
    assertEquals((Math.sqrt(4.0 / 3) + Math.sqrt(4.0 / 18)) / 2, result.wrmsse(), 1e-12);
    assertEquals(2.0 / 3, result.levels().get(1).bias(), 1e-12);
  }

  @Test
  void shouldWeighBySalesValueAndFallBackToVolumeWithoutPricedSales() {
    int[][] units = {{1, 2, 1, 2}, {3, 1, 3, 1}};
    String[][] ids = {{"a"}, {"b"}};
    var attributes = org.lagmill.store.ArraySeriesAttributes.of(new String[] {"series_id"}, ids);
    // Series a at 4.0 from day 0; series b priced at 1.0 only from day 2 (a gap before: NaN -> value 0).
    PriceTable prices = new ArrayPriceTable(new int[][] {{0}, {2}}, new float[][] {{4f}, {1f}});
    ArraySalesHistory priced = new ArraySalesHistory(LocalDate.of(2022, 5, 2), units, attributes, prices,
        DayCalendar.EMPTY);
    OriginStatistics statistics = new Evaluator(priced, Hierarchy.parse(List.of("series_id"))).statistics(4);
    // a: 6 units x 4 = 24; b: days 2 and 3 priced, 3 + 1 = 4 -> weights 24/28, 4/28.
    assertEquals("SALES_VALUE", statistics.weightBasis().name());
    assertArrayEquals(new double[] {24.0 / 28, 4.0 / 28}, statistics.weights(1), 1e-15);
    PriceTable late = new ArrayPriceTable(new int[][] {{9}, {9}}, new float[][] {{4f}, {1f}});
    OriginStatistics volume = new Evaluator(new ArraySalesHistory(LocalDate.of(2022, 5, 2), units, attributes, late,
        DayCalendar.EMPTY), Hierarchy.parse(List.of("series_id"))).statistics(4);
    assertEquals("UNIT_VOLUME", volume.weightBasis().name());
    // No price before day 9: units 6 and 8 -> weights 6/14, 8/14.
    assertArrayEquals(new double[] {6.0 / 14, 8.0 / 14}, volume.weights(1), 1e-15);
  }

  @Test
  void shouldSerialiseWithJackson() throws Exception {
    SplittableRandom random = new SplittableRandom(SEED);
    ArraySalesHistory history = RandomHistories.history(random, 60, true);
    Evaluator evaluator = new Evaluator(history, Hierarchy.parse(HIERARCHIES));
    double[][] forecasts = BaselineForecaster.forecastAll(history, 46, 14, BaselineKind.MOVING_AVERAGE);
    EvaluationResult result = evaluator.evaluate(46, forecasts);
    ObjectMapper mapper = new ObjectMapper();
    String json = mapper.writeValueAsString(result);
    assertTrue(json.contains("\"name\":\"region x store\""), json);
    assertEquals(result, mapper.readValue(json, EvaluationResult.class));
  }
}
