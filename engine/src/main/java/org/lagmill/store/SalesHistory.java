package org.lagmill.store;

import java.time.LocalDate;

/**
 * Read access to unit sales of many series per period (day, week or any fixed step, {@link #periodDays()}), by index: the one view that feature, evaluation and forecast code
 * read. Implemented by the memory-mapped {@link SalesStore} and, for tests and scratch copies, by
 * {@link ArraySalesHistory}.
 *
 * <p>Series are numbered {@code 0 .. seriesCount()-1}; days {@code 0 .. dayCount()-1} from {@link #firstDate()}: a day
 * index counts periods of {@link #periodDays()} days (see {@link Periods}). A day whose units are not known reads as {@link #UNKNOWN_UNITS}. Implementations are safe for concurrent reads while open.
 */
public interface SalesHistory {
  /** Units value of a day whose sales are not known (an empty cell in the input). */
  int UNKNOWN_UNITS = -1;

  /** {@link #firstSaleDayIndex(int)} of a series that never sold. */
  int NO_SALE = -1;

  int seriesCount();

  /** Number of days of sales held, the same for every series. */
  int dayCount();

  /** Date of day index 0. */
  LocalDate firstDate();

  /** Days per period: 1 for a daily store, 7 for a weekly one; index {@code i} starts {@code i × periodDays()} days
   * after {@link #firstDate()}. */
  int periodDays();

  /** The seasonal length in periods, {@link Periods#seasonLength}: 7 daily, 52 weekly. */
  default int seasonLength() {
    return Periods.seasonLength(periodDays());
  }

  /** Units sold by one series on one day, or {@link #UNKNOWN_UNITS}. */
  int units(int seriesIndex, int dayIndex);

  /**
   * Copies {@code count} consecutive days of one series into {@code dst}; unknown days read as {@link #UNKNOWN_UNITS}.
   *
   * @param fromDayIndex first day to copy, {@code >= 0}; {@code fromDayIndex + count <= dayCount()}
   */
  void readUnits(int seriesIndex, int fromDayIndex, int[] dst, int dstOffset, int count);

  /** First day index with a non-zero sale, or {@link #NO_SALE}. */
  int firstSaleDayIndex(int seriesIndex);

  /** Largest daily units of the series (0 when it never sold or every day is unknown). */
  int maxUnits(int seriesIndex);

  SeriesAttributes attributes();

  /** Shelf prices; {@link PriceTable#isEmpty()} when none were ingested. */
  PriceTable prices();

  /** Day-level calendar columns; may cover days after the last sales day. */
  DayCalendar calendar();

  /** Declared closures; a closed day reads as {@link #UNKNOWN_UNITS}. Empty unless closures were ingested. */
  default ClosureTable closures() {
    return ClosureTable.EMPTY;
  }

  /**
   * Known-future drivers (planned promotions and the like) per plan key, which may reach past the last sales day;
   * {@link PlanTable#isEmpty()} unless a plan was ingested. Plans are known in advance, so views that cut the history
   * (a backtest's origin) keep the plan whole.
   */
  default PlanTable plan() {
    return PlanTable.EMPTY;
  }

  /**
   * Whether the series was (or will be) closed on a day index, which may lie past the last sales day: tells a closed
   * day from an unknown one.
   */
  default boolean isClosed(int seriesIndex, int dayIndex) {
    return closures().isClosed(seriesIndex, dayIndex);
  }

  /**
   * How the attributes nest in the data (item under department, store under region); the source of every default
   * hierarchy and price group. Computed from {@link #attributes()} on each call unless an implementation keeps it.
   */
  default AttributeNesting nesting() {
    return AttributeNesting.detect(attributes(), seriesCount());
  }

  /** First date of the period with this index, which may lie past the last sales period. */
  default LocalDate dateOf(int dayIndex) {
    return firstDate().plusDays((long) dayIndex * periodDays());
  }
}
