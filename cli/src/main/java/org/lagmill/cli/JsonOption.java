package org.lagmill.cli;

import picocli.CommandLine.Option;

/**
 * {@code --json}, for the commands that can print their result as JSON instead of text; declared once here. A command
 * whose JSON is more than "the result" says what it is in {@code OptionTexts.properties}.
 */
final class JsonOption {
  @Option(names = "--json", descriptionKey = "json", description = "print the result as JSON")
  boolean on;
}
