package org.lagmill.ingest;

import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import org.lagmill.io.Excerpts;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/** Layout of a sales file ({@code --sales-format}); see docs/formats.md. */
public enum SalesFormat {
  /** One row per series, one ISO-date column per day. */
  WIDE,
  /** One row per series and day, with a date and a units column. */
  LONG,
  /** Decided from the header: wide when a column header is an ISO date, long when it has the date and units columns. */
  AUTO;

  /** The format named {@code wide}, {@code long} or {@code auto} (any case). */
  public static SalesFormat parse(String name) {
    for (SalesFormat format : values()) {
      if (format.name().equalsIgnoreCase(name)) {
        return format;
      }
    }
    throw new InvalidRequestException(Setting.SALES_FORMAT + " must be one of wide, long, auto, got '" + name
        + "'; auto (the default) decides from the header");
  }

  /**
   * This format, or for {@link #AUTO} the one the file's header shows. Reads only the header line.
   *
   * @throws InputFormatException when the header has neither a date column header nor both named columns
   * @throws NoSuchFileException when the file does not exist
   */
  public SalesFormat resolve(Path salesFile, String dateColumn, String unitsColumn) throws NoSuchFileException {
    if (this != AUTO) {
      return this;
    }
    // The missing file is reported as an I/O error (as the wide reader does), not as a malformed file.
    if (!Files.exists(salesFile)) {
      throw new NoSuchFileException(salesFile.toString());
    }
    String[] header;
    try (CsvSource source = CsvSource.open(salesFile)) {
      header = source.readHeader();
    }
    for (String name : header) {
      if (Cells.epochDay(name) != Cells.NOT_A_DATE) {
        return WIDE;
      }
    }
    if (Arrays.asList(header).contains(dateColumn) && Arrays.asList(header).contains(unitsColumn)) {
      return LONG;
    }
    throw new InputFormatException(salesFile, 1, 0,
        "header " + Excerpts.of(String.join(",", header)) + " is neither wide nor "
            + "long sales: expected ISO date column headers (wide) or the columns '" + dateColumn + "' and '"
            + unitsColumn + "' (long; rename with " + Setting.DATE_COLUMN + ", " + Setting.UNITS_COLUMN + ")");
  }

  /** The option value: {@code wide}, {@code long} or {@code auto}. */
  public String optionValue() {
    return name().toLowerCase(Locale.ROOT);
  }
}
