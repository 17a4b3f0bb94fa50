package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.lagmill.run.InspectJob;
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

  @Mixin
  JsonOption json;

  @Override
  public Integer call() throws Exception {
    StoreSummary summary = InspectJob.run(store.dir);
    PrintWriter out = spec.commandLine().getOut();
    if (json.on) {
      InspectPrinter.printJson(out, summary);
    } else {
      InspectPrinter.print(out, store.dir, summary);
    }
    return ExitCodes.OK;
  }
}
