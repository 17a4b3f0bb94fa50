package org.lagmill.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.ingest.StoreAppend;
import org.lagmill.ingest.WideSalesReader;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.StoreManifest;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill append}: adds the next days from a wide sales file to a store. */
@Command(name = "append", mixinStandardHelpOptions = true,
    description = {"Add new days to a store from a wide sales CSV whose first date is the store's next day.",
        "Series missing from the file get unknown units on the new days; new series get unknown units before them."},
    footer = {"", "Example:", "  lagmill append --store stores/chain --sales sales-next-week.csv"})
final class AppendCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "existing store directory")
  Path store;

  @Option(names = "--sales", required = true, paramLabel = "FILE", description = "wide sales CSV, optionally .gz")
  Path sales;

  @Option(names = "--series-id-column", paramLabel = "NAME", defaultValue = WideSalesReader.DEFAULT_SERIES_ID_COLUMN,
      description = "column naming each series (default: ${DEFAULT-VALUE})")
  String seriesIdColumn;

  @Override
  public Integer call() throws Exception {
    try (MemoryBudget budget = CliBudgets.root(null)) {
      StoreManifest manifest = StoreAppend.append(store, sales, seriesIdColumn, budget);
      spec.commandLine().getOut().printf("store %s now holds %d series x %d days (%s .. %s)%n", store,
          manifest.seriesCount(), manifest.dayCount(), manifest.firstDate(),
          manifest.firstLocalDate().plusDays(manifest.dayCount() - 1L));
    }
    return ExitCodes.OK;
  }
}
