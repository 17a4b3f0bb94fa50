package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.ResourceBundle;
import java.util.Set;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

/** Help text fits 80 columns and never splits a word or an example across lines. */
class HelpTextTest {
  private static List<CommandLine> commands() {
    CommandLine root = Main.commandLine();
    List<CommandLine> all = new ArrayList<>(List.of(root));
    for (CommandLine sub : root.getSubcommands().values()) {
      if (!(sub.getCommand() instanceof CommandLine.HelpCommand)) {
        all.add(sub);
      }
    }
    return all;
  }

  @Test
  void shouldFitEveryHelpLineInEightyColumns() {
    for (CommandLine cli : commands()) {
      for (String line : cli.getUsageMessage().split("\\R")) {
        assertTrue(line.length() <= HelpLayout.WIDTH_COLUMNS, cli.getCommandName() + ": " + line.length()
            + " columns: " + line);
      }
    }
  }

  @Test
  void shouldKeepEveryWordOfTheDescriptionsWhole() {
    for (CommandLine cli : commands()) {
      Set<String> printed = new HashSet<>(Arrays.asList(cli.getUsageMessage().split("\\s+")));
      List<String> source = new ArrayList<>(Arrays.asList(cli.getCommandSpec().usageMessage().description()));
      for (OptionSpec option : cli.getCommandSpec().options()) {
        source.addAll(Arrays.asList(option.description()));
      }
      for (String text : source) {
        for (String word : text.split("\\s+")) {
          if (!word.isEmpty() && !word.contains("${")) {
            assertTrue(printed.contains(word), cli.getCommandName() + ": the word '" + word
                + "' is split across lines in:\n" + cli.getUsageMessage());
          }
        }
      }
    }
  }

  @Test
  void shouldShowEveryCommandsOwnTextOfASharedOption() {
    ResourceBundle texts = ResourceBundle.getBundle("org.lagmill.cli.OptionTexts", Locale.ROOT);
    CommandLine root = Main.commandLine();
    for (String key : texts.keySet()) {
      // lagmill.COMMAND.OPTION: a key naming no command or option would leave the option's own text in place unseen
      String[] parts = key.split("\\.");
      assertEquals(3, parts.length, key);
      CommandLine command = root.getSubcommands().get(parts[1]);
      assertNotNull(command, key);
      OptionSpec option = command.getCommandSpec().findOption("--" + parts[2]);
      assertNotNull(option, key);
      assertEquals(texts.getString(key), String.join(" ", option.description()), key);
    }
    assertEquals("print nothing but errors", String.join(" ",
        root.getSubcommands().get("train").getCommandSpec().findOption("--quiet").description()));
  }

  @Test
  void shouldPrintExamplesExactlyAsWritten() {
    for (CommandLine cli : commands()) {
      String usage = cli.getUsageMessage();
      for (String line : cli.getCommandSpec().usageMessage().footer()) {
        assertTrue(usage.contains(line + System.lineSeparator()), cli.getCommandName() + ": footer line not "
            + "printed as written: " + line);
      }
    }
  }

  @Test
  void shouldQuoteHierarchyExamplesForTheShell() {
    for (CommandLine cli : commands()) {
      OptionSpec hierarchy = cli.getCommandSpec().findOption("--hierarchy");
      if (hierarchy != null) {
        String text = String.join(" ", hierarchy.description());
        assertTrue(text.contains("--hierarchy 'region>store'"), text);
      }
      for (String line : cli.getCommandSpec().usageMessage().footer()) {
        // a hierarchy such as region>store left unquoted would redirect the shell's output into a file named store;
        // a > standing alone between spaces is a deliberate redirection
        assertTrue(!line.replaceAll("'[^']*'", "").matches(".*\\S>.*|.*>\\S.*"), cli.getCommandName() + ": " + line);
      }
    }
  }
}
