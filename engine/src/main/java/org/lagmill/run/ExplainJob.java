package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.function.Consumer;
import java.util.function.Function;
import org.lagmill.eval.Hierarchy;
import org.lagmill.forecast.HorizonCoverage;
import org.lagmill.ingest.DateWindow;
import org.lagmill.report.DriverChart;
import org.lagmill.report.DriverChartBuilder;
import org.lagmill.report.SeriesChartBuilder;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;

/**
 * What a model leans on for the next forecast, as the {@code explain} command runs it: the model's per-input parts of
 * the forecast for the largest aggregate of each level and the chosen series. Writes no file.
 */
public final class ExplainJob {
  private ExplainJob() {}

  /**
   * What to explain.
   *
   * @param horizonPeriods periods to forecast, or null for the model's horizon
   * @param seriesIds series to explain besides each level's largest aggregate
   * @param planCarryForward carry the plan's last values past its end instead of refusing
   * @param hierarchyOf the levels whose largest aggregates are explained, once the store is open
   */
  public record Request(Path storeDir, Path modelDir, Integer horizonPeriods, List<String> seriesIds,
      boolean planCarryForward, Function<SalesHistory, Hierarchy> hierarchyOf) {}

  /**
   * Runs the explanation.
   *
   * @param warnings receives each warning (engine text with setting mentions) as it arises
   * @return one chart per explained aggregate or series
   */
  public static List<DriverChart> run(Request request, Consumer<String> warnings) throws IOException {
    try (Run run = Run.unlimited("explain");
        SalesStore opened = SalesStore.open(request.storeDir(), run.budget().child("store"));
        ModelSet models = ModelDirectory.open(request.modelDir(), opened);
        Stage stage = run.stage("explain")) {
      int horizon = request.horizonPeriods() == null ? models.spec().horizonDays() : request.horizonPeriods();
      DateWindow.requireHorizonWithin(opened.dateOf(opened.dayCount()), opened.periodDays(), horizon);
      HorizonCoverage.check(opened, models.spec(), horizon, request.planCarryForward()).warnings()
          .forEach(warnings);
      return DriverChartBuilder.build(opened, request.hierarchyOf().apply(opened).bind(opened), models, horizon,
          request.seriesIds(), SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, stage.budget());
    }
  }
}
