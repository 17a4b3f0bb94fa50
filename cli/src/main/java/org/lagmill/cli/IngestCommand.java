package org.lagmill.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.run.IngestJob;
import org.lagmill.store.Periods;
import org.lagmill.store.StoreUpdate;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill ingest}: builds a store from a sales file (wide or long) and optional calendar and prices files. */
@Command(name = "ingest", header = "Build a compact store from sales, calendar and prices CSV files.",
    mixinStandardHelpOptions = true,
    description = {"Build a compact store from a sales CSV: wide (one row per series, one column per day) or long",
        "(one row per series and day), with an optional calendar and prices (see docs/formats.md)."},
    footer = {"", "Example:", "  lagmill ingest --sales sales.csv.gz --store stores/chain",
        "  lagmill ingest --sales sales.csv --calendar calendar.csv --prices prices.csv \\",
        "      --plan plan.csv --store stores/chain",
        "  lagmill ingest --sales sales.csv --store stores/chain --replace"})
final class IngestCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--sales", required = true, paramLabel = "FILE", description = "sales CSV, optionally .gz")
  Path sales;

  @Option(names = "--calendar", paramLabel = "FILE", description = "calendar CSV")
  Path calendar;

  @Option(names = "--prices", paramLabel = "FILE", description = "prices CSV")
  Path prices;

  @Option(names = "--store", required = true, paramLabel = "DIR",
      description = "store directory to create: a new path or an empty folder")
  Path store;

  @Option(names = "--replace", description = "replace the store at --store (only a lagmill store that verifies is "
      + "replaced; any other file or folder is refused)")
  boolean replace;

  @Mixin
  NoWaitOption noWait;

  @Option(names = "--closures", paramLabel = "FILE", description = {"closures CSV: key columns, from, until (and",
      "an optional reason); a closed day reads as unknown and is forecast as 0"})
  Path closures;

  @Mixin
  InputOptions input;

  @Option(names = "--period", paramLabel = "PERIOD", description = {"the store's period: day, week or a number of",
      "days; checked against the sales dates (default: detected, from the most common gap between long sales'",
      "dates or the step of wide date columns)"})
  String period;

  @Mixin
  DateWindowOption dateWindow;

  @Mixin
  MemoryLimitOption memoryLimit;

  @Mixin
  QuietOption quiet;

  @Option(names = "--shard", paramLabel = "K/N", description = {"write only shard K of N (K from 0) straight from",
      "the files: the store lagmill shard --parts N --by ATTR would write as shard-K; needs --by"})
  String shard;

  @Option(names = "--by", paramLabel = "ATTR", description = "with --shard: attribute whose value picks each series' "
      + "shard (the rule of lagmill shard)")
  String by;

  @Override
  public Integer call() throws Exception {
    dateWindow.apply();
    IngestOptions options = IngestOptions.of(input.inputs(sales, calendar, prices, closures), store)
        .withPeriodDays(period == null ? null : Periods.parse("--period", period));
    IngestJob.Outcome outcome = IngestJob.run(new IngestJob.Request(options, shard, by,
        new StoreUpdate.Policy(replace ? StoreUpdate.Mode.REPLACE : StoreUpdate.Mode.CREATE, noWait.waits()),
        memoryLimit.bytes()));
    if (!quiet.on) {
      IngestPrinter.printIngested(spec.commandLine().getOut(), spec.commandLine().getErr(), outcome, store);
    }
    return ExitCodes.OK;
  }
}
