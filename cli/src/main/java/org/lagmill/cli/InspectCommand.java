package org.lagmill.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.lagmill.run.Run;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSummary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill inspect}: verifies a store and prints its summary. */
@Command(name = "inspect", header = "Verify a store and print its extent, widths and bytes per item-day.",
    mixinStandardHelpOptions = true,
    description = "Verify a store (sizes, checksums) and print its extent, widths and bytes per item-day.",
    footer = {"", "Example:", "  lagmill inspect --store stores/chain --json"})
final class InspectCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Mixin
  StoreOption store;

  @Option(names = "--json", description = "print the summary as JSON")
  boolean json;

  @Override
  public Integer call() throws Exception {
    StoreSummary summary;
    try (Run run = Run.unlimited("inspect");
        SalesStore opened = SalesStore.open(store.dir, run.budget().child("store"))) {
      summary = StoreSummary.of(opened);
    }
    PrintWriter out = spec.commandLine().getOut();
    if (json) {
      out.println(new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(summary.toMap()));
      return ExitCodes.OK;
    }
    out.printf("store                 %s%n", store.dir);
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
    return ExitCodes.OK;
  }
}
