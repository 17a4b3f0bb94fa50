package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.concurrent.Callable;
import org.lagmill.features.FeatureSpec;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.store.Periods;
import org.lagmill.run.Run;
import org.lagmill.run.Stage;
import org.lagmill.store.SalesStore;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.TrainingPlan;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill train}: streams features from a store into LightGBM and saves the model directory. */
@Command(name = "train", header = "Train a model on a store's history, streaming features into LightGBM.",
    mixinStandardHelpOptions = true,
    description = {"Train a model on a store's history: features stream from the store into LightGBM's Dataset,",
        "the last --horizon days before the cut are the validation window for early stopping."},
    footer = {"", "Example:", "  lagmill train --store stores/chain --model models/week49 --rounds 800",
        "  lagmill train --store stores/chain --model models/by-store \\",
        "      --partition-by store --until 2026-11-29"})
final class TrainCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store directory")
  Path store;

  @Option(names = "--model", required = true, paramLabel = "DIR", description = "model directory to write")
  Path model;

  @Option(names = "--until", paramLabel = "DATE", description = "last day the model may learn from (default: the "
      + "store's last day)")
  LocalDate until;

  @Option(names = "--memory-limit", paramLabel = "SIZE", converter = ByteSizeConverter.class,
      description = "off-heap budget: bytes, or with k, m, g (1024-based), e.g. 512m or 2g (default: none)")
  Long memoryLimitBytes;

  @Option(names = "--quiet", description = "print nothing but errors")
  boolean quiet;

  @Mixin
  TrainingOptions training;

  @Option(names = "--machines", paramLabel = "HOST:PORT,…", description = {"train one model over several machines,",
      "each holding one shard (lagmill shard), on LightGBM's distributed learner: every rank's host:port in rank",
      "order; rank 0 also uses its port + 1 (docs/distributed.md)"})
  String machines;

  @Option(names = "--rank", paramLabel = "K", description = "this machine's position in --machines, from 0; rank 0 "
      + "writes the model directory")
  Integer rank;

  @Option(names = "--tree-learner", paramLabel = "NAME", defaultValue = "data", description = {"with --machines:",
      "data (histograms reduced over all ranks) or voting (top features voted, less traffic)",
      "(default: ${DEFAULT-VALUE})"})
  String treeLearner;

  @Option(names = "--rank-timeout", paramLabel = "SECONDS", defaultValue = "600", description = {"with --machines:",
      "longest wait for another rank (to connect, or at a step every rank takes together) before this one stops;",
      "LightGBM's own socket time-out is this in whole minutes, at least 1 (default: ${DEFAULT-VALUE})"})
  int rankTimeoutSeconds;

  @Override
  public Integer call() throws Exception {
    FeatureSpec spec = training.featureSpec();
    try (Run run = Run.start("train", MemoryLimitOption.bytes(memoryLimitBytes));
        Stage opening = run.stage("open store");
        SalesStore opened = SalesStore.open(store, run.budget().child("store"))) {
      opening.close();
      int cut = until == null ? opened.dayCount() - 1
          : (int) Math.max(-1, Math.min(Integer.MAX_VALUE, Periods.periodIndexOf(opened.firstDate(),
              opened.periodDays(), until.toEpochDay())));
      if (cut < 0 || cut >= opened.dayCount()) {
        throw new InvalidRequestException("--until " + until + " is outside the store's days " + opened.firstDate()
            + " .. " + opened.dateOf(opened.dayCount() - 1));
      }
      TrainingPlan plan = training.plan(spec, cut);
      if (machines != null || rank != null) {
        return DistributedTrainRun.run(this, opened, plan, run);
      }
      run.record().configure("store", store.toString()).configure("model", model.toString())
          .configure("cutDate", opened.dateOf(cut).toString()).configure("plan", plan.toString());
      Stage trainStage = run.stage("train");
      try (ModelSet models = ModelTraining.train(opened, plan, trainStage.budget(),
          ConsoleProgress.forCommand(quiet))) {
        long learnerPeakBytes = trainStage.budget().peakBytes();
        trainStage.addRows(models.partitions().stream().mapToLong(p -> p.report().trainingRowCount()).sum()).close();
        try (Stage saving = run.stage("save model")) {
          ModelDirectory.save(models, model, opened, plan, opened.fingerprint());
        }
        run.record().result("partitions", models.partitions().stream().map(ModelSet.Partition::report).toList());
        printSummary(models, opened, learnerPeakBytes);
      } finally {
        trainStage.close();
      }
      run.record().write(model);
    }
    return ExitCodes.OK;
  }

  private void printSummary(ModelSet models, SalesStore opened, long learnerPeakBytes) {
    if (quiet) {
      return;
    }
    PrintWriter out = commandSpec.commandLine().getOut();
    for (ModelSet.Partition partition : models.partitions()) {
      PartitionReport r = partition.report();
      out.printf("model %-12s %,d series, Dataset %,d rows x %d features (%.1f bytes per row), best iteration %d of"
          + " %d, validation %s %.5f%n", r.partitionValue(), r.seriesCount(), r.trainingRowCount(), r.featureCount(),
          r.datasetBytesPerRow(), r.bestIteration(), r.iterationCount(), r.validationMetric(),
          r.validationCurve().length == 0 ? Double.NaN : r.validationCurve()[Math.max(0, r.bestIteration() - 1)]);
    }
    long peak = ProcessMemory.peakResidentBytes();
    long rows = models.partitions().stream().mapToLong(p -> p.report().trainingRowCount()).max().orElse(0);
    out.printf("peak RSS %,d MB (%.1f bytes per training row of the largest partition); off-heap held: store %,d MB "
        + "mapped, learner peak %,d KB%n", peak >> 20, rows == 0 ? 0 : peak / (double) rows,
        opened.offHeapBytes() >> 20,
        learnerPeakBytes >> 10);
    out.printf("model written to %s%n", model);
  }
}
