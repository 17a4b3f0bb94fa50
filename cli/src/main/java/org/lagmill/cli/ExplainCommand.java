package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.lagmill.forecast.HorizonCoverage;
import org.lagmill.ingest.DateWindow;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.report.DriverChart;
import org.lagmill.report.DriverChartBuilder;
import org.lagmill.report.SeriesChartBuilder;
import org.lagmill.run.Run;
import org.lagmill.run.RunRecord;
import org.lagmill.run.Stage;
import org.lagmill.store.SalesStore;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill explain}: splits the forecast of named series and top aggregates into its drivers. */
@Command(name = "explain", header = "Show why a forecast is what it is: its parts by driver family.",
    mixinStandardHelpOptions = true,
    description = {"Forecast as lagmill forecast does, and split each forecast period of the named series and of",
        "the largest aggregate of each level into a base level and the share of each family of inputs (recent",
        "sales, weekly pattern, season, events and holidays, price, plan, launch), in units; the parts add up to",
        "the forecast. From the model's own per-input contributions: what the model leaned on, not cause and effect."},
    footer = {"", "Example:", "  lagmill explain --store stores/chain --model models/week49 \\",
        "      --series k2/north/dry --json"})
final class ExplainCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Mixin
  StoreOption store;

  @Mixin
  ModelOption model;

  @Option(names = "--series", split = ",", paramLabel = "SERIES_ID", description = "series to explain besides the "
      + "largest aggregate of each level")
  List<String> seriesIds = List.of();

  @Option(names = "--horizon", converter = Counts.Positive.class,
      paramLabel = "PERIODS", description = "periods to forecast (default: the model's "
          + "horizon)")
  Integer horizonDays;

  @Option(names = "--plan-carry-forward", description = "when the plan ends before the horizon does, carry each "
      + "key's last plan values forward (counted in a warning) instead of stopping")
  boolean planCarryForward;

  @Option(names = "--json", description = "print every period's parts as JSON")
  boolean json;

  @Mixin
  HierarchyOptions hierarchyOptions;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = commandSpec.commandLine().getOut();
    List<DriverChart> charts;
    try (Run run = Run.unlimited("explain");
        SalesStore opened = SalesStore.open(store.dir, run.budget().child("store"));
        ModelSet models = ModelDirectory.open(model.dir, opened);
        Stage stage = run.stage("explain")) {
      int horizon = horizonDays == null ? models.spec().horizonDays() : horizonDays;
      DateWindow.requireHorizonWithin(opened.dateOf(opened.dayCount()), opened.periodDays(), horizon);
      HorizonCoverage.check(opened, models.spec(), horizon, planCarryForward).warnings()
          .forEach(w -> System.err.println("warning: " + FlagNames.render(w)));
      charts = DriverChartBuilder.build(opened, hierarchyOptions.hierarchy(opened).bind(opened), models,
          horizon, seriesIds, SeriesChartBuilder.DEFAULT_CONTEXT_DAYS, stage.budget());
    }
    if (json) {
      List<Map<String, Object>> document = new ArrayList<>();
      for (DriverChart c : charts) {
        Map<String, Object> row = new LinkedHashMap<>();
        row.put("title", c.title());
        row.put("seriesCount", c.seriesCount());
        row.put("dates", c.dates().stream().map(Object::toString).toList());
        row.put("forecast", c.forecast());
        Map<String, double[]> parts = new LinkedHashMap<>();
        c.parts().forEach(p -> parts.put(p.name(), p.units()));
        row.put("parts", parts);
        document.add(row);
      }
      out.println(RunRecord.JSON.writeValueAsString(document));
      return ExitCodes.OK;
    }
    for (DriverChart c : charts) {
      double total = 0;
      for (double v : c.forecast()) {
        total += v;
      }
      out.printf(Locale.ROOT, "%s (%d series), %s .. %s: forecast %.1f units%n", c.title(), c.seriesCount(),
          c.dates().get(0), c.dates().get(c.dates().size() - 1), total);
      for (DriverChart.Part part : c.parts()) {
        double units = part.totalUnits();
        out.printf(Locale.ROOT, "  %-22s %+12.1f units  %6.1f%%%n", part.name(), units,
            total > 0 ? 100 * units / total : Double.NaN);
      }
    }
    out.println("The parts show what the model leaned on, not cause and effect; forecasts are estimates for a planner"
        + " to review.");
    return ExitCodes.OK;
  }
}
