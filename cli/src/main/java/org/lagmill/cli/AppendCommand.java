package org.lagmill.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.ingest.AppendOptions;
import org.lagmill.ingest.IngestResult;
import org.lagmill.run.AppendJob;
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
  InputOptions input;

  @Mixin
  DateWindowOption dateWindow;

  @Mixin
  NoWaitOption noWait;

  @Mixin
  QuietOption quiet;

  @Override
  public Integer call() throws Exception {
    dateWindow.apply();
    AppendOptions options = new AppendOptions(store, input.inputs(sales, calendar, prices, closures));
    IngestResult result = AppendJob.run(options, noWait.waits());
    if (!quiet.on) {
      IngestPrinter.printAppended(spec.commandLine().getOut(), spec.commandLine().getErr(), result, store);
    }
    return ExitCodes.OK;
  }
}
