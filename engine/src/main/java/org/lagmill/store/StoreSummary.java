package org.lagmill.store;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What {@code lagmill inspect} reports about a store: its extent, how compact it is, and how much of it is zero.
 *
 * @param attributeCardinalities distinct values per attribute, in attribute order
 * @param seriesCountByWidth series per units width (BYTE, SHORT, INT)
 * @param diskBytes bytes of the store directory (binary files and manifest)
 * @param offHeapBytes bytes mapped while the store is open
 * @param unitsFileBytes bytes of units.bin
 * @param unitsBytesPerItemDay units.bin bytes per item-day
 * @param storeBytesPerItemDay all store bytes per item-day
 * @param int64ColumnBytes what one int64 column of units would take: seriesCount * dayCount * 8
 * @param sourceCsvBytes bytes of the source files the store was built from
 * @param unknownDayCount item-days with unknown units
 * @param zeroDayShare share of known item-days with zero units, 0 when none are known
 * @param fill the manifest's fill counts (zero-filled, unknown, closed item-days), null for a store written before
 *     they were recorded
 * @param nesting each attribute to the attribute it lies directly under, or null for a root ({@link AttributeNesting})
 * @param chains the nesting's chains from a root to a leaf, attributes naming each series left out
 * @param periodDays days per period (7 weekly); {@code dayCount} and the per-item-day figures count periods
 */
public record StoreSummary(int seriesCount, LocalDate firstDate, LocalDate lastDate, int dayCount,
    Map<String, Integer> attributeCardinalities, Map<String, Long> seriesCountByWidth, long diskBytes,
    long offHeapBytes, long unitsFileBytes, double unitsBytesPerItemDay, double storeBytesPerItemDay,
    long int64ColumnBytes, long sourceCsvBytes, long unknownDayCount, double zeroDayShare, String fingerprint,
    StoreManifest.Fill fill, Map<String, String> nesting, List<List<String>> chains, int periodDays) {

  /** Computes the summary; reads every units value once (for the zero share). */
  public static StoreSummary of(SalesStore store) {
    Map<String, Integer> cardinalities = new LinkedHashMap<>();
    SeriesAttributes attributes = store.attributes();
    for (int a = 0; a < attributes.attributeCount(); a++) {
      cardinalities.put(attributes.attributeName(a), attributes.cardinality(a));
    }
    Map<String, Long> byWidth = new LinkedHashMap<>();
    long[] counts = store.seriesCountByWidth();
    for (UnitsWidth width : UnitsWidth.values()) {
      byWidth.put(width.name(), counts[width.ordinal()]);
    }
    int dayCount = store.dayCount();
    int[] row = new int[dayCount];
    long zeroDays = 0;
    long unknownDays = 0;
    for (int s = 0; s < store.seriesCount(); s++) {
      store.readUnits(s, 0, row, 0, dayCount);
      for (int u : row) {
        zeroDays += u == 0 ? 1 : 0;
        unknownDays += u == SalesHistory.UNKNOWN_UNITS ? 1 : 0;
      }
    }
    long itemDays = (long) store.seriesCount() * dayCount;
    long knownDays = itemDays - unknownDays;
    long unitsFileBytes = store.manifest().file(FileKind.UNITS.fileName()).bytes();
    return new StoreSummary(store.seriesCount(), store.firstDate(), store.dateOf(dayCount - 1), dayCount,
        cardinalities, byWidth, store.diskBytes(), store.offHeapBytes(), unitsFileBytes,
        itemDays == 0 ? 0 : (double) unitsFileBytes / itemDays,
        itemDays == 0 ? 0 : (double) store.diskBytes() / itemDays,
        itemDays * Long.BYTES, store.manifest().sourceBytes(), unknownDays,
        knownDays == 0 ? 0 : (double) zeroDays / knownDays, store.fingerprint(),
        store.manifest().fill(), store.nesting().parents(), store.nesting().chains(), store.periodDays());
  }

  /** The summary as plain JSON-ready values (dates as ISO text), in field order. */
  public Map<String, Object> toMap() {
    Map<String, Object> map = new LinkedHashMap<>();
    map.put("seriesCount", seriesCount);
    map.put("firstDate", firstDate.toString());
    map.put("lastDate", lastDate.toString());
    map.put("dayCount", dayCount);
    if (periodDays != Periods.DAILY) {
      map.put("periodDays", periodDays);
    }
    map.put("attributeCardinalities", attributeCardinalities);
    map.put("seriesCountByWidth", seriesCountByWidth);
    map.put("diskBytes", diskBytes);
    map.put("offHeapBytes", offHeapBytes);
    map.put("unitsFileBytes", unitsFileBytes);
    map.put("unitsBytesPerItemDay", unitsBytesPerItemDay);
    map.put("storeBytesPerItemDay", storeBytesPerItemDay);
    map.put("int64ColumnBytes", int64ColumnBytes);
    map.put("sourceCsvBytes", sourceCsvBytes);
    map.put("unknownDayCount", unknownDayCount);
    map.put("zeroDayShare", zeroDayShare);
    map.put("fingerprint", fingerprint);
    map.put("fill", fill);
    map.put("nesting", nesting);
    map.put("chains", chains);
    return map;
  }
}
