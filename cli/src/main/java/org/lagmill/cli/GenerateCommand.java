package org.lagmill.cli;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.scenario.ScenarioGenerator;
import org.lagmill.scenario.ScenarioSpec;
import org.lagmill.scenario.ScenarioSummary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code lagmill generate}: writes the invented demo scenario (sales, calendar, prices, promotion plan, closures) as
 * CSV files, daily or weekly.
 */
@Command(
    name = "generate",
    header = "Write an invented chain's sales, calendar, prices, promotion plan and closures as CSV files.",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = {"Writes an invented retail scenario: wide sales per article-outlet series, a calendar with public",
        "holidays and per-district school breaks, prices, a promotion plan and outlet closures. Same arguments, same",
        "bytes."},
    footer = {"", "Examples:", "  lagmill generate --out demo-data --series 3000 --days 1095 --seed 7",
        "  (three years of 250 articles in 12 outlets: sales.csv, calendar.csv,",
        "  prices.csv, plan.csv, closures.csv)",
        "  lagmill generate --out weekly-data --series 3000 --days 1092 --period week",
        "  (the same chain in 156 weekly periods, one price row per article-outlet-week)"})
public final class GenerateCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--out", required = true, paramLabel = "DIR",
      description = "Folder to write into (created if missing).")
  Path outDir;

  @Option(names = "--series", required = true, paramLabel = "N", description = "Number of article-outlet series.")
  int seriesCount;

  @Option(names = "--days", required = true, paramLabel = "D", description = "Number of sales days.")
  int dayCount;

  @Option(names = "--start", paramLabel = "DATE",
      description = "First sales day, YYYY-MM-DD (default: ${DEFAULT-VALUE}).",
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

  @Option(names = "--period", paramLabel = "P", defaultValue = "day", description = {"day or week (default: "
      + "${DEFAULT-VALUE}). Weekly files hold 7-day sums from the start date; --days and --future-days must then be",
      "multiples of 7."})
  String period;

  @Override
  public Integer call() throws Exception {
    ScenarioSpec scenario = new ScenarioSpec(seriesCount, dayCount, startDate, seed, futureDayCount, gzip,
        periodDays(period));
    long startNanos = System.nanoTime();
    ScenarioSummary summary = ScenarioGenerator.write(scenario, outDir);
    double seconds = (System.nanoTime() - startNanos) / 1e9;
    spec.commandLine().getOut().println(String.format(Locale.ROOT,
        "generated %d files in %s: %d series x %d days = %d item-days%s, %.1f MB, %.2f s",
        summary.files().size(), outDir, summary.seriesCount(), summary.dayCount(), summary.itemDayCount(),
        summary.periodDays() == ScenarioSpec.WEEKLY ? " in " + summary.dayCount() / ScenarioSpec.WEEKLY + " weeks" : "",
        summary.fileBytes() / 1e6, seconds));
    spec.commandLine().getOut().flush();
    return ExitCodes.OK;
  }

  private static int periodDays(String period) {
    return switch (period) {
      case "day" -> ScenarioSpec.DAILY;
      case "week" -> ScenarioSpec.WEEKLY;
      default -> throw new InvalidRequestException("--period must be day or week, got '" + period + "'");
    };
  }
}
