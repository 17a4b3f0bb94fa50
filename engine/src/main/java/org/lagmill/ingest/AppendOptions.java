package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Objects;

/**
 * What {@link StoreAppend} adds to a store.
 *
 * @param storeDir the existing store, replaced atomically by the appended one
 * @param salesFile a wide sales CSV whose first date is the store's next period, or a long one dated from it on, or
 *     null to replace only the calendar,
 *     prices, closures or plan
 * @param calendarFile a newer calendar replacing the stored one, or null to keep it
 * @param pricesFile a newer prices file replacing the stored prices, or null to keep them
 * @param closuresFile a closures file replacing the stored closures, or null to keep them
 * @param columns column names (series id, sales date and units of long sales, calendar date, prices, closures)
 * @param plan a plan file replacing the stored plan, or null to keep it
 * @param salesFormat wide, long, or auto (decided from the sales file's header)
 * @param missingRows what a period with no row means in long sales (ignored for wide sales)
 */
public record AppendOptions(Path storeDir, Path salesFile, Path calendarFile, Path pricesFile, ColumnNames columns,
    Path closuresFile, PlanSource plan, SalesFormat salesFormat, MissingRows missingRows) {
  public AppendOptions {
    Objects.requireNonNull(storeDir, "storeDir");
    Objects.requireNonNull(columns, "columns");
    Objects.requireNonNull(salesFormat, "salesFormat");
    Objects.requireNonNull(missingRows, "missingRows");
  }

  /** Format decided from the header, missing rows read as zero (the defaults). */
  public AppendOptions(Path storeDir, Path salesFile, Path calendarFile, Path pricesFile, ColumnNames columns,
      Path closuresFile, PlanSource plan) {
    this(storeDir, salesFile, calendarFile, pricesFile, columns, closuresFile, plan, SalesFormat.AUTO,
        MissingRows.DEFAULT);
  }

  public AppendOptions withSalesFormat(SalesFormat format) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, columns, closuresFile, plan, format,
        missingRows);
  }

  public AppendOptions withMissingRows(MissingRows policy) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, columns, closuresFile, plan, salesFormat,
        policy);
  }

  /** Sales only, default column names: calendar and prices are carried over. */
  public static AppendOptions of(Path storeDir, Path salesFile) {
    return new AppendOptions(storeDir, salesFile, null, null, ColumnNames.DEFAULTS, null, null);
  }

  public AppendOptions withCalendarFile(Path file) {
    return new AppendOptions(storeDir, salesFile, file, pricesFile, columns, closuresFile, plan, salesFormat,
        missingRows);
  }

  public AppendOptions withPricesFile(Path file) {
    return new AppendOptions(storeDir, salesFile, calendarFile, file, columns, closuresFile, plan, salesFormat,
        missingRows);
  }

  public AppendOptions withClosuresFile(Path file) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, columns, file, plan, salesFormat,
        missingRows);
  }

  /** A plan file replacing the stored plan, or null to keep it. */
  public AppendOptions withPlan(PlanSource source) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, columns, closuresFile, source, salesFormat,
        missingRows);
  }

  public AppendOptions withColumns(ColumnNames names) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, names, closuresFile, plan, salesFormat,
        missingRows);
  }
}
