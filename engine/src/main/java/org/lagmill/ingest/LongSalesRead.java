package org.lagmill.ingest;

import java.util.List;

/**
 * What {@link LongSalesReader#read} found: the file's shape and which item-days it filled.
 *
 * @param header the file's shape, as given to {@link SeriesSink#begin}
 * @param zeroFills the item-days with no row that were read as zero under {@link MissingRows#ZERO}, series in the
 *     order the sink received them; none under {@link MissingRows#UNKNOWN}
 * @param periodNote which period the store holds and where it came from, for the console
 * @param unusualPeriod whether the period was detected and is neither a day nor a week (a sparse daily export whose
 *     dates happen to lie 2 days apart reads as a 2-day period): worth a warning that names {@code --period}
 * @param warnings what the reader noticed but read anyway (a date far from the others), one sentence each
 */
public record LongSalesRead(LongSalesHeader header, ZeroFills zeroFills, String periodNote, boolean unusualPeriod,
    List<String> warnings) {
  /** Item-days with no row read as zero. */
  public long zeroFilledItemDays() {
    return zeroFills.count();
  }
}
