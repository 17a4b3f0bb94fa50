package org.lagmill.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.ingest.AppendOptions;
import org.lagmill.ingest.IngestResult;
import org.lagmill.ingest.StoreAppend;
import org.lagmill.store.Periods;
import org.lagmill.run.Run;
import org.lagmill.run.Stage;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreUpdate;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill append}: adds a store's next days from a wide or long sales file; may replace the dated files. */
@Command(name = "append", header = "Add new days (and a newer calendar and prices) to a store, atomically.",
    mixinStandardHelpOptions = true,
    description = {"Add new days to a store from a wide sales CSV whose first date is the store's next day, or from",
        "a long one (a till export, sparse or dense) dated from the store's next day on. Wide: series missing from",
        "the file get unknown units on the new days. Long: a day with no row follows --missing-rows (zero by",
        "default, also for series the store lists that have no row). New series get unknown units before them.",
        "A --calendar, --prices, --closures or --plan file replaces the stored one; without it it is kept."},
    footer = {"", "Example:", "  lagmill append --store stores/chain --sales sales-next-week.csv \\",
        "      --calendar calendar.csv --prices prices.csv",
        "  lagmill append --store stores/chain --sales till-week-12.csv \\",
        "      --sales-date-column day",
        "  lagmill append --store stores/chain --plan plan-next-month.csv"})
final class AppendCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "existing store directory")
  Path store;

  @Option(names = "--sales", paramLabel = "FILE",
      description = {"wide or long sales CSV, optionally .gz; without it the",
          "calendar, prices, closures or plan given replace the stored ones and the days stay as they are"})
  Path sales;

  @Option(names = "--calendar", paramLabel = "FILE", description = "newer calendar CSV replacing the stored one")
  Path calendar;

  @Option(names = "--prices", paramLabel = "FILE", description = "newer prices CSV replacing the stored prices")
  Path prices;

  @Option(names = "--closures", paramLabel = "FILE", description = {"closures CSV: key columns, from, until (and",
      "an optional reason); a closed day reads as unknown and is forecast as 0; replaces the stored closures"})
  Path closures;

  @Mixin
  ColumnOptions columns;

  @Mixin
  SalesShapeOptions shape;

  @Mixin
  PlanOptions plan;

  @Mixin
  DateWindowOption dateWindow;

  @Mixin
  NoWaitOption noWait;

  @Option(names = "--quiet", description = "print nothing on success, not even warnings")
  boolean quiet;

  @Override
  public Integer call() throws Exception {
    dateWindow.apply();
    AppendOptions options = AppendOptions.of(store, sales).withColumns(columns.names())
        .withSalesFormat(shape.format()).withMissingRows(shape.missingRows())
        .withCalendarFile(calendar).withPricesFile(prices).withClosuresFile(closures)
        .withPlan(plan.source());
    try (Run run = Run.unlimited("append")) {
      run.record().configure("store", store.toString())
          .configure("sales", sales == null ? null : sales.toString())
          .configure("missingRows", shape.missingRows().optionValue())
          .configure("plan", plan.file == null ? null : plan.file.toString());
      IngestResult result;
      try (Stage stage = run.stage("append")) {
        result = StoreAppend.append(options, new StoreUpdate.Policy(StoreUpdate.Mode.CHANGE, noWait.waits()),
            stage.budget());
        stage.addRows((long) result.manifest().seriesCount() * result.manifest().dayCount());
      }
      StoreManifest appended = result.manifest();
      run.record().result("seriesCount", appended.seriesCount()).result("dayCount", appended.dayCount())
          .result("fill", appended.fill()).result("warnings", FlagNames.render(result.warnings()));
      run.record().write(store);
      if (!quiet) {
        IngestCommand.printWarnings(spec.commandLine().getErr(), result.warnings());
        StoreManifest manifest = result.manifest();
        spec.commandLine().getOut().printf("store %s now holds %d series x %s (%s .. %s)%n", store,
            manifest.seriesCount(), Periods.count(manifest.dayCount(), manifest.periodDaysOrDaily()),
            manifest.firstDate(), manifest.lastLocalDate());
        IngestCommand.printFill(spec.commandLine().getOut(), manifest);
      }
    }
    return ExitCodes.OK;
  }
}
