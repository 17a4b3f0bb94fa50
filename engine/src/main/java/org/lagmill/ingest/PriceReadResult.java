package org.lagmill.ingest;

import java.util.List;
import org.lagmill.store.ArrayPriceTable;

/**
 * What {@link PriceFileReader} read: price change points per series (indexed like the store's series) and the
 * warnings a user should see (rows for keys no series has), one sentence each.
 *
 * @param unknownKeyRowCount number of rows skipped because no series matches their key
 */
public record PriceReadResult(ArrayPriceTable prices, long unknownKeyRowCount, List<String> warnings) {
  public PriceReadResult {
    warnings = List.copyOf(warnings);
  }
}
