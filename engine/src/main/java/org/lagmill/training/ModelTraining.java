package org.lagmill.training;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSchema;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.learner.DatasetBuilder;
import org.lagmill.learner.FeatureImportance;
import org.lagmill.learner.TrainParameters;
import org.lagmill.learner.StartingScores;
import org.lagmill.learner.TrainedModel;
import org.lagmill.learner.Trainer;
import org.lagmill.learner.TrainingListener;
import org.lagmill.learner.TrainingDataset;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * Trains a {@link ModelSet} from a history: per partition, the training rows stream from the store into LightGBM's
 * Dataset, the validation rows (the last days before the cut) into a Dataset binned like it, the booster stops early
 * on them, and the held-out predictions set each series' interval dispersion. Partitions are trained one after
 * another and each Dataset is freed before the next is built, so peak memory follows the largest partition.
 */
public final class ModelTraining {
  private ModelTraining() {}

  public static ModelSet train(SalesHistory history, TrainingPlan plan, MemoryBudget budget,
      ProgressListener progress) {
    return train(history, plan, budget, progress, false);
  }

  /**
   * As {@link #train(SalesHistory, TrainingPlan, MemoryBudget, ProgressListener)}; with {@code keepRowScores} each
   * partition's model keeps the raw score it gave every training and validation row ({@link TrainedModel#rowScores()},
   * 16 bytes per row until the models are closed), so that a training continued from these models carries them over
   * instead of predicting them. A refit's model keeps none (it was trained on other rows).
   */
  public static ModelSet train(SalesHistory history, TrainingPlan plan, MemoryBudget budget,
      ProgressListener progress, boolean keepRowScores) {
    // The plan columns trained on are fixed in the models' spec, so a forecast reads exactly these.
    plan = plan.withSpec(plan.spec().withPlanColumnsResolved(history.plan().columnNames()));
    checkWindows(history, plan);
    Map<String, int[]> partitionSeries = partitionSeries(history, plan.partitionAttribute());
    if (plan.startingModels() != null) {
      ContinuationCheck.check(plan, partitionSeries.keySet());
    }
    float[] weights = plan.salesValueWeights()
        ? SalesValueWeights.compute(history, plan.validationFirstDayIndex()) : null;
    DispersionEstimator dispersion = new DispersionEstimator(history.seriesCount());
    List<ModelSet.Partition> partitions = new ArrayList<>();
    try {
      for (Map.Entry<String, int[]> entry : partitionSeries.entrySet()) {
        partitions.add(trainPartition(history, plan, entry.getKey(), partitions.size(), entry.getValue(), weights,
            dispersion, budget, progress, keepRowScores && !plan.refit()));
        if (partitionSeries.size() > 1) {
          // The finished partition's bin sample (tens of MB of heap arrays) is garbage now; collecting it before the
          // next Dataset lets the heap shrink instead of growing partition after partition, so the run's peak
          // follows the largest partition (measured in docs/benchmarks.md).
          System.gc();
        }
      }
    } catch (RuntimeException | Error e) {
      partitions.forEach(p -> p.model().close());
      throw e;
    }
    return new ModelSet(plan.spec(), plan.partitionAttribute(), partitions, dispersion.alphas());
  }

  static void checkWindows(SalesHistory history, TrainingPlan plan) {
    if (plan.cutDayIndex() >= history.dayCount() || plan.cutDayIndex() < 0) {
      throw new InvalidRequestException("the training cut (day " + plan.cutDayIndex() + ") must lie within the "
          + history.dayCount() + " days of history");
    }
    if (plan.trainingLastDayIndex() < 0) {
      throw new InvalidRequestException("the validation window of " + plan.validationDays() + " days (the horizon)"
          + " leaves no day of the " + (plan.cutDayIndex() + 1) + " days of history up to the cut to train on; use a"
          + " shorter " + Setting.HORIZON);
    }
    // long: a lag of Integer.MAX_VALUE days plus the one training day must not wrap around
    long minimumTrainingDays = plan.spec().launchSkipDays() + 1L;
    if (plan.trainingLastDayIndex() < minimumTrainingDays) {
      throw new InvalidRequestException("the history before the validation window has " + (plan
          .trainingLastDayIndex() + 1) + " days, too few for the longest lag (" + plan.spec().launchSkipDays()
          + " days) plus at least one training day; use a longer history or shorter lags");
    }
  }

  private static ModelSet.Partition trainPartition(SalesHistory history, TrainingPlan plan, String value,
      int partitionPosition, int[] seriesIndexes, float[] weights, DispersionEstimator dispersion, MemoryBudget budget,
      ProgressListener progress, boolean recordRows) {
    FeaturePass trainingRows = FeaturePass.training(history, plan.spec(), seriesIndexes, 0,
        plan.trainingLastDayIndex(), plan.zeroSampling());
    FeaturePass validationRows = FeaturePass.training(history, plan.spec(), seriesIndexes,
        plan.validationFirstDayIndex(), plan.cutDayIndex());
    if (weights != null) {
      trainingRows = trainingRows.withSeriesWeights(weights);
      validationRows = validationRows.withSeriesWeights(weights);
    }
    if (trainingRows.rowCount() == 0) {
      throw new InvalidRequestException("partition " + value + " has no training rows: its series have no known"
          + " sales after launch plus the longest lag before the validation window" + (trainingRows
              .droppedZeroRowCount() > 0 ? " that " + Setting.ZERO_ROWS_KEPT + " keeps (it dropped "
                  + trainingRows.droppedZeroRowCount() + " rows with zero sales)" : ""));
    }
    String stage = "all".equals(value) ? "" : " " + value;
    TrainedModel startingModel = plan.startingModels() == null ? null
        : ContinuationCheck.startingModel(plan.startingModels(), value);
    // the starting model's own rows keep their scores when it kept them; only the newer days are predicted
    StartingScores start = startingModel == null ? null : StartingScores.of(startingModel, seriesIndexes);
    DatasetBuilder builder = new DatasetBuilder(budget, plan.datasetParameters());
    long datasetStart = System.nanoTime();
    // The sample pass, the push of every training row, then one push of the validation rows (binned by reference).
    progress.startStage("dataset" + stage, "rows streamed", builder.sampleSource(trainingRows).rowCount()
        + trainingRows.rowCount() + validationRows.rowCount());
    long residentBefore = ProcessMemory.residentBytes();
    TrainedModel model;
    long validationRowCount = validationRows.rowCount();
    double trainSeconds;
    double datasetSeconds;
    long trainingRowCount;
    int featureCount;
    ProgressRowStream reportedTrainingRows = new ProgressRowStream(trainingRows, progress);
    long residentAfter;
    try (TrainingDataset training = builder.build(reportedTrainingRows, start, recordRows)) {
      residentAfter = ProcessMemory.residentBytes();
      trainingRowCount = training.rowCount();
      featureCount = training.featureCount();
      try (TrainingDataset validation = validationRowCount > 0
          ? builder.createValidation(training, reportedTrainingRows.continuedBy(validationRows), start, recordRows)
          : null) {
        progress.endStage();
        if (start != null) {
          progress.note(startingScoresNote(training, validation));
          // both Datasets now hold the starting scores: the carried copy is not needed for the boosting
          startingModel.releaseRowScores();
        }
        datasetSeconds = (System.nanoTime() - datasetStart) / 1e9;
        long trainStart = System.nanoTime();
        progress.startStage("train" + stage, "iterations", plan.trainParameters().maxRounds());
        TrainingListener listener = (iteration, seconds, loss) -> {
          progress.advance(iteration);
          if (iteration % 25 == 0 || iteration == 1) {
            progress.note(String.format(java.util.Locale.ROOT, "iteration %d, validation %s %.5f, %.1f s",
                iteration, plan.trainParameters().objective().metricName(), loss, seconds));
          }
        };
        Trainer trainer = new Trainer(plan.trainParameters());
        model = startingModel == null ? trainer.train(training, validation, listener)
            : trainer.continueFrom(startingModel, training, validation, listener);
        progress.endStage();
        trainSeconds = (System.nanoTime() - trainStart) / 1e9;
      }
    }
    try {
      // The dispersion comes from the early-stopped model's held-out errors: the refit model has seen those days.
      double pooled = estimateDispersion(validationRows, model, dispersion, budget, plan);
      int bestIteration = model.bestIteration();
      int iterationCount = model.iterationCount();
      double[] validationCurve = model.validationCurve();
      long refitRowCount = 0;
      int refitRounds = 0;
      long refitDroppedZeroRowCount = 0;
      if (plan.refit() && validationRowCount > 0) {
        FeaturePass allRows = FeaturePass.training(history, plan.spec(), seriesIndexes, 0, plan.cutDayIndex(),
            plan.zeroSampling());
        if (weights != null) {
          allRows = allRows.withSeriesWeights(weights);
        }
        refitRounds = refitRounds(bestIteration, trainingRowCount, allRows.rowCount());
        long refitStart = System.nanoTime();
        TrainedModel refit = trainOnAllDays(allRows, refitRounds, plan, stage, budget, progress);
        model.close();
        model = refit;
        refitRowCount = allRows.rowCount();
        refitDroppedZeroRowCount = allRows.droppedZeroRowCount();
        trainSeconds += (System.nanoTime() - refitStart) / 1e9;
      }
      PartitionReport report = new PartitionReport(value, modelFileName(value, partitionPosition),
          seriesIndexes.length, trainingRowCount, validationRowCount, featureCount, bestIteration, iterationCount,
          validationCurve, plan.trainParameters().objective().metricName(), importance(trainingRows.schema(), model),
          datasetSeconds, trainSeconds, residentAfter == ProcessMemory.UNAVAILABLE ? 0 : residentAfter - residentBefore,
          ProcessMemory.peakResidentBytes(), pooled, refitRowCount, refitRounds, trainingRows.zeroRowCount(),
          trainingRows.droppedZeroRowCount(), trainingRows.zeroSampling().zeroRowWeight(), refitDroppedZeroRowCount,
          startingModel == null ? null : plan.startingModels().source(), model.startingIterationCount(),
          Double.isNaN(model.startingValidationLoss()) ? null : model.startingValidationLoss());
      return new ModelSet.Partition(value, seriesIndexes, model, report);
    } catch (RuntimeException | Error e) {
      model.close();
      throw e;
    }
  }

  /** How many rows' starting scores were carried over from the starting model's rows, and how many predicted. */
  private static String startingScoresNote(TrainingDataset training, TrainingDataset validation) {
    long carried = training.carriedStartingScoreCount();
    long predicted = training.predictedStartingScoreCount();
    if (validation != null) {
      carried += validation.carriedStartingScoreCount();
      predicted += validation.predictedStartingScoreCount();
    }
    return "starting scores: " + carried + " rows carried over from the starting model's training, " + predicted
        + " predicted";
  }

  /**
   * Rounds of the refit on every day: the early-stopped best count scaled by the ratio of rows (all days over the
   * training days before the validation window), at least 1. More rows per round give each tree more evidence, and
   * the usual practice keeps the rounds per row about constant (common practice, no source).
   */
  static int refitRounds(int bestIteration, long trainingRowCount, long allRowCount) {
    if (trainingRowCount <= 0) {
      return Math.max(1, bestIteration);
    }
    return (int) Math.max(1, Math.round(bestIteration * (double) allRowCount / trainingRowCount));
  }

  /** Trains a fixed number of rounds on {@code rows} with no validation; the Dataset is freed before returning. */
  private static TrainedModel trainOnAllDays(FeaturePass rows, int rounds, TrainingPlan plan, String stage,
      MemoryBudget budget, ProgressListener progress) {
    DatasetBuilder builder = new DatasetBuilder(budget, plan.datasetParameters());
    progress.startStage("refit dataset" + stage, "rows streamed", builder.sampleSource(rows).rowCount()
        + rows.rowCount());
    ProgressRowStream reported = new ProgressRowStream(rows, progress);
    try (TrainingDataset training = builder.build(reported)) {
      progress.endStage();
      progress.startStage("refit" + stage, "iterations", rounds);
      TrainParameters parameters = plan.trainParameters().withRounds(rounds, 0);
      TrainedModel model = new Trainer(parameters).train(training,
          (iteration, seconds, loss) -> progress.advance(iteration));
      progress.endStage();
      return model;
    }
  }

  /** Predicts the validation rows and feeds their errors to the dispersion estimate; returns the pooled estimate. */
  static double estimateDispersion(FeaturePass validationRows, TrainedModel model,
      DispersionEstimator dispersion, MemoryBudget budget, TrainingPlan plan) {
    if (validationRows.rowCount() == 0) {
      return 0;
    }
    DispersionEstimator partitionOnly = new DispersionEstimator(1);
    int batchRows = (int) Math.min(TrainedModel.PREDICTION_BATCH_ROWS, validationRows.rowCount());
    double[] predictions = new double[batchRows];
    try (FeatureBatch batch = new FeatureBatch(budget, batchRows, validationRows.schema().featureCount())) {
      validationRows.stream(batch, full -> {
        model.predict(full, predictions);
        for (int row = 0; row < full.rowCount(); row++) {
          double actual = full.labels()[row];
          dispersion.add(full.seriesIndexes()[row], predictions[row], actual);
          partitionOnly.add(0, predictions[row], actual);
        }
      });
    }
    return partitionOnly.pooledAlpha();
  }

  static List<PartitionReport.FeatureImportanceRow> importance(FeatureSchema schema, TrainedModel model) {
    double[] gain = model.featureImportance(FeatureImportance.GAIN);
    double[] split = model.featureImportance(FeatureImportance.SPLIT);
    List<PartitionReport.FeatureImportanceRow> rows = new ArrayList<>();
    for (int f = 0; f < schema.featureCount(); f++) {
      rows.add(new PartitionReport.FeatureImportanceRow(schema.names().get(f), gain[f], Math.round(split[f])));
    }
    rows.sort((a, b) -> Double.compare(b.gain(), a.gain()));
    return rows;
  }

  /**
   * File name of a partition's model. The partition's position keeps names unique when two values differ only in
   * characters a file name cannot hold ("a b" and "a_b").
   */
  static String modelFileName(String partitionValue, int partitionPosition) {
    return "all".equals(partitionValue) ? "model.txt"
        : "model-" + partitionPosition + "-" + partitionValue.replaceAll("[^A-Za-z0-9._-]", "_") + ".txt";
  }

  /** Series indexes per partition value, in order of first appearance; one partition "all" without an attribute. */
  static Map<String, int[]> partitionSeries(SalesHistory history, String partitionAttribute) {
    Map<String, int[]> result = new LinkedHashMap<>();
    if (partitionAttribute == null) {
      int[] all = new int[history.seriesCount()];
      for (int s = 0; s < all.length; s++) {
        all[s] = s;
      }
      result.put("all", all);
      return result;
    }
    SeriesAttributes attributes = history.attributes();
    int attribute = attributes.attributeIndex(partitionAttribute);
    if (attribute < 0) {
      throw new InvalidRequestException("unknown partition attribute '" + partitionAttribute + "'; the store has "
          + attributes.attributeNames());
    }
    int[] counts = new int[attributes.cardinality(attribute)];
    for (int s = 0; s < history.seriesCount(); s++) {
      counts[attributes.code(s, attribute)]++;
    }
    int[][] members = new int[counts.length][];
    for (int c = 0; c < counts.length; c++) {
      members[c] = new int[counts[c]];
    }
    int[] filled = new int[counts.length];
    for (int s = 0; s < history.seriesCount(); s++) {
      int code = attributes.code(s, attribute);
      members[code][filled[code]++] = s;
    }
    for (int c = 0; c < counts.length; c++) {
      if (counts[c] > 0) {
        result.put(attributes.value(attribute, c), members[c]);
      }
    }
    return result;
  }
}
