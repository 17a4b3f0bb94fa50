package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.lagmill.eval.BacktestSettings;
import org.lagmill.eval.Hierarchy;
import org.lagmill.io.Setting;
import picocli.CommandLine;

/** Engine messages name settings; the CLI shows each as a flag that exists. */
class FlagNamesTest {
  @Test
  void shouldMapEverySettingToAFlagSomeCommandAccepts() {
    Set<String> flags = new HashSet<>();
    for (CommandLine sub : Main.commandLine().getSubcommands().values()) {
      sub.getCommandSpec().options().forEach(option -> flags.addAll(java.util.List.of(option.names())));
    }
    for (Setting setting : Setting.values()) {
      assertTrue(flags.contains(FlagNames.flagOf(setting)), setting + " shown as " + FlagNames.flagOf(setting)
          + ", which no command accepts");
    }
  }

  @Test
  void shouldMapEveryCommandMentionToASubcommand() {
    Set<String> subcommands = Main.commandLine().getSubcommands().keySet();
    for (Setting.Command command : Setting.Command.values()) {
      assertTrue(subcommands.contains(command.key()), command + " names no subcommand");
    }
    String hint = "list them with " + Setting.Command.SERIES + " " + Setting.STORE + " stores/chain";
    assertEquals("list them with \u2039series command\u203a \u2039store\u203a stores/chain", hint);
    assertEquals("list them with lagmill series --store stores/chain", FlagNames.render(hint));
  }

  @Test
  void shouldShowMentionsInTheFilesTheEngineWritesAsTheCommandLineDoes() {
    Main.commandLine();
    assertEquals("pass its folder with lagmill forecast --backtest DIR", Setting.shown("pass its folder with "
        + Setting.Command.FORECAST + " " + Setting.BACKTEST_REPORT + " DIR"));
  }

  @Test
  void shouldShowAnEngineRefusalWithTheFlag() {
    IllegalArgumentException e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
        () -> new BacktestSettings(0, 7, 7, java.util.List.of(), Hierarchy.parse(java.util.List.of()),
            new double[0]));
    assertEquals("\u2039origins\u203a must be >= 1, got 0", e.getMessage());
    assertEquals("--origins must be >= 1, got 0", FlagNames.render(Main.message(e)));
  }
}
