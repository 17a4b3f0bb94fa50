package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesStore;
import org.lagmill.training.ModelCombination;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.PartitionReport;
import org.lagmill.training.StartingModels;
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
   * @param members the training plans, once the store's period and the cut are known: one plain plan writes a model
   *     directory, several named members a combination ({@link ModelCombination})
   * @param continueFrom a model directory to continue from (its trees first, then added rounds) instead of boosting
   *     from scratch, or null; one plain plan only
   */
  public record Request(Path storeDir, Path modelDir, LocalDate until, long memoryLimitBytes, MemberPlans members,
      Path continueFrom) {

    /** A training that boosts from scratch. */
    public Request(Path storeDir, Path modelDir, LocalDate until, long memoryLimitBytes, MemberPlans members) {
      this(storeDir, modelDir, until, memoryLimitBytes, members, null);
    }
  }

  /**
   * What was trained.
   *
   * @param memberNames the members' names in order (empty for a single model)
   * @param partitions one report per trained partition, every member's in member order
   * @param learnerPeakBytes the largest training stage's peak off-heap bytes
   * @param storeOffHeapBytes what the open store held mapped
   */
  public record Outcome(List<String> memberNames, List<PartitionReport> partitions, long learnerPeakBytes,
      long storeOffHeapBytes, Path modelDir) {}

  /** Training done elsewhere on the opened store and plan, under the job's run ({@link DistributedTrainJob}). */
  @FunctionalInterface
  interface Training<T> {
    T train(SalesStore opened, TrainingPlan plan, Run run) throws Exception;
  }

  public static Outcome run(Request request, ProgressListener progress) throws Exception {
    return openMembers(request, (opened, members, run) -> {
      if (!MemberPlans.combined(members)) {
        return trainOne(request, opened, members.get(0).plan(), run, progress);
      }
      if (request.continueFrom() != null) {
        throw new InvalidRequestException(Setting.CONTINUE_FROM + " continues one model: combined models (members)"
            + " cannot continue yet; leave out the members");
      }
      return trainMembers(request, opened, members, run, progress);
    });
  }

  /**
   * Opens the store under a new run, resolves the cut and the one plan, and hands them to {@code training}; the store
   * and the run close after it returns.
   *
   * @throws InvalidRequestException when the request names several members: elsewhere-training takes one plan
   */
  static <T> T open(Request request, Training<T> training) throws Exception {
    return openMembers(request, (opened, members, run) -> {
      if (request.continueFrom() != null) {
        throw new InvalidRequestException(Setting.CONTINUE_FROM + " cannot be combined with " + Setting.MACHINES
            + " yet: a distributed training boosts from scratch");
      }
      if (MemberPlans.combined(members)) {
        throw new InvalidRequestException("a distributed training trains one feature spec, got " + members.size()
            + " members; train each member with its own " + Setting.CONFIG);
      }
      return training.train(opened, members.get(0).plan(), run);
    });
  }

  private interface MembersTraining<T> {
    T train(SalesStore opened, List<MemberPlans.Member> members, Run run) throws Exception;
  }

  private static <T> T openMembers(Request request, MembersTraining<T> training) throws Exception {
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
      return training.train(opened, request.members().plansFor(opened.periodDays(), cut), run);
    }
  }

  private static Outcome trainOne(Request request, SalesStore opened, TrainingPlan plan, Run run,
      ProgressListener progress) throws IOException {
    // refused before the training, not after it
    ModelDirectory.checkTarget(request.modelDir());
    if (request.continueFrom() == null) {
      return trainOne(request, opened, plan, run, progress, null);
    }
    Path from = request.continueFrom();
    if (ModelCombination.isCombination(from)) {
      throw new InvalidRequestException(Setting.CONTINUE_FROM + " " + from + " holds combined models (members), "
          + "which cannot be continued from yet; give a single model's folder");
    }
    // the saved row scores stay with the starting models for the whole training: a budget spanning the stages
    try (MemoryBudget scoresBudget = run.budget().child("starting row scores");
        Stage opening = run.stage("open starting model");
        ModelSet starting = ModelDirectory.open(from, opened)) {
      List<String> scoreLines = ModelDirectory.attachRowScores(starting, from, opened.fingerprint(), scoresBudget);
      scoreLines.forEach(line -> progress.note("starting model " + line));
      run.record().result("startingRowScores", scoreLines);
      opening.close();
      // closing the models (first) gives the scores' memory back before their budget closes
      return trainOne(request, opened, plan.withStartingModels(new StartingModels(starting, from.toString())), run,
          progress, from);
    }
  }

  /** @param continueFrom the folder of the starting models in {@code plan}, or null */
  private static Outcome trainOne(Request request, SalesStore opened, TrainingPlan plan, Run run,
      ProgressListener progress, Path continueFrom) throws IOException {
    run.record().configure("store", request.storeDir().toString()).configure("model", request.modelDir().toString())
        .configure("cutDate", opened.dateOf(plan.cutDayIndex()).toString()).configure("plan", plan.toString());
    if (continueFrom != null) {
      run.record().configure("continueFrom", continueFrom.toString());
    }
    Trained trained = trainAndSave(run, "train", "save model", opened, plan, progress,
        models -> ModelDirectory.save(models, request.modelDir(), opened, plan, opened.fingerprint()));
    run.record().result("partitions", trained.reports());
    Outcome outcome = new Outcome(List.of(), trained.reports(), trained.learnerPeakBytes(), opened.offHeapBytes(),
        request.modelDir());
    run.record().write(request.modelDir());
    return outcome;
  }

  /**
   * Trains the members one after another (memory is the largest member's) into one combination directory, which
   * appears only when every member is saved.
   */
  private static Outcome trainMembers(Request request, SalesStore opened, List<MemberPlans.Member> members, Run run,
      ProgressListener progress) throws IOException {
    int horizon = members.get(0).plan().spec().horizonDays();
    for (MemberPlans.Member member : members) {
      if (member.plan().spec().horizonDays() != horizon) {
        throw new InvalidRequestException("the members of a combination must share one horizon: " + members.get(0)
            .name() + " has " + horizon + ", " + member.name() + " has " + member.plan().spec().horizonDays());
      }
    }
    List<String> names = members.stream().map(MemberPlans.Member::name).toList();
    run.record().configure("store", request.storeDir().toString()).configure("model", request.modelDir().toString())
        .configure("cutDate", opened.dateOf(members.get(0).plan().cutDayIndex()).toString())
        .configure("members", names);
    List<PartitionReport> reports = new ArrayList<>();
    long learnerPeakBytes = 0;
    try (ModelCombination.Writer writer = ModelCombination.Writer.begin(request.modelDir())) {
      for (int m = 0; m < members.size(); m++) {
        MemberPlans.Member member = members.get(m);
        run.record().configure("plan " + (m + 1), member.plan().toString());
        Trained trained = trainAndSave(run, "train member " + (m + 1), "save member " + (m + 1), opened,
            member.plan(), progress, models -> writer.save(member.name(), models, opened, member.plan(),
                opened.fingerprint()));
        learnerPeakBytes = Math.max(learnerPeakBytes, trained.learnerPeakBytes());
        reports.addAll(trained.reports());
      }
      writer.finish();
    }
    run.record().result("partitions", reports);
    run.record().write(request.modelDir());
    return new Outcome(names, reports, learnerPeakBytes, opened.offHeapBytes(), request.modelDir());
  }

  /** What one training stage produced: its partitions' reports and the learner's peak off-heap bytes. */
  private record Trained(List<PartitionReport> reports, long learnerPeakBytes) {}

  /** Where a trained model set goes before it is closed. */
  private interface Saving {
    void save(ModelSet models) throws IOException;
  }

  /** Trains one plan in its own stage, then saves it in the next; the models are closed before returning. */
  private static Trained trainAndSave(Run run, String trainStageName, String saveStageName, SalesStore opened,
      TrainingPlan plan, ProgressListener progress, Saving saving) throws IOException {
    Stage trainStage = run.stage(trainStageName);
    try (ModelSet models = ModelTraining.train(opened, plan, trainStage.budget(), progress)) {
      long learnerPeakBytes = trainStage.budget().peakBytes();
      List<PartitionReport> reports = models.partitions().stream().map(ModelSet.Partition::report).toList();
      trainStage.addRows(reports.stream().mapToLong(PartitionReport::trainingRowCount).sum()).close();
      try (Stage saveStage = run.stage(saveStageName)) {
        saving.save(models);
      }
      return new Trained(reports, learnerPeakBytes);
    } finally {
      trainStage.close();
    }
  }
}
