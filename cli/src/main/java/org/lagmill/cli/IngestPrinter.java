package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import org.lagmill.ingest.IngestResult;
import org.lagmill.run.IngestJob;
import org.lagmill.store.Periods;
import org.lagmill.store.StoreManifest;

/** The console lines of {@code ingest} and {@code append}, and the fill line other commands print of a store. */
final class IngestPrinter {
  private IngestPrinter() {}

  /** The warnings on {@code err}, then what the ingest wrote into {@code storeDir}, its shard, period and fill. */
  static void printIngested(PrintWriter out, PrintWriter err, IngestJob.Outcome outcome, Path storeDir) {
    IngestResult result = outcome.result();
    result.warnings().forEach(Warnings.to(err));
    StoreManifest manifest = result.manifest();
    out.printf("ingested %d series x %s (%s .. %s%s) into %s, %d bytes, peak off-heap %d bytes%n",
        manifest.seriesCount(), Periods.count(manifest.dayCount(), manifest.periodDaysOrDaily()),
        manifest.firstDate(), manifest.lastLocalDate(), manifest.periodDaysOrDaily() == Periods.DAILY ? ""
            : ", " + Periods.describe(manifest.periodDaysOrDaily()),
        storeDir, manifest.binaryBytes(), outcome.peakOffHeapBytes());
    StoreManifest.Shard part = manifest.shard();
    if (part != null) {
      out.printf("shard %d of %d by %s: %d of the input's %d series%n", part.part(), part.partCount(),
          part.attribute(), manifest.seriesCount(), part.sourceSeriesCount());
    }
    if (result.periodNote() != null) {
      out.println(FlagNames.render(result.periodNote()));
    }
    printFill(out, manifest);
  }

  /** The warnings on {@code err}, then the store's extent after the append and its fill. */
  static void printAppended(PrintWriter out, PrintWriter err, IngestResult result, Path storeDir) {
    result.warnings().forEach(Warnings.to(err));
    StoreManifest manifest = result.manifest();
    out.printf("store %s now holds %d series x %s (%s .. %s)%n", storeDir, manifest.seriesCount(),
        Periods.count(manifest.dayCount(), manifest.periodDaysOrDaily()), manifest.firstDate(),
        manifest.lastLocalDate());
    printFill(out, manifest);
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
        : String.format(Locale.ROOT, ", %,d partly closed (kept open)", fill.partlyClosedItemDays());
  }
}
