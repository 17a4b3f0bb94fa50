package org.lagmill.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.eval.BacktestScoringPart;
import org.lagmill.eval.BacktestSettings;
import org.lagmill.eval.BaselineKind;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.eval.Evaluator;
import org.lagmill.eval.Hierarchy;
import org.lagmill.eval.RollingOriginBacktest;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.SalesInputs;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.scenario.ScenarioGenerator;
import org.lagmill.scenario.ScenarioSpec;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSharding;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;

/**
 * Each shard back-tested on its own with its backtest scoring part, the parts merged origin by origin, against the
 * whole store's evaluation of the same forecasts (every shard's, put together by series id): WRMSSE per origin, the
 * mean over origins and every level's figures agree to 1e-9, with levels (the total, districts, outlets) whose
 * aggregates span shards.
 */
class BacktestScoringPartTest {
  private static final int HORIZON = 7;
  private static final int ORIGINS = 2;
  private static final int PARTS = 3;
  private static final Hierarchy HIERARCHY = Hierarchy.parse(List.of("district>outlet", "section>family>article"));

  @TempDir
  Path temp;

  @Test
  void shouldMergeTheShardsBacktestsIntoTheWholeStoresScoresOfTheSameForecasts() throws IOException {
    Path data = temp.resolve("data");
    ScenarioGenerator.write(new ScenarioSpec(48, 120, ScenarioSpec.DEFAULT_START_DATE, 9L, 0, false,
        ScenarioSpec.DAILY), data);
    Path whole = temp.resolve("whole");
    Path shards = temp.resolve("shards");
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(HORIZON), 5, 0, HORIZON, null);
    BacktestSettings settings = new BacktestSettings(ORIGINS, HORIZON, HORIZON, List.of(BaselineKind.NAIVE),
        HIERARCHY, new double[0]);
    Map<String, double[]> forecastById = new HashMap<>();
    List<BacktestScoringPart> parts = new ArrayList<>();
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(data.resolve(ScenarioGenerator.SALES_FILE))
          .with(SideFile.CALENDAR, data.resolve(ScenarioGenerator.CALENDAR_FILE))
          .with(SideFile.PRICES, data.resolve(ScenarioGenerator.PRICES_FILE)), whole), budget);
      StoreSharding.shard(whole, PARTS, "article", shards, budget);
      for (int part = 0; part < PARTS; part++) {
        try (SalesStore shard = SalesStore.open(shards.resolve(StoreSharding.shardDirectoryName(part)), budget)) {
          StoreManifest manifest = shard.manifest();
          BacktestScoringPart.Collector collector = new BacktestScoringPart.Collector(shard,
              new Evaluator(shard, HIERARCHY, HORIZON), manifest.shard(), manifest.nesting());
          RollingOriginBacktest.run(shard, plan.withCutDayIndex(shard.dayCount() - 1), settings, budget,
              ProgressListener.SILENT, (origin, point, dispersion) -> {
                collector.onOrigin(origin, point);
                for (int s = 0; s < point.length; s++) {
                  forecastById.put(origin + "|" + shard.attributes().seriesId(s), point[s]);
                }
              });
          // through the file format: doubles must round-trip exactly
          Path file = temp.resolve("part-" + part + ".json");
          collector.finish().write(file);
          parts.add(BacktestScoringPart.read(file));
        }
      }
      List<EvaluationResult> merged = BacktestScoringPart.merge(parts);
      assertEquals(ORIGINS, merged.size());
      try (SalesStore store = SalesStore.open(whole, budget)) {
        Evaluator evaluator = new Evaluator(store, HIERARCHY, HORIZON);
        double sum = 0;
        for (int k = 0; k < ORIGINS; k++) {
          int origin = settings.originDayIndex(store.dayCount(), k);
          double[][] point = new double[store.seriesCount()][];
          for (int s = 0; s < point.length; s++) {
            point[s] = forecastById.get(origin + "|" + store.attributes().seriesId(s));
            assertTrue(point[s] != null, "series " + store.attributes().seriesId(s) + " was forecast by no shard");
          }
          EvaluationResult expected = evaluator.evaluate(evaluator.statistics(origin), evaluator.aggregator()
              .aggregateForecasts(evaluator.withoutUnknownActuals(point, origin)), null);
          EvaluationResult actual = merged.get(k);
          String context = "origin " + origin;
          assertEquals(origin, actual.originDay(), context);
          assertEquals(expected.wrmsse(), actual.wrmsse(), 1e-9, context);
          assertEquals(expected.levels().size(), actual.levels().size(), context);
          for (int l = 0; l < expected.levels().size(); l++) {
            EvaluationResult.LevelResult e = expected.levels().get(l);
            EvaluationResult.LevelResult a = actual.levels().get(l);
            assertEquals(e.name(), a.name(), context);
            assertEquals(e.aggregateCount(), a.aggregateCount(), context + ", " + e.name());
            assertEquals(e.wrmsseContribution(), a.wrmsseContribution(), 1e-9, context + ", " + e.name());
            assertEquals(e.weightedRmsse(), a.weightedRmsse(), 1e-9, context + ", " + e.name());
          }
          sum += expected.wrmsse();
        }
        assertEquals(sum / ORIGINS, BacktestScoringPart.meanWrmsse(merged), 1e-9);
      }
    }
    boolean anySpanning = parts.get(0).origins().get(0).levels().stream().anyMatch(l -> !l.wholeInOneShard());
    assertTrue(anySpanning, "some level must span shards, or the merge proves little");
    // parts of different origins do not merge
    BacktestScoringPart shorter = new BacktestScoringPart(BacktestScoringPart.KIND, BacktestScoringPart.FORMAT_VERSION,
        parts.get(1).origins().subList(0, 1));
    InvalidRequestException refused = assertThrows(InvalidRequestException.class,
        () -> BacktestScoringPart.merge(List.of(parts.get(0), shorter, parts.get(2))));
    assertTrue(refused.getMessage().contains("back-test every shard with the same origins"), refused.getMessage());
  }
}
