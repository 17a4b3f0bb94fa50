package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.lagmill.features.FeatureSpecTemplate;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.Periods;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill config}: prints a commented feature spec, or checks one. */
@Command(name = "config", header = "Print a commented feature spec, or check one.", mixinStandardHelpOptions = true,
    description = {"--template prints every key of a feature spec with its meaning and its default, ready to edit",
        "and pass to --config; --check reads a spec file and prints every setting it resolves to, defaults included."},
    footer = {"", "Example:", "  lagmill config --template > features.yaml",
        "  lagmill config --template --period week > weekly-features.yaml",
        "  lagmill config --check features.yaml"})
final class ConfigCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--template", description = "print the commented template with the defaults")
  boolean template;

  @Option(names = "--check", paramLabel = "FILE", description = "read a feature spec and print what it resolves to")
  Path check;

  @Option(names = "--period", paramLabel = "P", defaultValue = "day", description = "the store's period the "
      + "defaults are for: day, week, or a number of days (default: ${DEFAULT-VALUE})")
  String period;

  private int periodDays() {
    return Periods.parse("--period", period);
  }

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    if (template == (check != null)) {
      throw new InvalidRequestException("give either --template or --check FILE; e.g. lagmill config --template > "
          + "features.yaml");
    }
    if (template) {
      out.print(FlagNames.render(FeatureSpecTemplate.text(periodDays())));
    } else {
      out.print(FeatureSpecYaml.format(FeatureSpecYaml.read(check, periodDays())));
    }
    out.flush();
    return ExitCodes.OK;
  }
}
