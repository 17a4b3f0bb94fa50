package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.lagmill.features.FeatureFamily;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.run.RunRecord;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelManifest;
import org.lagmill.training.PartitionReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill model}: shows what a model directory holds, from its manifest alone. */
@Command(name = "model", header = "Show a model's features, parameters, windows and importance.",
    mixinStandardHelpOptions = true,
    description = {"Show what a trained model directory holds: the days it learned from and was validated on, the",
        "feature spec (lags, rolling windows), the training parameters, each partition's size and best iteration, and",
        "the features by importance with a label in plain words. Reads only manifest.json."},
    footer = {"", "Example:", "  lagmill model --model models/week49"})
final class ModelCommand implements Callable<Integer> {
  /** Features listed by importance, at most. */
  static final int LISTED_FEATURE_COUNT = 20;

  @Spec
  CommandSpec spec;

  @Mixin
  ModelOption model;

  @Option(names = "--all", description = "list every feature, not only the 20 with the most gain")
  boolean all;

  @Mixin
  JsonOption json;

  @Override
  public Integer call() throws Exception {
    ModelManifest manifest = ModelDirectory.readManifest(model.dir);
    FeatureSpec features = FeatureSpecYaml.parse(manifest.featureSpecYaml(), model.dir.resolve(ModelManifest.FILE_NAME)
        .toString());
    List<Map<String, Object>> importance = importance(manifest.partitions());
    PrintWriter out = spec.commandLine().getOut();
    if (json.on) {
      Map<String, Object> document = new LinkedHashMap<>();
      document.put("model", model.dir.toString());
      document.put("createdAt", manifest.createdAt());
      document.put("storeFingerprint", manifest.storeFingerprint());
      document.put("windows", windows(manifest));
      document.put("featureSpec", FeatureSpecYaml.values(features));
      document.put("trainParameters", manifest.trainParameters());
      document.put("datasetParameters", manifest.datasetParameters());
      document.put("partitionAttribute", manifest.partitionAttribute());
      document.put("zeroRowsKept", manifest.zeroRowsKept());
      List<Map<String, Object>> partitions = new ArrayList<>();
      for (PartitionReport p : manifest.partitions()) {
        Map<String, Object> row = new LinkedHashMap<>();
        row.put("partitionValue", p.partitionValue());
        row.put("seriesCount", p.seriesCount());
        row.put("trainingRowCount", p.trainingRowCount());
        row.put("droppedZeroRowCount", p.droppedZeroRowCount());
        row.put("zeroRowWeight", p.zeroRowWeight());
        row.put("featureCount", p.featureCount());
        row.put("bestIteration", p.bestIteration());
        row.put("iterationCount", p.iterationCount());
        row.put("continuedFrom", p.continuedFrom());
        row.put("startingRounds", p.startingRounds());
        row.put("validationMetric", p.validationMetric());
        partitions.add(row);
      }
      document.put("partitions", partitions);
      document.put("importance", importance);
      out.println(RunRecord.JSON.writeValueAsString(document));
      return ExitCodes.OK;
    }
    out.printf("model                %s (created %s, store fingerprint %s)%n", model.dir, manifest.createdAt(),
        manifest.storeFingerprint());
    windows(manifest).forEach((name, value) -> out.printf("%-20s %s%n", name, value));
    out.printf("strategy             %s, horizon %s%n", features.strategy().configName(),
        periods(features.horizonDays()));
    out.printf("lags                 %s%n", java.util.Arrays.toString(features.lagDays()));
    out.printf("rolling windows      %s, ending %s before the row; %s%n",
        java.util.Arrays.toString(features.rollingWindowDays()), periods(features.rollingShiftDays()),
        features.rollingStats().stream().map(FeatureSpec.RollingStat::configName).toList());
    out.printf("partitioned by       %s%n", manifest.partitionAttribute() == null ? "none (one model)"
        : manifest.partitionAttribute());
    out.println("zero-sales rows kept " + (manifest.zeroRowsKept() == 1.0 ? "all"
        : String.format(Locale.ROOT, "%s (each weighted %s)", manifest.zeroRowsKept(), 1 / manifest.zeroRowsKept())));
    out.println("training parameters  " + text(manifest.trainParameters()));
    out.println("dataset parameters   " + text(manifest.datasetParameters()));
    for (PartitionReport p : manifest.partitions()) {
      out.printf(Locale.ROOT, "partition %-10s %,d series, %,d training rows, %d features, best iteration %d of %d%n",
          p.partitionValue(), p.seriesCount(), p.trainingRowCount(), p.featureCount(), p.bestIteration(),
          p.iterationCount());
      String dropped = PartitionReport.zeroRowsNotice(List.of(p));
      if (dropped != null) {
        out.println("  " + dropped);
      }
      if (p.continued()) {
        out.println("  " + TrainPrinter.continuation(p));
      }
    }
    int shown = all ? importance.size() : Math.min(LISTED_FEATURE_COUNT, importance.size());
    out.printf("features by share of gain (%d of %d, summed over partitions)%n", shown, importance.size());
    out.printf("  %7s %7s  %-32s %-20s %s%n", "gain", "splits", "feature", "family", "meaning");
    for (Map<String, Object> row : importance.subList(0, shown)) {
      out.printf(Locale.ROOT, "  %6.1f%% %7d  %-32s %-20s %s%n", 100 * ((Number) row.get("gainShare")).doubleValue(),
          row.get("splitCount"), row.get("feature"), row.get("family"), row.get("label"));
    }
    return ExitCodes.OK;
  }

  private static Map<String, Object> windows(ModelManifest m) {
    Map<String, Object> w = new LinkedHashMap<>();
    w.put("learned from", m.trainingFirstDate() + " .. " + m.trainingLastDate());
    w.put("validated on", m.validationFirstDate() + " .. " + m.validationLastDate());
    return w;
  }

  /** Gain and splits summed over partitions, largest gain first, with family and plain-words label. */
  static List<Map<String, Object>> importance(List<PartitionReport> partitions) {
    Map<String, double[]> sums = new LinkedHashMap<>();
    double total = 0;
    for (PartitionReport p : partitions) {
      for (PartitionReport.FeatureImportanceRow row : p.featureImportance()) {
        double[] s = sums.computeIfAbsent(row.feature(), k -> new double[2]);
        s[0] += row.gain();
        s[1] += row.splitCount();
        total += row.gain();
      }
    }
    List<Map<String, Object>> rows = new ArrayList<>();
    for (Map.Entry<String, double[]> e : sums.entrySet()) {
      Map<String, Object> row = new LinkedHashMap<>();
      row.put("feature", e.getKey());
      row.put("family", FeatureFamily.of(e.getKey()).label());
      row.put("label", FeatureFamily.label(e.getKey(), "periods"));
      row.put("gain", e.getValue()[0]);
      row.put("gainShare", total > 0 ? e.getValue()[0] / total : 0.0);
      row.put("splitCount", (long) e.getValue()[1]);
      rows.add(row);
    }
    rows.sort((a, b) -> Double.compare((double) b.get("gain"), (double) a.get("gain")));
    return rows;
  }

  private static String text(Map<String, Object> parameters) {
    List<String> parts = new ArrayList<>();
    parameters.forEach((k, v) -> parts.add(k + "=" + v));
    return String.join(", ", parts);
  }

  private static String periods(int count) {
    return count + (count == 1 ? " period" : " periods");
  }
}
