package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.IngestResult;
import org.lagmill.ingest.ShardIngest;
import org.lagmill.ingest.StoreIngest;
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
  ColumnOptions columns;

  @Mixin
  SalesShapeOptions shape;

  @Mixin
  PlanOptions plan;

  @Option(names = "--period", paramLabel = "PERIOD", description = {"the store's period: day, week or a number of",
      "days; checked against the sales dates (default: detected, from the most common gap between long sales'",
      "dates or the step of wide date columns)"})
  String period;

  @Mixin
  DateWindowOption dateWindow;

  @Mixin
  MemoryLimitOption memoryLimit;

  @Option(names = "--quiet", description = "print nothing on success, not even warnings")
  boolean quiet;

  @Option(names = "--shard", paramLabel = "K/N", description = {"write only shard K of N (K from 0) straight from",
      "the files: the store lagmill shard --parts N --by ATTR would write as shard-K; needs --by"})
  String shard;

  @Option(names = "--by", paramLabel = "ATTR", description = "with --shard: attribute whose value picks each series' "
      + "shard (the rule of lagmill shard)")
  String by;

  @Override
  public Integer call() throws Exception {
    dateWindow.apply();
    IngestOptions options = IngestOptions.of(sales, store)
        .withColumns(columns.names())
        .withSalesFormat(shape.format()).withMissingRows(shape.missingRows())
        .withCalendarFile(calendar).withPricesFile(prices).withClosuresFile(closures)
        .withPlan(plan.source()).withPeriodDays(period == null ? null : Periods.parse("--period", period));
    ShardIngest.Request request = shardRequest(shard, by);
    try (Run run = Run.start("ingest", memoryLimit.bytes())) {
      run.record().configure("shard", shard).configure("shardAttribute", by);
      run.record().configure("sales", sales.toString())
          .configure("calendar", calendar == null ? null : calendar.toString())
          .configure("prices", prices == null ? null : prices.toString()).configure("store", store.toString())
          .configure("plan", plan.file == null ? null : plan.file.toString())
          .configure("missingRows", shape.missingRows().optionValue());
      IngestResult result;
      long peakOffHeapBytes;
      try (Stage stage = run.stage("ingest")) {
        StoreUpdate.Policy policy = new StoreUpdate.Policy(replace ? StoreUpdate.Mode.REPLACE
            : StoreUpdate.Mode.CREATE, noWait.waits());
        result = request == null ? StoreIngest.ingest(options, policy, stage.budget())
            : ShardIngest.ingest(options, request, policy, stage.budget());
        peakOffHeapBytes = stage.budget().peakBytes();
        stage.addRows((long) result.manifest().seriesCount() * result.manifest().dayCount());
      }
      StoreManifest ingested = result.manifest();
      run.record().result("seriesCount", ingested.seriesCount()).result("dayCount", ingested.dayCount())
          .result("storeBytes", ingested.binaryBytes()).result("fill", ingested.fill())
          .result("warnings", FlagNames.render(result.warnings()));
      run.record().write(store);
      if (!quiet) {
        printWarnings(spec.commandLine().getErr(), result.warnings());
        StoreManifest manifest = result.manifest();
        spec.commandLine().getOut().printf("ingested %d series x %s (%s .. %s%s) into %s, %d bytes, peak off-heap "
            + "%d bytes%n", manifest.seriesCount(), Periods.count(manifest.dayCount(), manifest.periodDaysOrDaily()),
            manifest.firstDate(), manifest.lastLocalDate(), manifest.periodDaysOrDaily() == Periods.DAILY ? ""
                : ", " + Periods.describe(manifest.periodDaysOrDaily()),
            store, manifest.binaryBytes(),
            peakOffHeapBytes);
        StoreManifest.Shard part = manifest.shard();
        if (part != null) {
          spec.commandLine().getOut().printf("shard %d of %d by %s: %d of the input's %d series%n", part.part(),
              part.partCount(), part.attribute(), manifest.seriesCount(), part.sourceSeriesCount());
        }
        if (result.periodNote() != null) {
          spec.commandLine().getOut().println(FlagNames.render(result.periodNote()));
        }
        printFill(spec.commandLine().getOut(), manifest);
      }
    }
    return ExitCodes.OK;
  }

  /** The shard asked for with {@code --shard K/N --by ATTR}, or null for the whole input. */
  static ShardIngest.Request shardRequest(String shard, String by) {
    if (shard == null) {
      if (by != null) {
        throw new InvalidRequestException("--by " + by + " picks the shard of each series for --shard K/N; give "
            + "--shard too, or leave both out to ingest every series");
      }
      return null;
    }
    java.util.regex.Matcher m = java.util.regex.Pattern.compile("(\\d{1,9})/(\\d{1,9})").matcher(shard);
    if (!m.matches()) {
      throw new InvalidRequestException("--shard '" + shard + "': expected K/N, shard K (from 0) of N, e.g. 0/3");
    }
    return new ShardIngest.Request(Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)), by);
  }

  /** One line with the manifest's fill counts, as ingest and append print them. */
  static void printFill(PrintWriter out, StoreManifest manifest) {
    StoreManifest.Fill fill = manifest.fill();
    if (fill != null) {
      out.printf("item-days filled with zero %,d, unknown %,d, closed %,d%s%n", fill.zeroFilledItemDays(),
          fill.unknownItemDays(), fill.closedItemDays(), partlyClosed(fill));
    }
  }

  /** ", N partly closed (kept open)" when a store of longer periods has periods closed on some days only. */
  static String partlyClosed(StoreManifest.Fill fill) {
    return fill.partlyClosedItemDays() == 0 ? ""
        : String.format(java.util.Locale.ROOT, ", %,d partly closed (kept open)", fill.partlyClosedItemDays());
  }

  static void printWarnings(PrintWriter err, List<String> warnings) {
    for (String warning : warnings) {
      err.println("warning: " + FlagNames.render(warning));
    }
    err.flush();
  }
}
