package org.lagmill.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.lagmill.run.RunRecord;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;

/** The console lines of {@code inspect}: one aligned line per figure of a store's summary, or the summary as JSON. */
final class InspectPrinter {
  private InspectPrinter() {}

  static void printJson(PrintWriter out, StoreSummary summary) throws JsonProcessingException {
    out.println(RunRecord.JSON.writeValueAsString(summary.toMap()));
  }

  static void print(PrintWriter out, Path storeDir, StoreSummary summary) {
    out.printf("store                 %s%n", storeDir);
    out.printf("series                %,d%n", summary.seriesCount());
    out.printf("days                  %,d (%s .. %s)%n", summary.dayCount(), summary.firstDate(), summary.lastDate());
    for (Map.Entry<String, Integer> e : summary.attributeCardinalities().entrySet()) {
      out.printf("attribute %-11s %,d distinct values%n", e.getKey(), e.getValue());
    }
    for (Map.Entry<String, String> e : summary.nesting().entrySet()) {
      out.printf("nesting %-13s %s%n", e.getKey(), e.getValue() == null ? "(root)" : "under " + e.getValue());
    }
    List<String> chains = new ArrayList<>();
    for (List<String> chain : summary.chains()) {
      chains.add(String.join(" > ", chain));
    }
    out.printf("default levels from   %s, with the total and single series%n",
        chains.isEmpty() ? "no nesting" : String.join("; ", chains));
    out.printf("series by width       1 byte: %,d  2 bytes: %,d  4 bytes: %,d%n",
        summary.seriesCountByWidth().get("BYTE"), summary.seriesCountByWidth().get("SHORT"),
        summary.seriesCountByWidth().get("INT"));
    out.printf("units file            %,d bytes (%.3f bytes per item-day)%n", summary.unitsFileBytes(),
        summary.unitsBytesPerItemDay());
    out.printf("store on disk         %,d bytes (%.3f bytes per item-day)%n", summary.diskBytes(),
        summary.storeBytesPerItemDay());
    out.printf("as int64 columns      %,d bytes%n", summary.int64ColumnBytes());
    out.printf("source CSV            %,d bytes%n", summary.sourceCsvBytes());
    out.printf("mapped off-heap       %,d bytes%n", summary.offHeapBytes());
    out.printf("zero days             %.1f%% of known item-days; %,d item-days unknown%n",
        100 * summary.zeroDayShare(), summary.unknownDayCount());
    StoreManifest.Fill fill = summary.fill();
    if (fill == null) {
      out.printf("filled                not recorded (store written before fill counts were kept)%n");
    } else {
      out.printf("filled                %,d item-days with zero (no row in long sales), %,d unknown, %,d closed%s%n",
          fill.zeroFilledItemDays(), fill.unknownItemDays(), fill.closedItemDays(),
          IngestPrinter.partlyClosed(fill));
    }
    out.printf("fingerprint           %s%n", summary.fingerprint());
  }
}
