package org.lagmill.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.ingest.WideSalesReader;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.StoreManifest;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill ingest}: builds a store from a wide sales file (and, once wired, calendar and prices files). */
@Command(name = "ingest", mixinStandardHelpOptions = true,
    description = "Build a compact store from a wide sales CSV (one row per series, one column per day).",
    footer = {"", "Example:", "  lagmill ingest --sales sales.csv.gz --store stores/chain"})
final class IngestCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--sales", required = true, paramLabel = "FILE", description = "wide sales CSV, optionally .gz")
  Path sales;

  @Option(names = "--calendar", paramLabel = "FILE", description = "calendar CSV")
  Path calendar;

  @Option(names = "--prices", paramLabel = "FILE", description = "prices CSV")
  Path prices;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store directory to create or replace")
  Path store;

  @Option(names = "--series-id-column", paramLabel = "NAME", defaultValue = WideSalesReader.DEFAULT_SERIES_ID_COLUMN,
      description = "column naming each series (default: ${DEFAULT-VALUE}); without it a series is named by its "
          + "attribute values joined with '/'")
  String seriesIdColumn;

  @Option(names = "--memory-limit", paramLabel = "BYTES", description = "off-heap budget in bytes (default: none)")
  Long memoryLimitBytes;

  @Option(names = "--quiet", description = "print nothing on success")
  boolean quiet;

  @Override
  public Integer call() throws Exception {
    IngestOptions options = IngestOptions.of(sales, store).withSeriesIdColumn(seriesIdColumn)
        .withCalendarFile(calendar).withPricesFile(prices);
    try (MemoryBudget budget = CliBudgets.root(memoryLimitBytes)) {
      StoreManifest manifest = StoreIngest.ingest(options, budget);
      if (!quiet) {
        spec.commandLine().getOut().printf("ingested %d series x %d days (%s .. %s) into %s, %d bytes, peak off-heap "
            + "%d bytes%n", manifest.seriesCount(), manifest.dayCount(), manifest.firstDate(),
            manifest.firstLocalDate().plusDays(manifest.dayCount() - 1L), store, manifest.binaryBytes(),
            budget.peakBytes());
      }
    }
    return ExitCodes.OK;
  }
}
