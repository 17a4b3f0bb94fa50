package org.lagmill.run;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import org.lagmill.eval.BacktestScoringPart;
import org.lagmill.eval.CombinedBacktestResult;
import org.lagmill.eval.EvaluationResult;
import org.lagmill.eval.Evaluator;
import org.lagmill.eval.Hierarchy;
import org.lagmill.eval.RollingOriginBacktest;
import org.lagmill.io.AtomicFiles;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.progress.ProgressListener;
import org.lagmill.report.ReportAssembler;
import org.lagmill.report.ReportData;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.TrainingPlan;

/**
 * The whole backtest of a store, as the {@code backtest} command runs it: open the store, score the model (or several
 * members and their average) against the baselines over rolling origins, and write {@code backtest.json},
 * {@code report.json}, {@code report.html} and {@code run.json} into the report folder, which is checked before
 * anything runs. Stage figures in the run record come from the run's stages.
 */
public final class BacktestJob {
  private BacktestJob() {}

  /**
   * What to backtest.
   *
   * @param stepPeriods periods between origins, or null for the horizon
   * @param memoryLimitBytes off-heap limit of the run, or null for none
   * @param members the plans to score
   * @param hierarchyOf the levels to score, once the store is open
   * @param commandLine shown in the report
   * @param scoringPart where to write this store's additive share of the scores ({@link BacktestScoringPart}), or
   *     null for none; one plan only
   * @param continueOrigins every origin after the first continues from the previous origin's model instead of
   *     boosting from scratch; one plan only
   * @param lastModelDir where to save the last origin's model as a model directory (what a training continues
   *     from), or null; one plan only
   */
  public record Request(Path storeDir, int originCount, Integer stepPeriods, Long memoryLimitBytes, Path reportDir,
      List<String> shownSeries, MemberPlans members,
      Function<SalesHistory, Hierarchy> hierarchyOf, String commandLine, Path scoringPart, boolean continueOrigins,
      Path lastModelDir) {

    /** A backtest whose origins boost from scratch and whose models are not kept. */
    public Request(Path storeDir, int originCount, Integer stepPeriods, Long memoryLimitBytes, Path reportDir,
        List<String> shownSeries, MemberPlans members, Function<SalesHistory, Hierarchy> hierarchyOf,
        String commandLine, Path scoringPart) {
      this(storeDir, originCount, stepPeriods, memoryLimitBytes, reportDir, shownSeries, members, hierarchyOf,
          commandLine, scoringPart, false, null);
    }
  }

  /**
   * What the backtest found.
   *
   * @param combined the members and their average, or null for a single plan
   * @param written what backtest.json and run.json hold: the combined result, else the backtest's
   */
  public record Outcome(BacktestRun backtest, CombinedBacktestResult combined, StoreManifest manifest, Path reportHtml,
      Object written) {
    /** The scores of the first origin, whose levels every origin shares. */
    public EvaluationResult firstOriginScores() {
      return backtest.result().origins().get(0).model();
    }
  }

  public static Outcome run(Request request, ProgressListener progress) throws IOException {
    // Refused before the (long) backtest runs, not after it.
    RunReport.checkTarget(request.reportDir());
    if (request.lastModelDir() != null) {
      ModelDirectory.checkTarget(request.lastModelDir());
    }
    ReportData.Builder report = RunReport.start(Setting.shown(Setting.Command.BACKTEST.toString()),
        request.commandLine(),
        request.storeDir().toString());
    try (Run run = Run.start("backtest", request.memoryLimitBytes());
        Stage opening = run.stage("open store");
        SalesStore opened = SalesStore.open(request.storeDir(), run.budget().child("store"))) {
      opening.close();
      report.data(ReportAssembler.dataSummary(StoreSummary.of(opened)));
      List<MemberPlans.Member> members = request.members().plansFor(opened.periodDays(), opened.dayCount() - 1);
      TrainingPlan first = members.get(0).plan();
      int stepPeriods = request.stepPeriods() == null ? first.spec().horizonDays() : request.stepPeriods();
      run.record().configure("store", request.storeDir().toString()).configure("origins", request.originCount())
          .configure("stepDays", stepPeriods).configure("plan", first.toString());
      Hierarchy hierarchy = request.hierarchyOf().apply(opened);
      boolean combination = MemberPlans.combined(members);
      if (request.scoringPart() != null && combination) {
        throw new InvalidRequestException(Setting.SCORING_PART + " scores one plan: leave out the members");
      }
      if ((request.continueOrigins() || request.lastModelDir() != null) && combination) {
        throw new InvalidRequestException((request.continueOrigins() ? Setting.CONTINUE_ORIGINS
            : Setting.SAVE_LAST_MODEL) + " works on one plan: combined models (members) can neither continue from an"
            + " earlier origin nor be saved from a backtest yet; leave out the members");
      }
      run.record().configure("continueOrigins", request.continueOrigins());
      RollingOriginBacktest.OriginModels originModels = new RollingOriginBacktest.OriginModels(
          request.continueOrigins(), request.lastModelDir() == null ? null : (models, plan, known) -> {
            try {
              ModelDirectory.save(models, request.lastModelDir(), known, plan, opened.fingerprint());
            } catch (IOException e) {
              throw new UncheckedIOException("cannot save the last origin's model to " + request.lastModelDir(), e);
            }
          });
      StoreManifest manifest = opened.manifest();
      BacktestScoringPart.Collector scoringParts = request.scoringPart() == null ? null
          : new BacktestScoringPart.Collector(opened, new Evaluator(opened, hierarchy, first.spec().horizonDays()),
              manifest.shard(), manifest.nesting() != null ? manifest.nesting() : opened.nesting().parents());
      BacktestRun backtest;
      CombinedBacktestResult[] combined = new CombinedBacktestResult[1];
      try (Stage stage = run.stage("backtest")) {
        if (combination) {
          List<String> names = new ArrayList<>();
          List<TrainingPlan> plans = new ArrayList<>();
          members.forEach(m -> {
            names.add(m.name());
            plans.add(m.plan());
          });
          run.record().configure("members", names);
          backtest = BacktestRun.runMembers(opened, names, plans, request.originCount(), stepPeriods, hierarchy,
              stage.budget(), progress, combined);
        } else {
          backtest = BacktestRun.run(opened, first, request.originCount(), stepPeriods, hierarchy, stage.budget(),
              progress, scoringParts, originModels);
        }
        stage.addRows(backtest.result().origins().stream().flatMap(o -> o.partitions().stream())
            .mapToLong(p -> p.trainingRowCount()).sum());
      }
      backtest.addTo(report, opened, request.shownSeries());
      RunReport.addStages(report, run.record(), backtest.lastPartitions().get(0).datasetBytesPerRow());
      Object written = combined[0] != null ? combined[0] : backtest.result();
      AtomicFiles.write(request.reportDir().resolve(RunReport.BACKTEST_FILE), RunRecord.JSON.writeValueAsBytes(
          written));
      Path html = RunReport.write(report.build(), request.reportDir());
      if (scoringParts != null) {
        scoringParts.finish().write(request.scoringPart());
      }
      EvaluationResult scores = backtest.result().origins().get(0).model();
      run.record().result("backtest", written).result("levelsScored", Setting.shown(scores.scoredLevelsLine()))
          .result("fill", opened.manifest().fill());
      if (request.lastModelDir() != null) {
        run.record().result("lastModel", request.lastModelDir().toString());
      }
      run.record().write(request.reportDir());
      return new Outcome(backtest, combined[0], opened.manifest(), html, written);
    }
  }
}
