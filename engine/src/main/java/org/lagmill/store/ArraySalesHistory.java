package org.lagmill.store;

import java.time.LocalDate;
import java.util.Arrays;

/**
 * A {@link SalesHistory} held in plain heap arrays: the slow obvious form that tests compare the mapped store against,
 * and the scratch copy a recursive forecast writes its predictions into. Not for full-scale data.
 */
public final class ArraySalesHistory implements SalesHistory {
  private final LocalDate firstDate;
  private final int periodDays;
  private final int[][] unitsBySeries;
  private final int dayCount;
  private final SeriesAttributes attributes;
  private final PriceTable prices;
  private final DayCalendar calendar;
  private final PlanTable plan;

  /**
   * @param unitsBySeries one row per series, all of the same length; {@link #UNKNOWN_UNITS} marks unknown days. The
   *     array is held, not copied, so a caller may overwrite a day (recursive forecasting does).
   */
  public ArraySalesHistory(LocalDate firstDate, int[][] unitsBySeries, SeriesAttributes attributes, PriceTable prices,
      DayCalendar calendar) {
    this(firstDate, Periods.DAILY, unitsBySeries, attributes, prices, calendar);
  }

  /** As the daily constructor, for a store of {@code periodDays} days per index (prices and calendar per period). */
  public ArraySalesHistory(LocalDate firstDate, int periodDays, int[][] unitsBySeries, SeriesAttributes attributes,
      PriceTable prices, DayCalendar calendar) {
    this(firstDate, periodDays, unitsBySeries, attributes, prices, calendar, PlanTable.EMPTY);
  }

  private ArraySalesHistory(LocalDate firstDate, int periodDays, int[][] unitsBySeries, SeriesAttributes attributes,
      PriceTable prices, DayCalendar calendar, PlanTable plan) {
    this.firstDate = firstDate;
    this.periodDays = Periods.requireValid(periodDays);
    this.unitsBySeries = unitsBySeries;
    this.dayCount = unitsBySeries.length == 0 ? 0 : unitsBySeries[0].length;
    for (int[] row : unitsBySeries) {
      if (row.length != dayCount) {
        throw new IllegalArgumentException("every series needs " + dayCount + " days, got " + row.length);
      }
    }
    this.attributes = attributes;
    this.prices = prices;
    this.calendar = calendar;
    this.plan = plan;
  }

  /** The same history (sharing its unit arrays) holding {@code plan}. */
  public ArraySalesHistory withPlan(PlanTable plan) {
    return new ArraySalesHistory(firstDate, periodDays, unitsBySeries, attributes, prices, calendar, plan);
  }

  @Override
  public PlanTable plan() {
    return plan;
  }

  /** A history with one attribute {@code series_id} naming series s0, s1, …, no prices and no calendar. */
  public static ArraySalesHistory ofUnits(LocalDate firstDate, int[][] unitsBySeries) {
    String[][] codes = new String[unitsBySeries.length][1];
    for (int s = 0; s < unitsBySeries.length; s++) {
      codes[s][0] = "s" + s;
    }
    return new ArraySalesHistory(firstDate, unitsBySeries,
        ArraySeriesAttributes.of(new String[] {SeriesIdentity.SERIES_ID}, codes),
        PriceTable.EMPTY, DayCalendar.EMPTY);
  }

  /** A copy of the whole history extended by {@code extraDayCount} days of unknown units. */
  public static ArraySalesHistory copyOf(SalesHistory source, int extraDayCount) {
    int[][] units = new int[source.seriesCount()][source.dayCount() + extraDayCount];
    for (int s = 0; s < units.length; s++) {
      source.readUnits(s, 0, units[s], 0, source.dayCount());
      Arrays.fill(units[s], source.dayCount(), units[s].length, UNKNOWN_UNITS);
    }
    return new ArraySalesHistory(source.firstDate(), source.periodDays(), units, source.attributes(), source.prices(),
        source.calendar(), source.plan());
  }

  /** Overwrites one day; for scratch copies. */
  public void setUnits(int seriesIndex, int dayIndex, int units) {
    unitsBySeries[seriesIndex][dayIndex] = units;
  }

  @Override
  public int seriesCount() { return unitsBySeries.length; }
  @Override
  public int dayCount() { return dayCount; }
  @Override
  public LocalDate firstDate() { return firstDate; }
  @Override
  public int periodDays() { return periodDays; }
  @Override
  public int units(int seriesIndex, int dayIndex) { return unitsBySeries[seriesIndex][dayIndex]; }

  @Override
  public void readUnits(int seriesIndex, int fromDayIndex, int[] dst, int dstOffset, int count) {
    System.arraycopy(unitsBySeries[seriesIndex], fromDayIndex, dst, dstOffset, count);
  }

  @Override
  public int firstSaleDayIndex(int seriesIndex) {
    int[] row = unitsBySeries[seriesIndex];
    for (int d = 0; d < row.length; d++) {
      if (row[d] > 0) {
        return d;
      }
    }
    return NO_SALE;
  }

  @Override
  public int maxUnits(int seriesIndex) {
    int max = 0;
    for (int u : unitsBySeries[seriesIndex]) {
      max = Math.max(max, u);
    }
    return max;
  }

  @Override
  public SeriesAttributes attributes() { return attributes; }
  @Override
  public PriceTable prices() { return prices; }
  @Override
  public DayCalendar calendar() { return calendar; }
}
