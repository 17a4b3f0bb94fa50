package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.function.Consumer;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.learner.LearnerException;
import org.lagmill.learner.TreeLearner;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.training.ClusterSpec;
import org.lagmill.training.DistributedTraining;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.RankExchange;
import org.lagmill.training.RankFailureException;
import org.lagmill.training.TrainingPlan;

/**
 * One rank of a training over several machines, as the {@code train} command runs it with {@link Setting#MACHINES}:
 * checks the cluster request against this rank's shard, joins the other ranks, trains this shard's share on
 * LightGBM's distributed learner ({@link DistributedTraining}), and on rank 0 saves the model directory with its
 * {@code run.json}. How the process ends when another rank dies is the caller's: it is told through a callback.
 */
public final class DistributedTrainJob {
  /** Shortest and longest wait for another rank a request may set, in seconds. */
  static final int MIN_RANK_TIMEOUT_SECONDS = 5;

  static final int MAX_RANK_TIMEOUT_SECONDS = 86_400;

  /** How long a rank whose LightGBM call failed waits for the exchange to report a dead rank first. */
  private static final long PEER_REPORT_GRACE_MILLIS = 3_000;

  private DistributedTrainJob() {}

  /**
   * What this rank trains.
   *
   * @param train the store (this rank's shard), model directory, cut, memory limit and the one plan, as for one
   *     machine; a starting model or several members are refused
   * @param machines every rank's {@code host:port} in rank order ({@link ClusterSpec#parse}), or null when not given
   * @param rank this process's rank, from 0, or null when not given
   * @param treeLearner LightGBM's learner over several machines by name: {@code data} or {@code voting}
   * @param rankTimeoutSeconds bound on every wait for another rank, 5 to 86,400 seconds; LightGBM's socket time-out
   *     is this in whole minutes, at least 1
   */
  public record Request(TrainJob.Request train, String machines, Integer rank, String treeLearner,
      int rankTimeoutSeconds) {}

  /**
   * What this rank trained.
   *
   * @param rank this process's rank
   * @param rankCount the number of ranks
   * @param localTrainingRowCount the training rows this rank held
   * @param partition the model's report: training rows, iterations and validation loss over all ranks
   * @param modelSha256 the SHA-256 of the model text, the same on every rank
   * @param binning what the ranks agreed beyond one machine's settings
   * @param learnerPeakBytes the training stage's peak off-heap bytes
   * @param modelDir where the model directory was written (rank 0), or null on the other ranks
   */
  public record Outcome(int rank, int rankCount, long localTrainingRowCount, PartitionReport partition,
      String modelSha256, DistributedTraining.Binning binning, long learnerPeakBytes, Path modelDir) {}

  /**
   * Trains this rank's share and, on rank 0, writes the model directory and its {@code run.json}.
   *
   * @param onPeerLost told, from the exchange's reader thread, the cause when another rank dies or fails, even while
   *     this rank waits inside LightGBM (whose sockets would wait for the dead rank or spin); a front end ends the
   *     process there
   * @throws InvalidRequestException when the cluster request is incomplete or out of range, or the store is not this
   *     rank's shard
   * @throws RankFailureException when a rank does not come, disagrees, fails or leaves
   */
  public static Outcome run(Request request, ProgressListener progress, Consumer<String> onPeerLost)
      throws Exception {
    return TrainJob.open(request.train(), (opened, plan, run) -> runRank(request, opened, plan, run, progress,
        onPeerLost));
  }

  private static Outcome runRank(Request request, SalesStore opened, TrainingPlan plan, Run run,
      ProgressListener progress, Consumer<String> onPeerLost) throws IOException {
    if (request.machines() == null || request.rank() == null) {
      throw new InvalidRequestException(Setting.MACHINES + " and " + Setting.RANK + " go together: give every rank "
          + "the same " + Setting.MACHINES + " list and its own " + Setting.RANK);
    }
    ClusterSpec cluster = ClusterSpec.parse(request.machines());
    int rank = request.rank();
    cluster.checkRank(rank);
    TreeLearner learner = TreeLearner.parse(request.treeLearner());
    if (learner == TreeLearner.SERIAL) {
      throw new InvalidRequestException(Setting.TREE_LEARNER + " serial trains on one machine; use data or voting "
          + "with " + Setting.MACHINES);
    }
    int timeoutSeconds = request.rankTimeoutSeconds();
    if (timeoutSeconds < MIN_RANK_TIMEOUT_SECONDS || timeoutSeconds > MAX_RANK_TIMEOUT_SECONDS) {
      throw new InvalidRequestException(Setting.RANK_TIMEOUT + " " + timeoutSeconds + " is outside "
          + MIN_RANK_TIMEOUT_SECONDS + ".." + MAX_RANK_TIMEOUT_SECONDS + " seconds");
    }
    StoreManifest.Shard part = requireShard(request, opened, cluster, rank);
    Path modelDir = request.train().modelDir();
    run.record().configure("store", request.train().storeDir().toString()).configure("model", modelDir.toString())
        .configure("machines", cluster.machines()).configure("rank", rank)
        .configure("treeLearner", learner.lightGbmName()).configure("plan", plan.toString());
    Outcome outcome;
    try (RankExchange exchange = RankExchange.join(cluster, rank, identity(opened, part, plan, learner),
        Duration.ofSeconds(timeoutSeconds), onPeerLost)) {
      int networkMinutes = Math.max(1, (timeoutSeconds + 59) / 60);
      outcome = train(opened, part, plan, run, exchange, cluster, learner, networkMinutes, modelDir, progress);
    }
    if (rank == 0) {
      run.record().write(modelDir);
    }
    return outcome;
  }

  /** This rank's part of the split, refused unless the store is shard {@code rank} of a split in as many ranks. */
  private static StoreManifest.Shard requireShard(Request request, SalesStore opened, ClusterSpec cluster,
      int rank) {
    StoreManifest.Shard part = opened.manifest().shard();
    int rankCount = cluster.rankCount();
    if (part == null || part.partCount() != rankCount || part.part() != rank) {
      throw new InvalidRequestException("rank " + rank + " of " + rankCount + " needs shard " + rank + " of a store "
          + "split in " + rankCount + " (" + Setting.Command.SHARD + " " + Setting.SHARD_COUNT + " " + rankCount
          + "); " + Setting.STORE + " " + request.train().storeDir() + " is " + (part == null ? "a whole store"
              : "shard " + part.part() + " of " + part.partCount()));
    }
    return part;
  }

  /** What every rank must agree on before training, compared as text by the exchange. */
  private static String identity(SalesStore shard, StoreManifest.Shard part, TrainingPlan plan,
      TreeLearner learner) {
    return "split " + part.sourceName() + " in " + part.partCount() + " by " + part.attribute() + "\n"
        + "first date " + shard.firstDate() + ", " + shard.periodDays() + " days per period, cut at "
        + shard.dateOf(plan.cutDayIndex()) + "\n" + "tree learner " + learner.lightGbmName() + "\n"
        + "train " + plan.trainParameters() + "\n" + "dataset " + plan.datasetParameters() + "\n"
        + "validation " + plan.validationDays() + ", weights " + plan.salesValueWeights() + ", refit " + plan.refit()
        + ", zero rows kept " + plan.zeroRowsKept() + "\n" + FeatureSpecYaml.format(plan.spec());
  }

  private static Outcome train(SalesStore shard, StoreManifest.Shard part, TrainingPlan plan, Run run,
      RankExchange exchange, ClusterSpec cluster, TreeLearner learner, int networkMinutes, Path modelDir,
      ProgressListener progress) throws IOException {
    int rank = exchange.rank();
    Stage trainStage = run.stage("train");
    DistributedTraining.Result result;
    try {
      result = DistributedTraining.train(shard, plan, exchange, cluster, learner, networkMinutes,
          trainStage.budget(), progress);
    } catch (RankFailureException e) {
      exchange.fail(e.getMessage());
      trainStage.close();
      throw e;
    } catch (RuntimeException | Error e) {
      // A dead rank often shows here first as LightGBM's socket error; give the exchange's reader a moment to name
      // the rank that died (the caller's callback ends the process with that message), else report this failure to
      // the others.
      if (e instanceof LearnerException) {
        awaitPeerReport();
      }
      exchange.fail(e.getMessage());
      throw e;
    }
    try {
      PartitionReport report = result.models().partitions().get(0).report();
      long learnerPeakBytes = trainStage.budget().peakBytes();
      trainStage.addRows(result.localTrainingRowCount());
      Path written = null;
      if (rank == 0) {
        // the model learned from every shard: it records the store they were split from
        String trainedOn = part.sourceFingerprint() != null ? part.sourceFingerprint() : shard.fingerprint();
        ModelDirectory.save(result.models(), modelDir, shard, plan, trainedOn, result.dispersionRows());
        run.record().result("partitions", List.of(report));
        written = modelDir;
      }
      DistributedTraining.Binning binning = result.binning();
      run.record().result("rank", rank).result("modelSha256", result.modelSha256())
          .result("categoriesPerSplit", binning.categoriesPerSplit())
          .result("categoricalsBinnedAsNumbers", binning.categoricalsBinnedAsNumbers());
      return new Outcome(rank, cluster.rankCount(), result.localTrainingRowCount(), report, result.modelSha256(),
          binning, learnerPeakBytes, written);
    } finally {
      result.models().close();
      trainStage.close();
    }
  }

  private static void awaitPeerReport() {
    try {
      Thread.sleep(PEER_REPORT_GRACE_MILLIS);
    } catch (InterruptedException interrupted) {
      Thread.currentThread().interrupt();
    }
  }
}
