package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesStore;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.TrainingPlan;

/**
 * The training of a model directory from a store, as the {@code train} command runs it: open the store, cut its
 * history at the chosen day, train every partition and save the model directory with its {@code run.json}.
 */
public final class TrainJob {
  private TrainJob() {}

  /**
   * What to train.
   *
   * @param until the last day the model may learn from, or null for the store's last day
   * @param memoryLimitBytes the run's off-heap limit, or {@link org.lagmill.memory.MemoryBudget#UNLIMITED_BYTES}
   * @param plan the training plan, once the store's period and the cut are known
   */
  public record Request(Path storeDir, Path modelDir, LocalDate until, long memoryLimitBytes, PlanFor plan) {}

  /** The training plan for a store of this period cut at this period index. */
  @FunctionalInterface
  public interface PlanFor {
    /**
     * @param periodDays the store's step in days: a spec left to defaults takes the period's
     * @param cutIndex the index of the last period training may read
     */
    TrainingPlan planFor(int periodDays, int cutIndex) throws IOException;
  }

  /**
   * What was trained.
   *
   * @param partitions one report per trained partition
   * @param learnerPeakBytes the training stage's peak off-heap bytes
   * @param storeOffHeapBytes what the open store held mapped
   */
  public record Outcome(List<PartitionReport> partitions, long learnerPeakBytes, long storeOffHeapBytes,
      Path modelDir) {}

  /** Training done elsewhere on the opened store and plan, under the job's run (the distributed ranks). */
  @FunctionalInterface
  public interface Training<T> {
    T train(SalesStore opened, TrainingPlan plan, Run run) throws Exception;
  }

  public static Outcome run(Request request, ProgressListener progress) throws Exception {
    return open(request, (opened, plan, run) -> trainHere(request, opened, plan, run, progress));
  }

  /**
   * Opens the store under a new run, resolves the cut and the plan, and hands them to {@code training}; the store
   * and the run close after it returns.
   */
  public static <T> T open(Request request, Training<T> training) throws Exception {
    try (Run run = Run.start("train", request.memoryLimitBytes());
        Stage opening = run.stage("open store");
        SalesStore opened = SalesStore.open(request.storeDir(), run.budget().child("store"))) {
      opening.close();
      LocalDate until = request.until();
      int cut = until == null ? opened.dayCount() - 1
          : (int) Math.max(-1, Math.min(Integer.MAX_VALUE, Periods.periodIndexOf(opened.firstDate(),
              opened.periodDays(), until.toEpochDay())));
      if (cut < 0 || cut >= opened.dayCount()) {
        throw new InvalidRequestException(Setting.UNTIL + " " + until + " is outside the store's days "
            + opened.firstDate() + " .. " + opened.dateOf(opened.dayCount() - 1));
      }
      return training.train(opened, request.plan().planFor(opened.periodDays(), cut), run);
    }
  }

  private static Outcome trainHere(Request request, SalesStore opened, TrainingPlan plan, Run run,
      ProgressListener progress) throws IOException {
    // refused before the training, not after it
    ModelDirectory.checkTarget(request.modelDir());
    run.record().configure("store", request.storeDir().toString()).configure("model", request.modelDir().toString())
        .configure("cutDate", opened.dateOf(plan.cutDayIndex()).toString()).configure("plan", plan.toString());
    Outcome outcome;
    Stage trainStage = run.stage("train");
    try (ModelSet models = ModelTraining.train(opened, plan, trainStage.budget(), progress)) {
      long learnerPeakBytes = trainStage.budget().peakBytes();
      List<PartitionReport> reports = models.partitions().stream().map(ModelSet.Partition::report).toList();
      trainStage.addRows(reports.stream().mapToLong(PartitionReport::trainingRowCount).sum()).close();
      try (Stage saving = run.stage("save model")) {
        ModelDirectory.save(models, request.modelDir(), opened, plan, opened.fingerprint());
      }
      run.record().result("partitions", reports);
      outcome = new Outcome(reports, learnerPeakBytes, opened.offHeapBytes(), request.modelDir());
    } finally {
      trainStage.close();
    }
    run.record().write(request.modelDir());
    return outcome;
  }
}
