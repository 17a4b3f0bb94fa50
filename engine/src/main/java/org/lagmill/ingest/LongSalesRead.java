package org.lagmill.ingest;

/**
 * What {@link LongSalesReader#read} found: the file's shape and how many item-days it filled.
 *
 * @param header the file's shape, as given to {@link SeriesSink#begin}
 * @param zeroFilledItemDays item-days with no row that were read as zero under {@link MissingRows#ZERO}
 */
public record LongSalesRead(LongSalesHeader header, long zeroFilledItemDays) {}
