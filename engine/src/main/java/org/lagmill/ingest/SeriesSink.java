package org.lagmill.ingest;

/**
 * Receives the series of a sales file one at a time, in order of first appearance in the file: the store writer's
 * side of {@link LongSalesReader}.
 */
public interface SeriesSink {
  /** Called once, after the file's series and dates are known and before the first {@link #accept}. */
  default void begin(LongSalesHeader header) {}

  /**
   * One series.
   *
   * @param attributeValues the series' value of each attribute, in the order of
   *     {@link LongSalesHeader#attributeNames()}
   * @param units units per day from {@link LongSalesHeader#firstDate()}, {@code dayCount} long; unknown days hold
   *     {@link org.lagmill.store.SalesHistory#UNKNOWN_UNITS}. Both arrays are reused by the next call: copy what you
   *     keep, and do not modify them.
   */
  void accept(String[] attributeValues, int[] units);

  /**
   * As {@link #accept(String[], int[])}, with the day index of the series' first row in the file: the days before it
   * had no row and are unknown whatever the missing-rows policy (an append may fill them for a series the store
   * already lists).
   */
  default void accept(String[] attributeValues, int[] units, int firstRowDayIndex) {
    accept(attributeValues, units);
  }
}
