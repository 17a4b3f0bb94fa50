package org.lagmill.cli;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.lagmill.scenario.ScenarioGenerator;
import org.lagmill.scenario.ScenarioSpec;
import org.lagmill.scenario.ScenarioSummary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill generate}: writes the invented demo scenario (sales, calendar, prices) as CSV files. */
@Command(
    name = "generate",
    header = "Write an invented chain's sales, calendar and prices as CSV files.",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = {"Writes an invented retail scenario: wide daily sales per item-store series, a calendar with events",
        "and per-region paydays, and price change points with promotions. Same arguments, same bytes."},
    footer = {"", "Example:", "  lagmill generate --out demo-data --series 3000 --days 1095 --seed 7",
        "  (three years of 300 items in 10 stores: sales.csv, calendar.csv, prices.csv)"})
public final class GenerateCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--out", required = true, paramLabel = "DIR", description = "Folder to write into (created if missing).")
  Path outDir;

  @Option(names = "--series", required = true, paramLabel = "N", description = "Number of item-store series.")
  int seriesCount;

  @Option(names = "--days", required = true, paramLabel = "D", description = "Number of sales days.")
  int dayCount;

  @Option(names = "--start", paramLabel = "DATE", description = "First sales day, YYYY-MM-DD (default: ${DEFAULT-VALUE}).",
      defaultValue = "2023-01-02")
  LocalDate startDate;

  @Option(names = "--seed", paramLabel = "S", description = "Random seed (default: ${DEFAULT-VALUE}).",
      defaultValue = "42")
  long seed;

  @Option(names = "--future-days", paramLabel = "F",
      description = "Calendar and price days past the last sales day (default: ${DEFAULT-VALUE}).", defaultValue = "28")
  int futureDayCount;

  @Option(names = "--gzip", description = "Write gzip-compressed .csv.gz files.")
  boolean gzip;

  @Override
  public Integer call() throws Exception {
    ScenarioSpec scenario = new ScenarioSpec(seriesCount, dayCount, startDate, seed, futureDayCount, gzip);
    long startNanos = System.nanoTime();
    ScenarioSummary summary = ScenarioGenerator.write(scenario, outDir);
    double seconds = (System.nanoTime() - startNanos) / 1e9;
    spec.commandLine().getOut().println(String.format(Locale.ROOT,
        "generated %d files in %s: %d series x %d days = %d item-days, %.1f MB, %.2f s",
        summary.files().size(), outDir, summary.seriesCount(), summary.dayCount(), summary.itemDayCount(),
        summary.fileBytes() / 1e6, seconds));
    spec.commandLine().getOut().flush();
    return ExitCodes.OK;
  }
}
