package org.lagmill.ingest;

import java.util.List;

/**
 * The appended sales file's rows: new days of the store's series by store index (null: the series has no row and
 * its new days are unknown), then series new to the store in file order, with which new days were filled with zero.
 *
 * @param dayCount new periods appended
 * @param zeroFills new item-days read as zero for want of a row, series indexed as the appended store will hold
 *     them (the store's series, then the new ones); {@link ZeroFills#NONE} for wide sales
 * @param warnings what the sales reader noticed but read anyway (a date that stretches the store), one sentence each
 */
record AppendedDays(int dayCount, int[][] unitsBySeries, List<String[]> newSeriesAttributes,
    List<int[]> newSeriesUnits, ZeroFills zeroFills, List<String> warnings) {

  /** No sales file: the days stay as they are. */
  static AppendedDays none(int seriesCount) {
    return new AppendedDays(0, new int[seriesCount][], List.of(), List.of(), ZeroFills.NONE, List.of());
  }
}
