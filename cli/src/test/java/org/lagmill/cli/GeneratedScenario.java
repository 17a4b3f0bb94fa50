package org.lagmill.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The set-up most command tests share: {@code generate} writes a synthetic scenario and {@code ingest} reads its own
 * sales, calendar and prices (and closures, when asked) into a store. The tests differ only in size, seed and paths,
 * so the two command lines are kept here in one place rather than copied into each test; a change to the scenario's
 * files or to ingest's options is then made once. Tests that shape the data on purpose (sales cut short or rewritten
 * as long rows, a plan, other column options, ingest by shard) write their own ingest and may use {@link #generate}
 * alone.
 */
final class GeneratedScenario {
  private GeneratedScenario() {}

  /** Generates {@code series} series over {@code days} days from {@code seed} into {@code out}; returns {@code out}. */
  static Path generate(Path out, int series, int days, long seed) {
    MainRun.of("generate", "--out", out.toString(), "--series", String.valueOf(series), "--days",
        String.valueOf(days), "--seed", String.valueOf(seed)).expectOk();
    return out;
  }

  /**
   * Ingests the scenario's sales.csv, calendar.csv and prices.csv, and its closures.csv when {@code withClosures},
   * into {@code store} quietly; returns {@code store}.
   */
  static Path ingest(Path scenario, Path store, boolean withClosures) {
    List<String> args = new ArrayList<>(List.of("ingest", "--sales", scenario.resolve("sales.csv").toString(),
        "--calendar", scenario.resolve("calendar.csv").toString(), "--prices",
        scenario.resolve("prices.csv").toString()));
    if (withClosures) {
      args.addAll(List.of("--closures", scenario.resolve("closures.csv").toString()));
    }
    args.addAll(List.of("--store", store.toString(), "--quiet"));
    MainRun.of(args.toArray(new String[0])).expectOk();
    return store;
  }

  /** {@link #generate} into {@code scenario}, then {@link #ingest} of it into {@code store}; returns {@code store}. */
  static Path generateAndIngest(Path scenario, Path store, int series, int days, long seed, boolean withClosures) {
    return ingest(generate(scenario, series, days, seed), store, withClosures);
  }
}
