package org.lagmill.ingest;

/**
 * What {@link LongSalesReader#read} found: the file's shape and which item-days it filled.
 *
 * @param header the file's shape, as given to {@link SeriesSink#begin}
 * @param zeroFills the item-days with no row that were read as zero under {@link MissingRows#ZERO}, series in the
 *     order the sink received them; none under {@link MissingRows#UNKNOWN}
 */
public record LongSalesRead(LongSalesHeader header, ZeroFills zeroFills) {
  /** Item-days with no row read as zero. */
  public long zeroFilledItemDays() {
    return zeroFills.count();
  }
}
