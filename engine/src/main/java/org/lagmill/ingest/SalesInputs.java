package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Objects;

/**
 * The input files of an ingest or an append and how to read them; {@link IngestOptions} and {@link AppendOptions}
 * each hold one. Immutable.
 *
 * @param salesFile the sales CSV, wide or long (optionally {@code .gz}); null only for an append that replaces the
 *     calendar, prices, closures or plan alone
 * @param calendarFile a calendar CSV, or null (an append then keeps the stored calendar)
 * @param pricesFile a prices CSV, or null (an append then keeps the stored prices)
 * @param closuresFile a closures CSV (days on which series could not sell), or null (an append keeps the stored ones)
 * @param plan a plan file (known-future drivers) with its column names, or null (an append keeps the stored plan)
 * @param columns the column names the readers look for
 * @param salesFormat wide, long, or auto (decided from the sales file's header)
 * @param missingRows what a period with no row means in long sales (ignored for wide sales, whose empty cells are
 *     unknown)
 */
public record SalesInputs(Path salesFile, Path calendarFile, Path pricesFile, Path closuresFile, PlanSource plan,
    ColumnNames columns, SalesFormat salesFormat, MissingRows missingRows) {
  /** The optional files beside the sales file, each read by its own reader. */
  public enum SideFile {
    CALENDAR,
    PRICES,
    CLOSURES
  }

  public SalesInputs {
    Objects.requireNonNull(columns, "columns");
    Objects.requireNonNull(salesFormat, "salesFormat");
    Objects.requireNonNull(missingRows, "missingRows");
  }

  /** Sales only, default column names, format decided from the header, a period with no row read as zero. */
  public static SalesInputs of(Path salesFile) {
    return new SalesInputs(salesFile, null, null, null, null, ColumnNames.DEFAULTS, SalesFormat.AUTO,
        MissingRows.DEFAULT);
  }

  /** These inputs with {@code kind} read from {@code file}, or without it for null. */
  public SalesInputs with(SideFile kind, Path file) {
    return switch (kind) {
      case CALENDAR -> new SalesInputs(salesFile, file, pricesFile, closuresFile, plan, columns, salesFormat,
          missingRows);
      case PRICES -> new SalesInputs(salesFile, calendarFile, file, closuresFile, plan, columns, salesFormat,
          missingRows);
      case CLOSURES -> new SalesInputs(salesFile, calendarFile, pricesFile, file, plan, columns, salesFormat,
          missingRows);
    };
  }

  /** A plan file read once the series are known, or null for none. */
  public SalesInputs withPlan(PlanSource source) {
    return new SalesInputs(salesFile, calendarFile, pricesFile, closuresFile, source, columns, salesFormat,
        missingRows);
  }

  public SalesInputs withColumns(ColumnNames names) {
    return new SalesInputs(salesFile, calendarFile, pricesFile, closuresFile, plan, names, salesFormat, missingRows);
  }

  public SalesInputs withSalesFormat(SalesFormat format) {
    return new SalesInputs(salesFile, calendarFile, pricesFile, closuresFile, plan, columns, format, missingRows);
  }

  public SalesInputs withMissingRows(MissingRows policy) {
    return new SalesInputs(salesFile, calendarFile, pricesFile, closuresFile, plan, columns, salesFormat, policy);
  }
}
