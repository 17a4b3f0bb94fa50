package org.lagmill.ingest;

import java.time.LocalDate;
import java.util.List;

/**
 * Shape of a long-format sales file, known after its first pass.
 *
 * @param attributeNames the attribute columns, in header order (the {@code series_id} column among them when present)
 * @param firstDate the earliest date in the file: day index 0
 * @param periodDays the step of the file's dates in days (1 daily, 7 weekly)
 * @param dayCount periods from the earliest to the latest date, both included
 * @param seriesCount number of distinct series
 */
public record LongSalesHeader(List<String> attributeNames, LocalDate firstDate, int periodDays, int dayCount,
    int seriesCount) {
  public LongSalesHeader {
    attributeNames = List.copyOf(attributeNames);
  }

  /** A daily file's shape. */
  public LongSalesHeader(List<String> attributeNames, LocalDate firstDate, int dayCount, int seriesCount) {
    this(attributeNames, firstDate, 1, dayCount, seriesCount);
  }
}
