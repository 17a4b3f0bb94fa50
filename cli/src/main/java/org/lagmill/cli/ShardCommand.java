package org.lagmill.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.run.ShardJob;
import org.lagmill.store.ShardAssignment;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill shard}: splits a store into complete stores by a hash of one attribute's value. */
@Command(name = "shard", header = "Split a store into N complete stores by one attribute, one per machine.",
    mixinStandardHelpOptions = true,
    description = {"Split a store into N stores DIR/shard-0 .. DIR/shard-(N-1): each series goes to the shard its",
        "value of --by hashes to (64-bit FNV-1a of the UTF-8 text, modulo N), with its prices and closures;",
        "every shard gets the calendar. Each shard is a complete store with its own checksums (see",
        "docs/distributed.md)."},
    footer = {"", "Example:", "  lagmill shard --store stores/chain --parts 3 --by item --out shards"})
final class ShardCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store to split")
  Path store;

  @Option(names = "--parts", required = true, paramLabel = "N", description = "number of shards, 1 to "
      + ShardAssignment.MAX_PART_COUNT)
  int parts;

  @Option(names = "--by", required = true, paramLabel = "ATTR", description = "attribute whose value picks each "
      + "series' shard; every series with the same value lands in the same shard (e.g. item)")
  String by;

  @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for the shard stores; an "
      + "existing shard store there is replaced")
  Path out;

  @Mixin
  MemoryLimitOption memoryLimit;

  @Override
  public Integer call() throws Exception {
    ShardJob.Outcome outcome = ShardJob.run(new ShardJob.Request(store, parts, by, out, memoryLimit.bytes()));
    ShardPrinter.print(spec.commandLine().getOut(), outcome, by);
    return ExitCodes.OK;
  }
}
