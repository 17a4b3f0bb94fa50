package org.lagmill.cli;

import java.io.PrintWriter;
import java.time.Duration;
import java.util.Locale;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.learner.DistributedBinning;
import org.lagmill.learner.TreeLearner;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.run.Run;
import org.lagmill.run.Stage;
import org.lagmill.training.ClusterSpec;
import org.lagmill.training.DistributedTraining;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.RankExchange;
import org.lagmill.training.RankFailureException;
import org.lagmill.training.TrainingPlan;

/**
 * {@code lagmill train --machines … --rank K}: this process's rank of a distributed training. Joins the other ranks,
 * trains its shard's share, and on rank 0 writes the model directory. When another rank dies while this one waits
 * inside LightGBM (whose sockets would wait for it or spin), the exchange's reader thread prints the cause and ends
 * the process at once with {@link ExitCodes#RANK_FAILED}.
 */
final class DistributedTrainRun {
  /** How long a rank whose LightGBM call failed waits for the exchange to report a dead rank first. */
  private static final long PEER_REPORT_GRACE_MILLIS = 3_000;

  private DistributedTrainRun() {}

  static int run(TrainCommand command, SalesStore shard, TrainingPlan plan, Run run) throws Exception {
    if (command.machines == null || command.rank == null) {
      throw new InvalidRequestException("--machines and --rank go together: give every rank the same --machines "
          + "list and its own --rank");
    }
    ClusterSpec cluster = ClusterSpec.parse(command.machines);
    int rank = command.rank;
    cluster.checkRank(rank);
    TreeLearner learner = TreeLearner.parse(command.treeLearner);
    if (learner == TreeLearner.SERIAL) {
      throw new InvalidRequestException("--tree-learner serial trains on one machine; use data or voting with "
          + "--machines");
    }
    if (command.rankTimeoutSeconds < 5 || command.rankTimeoutSeconds > 86_400) {
      throw new InvalidRequestException("--rank-timeout " + command.rankTimeoutSeconds + " is outside 5..86400 "
          + "seconds");
    }
    StoreManifest.Shard part = shard.manifest().shard();
    if (part == null || part.partCount() != cluster.rankCount() || part.part() != rank) {
      throw new InvalidRequestException("rank " + rank + " of " + cluster.rankCount() + " needs shard " + rank
          + " of a store split in " + cluster.rankCount() + " (lagmill shard --parts " + cluster.rankCount() + "); "
          + "--store " + command.store.dir + " is " + (part == null ? "a whole store"
              : "shard " + part.part() + " of " + part.partCount()));
    }
    String identity = "split " + part.sourceName() + " in " + part.partCount() + " by " + part.attribute() + "\n"
        + "first date " + shard.firstDate() + ", " + shard.periodDays() + " days per period, cut at "
        + shard.dateOf(plan.cutDayIndex()) + "\n" + "tree learner " + learner.lightGbmName() + "\n"
        + "train " + plan.trainParameters() + "\n" + "dataset " + plan.datasetParameters() + "\n"
        + "validation " + plan.validationDays() + ", weights " + plan.salesValueWeights() + ", refit " + plan.refit()
        + ", zero rows kept " + plan.zeroRowsKept() + "\n" + FeatureSpecYaml.format(plan.spec());
    Duration timeout = Duration.ofSeconds(command.rankTimeoutSeconds);
    int networkMinutes = Math.max(1, (command.rankTimeoutSeconds + 59) / 60);
    PrintWriter out = command.commandSpec.commandLine().getOut();
    run.record().configure("store", command.store.dir.toString()).configure("model", command.model.toString())
        .configure("machines", cluster.machines()).configure("rank", rank).configure("treeLearner",
            learner.lightGbmName())
        .configure("plan", plan.toString());
    try (RankExchange exchange = RankExchange.join(cluster, rank, identity, timeout, message -> {
      System.err.println("lagmill: rank " + rank + " stops: " + message);
      System.err.flush();
      System.out.flush();
      Runtime.getRuntime().halt(ExitCodes.RANK_FAILED);
    })) {
      Stage trainStage = run.stage("train");
      DistributedTraining.Result result;
      try {
        result = DistributedTraining.train(shard, plan, exchange, cluster, learner, networkMinutes,
            trainStage.budget(), ConsoleProgress.forCommand(command.quiet.on));
      } catch (RankFailureException e) {
        exchange.fail(e.getMessage());
        trainStage.close();
        throw e;
      } catch (RuntimeException | Error e) {
        // A dead rank often shows here first as LightGBM's socket error; give the exchange's reader a moment to name
        // the rank that died (it ends the process with that message), else report this failure to the others.
        if (e instanceof org.lagmill.learner.LearnerException) {
          try {
            Thread.sleep(PEER_REPORT_GRACE_MILLIS);
          } catch (InterruptedException interrupted) {
            Thread.currentThread().interrupt();
          }
        }
        exchange.fail(e.getMessage());
        throw e;
      }
      try {
        PartitionReport report = result.models().partitions().get(0).report();
        long learnerPeakBytes = trainStage.budget().peakBytes();
        trainStage.addRows(result.localTrainingRowCount());
        if (rank == 0) {
          // the model learned from every shard: it records the store they were split from
          String trainedOn = part.sourceFingerprint() != null ? part.sourceFingerprint() : shard.fingerprint();
          ModelDirectory.save(result.models(), command.model, shard, plan, trainedOn, result.dispersionRows());
          run.record().result("partitions", java.util.List.of(report));
        }
        DistributedTraining.Binning binning = result.binning();
        run.record().result("rank", rank).result("modelSha256", result.modelSha256())
            .result("categoriesPerSplit", binning.categoriesPerSplit())
            .result("categoricalsBinnedAsNumbers", binning.categoricalsBinnedAsNumbers());
        if (binning.differsFromOneMachine() && rank == 0 && !command.quiet.on) {
          java.util.List<String> changes = new java.util.ArrayList<>();
          if (binning.categoriesPerSplit() != DistributedBinning.DEFAULT_CATEGORIES_PER_SPLIT) {
            changes.add(String.format(Locale.ROOT, "categorical splits may hold up to %d categories (one machine: %d),"
                + " so that LightGBM 4.3.0's split exchange cannot overrun", binning.categoriesPerSplit(),
                DistributedBinning.DEFAULT_CATEGORIES_PER_SPLIT));
          }
          if (!binning.categoricalsBinnedAsNumbers().isEmpty()) {
            changes.add(binning.categoricalsBinnedAsNumbers().size() + " categorical feature(s) binned as numbers on "
                + "every rank because some rank's bin sample holds no category for them "
                + binning.categoricalsBinnedAsNumbers());
          }
          out.println("distributed binning: " + String.join("; ", changes));
        }
        if (!command.quiet.on) {
          out.printf(Locale.ROOT, "rank %d of %d: %,d of %,d training rows here, best iteration %d of %d, validation "
              + "%s over all ranks %.5f, model SHA-256 %s (the same on every rank)%n", rank, cluster.rankCount(),
              result.localTrainingRowCount(), report.trainingRowCount(),
              report.bestIteration(), report.iterationCount(), report.validationMetric(),
              report.validationCurve().length == 0 ? Double.NaN
                  : report.validationCurve()[Math.max(0, report.bestIteration() - 1)],
              result.modelSha256());
          String dropped = PartitionReport.zeroRowsNotice(java.util.List.of(report));
          if (dropped != null) {
            out.printf(Locale.ROOT, "rank %d: over all ranks %s%n", rank, dropped);
          }
          out.printf(Locale.ROOT, "rank %d: peak RSS %,d MB, learner off-heap peak %,d KB%s%n", rank,
              ProcessMemory.peakResidentBytes() >> 20, learnerPeakBytes >> 10,
              rank == 0 ? ", model written to " + command.model : "");
        }
      } finally {
        result.models().close();
        trainStage.close();
      }
    }
    if (rank == 0) {
      run.record().write(command.model);
    }
    return ExitCodes.OK;
  }
}
