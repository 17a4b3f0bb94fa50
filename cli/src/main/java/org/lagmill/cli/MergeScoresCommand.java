package org.lagmill.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.lagmill.eval.BacktestScoringPart;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.eval.MergedScoring;
import org.lagmill.eval.ScoringPart;
import org.lagmill.run.RunRecord;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code lagmill merge-scores}: one hierarchy-wide score from every shard's scoring part. */
@Command(name = "merge-scores", header = "Merge the shards' scoring parts into one hierarchy-wide score.",
    mixinStandardHelpOptions = true,
    description = {"Add every shard's scoring part (lagmill evaluate --scoring-part on each shard) and score the",
        "whole hierarchy: the same WRMSSE and per-level table one evaluate of the unsplit store gives. Backtest",
        "parts (lagmill backtest --scoring-part) merge origin by origin, with the mean WRMSSE over origins."},
    footer = {"", "Example:", "  lagmill merge-scores part-0.json part-1.json part-2.json --json"})
final class MergeScoresCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Parameters(arity = "1..*", paramLabel = "PART", description = "scoring part files, one per shard")
  List<Path> parts;

  @Mixin
  JsonOption json;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    if (BacktestScoringPart.KIND.equals(BacktestScoringPart.kindOf(parts.get(0)))) {
      return mergeBacktests(out);
    }
    List<ScoringPart> read = new ArrayList<>();
    for (Path part : parts) {
      read.add(ScoringPart.read(part));
    }
    EvaluationResult result = MergedScoring.merge(read);
    if (json.on) {
      Map<String, Object> document = new LinkedHashMap<>();
      document.put("forecast", result);
      document.put("partCount", read.size());
      out.println(RunRecord.JSON.writeValueAsString(document));
      return ExitCodes.OK;
    }
    ScoringPart first = read.get(0);
    out.printf(Locale.ROOT, "%d scoring parts, origin period %d, horizon %d%n", read.size(), first.originDay(),
        first.horizon());
    EvaluatePrinter.printLevels(out, result);
    return ExitCodes.OK;
  }

  /** Backtest parts (lagmill backtest --scoring-part): one merged score per origin and their mean. */
  private int mergeBacktests(PrintWriter out) throws IOException {
    List<BacktestScoringPart> read = new ArrayList<>();
    for (Path part : parts) {
      read.add(BacktestScoringPart.read(part));
    }
    List<EvaluationResult> origins = BacktestScoringPart.merge(read);
    double mean = BacktestScoringPart.meanWrmsse(origins);
    List<ScoringPart> first = read.get(0).origins();
    if (json.on) {
      List<Map<String, Object>> rows = new ArrayList<>();
      for (int k = 0; k < origins.size(); k++) {
        Map<String, Object> row = new LinkedHashMap<>();
        row.put("originDay", first.get(k).originDay());
        row.put("forecast", origins.get(k));
        rows.add(row);
      }
      Map<String, Object> document = new LinkedHashMap<>();
      document.put("origins", rows);
      document.put("meanModelWrmsse", mean);
      document.put("partCount", read.size());
      out.println(RunRecord.JSON.writeValueAsString(document));
      return ExitCodes.OK;
    }
    out.printf(Locale.ROOT, "%d backtest scoring parts, %d origins, horizon %d%n", read.size(), origins.size(),
        first.get(0).horizon());
    for (int k = 0; k < origins.size(); k++) {
      out.printf(Locale.ROOT, "  origin period %d: WRMSSE %.4f%n", first.get(k).originDay(), origins.get(k).wrmsse());
    }
    out.printf(Locale.ROOT, "mean WRMSSE over origins %.4f%n", mean);
    return ExitCodes.OK;
  }
}
