package org.lagmill.store;

import java.time.LocalDate;

/**
 * A view of a {@link SalesHistory} that ends before a cut day: days at or after the cut do not exist for its readers.
 * A backtest forecasts from this view, so no feature, scale or weight can read a unit it would not have known at the
 * forecast origin; the leak-freedom of a backtest rests on this class, not on the care of each caller.
 *
 * <p>Prices, calendar and plan stay whole: announced shelf prices, the calendar of the horizon and planned promotions
 * are known in advance.
 */
public final class TruncatedHistory implements SalesHistory {
  private final SalesHistory source;
  private final int dayCount;

  /** @param dayCount days kept from day 0, in {@code [0, source.dayCount()]} */
  public TruncatedHistory(SalesHistory source, int dayCount) {
    if (dayCount < 0 || dayCount > source.dayCount()) {
      throw new IllegalArgumentException("dayCount must be in [0, " + source.dayCount() + "], got " + dayCount);
    }
    this.source = source;
    this.dayCount = dayCount;
  }

  @Override
  public int seriesCount() { return source.seriesCount(); }
  @Override
  public int dayCount() { return dayCount; }
  @Override
  public LocalDate firstDate() { return source.firstDate(); }
  @Override
  public int periodDays() { return source.periodDays(); }

  @Override
  public int units(int seriesIndex, int dayIndex) {
    if (dayIndex >= dayCount) {
      throw new IndexOutOfBoundsException("day " + dayIndex + " is at or after the cut at day " + dayCount);
    }
    return source.units(seriesIndex, dayIndex);
  }

  @Override
  public void readUnits(int seriesIndex, int fromDayIndex, int[] dst, int dstOffset, int count) {
    if (fromDayIndex + count > dayCount) {
      throw new IndexOutOfBoundsException("days " + fromDayIndex + ".." + (fromDayIndex + count - 1)
          + " reach past the cut at day " + dayCount);
    }
    source.readUnits(seriesIndex, fromDayIndex, dst, dstOffset, count);
  }

  @Override
  public int firstSaleDayIndex(int seriesIndex) {
    int first = source.firstSaleDayIndex(seriesIndex);
    return first >= dayCount ? NO_SALE : first;
  }

  /** The source's maximum when the cut keeps every day; otherwise recomputed over the kept days (a slow path). */
  @Override
  public int maxUnits(int seriesIndex) {
    if (dayCount == source.dayCount()) {
      return source.maxUnits(seriesIndex);
    }
    int max = 0;
    for (int d = 0; d < dayCount; d++) {
      max = Math.max(max, source.units(seriesIndex, d));
    }
    return max;
  }

  @Override
  public SeriesAttributes attributes() { return source.attributes(); }
  @Override
  public PriceTable prices() { return source.prices(); }
  @Override
  public DayCalendar calendar() { return source.calendar(); }
  @Override
  public AttributeNesting nesting() { return source.nesting(); }
  @Override
  public ClosureTable closures() { return source.closures(); }
  @Override
  public PlanTable plan() { return source.plan(); }
}
