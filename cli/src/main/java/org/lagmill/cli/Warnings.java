package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.function.Consumer;

/** How the console shows an engine warning: a line {@code warning: …} on stderr with flags for mentions, at once. */
final class Warnings {
  private Warnings() {}

  /** A sink that prints each warning to {@code err} as it arises. */
  static Consumer<String> to(PrintWriter err) {
    return warning -> {
      err.println("warning: " + FlagNames.render(warning));
      err.flush();
    };
  }

  /** A sink that prints nothing: the command was asked to be quiet. */
  static Consumer<String> none() {
    return warning -> {};
  }
}
