package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Objects;

/**
 * What {@link StoreAppend} adds to a store.
 *
 * @param storeDir the existing store, replaced atomically by the appended one
 * @param salesFile a wide sales CSV whose first date is the store's next day, or null to replace only the calendar,
 *     prices, closures or plan
 * @param calendarFile a newer calendar replacing the stored one, or null to keep it
 * @param pricesFile a newer prices file replacing the stored prices, or null to keep them
 * @param closuresFile a closures file replacing the stored closures, or null to keep them
 * @param columns column names (series id, calendar date, prices from and price; the units column does not apply)
 * @param plan a plan file replacing the stored plan, or null to keep it
 */
public record AppendOptions(Path storeDir, Path salesFile, Path calendarFile, Path pricesFile, ColumnNames columns,
    Path closuresFile, PlanSource plan) {
  public AppendOptions {
    Objects.requireNonNull(storeDir, "storeDir");
    Objects.requireNonNull(columns, "columns");
  }

  /** Sales only, default column names: calendar and prices are carried over. */
  public static AppendOptions of(Path storeDir, Path salesFile) {
    return new AppendOptions(storeDir, salesFile, null, null, ColumnNames.DEFAULTS, null, null);
  }

  public AppendOptions withCalendarFile(Path file) {
    return new AppendOptions(storeDir, salesFile, file, pricesFile, columns, closuresFile, plan);
  }

  public AppendOptions withPricesFile(Path file) {
    return new AppendOptions(storeDir, salesFile, calendarFile, file, columns, closuresFile, plan);
  }

  public AppendOptions withClosuresFile(Path file) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, columns, file, plan);
  }

  /** A plan file replacing the stored plan, or null to keep it. */
  public AppendOptions withPlan(PlanSource source) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, columns, closuresFile, source);
  }

  public AppendOptions withColumns(ColumnNames names) {
    return new AppendOptions(storeDir, salesFile, calendarFile, pricesFile, names, closuresFile, plan);
  }
}
