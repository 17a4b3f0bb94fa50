package org.lagmill.training;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.learner.DatasetBuilder;
import org.lagmill.learner.DistributedBinning;
import org.lagmill.learner.RankSum;
import org.lagmill.learner.LearnerNetwork;
import org.lagmill.learner.TrainParameters;
import org.lagmill.learner.TrainedModel;
import org.lagmill.learner.Trainer;
import org.lagmill.learner.TrainingDataset;
import org.lagmill.learner.TreeLearner;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.SalesHistory;

/**
 * One rank's part of a model trained over several machines with LightGBM's own distributed tree learner: this rank
 * holds one shard (a store from {@code lagmill shard}) and pushes only its own rows; LightGBM agrees the bins and grows
 * every tree over all ranks' rows through its network ({@link LearnerNetwork}); lagmill's {@link RankExchange} adds
 * what LightGBM does not: row counts over all ranks (the Dataset must know the total), the validation loss over all
 * ranks after every iteration (so every rank stops early at the same iteration), sales-value weights and the pooled
 * dispersion over all series, and the final check that every rank holds byte-identical model text. The flow and the
 * windows are those of {@link ModelTraining} with one partition: train before the validation window, stop early on
 * it, estimate dispersion, refit on every day for the rounds scaled by the ratio of rows over all ranks.
 *
 * <p>Memory per rank is that of a single-machine training of its own rows (LightGBM's Dataset holds this rank's rows
 * only; the bin mappers and histograms are per feature), plus LightGBM's network buffers.
 */
public final class DistributedTraining {
  /** A rank's result: the model (the same on every rank) and, on rank 0, every rank's dispersion rows. */
  public record Result(ModelSet models, List<ModelDirectory.SeriesDispersion> dispersionRows,
      long localTrainingRowCount, long totalTrainingRowCount, long totalValidationRowCount, String modelSha256,
      Binning binning) {}

  /**
   * What the ranks agreed beyond one machine's settings ({@link DistributedBinning}), over the training and the refit
   * Dataset: both change the model against one machine, so they are reported.
   *
   * @param categoriesPerSplit the largest {@code max_cat_threshold} used (one machine: 32)
   * @param categoricalsBinnedAsNumbers names of the categorical features binned as numbers on every rank
   */
  public record Binning(int categoriesPerSplit, List<String> categoricalsBinnedAsNumbers) {
    public Binning {
      categoricalsBinnedAsNumbers = List.copyOf(categoricalsBinnedAsNumbers);
    }

    static Binning of(TrainingDataset dataset) {
      List<String> names = new ArrayList<>();
      for (int column : dataset.categoricalColumnsBinnedAsNumbers()) {
        names.add(dataset.schema().names().get(column));
      }
      return new Binning(Trainer.categoriesPerSplit(dataset), names);
    }

    Binning and(Binning other) {
      java.util.TreeSet<String> names = new java.util.TreeSet<>(categoricalsBinnedAsNumbers);
      names.addAll(other.categoricalsBinnedAsNumbers);
      return new Binning(Math.max(categoriesPerSplit, other.categoriesPerSplit), new ArrayList<>(names));
    }

    /** True when the ranks trained with anything one machine would not. */
    public boolean differsFromOneMachine() {
      return categoriesPerSplit != DistributedBinning.DEFAULT_CATEGORIES_PER_SPLIT
          || !categoricalsBinnedAsNumbers.isEmpty();
    }
  }

  private DistributedTraining() {}

  /**
   * @param shard this rank's store
   * @param exchange joined by every rank
   * @param networkTimeoutMinutes LightGBM's socket time-out (minutes, at least 1)
   * @throws InvalidRequestException for a partitioned plan, or when some rank holds no training rows
   * @throws RankFailureException when another rank fails, leaves or disagrees
   */
  /**
   * Fails this rank, and through the exchange every other, before the feature pass when LightGBM could not listen on
   * this rank's port: a re-run right after a finished one hits the port's TIME-WAIT, and LightGBM's own failure comes
   * only after the Dataset's feature pass and says no more than "Binding port failed".
   */
  private static void requireLearnerPort(ClusterSpec cluster, int rank) {
    try {
      LearnerNetwork.requireBindable(cluster.port(rank));
    } catch (LearnerNetwork.PortUnavailableException e) {
      throw new RankFailureException("rank " + rank + " cannot listen on port " + e.port() + " for LightGBM's "
          + "network (" + e.getCause().getMessage() + "): another process holds it, or a run that used it ended "
          + "less than about a minute ago (the system keeps a closed connection's port for up to 60 s); wait a "
          + "minute, or give this rank another port in " + Setting.MACHINES, e);
    }
  }

  public static Result train(SalesHistory shard, TrainingPlan plan, RankExchange exchange, ClusterSpec cluster,
      TreeLearner learner, int networkTimeoutMinutes, MemoryBudget budget, ProgressListener progress)
      throws IOException {
    if (plan.partitionAttribute() != null) {
      throw new InvalidRequestException(
          Setting.PARTITION_BY + " cannot be combined with " + Setting.MACHINES + ": a distributed training "
              + "trains one model over every shard");
    }
    if (plan.startingModels() != null) {
      throw new InvalidRequestException(Setting.CONTINUE_FROM + " cannot be combined with " + Setting.MACHINES
          + " yet: a distributed training boosts from scratch");
    }
    ModelTraining.checkWindows(shard, plan);
    int rank = exchange.rank();
    int rankCount = exchange.rankCount();
    requireLearnerPort(cluster, rank);
    int[] allSeries = new int[shard.seriesCount()];
    for (int s = 0; s < allSeries.length; s++) {
      allSeries[s] = s;
    }
    float[] weights = null;
    if (plan.salesValueWeights()) {
      double[] values = SalesValueWeights.values(shard, plan.validationFirstDayIndex());
      double total = 0;
      for (double v : values) {
        total += v;
      }
      double[] sums = exchange.sum(new double[] {total, values.length}, "sales values");
      weights = SalesValueWeights.weights(values, sums[0] / Math.max(1, sums[1]));
    }
    // The sampling hashes shard-local series indexes: each rank keeps its own share, and the row count LightGBM is
    // told is the sum over ranks of the rows each rank keeps (the exchange below).
    FeaturePass trainingRows = FeaturePass.training(shard, plan.spec(), allSeries, 0, plan.trainingLastDayIndex(),
        plan.zeroSampling());
    FeaturePass validationRows = FeaturePass.training(shard, plan.spec(), allSeries,
        plan.validationFirstDayIndex(), plan.cutDayIndex());
    if (weights != null) {
      trainingRows = trainingRows.withSeriesWeights(weights);
      validationRows = validationRows.withSeriesWeights(weights);
    }
    double[] counts = exchange.sum(new double[] {trainingRows.rowCount(), validationRows.rowCount(),
        trainingRows.rowCount() == 0 ? 1 : 0, trainingRows.zeroRowCount(), trainingRows.droppedZeroRowCount()},
        "row counts");
    if (counts[2] > 0) {
      throw new InvalidRequestException((int) counts[2] + " of " + rankCount + " ranks hold no training rows"
          + (trainingRows.rowCount() == 0 ? " (this one among them)" : "") + "; LightGBM's distributed learner needs "
          + "rows on every rank: use fewer shards");
    }
    long totalTraining = (long) counts[0];
    long totalValidation = (long) counts[1];
    long totalZeroRows = (long) counts[3];
    long totalDroppedZeroRows = (long) counts[4];
    TrainParameters parameters = plan.trainParameters();
    ValidationSums reducer = new ValidationSums(exchange);
    try (LearnerNetwork network = LearnerNetwork.join(cluster.machines(), cluster.port(rank), networkTimeoutMinutes,
        rankCount)) {
      DatasetBuilder builder = new DatasetBuilder(budget, plan.datasetParameters());
      long datasetStart = System.nanoTime();
      progress.startStage("dataset rank " + rank, "rows streamed", builder.sampleSource(trainingRows).rowCount()
          + trainingRows.rowCount() + validationRows.rowCount());
      long residentBefore = ProcessMemory.residentBytes();
      ProgressRowStream reported = new ProgressRowStream(trainingRows, progress);
      TrainedModel model;
      double datasetSeconds;
      double trainSeconds;
      Binning binning;
      long residentAfter;
      try (TrainingDataset training = builder.buildDistributed(reported, totalTraining, rankSum(exchange,
          "categorical columns of the training sample"))) {
        residentAfter = ProcessMemory.residentBytes();
        binning = Binning.of(training);
        try (TrainingDataset validation = validationRows.rowCount() > 0
            ? builder.createValidation(training, reported.continuedBy(validationRows)) : null) {
          progress.endStage();
          datasetSeconds = (System.nanoTime() - datasetStart) / 1e9;
          long trainStart = System.nanoTime();
          progress.startStage("train rank " + rank, "iterations", parameters.maxRounds());
          model = new Trainer(parameters).trainDistributed(training, validation, totalValidation > 0, learner,
              rankCount, reducer, (iteration, seconds, loss) -> {
                progress.advance(iteration);
                if (iteration % 25 == 0 || iteration == 1) {
                  progress.note(String.format(Locale.ROOT, "iteration %d, validation %s over all ranks %.5f, %.1f s",
                      iteration, parameters.objective().metricName(), loss, seconds));
                }
              });
          progress.endStage();
          trainSeconds = (System.nanoTime() - trainStart) / 1e9;
        }
      }
      try {
        DispersionEstimator dispersion = new DispersionEstimator(shard.seriesCount());
        ModelTraining.estimateDispersion(validationRows, model, dispersion, budget, plan);
        double pooled = DispersionEstimator.pooledAlpha(exchange.sum(dispersion.pooledSums(), "pooled dispersion"));
        int bestIteration = model.bestIteration();
        int iterationCount = model.iterationCount();
        double[] validationCurve = model.validationCurve();
        long refitRowCount = 0;
        int refitRounds = 0;
        long refitDroppedZeroRows = 0;
        if (plan.refit() && totalValidation > 0) {
          FeaturePass allRows = FeaturePass.training(shard, plan.spec(), allSeries, 0, plan.cutDayIndex(),
              plan.zeroSampling());
          if (weights != null) {
            allRows = allRows.withSeriesWeights(weights);
          }
          double[] refitCounts = exchange.sum(new double[] {allRows.rowCount(), allRows.droppedZeroRowCount()},
              "refit row counts");
          refitRowCount = (long) refitCounts[0];
          refitDroppedZeroRows = (long) refitCounts[1];
          refitRounds = ModelTraining.refitRounds(bestIteration, totalTraining, refitRowCount);
          long refitStart = System.nanoTime();
          Refit refit = refit(allRows, refitRowCount, refitRounds, plan, learner, exchange, budget, progress);
          model.close();
          model = refit.model();
          binning = binning.and(refit.binning());
          trainSeconds += (System.nanoTime() - refitStart) / 1e9;
        }
        String sha256 = sha256(model.modelText());
        List<byte[]> checksums = exchange.gather(sha256.getBytes(StandardCharsets.UTF_8), "model checksums");
        for (int r = 0; r < checksums.size(); r++) {
          String other = new String(checksums.get(r), StandardCharsets.UTF_8);
          if (!other.equals(sha256)) {
            throw new RankFailureException("rank " + r + " holds a different model (SHA-256 " + other + ") than "
                + "rank " + rank + " (" + sha256 + "); the ranks did not train in step");
          }
        }
        PartitionReport report = new PartitionReport("all", ModelTraining.modelFileName("all", 0),
            shard.seriesCount(), totalTraining, totalValidation, trainingRows.schema().featureCount(), bestIteration,
            iterationCount, validationCurve, parameters.objective().metricName(),
            ModelTraining.importance(trainingRows.schema(), model), datasetSeconds, trainSeconds,
            residentAfter == ProcessMemory.UNAVAILABLE ? 0 : residentAfter - residentBefore,
            ProcessMemory.peakResidentBytes(), pooled, refitRowCount, refitRounds, totalZeroRows, totalDroppedZeroRows,
            trainingRows.zeroSampling().zeroRowWeight(), refitDroppedZeroRows);
        float[] alphas = dispersion.alphas(pooled);
        StringBuilder rows = new StringBuilder();
        for (int s = 0; s < alphas.length; s++) {
          rows.append(shard.attributes().seriesId(s)).append('\u0000').append(alphas[s]).append('\n');
        }
        List<byte[]> allRows = exchange.gather(rows.toString().getBytes(StandardCharsets.UTF_8), "dispersion rows");
        List<ModelDirectory.SeriesDispersion> dispersionRows = new ArrayList<>();
        if (rank == 0) {
          for (byte[] bytes : allRows) {
            for (String line : new String(bytes, StandardCharsets.UTF_8).split("\n")) {
              int separator = line.lastIndexOf('\u0000');
              if (separator > 0) {
                dispersionRows.add(new ModelDirectory.SeriesDispersion(line.substring(0, separator),
                    Float.parseFloat(line.substring(separator + 1))));
              }
            }
          }
        }
        ModelSet models = new ModelSet(plan.spec(), null, List.of(new ModelSet.Partition("all", allSeries, model,
            report)), alphas);
        return new Result(models, dispersionRows, trainingRows.rowCount(), totalTraining, totalValidation, sha256,
            binning);
      } catch (IOException | RuntimeException | Error e) {
        model.close();
        throw e;
      }
    }
  }

  private record Refit(TrainedModel model, Binning binning) {}

  private static Refit refit(FeaturePass rows, long totalRowCount, int rounds, TrainingPlan plan,
      TreeLearner learner, RankExchange exchange, MemoryBudget budget, ProgressListener progress) {
    int rank = exchange.rank();
    DatasetBuilder builder = new DatasetBuilder(budget, plan.datasetParameters());
    progress.startStage("refit dataset rank " + rank, "rows streamed", builder.sampleSource(rows).rowCount()
        + rows.rowCount());
    try (TrainingDataset training = builder.buildDistributed(new ProgressRowStream(rows, progress), totalRowCount,
        rankSum(exchange, "categorical columns of the refit sample"))) {
      progress.endStage();
      progress.startStage("refit rank " + rank, "iterations", rounds);
      TrainedModel model = new Trainer(plan.trainParameters().withRounds(rounds, 0)).trainDistributed(training, null,
          false, learner, exchange.rankCount(), null, (iteration, seconds, loss) -> progress.advance(iteration));
      progress.endStage();
      return new Refit(model, Binning.of(training));
    }
  }

  /** Sums over every rank through the exchange, for the learner's agreements before LightGBM's network. */
  private static RankSum rankSum(RankExchange exchange, String what) {
    return local -> {
      try {
        return exchange.sum(local, what);
      } catch (IOException e) {
        throw new java.io.UncheckedIOException(e);
      }
    };
  }

  static String sha256(String text) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
          .digest(text.getBytes(StandardCharsets.UTF_8)));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime provides SHA-256", e);
    }
  }

  /** The validation sums of one iteration over every rank, through the exchange. */
  private static final class ValidationSums implements org.lagmill.learner.ValidationReducer {
    private final RankExchange exchange;

    ValidationSums(RankExchange exchange) {
      this.exchange = exchange;
    }

    @Override
    public double[] reduce(int iteration, double lossSum, double squaredErrorSum, double weightSum) {
      try {
        double[] sums = exchange.sum(new double[] {lossSum, weightSum, squaredErrorSum, iteration},
            "the validation loss of iteration " + iteration);
        if (Math.round(sums[3]) != (long) iteration * exchange.rankCount()) {
          throw new RankFailureException("ranks report different iterations (sum " + sums[3] + " at iteration "
              + iteration + "); the ranks are out of step");
        }
        return new double[] {sums[0], sums[1], sums[2]};
      } catch (IOException e) {
        throw new java.io.UncheckedIOException(e);
      }
    }
  }
}
