package org.lagmill.eval;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.StoreManifest;

/**
 * One shard's additive share of a rolling-origin backtest's hierarchy-wide scores: the {@link ScoringPart} of the
 * model's point forecasts at every origin, in origin order, built exactly as {@code evaluate} builds one. Merged
 * origin by origin ({@link #merge}), the shards' parts give the scores one store holding every shard's series would
 * give the same forecasts.
 *
 * <p>Point forecasts only: the backtest's quantiles of an aggregate come from the distribution of the sum of its
 * series ({@link IntervalAggregation}), which does not add over shards, so the parts carry no quantiles and the
 * merged scores no WSPL.
 *
 * @param kind always {@link #KIND}
 * @param formatVersion {@link #FORMAT_VERSION}
 * @param origins one part per origin, in the backtest's origin order
 */
public record BacktestScoringPart(String kind, int formatVersion, List<ScoringPart> origins) {
  public static final String KIND = "lagmill-backtest-scoring-part";
  public static final int FORMAT_VERSION = 1;
  private static final ObjectMapper JSON = new ObjectMapper();

  public BacktestScoringPart {
    origins = List.copyOf(origins);
  }

  /**
   * Collects the parts of one backtest as its origins are forecast.
   *
   * <p>Not thread-safe; one per backtest.
   */
  public static final class Collector {
    private final SalesHistory history;
    private final Evaluator evaluator;
    private final StoreManifest.Shard shard;
    private final Map<String, String> wholeStoreParents;
    private final List<ScoringPart> origins = new ArrayList<>();

    /**
     * @param evaluator bound to {@code history} with the backtest's levels and horizon
     * @param shard the store's shard record, or null for a whole store
     * @param wholeStoreParents the whole store's nesting ({@link StoreManifest#nesting()} of a shard)
     */
    public Collector(SalesHistory history, Evaluator evaluator, StoreManifest.Shard shard,
        Map<String, String> wholeStoreParents) {
      this.history = history;
      this.evaluator = evaluator;
      this.shard = shard;
      this.wholeStoreParents = wholeStoreParents;
    }

    /**
     * Adds the part of one origin's point forecasts, scored on known actuals as the backtest scores them.
     *
     * @param point {@code point[s][k]}: series {@code s}, period {@code originDay + k}
     */
    public void onOrigin(int originDay, double[][] point) {
      AggregateTable aggregated = evaluator.aggregator().aggregateForecasts(evaluator.withoutUnknownActuals(point,
          originDay));
      origins.add(ScoringPart.build(history, evaluator, originDay, aggregated, null, shard, wholeStoreParents));
    }

    public BacktestScoringPart finish() {
      if (origins.isEmpty()) {
        throw new IllegalStateException("no origin was forecast");
      }
      return new BacktestScoringPart(KIND, FORMAT_VERSION, origins);
    }
  }

  /**
   * Merges every shard's part origin by origin ({@link MergedScoring#merge}).
   *
   * @return one hierarchy-wide score per origin, in origin order
   * @throws InvalidRequestException when the parts hold different origins
   */
  public static List<EvaluationResult> merge(List<BacktestScoringPart> parts) {
    if (parts.isEmpty()) {
      throw new InvalidRequestException("need at least one backtest scoring part, got none");
    }
    BacktestScoringPart first = parts.get(0);
    List<EvaluationResult> merged = new ArrayList<>();
    for (int k = 0; k < first.origins().size(); k++) {
      List<ScoringPart> atOrigin = new ArrayList<>();
      for (int p = 0; p < parts.size(); p++) {
        BacktestScoringPart part = parts.get(p);
        if (part.origins().size() != first.origins().size()
            || part.origins().get(k).originDay() != first.origins().get(k).originDay()) {
          throw new InvalidRequestException("backtest scoring part " + (p + 1) + " has origins "
              + originDays(part) + ", part 1 " + originDays(first) + "; back-test every shard with the same "
              + "origins and step");
        }
        atOrigin.add(part.origins().get(k));
      }
      merged.add(MergedScoring.merge(atOrigin));
    }
    return merged;
  }

  /** The mean of the origins' WRMSSE, as a backtest summarises its model. */
  public static double meanWrmsse(List<EvaluationResult> origins) {
    double sum = 0;
    for (EvaluationResult origin : origins) {
      sum += origin.wrmsse();
    }
    return sum / origins.size();
  }

  private static List<Integer> originDays(BacktestScoringPart part) {
    return part.origins().stream().map(ScoringPart::originDay).toList();
  }

  /** Writes the part as JSON (to a temporary sibling, renamed into place). */
  public void write(Path file) throws IOException {
    org.lagmill.io.AtomicFiles.write(file, JSON.writeValueAsBytes(this));
  }

  /**
   * Reads a part written by {@link #write}.
   *
   * @throws InvalidRequestException when the file is not a backtest scoring part
   */
  public static BacktestScoringPart read(Path file) throws IOException {
    try {
      BacktestScoringPart part = JSON.readValue(file.toFile(), BacktestScoringPart.class);
      if (!KIND.equals(part.kind()) || part.formatVersion() != FORMAT_VERSION) {
        throw new InvalidRequestException(file + ": kind " + part.kind() + " version " + part.formatVersion()
            + ", expected " + KIND + " version " + FORMAT_VERSION);
      }
      return part;
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      throw new InvalidRequestException(file + ": not a backtest scoring part (" + e.getOriginalMessage() + ")", e);
    }
  }

  /** The {@code kind} field of a scoring file, or null when it has none: which of the two part formats it is. */
  public static String kindOf(Path file) throws IOException {
    try {
      com.fasterxml.jackson.databind.JsonNode kind = JSON.readTree(file.toFile()).get("kind");
      return kind == null ? null : kind.asText();
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      throw new InvalidRequestException(file + ": not a scoring part (" + e.getOriginalMessage() + ")", e);
    }
  }
}
