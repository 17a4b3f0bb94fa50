package org.lagmill.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** {@code --store DIR}, for the commands that read a store as it is; declared once here. */
final class StoreOption {
  @Option(names = "--store", required = true, paramLabel = "DIR", description = "store directory")
  Path dir;
}
