package org.lagmill.forecast;

import java.time.LocalDate;
import org.lagmill.store.AttributeNesting;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.PlanTable;
import org.lagmill.store.DayCalendar;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

/**
 * The history a recursive forecast reads: the real history followed by the days already forecast, whose rounded
 * predictions stand in for units. Only the horizon is copied ({@code seriesCount × horizonDays} ints on the heap), never
 * the history itself.
 *
 * <p>{@link #dayCount()} grows by one with each {@link #revealNextDay()}, so a feature pass over the next day can read
 * every earlier forecast day but nothing after it.
 */
final class ForecastScratch implements SalesHistory {
  private final SalesHistory base;
  private final int baseDayCount;
  private final int[][] forecastUnits;
  private int revealedDayCount;

  ForecastScratch(SalesHistory base, int horizonDays) {
    this.base = base;
    this.baseDayCount = base.dayCount();
    this.forecastUnits = new int[base.seriesCount()][horizonDays];
  }

  /** Writes the forecast of horizon day {@code dayOffset} (0-based) of one series, rounded to whole units. */
  void setForecast(int seriesIndex, int dayOffset, double units) {
    forecastUnits[seriesIndex][dayOffset] = (int) Math.min(Integer.MAX_VALUE - 1, Math.max(0, Math.round(units)));
  }

  /** Makes the next forecast day readable. */
  void revealNextDay() {
    if (revealedDayCount == forecastUnits[0].length) {
      throw new IllegalStateException("every one of the " + revealedDayCount + " horizon days is already revealed");
    }
    revealedDayCount++;
  }

  @Override
  public int seriesCount() { return base.seriesCount(); }
  @Override
  public int dayCount() { return baseDayCount + revealedDayCount; }
  @Override
  public LocalDate firstDate() { return base.firstDate(); }
  @Override
  public int periodDays() { return base.periodDays(); }

  @Override
  public int units(int seriesIndex, int dayIndex) {
    if (dayIndex < baseDayCount) {
      return base.units(seriesIndex, dayIndex);
    }
    if (dayIndex >= dayCount()) {
      throw new IndexOutOfBoundsException("day " + dayIndex + " is not forecast yet");
    }
    return forecastUnits[seriesIndex][dayIndex - baseDayCount];
  }

  @Override
  public void readUnits(int seriesIndex, int fromDayIndex, int[] dst, int dstOffset, int count) {
    if (fromDayIndex + count > dayCount()) {
      throw new IndexOutOfBoundsException("days up to " + (fromDayIndex + count - 1) + " are not forecast yet");
    }
    int fromBase = Math.max(0, Math.min(count, baseDayCount - fromDayIndex));
    if (fromBase > 0) {
      base.readUnits(seriesIndex, fromDayIndex, dst, dstOffset, fromBase);
    }
    if (count > fromBase) {
      int firstForecastDay = fromDayIndex + fromBase - baseDayCount;
      System.arraycopy(forecastUnits[seriesIndex], firstForecastDay, dst, dstOffset + fromBase, count - fromBase);
    }
  }

  /** The real history's first sale: a forecast day never counts as a launch. */
  @Override
  public int firstSaleDayIndex(int seriesIndex) { return base.firstSaleDayIndex(seriesIndex); }
  @Override
  public int maxUnits(int seriesIndex) { return base.maxUnits(seriesIndex); }
  @Override
  public SeriesAttributes attributes() { return base.attributes(); }
  @Override
  public PriceTable prices() { return base.prices(); }
  @Override
  public DayCalendar calendar() { return base.calendar(); }
  @Override
  public AttributeNesting nesting() { return base.nesting(); }
  @Override
  public ClosureTable closures() { return base.closures(); }
  @Override
  public PlanTable plan() { return base.plan(); }
}
