package org.lagmill.cli;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import org.lagmill.ingest.DateWindow;
import org.lagmill.io.InvalidRequestException;

/** Parses {@code --date-window FROM..TO} and sets the engine's plausible-date window (the default when absent). */
final class DateWindows {
  private DateWindows() {}

  static void apply(String option) {
    if (option == null) {
      DateWindow.reset();
      return;
    }
    int dots = option.indexOf("..");
    try {
      if (dots < 0) {
        throw new DateTimeParseException("no ..", option, 0);
      }
      DateWindow.set(LocalDate.parse(option.substring(0, dots)), LocalDate.parse(option.substring(dots + 2)));
    } catch (DateTimeParseException e) {
      throw new InvalidRequestException("--date-window must be FROM..TO with ISO dates, e.g. 1800-01-01..2300-12-31, "
          + "got '" + option + "'");
    }
  }
}
