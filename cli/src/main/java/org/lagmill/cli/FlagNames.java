package org.lagmill.cli;

import java.util.List;
import org.lagmill.io.Setting;

/**
 * How the command line spells the settings engine messages mention: the engine says which setting a message is about
 * ({@link Setting}), the CLI shows it as its flag. Every setting is the flag of the same key today; a flag renamed in
 * the CLI changes here and nowhere in the engine.
 */
final class FlagNames {
  private FlagNames() {}

  static String flagOf(Setting setting) {
    return "--" + setting.key();
  }

  static String commandOf(Setting.Command command) {
    return "lagmill " + command.key();
  }

  /** Engine text as the command line shows it: each setting mention replaced by its flag, each command by its line. */
  static String render(String engineText) {
    return Setting.render(engineText, FlagNames::flagOf, FlagNames::commandOf);
  }

  static List<String> render(List<String> engineTexts) {
    return engineTexts.stream().map(FlagNames::render).toList();
  }
}
