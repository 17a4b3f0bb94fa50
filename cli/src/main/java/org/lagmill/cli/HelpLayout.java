package org.lagmill.cli;

import java.util.ArrayList;
import java.util.List;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

/**
 * How help text is laid out, in one place for every command. Description arrays in the annotations are written as
 * source lines of one paragraph (an empty element starts a new one), so they are joined before picocli wraps them at
 * word boundaries; left as they are, picocli would end a line at every array element and again at the width.
 * Footers hold examples, which must be copied into a shell exactly as shown, so they are printed verbatim: each
 * example is written to fit 80 columns, continued with a backslash where it is long.
 */
final class HelpLayout {
  /** Columns every help line fits in: the usual terminal width. */
  static final int WIDTH_COLUMNS = 80;

  private HelpLayout() {}

  /** Applies the layout to a command and all its subcommands. */
  static void apply(CommandLine cli) {
    cli.setUsageHelpWidth(WIDTH_COLUMNS);
    CommandSpec spec = cli.getCommandSpec();
    spec.usageMessage().description(paragraphs(spec.usageMessage().description()));
    for (OptionSpec option : List.copyOf(spec.options())) {
      String[] joined = paragraphs(option.description());
      String[] target = option.description();
      if (joined.length != target.length) {
        // OptionSpec has no setter for its description once built; rebuild it with the joined text
        spec.remove(option);
        spec.addOption(option.toBuilder().description(joined).build());
      }
    }
    cli.getHelpSectionMap().put(CommandLine.Model.UsageMessageSpec.SECTION_KEY_FOOTER, help -> {
      StringBuilder b = new StringBuilder();
      for (String line : help.commandSpec().usageMessage().footer()) {
        b.append(line).append(System.lineSeparator());
      }
      return b.toString();
    });
    for (CommandLine sub : cli.getSubcommands().values()) {
      if (sub.getParent() == cli) {
        apply(sub);
      }
    }
  }

  /** Joins source lines into paragraphs; an empty line separates paragraphs. */
  static String[] paragraphs(String[] lines) {
    List<String> out = new ArrayList<>();
    StringBuilder current = new StringBuilder();
    for (String line : lines) {
      if (line.isBlank()) {
        if (current.length() > 0) {
          out.add(current.toString());
          current.setLength(0);
        }
        continue;
      }
      current.append(current.length() == 0 ? "" : " ").append(line.strip());
    }
    if (current.length() > 0) {
      out.add(current.toString());
    }
    return out.toArray(String[]::new);
  }
}
