package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Objects;

/**
 * What {@link StoreAppend} adds to a store.
 *
 * @param storeDir the existing store, replaced atomically by the appended one
 * @param inputs a wide sales CSV whose first date is the store's next period, or a long one dated from it on, or
 *     none to replace only the calendar, prices, closures or plan; each of those given replaces the stored one, and
 *     each left out is kept
 */
public record AppendOptions(Path storeDir, SalesInputs inputs) {
  public AppendOptions {
    Objects.requireNonNull(storeDir, "storeDir");
    Objects.requireNonNull(inputs, "inputs");
  }

  /** Sales only, default column names: calendar, prices, closures and plan are carried over. */
  public static AppendOptions of(Path storeDir, Path salesFile) {
    return new AppendOptions(storeDir, SalesInputs.of(salesFile));
  }
}
