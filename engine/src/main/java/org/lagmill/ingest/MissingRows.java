package org.lagmill.ingest;

import java.util.Locale;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * What a day with no row means in long sales ({@code --missing-rows}); see docs/formats/sales-long.md. Applies from
 * each series' first row to the last date of the file: days before a series' first row are unknown under both
 * policies (the series may not have been listed yet). A row with an empty units cell is unknown under both.
 */
public enum MissingRows {
  /** A missing row means nothing sold: what till exports do, which write a row only when something sold. */
  ZERO,
  /** A missing row means the day's sales are not known. */
  UNKNOWN;

  /** The default for long files: till exports omit zero-sales days. */
  public static final MissingRows DEFAULT = ZERO;

  /** The policy named {@code zero} or {@code unknown} (any case). */
  public static MissingRows parse(String name) {
    for (MissingRows policy : values()) {
      if (policy.name().equalsIgnoreCase(name)) {
        return policy;
      }
    }
    throw new InvalidRequestException(Setting.MISSING_ROWS + " must be one of zero, unknown, got '" + name
        + "'; zero (the default) reads a day with no row as no sale");
  }

  /** The option value: {@code zero} or {@code unknown}. */
  public String optionValue() {
    return name().toLowerCase(Locale.ROOT);
  }
}
