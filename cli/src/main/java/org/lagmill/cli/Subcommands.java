package org.lagmill.cli;

import java.util.List;

/** The subcommands of {@code lagmill}, in the order {@code --help} lists them. */
final class Subcommands {
  private Subcommands() {}

  static List<Object> all() {
    return List.of(new DemoCommand(), new GenerateCommand(), new IngestCommand(), new AppendCommand(),
        new ShardCommand(), new InspectCommand(), new SeriesCommand(), new ConfigCommand(), new TrainCommand(),
        new ModelCommand(), new BacktestCommand(), new ForecastCommand(), new ExplainCommand(), new EvaluateCommand(),
        new MergeScoresCommand(), new ClusterLocalCommand(), new ReportCommand());
  }
}
