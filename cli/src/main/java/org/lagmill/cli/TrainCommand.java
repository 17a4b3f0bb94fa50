package org.lagmill.cli;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.run.BacktestChoice;
import org.lagmill.run.DistributedTrainJob;
import org.lagmill.run.TrainJob;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill train}: streams features from a store into LightGBM and saves the model directory. */
@Command(name = "train", header = "Train a model on a store's history, streaming features into LightGBM.",
    mixinStandardHelpOptions = true,
    description = {"Train a model on a store's history: features stream from the store into LightGBM's Dataset,",
        "the last --horizon days before the cut are the validation window for early stopping."},
    footer = {"", "Example:", "  lagmill train --store stores/chain --model models/week49 --rounds 800",
        "  lagmill train --store stores/chain --model models/by-store \\",
        "      --partition-by store --until 2026-11-29",
        "  lagmill train --store stores/chain --model models/combined \\",
        "      --from-backtest runs/members",
        "  lagmill train --store stores/chain --model models/week50 \\",
        "      --continue-from models/last-origin"})
final class TrainCommand implements Callable<Integer> {
  @Spec
  CommandSpec commandSpec;

  @Mixin
  StoreOption store;

  @Option(names = "--model", required = true, paramLabel = "DIR", description = "model directory to write")
  Path model;

  @Option(names = "--until", paramLabel = "DATE", description = "last day the model may learn from (default: the "
      + "store's last day)")
  LocalDate until;

  @Mixin
  MemoryLimitOption memoryLimit;

  @Mixin
  QuietOption quiet;

  @Mixin
  TrainingOptions training;

  @Option(names = "--member", paramLabel = "SPEC[@ATTRIBUTE]", description = {"train a combined model: a feature",
      "spec YAML, optionally @ the attribute to partition by; repeat it: each member trains in turn (memory is the",
      "largest member's) and forecast averages them, as backtest --member scores them"})
  List<String> members = List.of();

  @Option(names = "--from-backtest", paramLabel = "DIR", description = {"train what a backtest of several --member",
      "specs chose: the member with the lowest mean WRMSSE, or all of them when their average scored lowest"})
  Path fromBacktest;

  @Option(names = "--continue-from", paramLabel = "DIR", description = {"start from the trees of a saved model",
      "(backtest --save-last-model, or last week's) and add rounds until early stopping, instead of boosting from",
      "scratch; same feature spec, objective and --partition-by; one model, not --member"})
  Path continueFrom;

  @Option(names = "--machines", paramLabel = "HOST:PORT,…", description = {"train one model over several machines,",
      "each holding one shard (lagmill shard), on LightGBM's distributed learner: every rank's host:port in rank",
      "order; rank 0 also uses its port + 1 (docs/distributed.md)"})
  String machines;

  @Option(names = "--rank", paramLabel = "K", description = "this machine's position in --machines, from 0; rank 0 "
      + "writes the model directory")
  Integer rank;

  @Option(names = "--tree-learner", paramLabel = "NAME", defaultValue = "data", description = {"with --machines:",
      "data (histograms reduced over all ranks) or voting (top features voted, less traffic)",
      "(default: ${DEFAULT-VALUE})"})
  String treeLearner;

  @Option(names = "--rank-timeout", paramLabel = "SECONDS", defaultValue = "600", description = {"with --machines:",
      "longest wait for another rank (to connect, or at a step every rank takes together) before this one stops;",
      "LightGBM's own socket time-out is this in whole minutes, at least 1 (default: ${DEFAULT-VALUE})"})
  int rankTimeoutSeconds;

  @Override
  public Integer call() throws Exception {
    List<String> memberArgs = members;
    if (fromBacktest != null) {
      if (!members.isEmpty() || training.config != null) {
        throw new InvalidRequestException("--from-backtest takes the specs the backtest chose; drop --member and "
            + "--config");
      }
      BacktestChoice choice = BacktestChoice.read(fromBacktest);
      memberArgs = choice.memberNames();
      if (!quiet.on) {
        commandSpec.commandLine().getOut().printf(Locale.ROOT, "the backtest in %s chose %s (mean WRMSSE %.4f): "
            + "training %s%n", fromBacktest, choice.chosenName(), choice.meanWrmsse(), String.join(", ", memberArgs));
      }
    } else if (!members.isEmpty() && training.config != null) {
      throw new InvalidRequestException("give either --config or --member, not both: each member is its own spec");
    }
    List<String> chosenMembers = memberArgs;
    TrainJob.Request request = new TrainJob.Request(store.dir, model, until, memoryLimit.bytes(),
        (periodDays, cut) -> training.members(chosenMembers, periodDays, cut), continueFrom);
    if (machines != null || rank != null) {
      return trainRank(request);
    }
    TrainJob.Outcome outcome = TrainJob.run(request, ConsoleProgress.forCommand(quiet.on));
    if (!quiet.on) {
      TrainPrinter.print(commandSpec.commandLine().getOut(), outcome);
    }
    return ExitCodes.OK;
  }

  /**
   * This process's rank of a distributed training. When another rank dies while this one waits inside LightGBM, the
   * exchange's reader thread prints the cause and ends the process at once with {@link ExitCodes#RANK_FAILED}.
   */
  private int trainRank(TrainJob.Request request) throws Exception {
    DistributedTrainJob.Outcome outcome = DistributedTrainJob.run(new DistributedTrainJob.Request(request, machines,
        rank, treeLearner, rankTimeoutSeconds), ConsoleProgress.forCommand(quiet.on), message -> {
          System.err.println("lagmill: rank " + rank + " stops: " + FlagNames.render(message));
          System.err.flush();
          System.out.flush();
          Runtime.getRuntime().halt(ExitCodes.RANK_FAILED);
        });
    if (!quiet.on) {
      DistributedTrainPrinter.print(commandSpec.commandLine().getOut(), outcome);
    }
    return ExitCodes.OK;
  }
}
