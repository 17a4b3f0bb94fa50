package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.lagmill.run.SeriesJob;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill series}: lists a store's series ids and attributes, optionally those matching a text. */
@Command(name = "series", header = "List a store's series ids and attributes.", mixinStandardHelpOptions = true,
    description = {"List the series of a store: the id other commands take (--series, --show) and every attribute,",
        "one series per line, tab-separated with a header; --match keeps the series whose id or any attribute value",
        "contains the text, ignoring case."},
    footer = {"", "Example:", "  lagmill series --store stores/chain --match bakery"})
final class SeriesCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Mixin
  StoreOption store;

  @Option(names = "--match", paramLabel = "TEXT", description = "only series whose id or attribute values contain "
      + "this text (case ignored)")
  String match;

  @Mixin
  JsonOption json;

  @Override
  public Integer call() throws Exception {
    SeriesJob.Listing listing = SeriesJob.run(store.dir, match);
    PrintWriter out = spec.commandLine().getOut();
    if (json.on) {
      SeriesPrinter.printJson(out, listing);
    } else {
      SeriesPrinter.print(out, spec.commandLine().getErr(), listing, match);
    }
    return ExitCodes.OK;
  }
}
