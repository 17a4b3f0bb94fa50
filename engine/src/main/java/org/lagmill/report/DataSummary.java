package org.lagmill.report;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.time.LocalDate;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import org.lagmill.store.Periods;
import org.lagmill.store.StoreManifest;

/**
 * What the sales history holds and how compactly it is stored. Every field may be null when unknown.
 *
 * @param seriesCount item-store series
 * @param dayCount days per series
 * @param firstDate first day of the history
 * @param lastDate last day of the history
 * @param attributeCardinalities distinct values per series attribute (e.g. "store" to 10), in display order
 * @param zeroDayShare share of item-days with zero units sold, in [0, 1]
 * @param storeBytesPerItemDay bytes the store takes per item-day (columns, dictionaries and prices together)
 * @param int64BytesPerItemDay bytes per item-day of the same history as one 64-bit integer per item-day (8 plus any
 *     overhead the caller counts)
 * @param csvBytesPerItemDay bytes per item-day of the input as CSV text
 * @param periodDays days per period of the store (7 weekly); null for a daily store, whose day counts are days. With
 *     another period, "day" in the other fields' names means one period: {@code dayCount} counts weeks, item-days are
 *     item-weeks
 * @param fill item-days not read as a count from the input (zero-filled, unknown, closed, partly closed periods), as
 *     the store's manifest records them; null when not recorded
 */
public record DataSummary(
    Long seriesCount,
    Integer dayCount,
    LocalDate firstDate,
    LocalDate lastDate,
    Map<String, Long> attributeCardinalities,
    Double zeroDayShare,
    Double storeBytesPerItemDay,
    Double int64BytesPerItemDay,
    Double csvBytesPerItemDay,
    @JsonInclude(JsonInclude.Include.NON_NULL) Integer periodDays,
    @JsonInclude(JsonInclude.Include.NON_NULL) StoreManifest.Fill fill) {

  /** A summary without fill counts. */
  public DataSummary(Long seriesCount, Integer dayCount, LocalDate firstDate, LocalDate lastDate,
      Map<String, Long> attributeCardinalities, Double zeroDayShare, Double storeBytesPerItemDay,
      Double int64BytesPerItemDay, Double csvBytesPerItemDay, Integer periodDays) {
    this(seriesCount, dayCount, firstDate, lastDate, attributeCardinalities, zeroDayShare, storeBytesPerItemDay,
        int64BytesPerItemDay, csvBytesPerItemDay, periodDays, null);
  }

  /** A daily history's summary. */
  public DataSummary(Long seriesCount, Integer dayCount, LocalDate firstDate, LocalDate lastDate,
      Map<String, Long> attributeCardinalities, Double zeroDayShare, Double storeBytesPerItemDay,
      Double int64BytesPerItemDay, Double csvBytesPerItemDay) {
    this(seriesCount, dayCount, firstDate, lastDate, attributeCardinalities, zeroDayShare, storeBytesPerItemDay,
        int64BytesPerItemDay, csvBytesPerItemDay, null);
  }

  public DataSummary {
    attributeCardinalities = attributeCardinalities == null
        ? Map.of() : Collections.unmodifiableMap(new LinkedHashMap<>(attributeCardinalities));
  }

  /** The store's period in words, "day" or "week" (or "period" for another step), for the report's text. */
  public String periodUnit() {
    return Periods.unit(periodDays == null ? Periods.DAILY : periodDays);
  }

  /** Item-days in the history, or null when series or day count is unknown. */
  public Long itemDayCount() {
    return seriesCount == null || dayCount == null ? null : seriesCount * dayCount;
  }
}
