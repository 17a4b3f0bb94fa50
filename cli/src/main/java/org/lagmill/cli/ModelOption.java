package org.lagmill.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** {@code --model DIR}, for the commands that read a trained model; declared once here. */
final class ModelOption {
  @Option(names = "--model", required = true, paramLabel = "DIR", description = "model directory from train")
  Path dir;
}
