package org.lagmill.cli;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import org.lagmill.ingest.DateWindow;
import org.lagmill.io.InvalidRequestException;
import picocli.CommandLine.Option;

/** {@code --date-window FROM..TO}, for the commands that read dated input: sets the engine's plausible dates. */
final class DateWindowOption {
  @Option(names = "--date-window", paramLabel = "FROM..TO", description = "plausible dates: any date read outside "
      + "stops the run (default: 1900-01-01..2200-12-31)")
  String window;

  /** Sets the engine's plausible-date window from the option, or the default when it is absent. */
  void apply() {
    if (window == null) {
      DateWindow.reset();
      return;
    }
    int dots = window.indexOf("..");
    try {
      if (dots < 0) {
        throw new DateTimeParseException("no ..", window, 0);
      }
      DateWindow.set(LocalDate.parse(window.substring(0, dots)), LocalDate.parse(window.substring(dots + 2)));
    } catch (DateTimeParseException e) {
      throw new InvalidRequestException("--date-window must be FROM..TO with ISO dates, e.g. 1800-01-01..2300-12-31, "
          + "got '" + window + "'");
    }
  }
}
