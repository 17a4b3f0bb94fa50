package org.lagmill.cli;

import picocli.CommandLine.Option;

/**
 * {@code --quiet}, for the commands that print progress, results or warnings on success; declared once here. A command
 * whose {@code --quiet} keeps more (a summary, the JSON) says so in {@code OptionTexts.properties}.
 */
final class QuietOption {
  @Option(names = "--quiet", descriptionKey = "quiet", description = "print nothing but errors")
  boolean on;
}
