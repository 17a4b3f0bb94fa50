package org.lagmill.scenario;

import java.io.IOException;

/**
 * Days on which an outlet could not sell, over the sales days and the future days: holidays that close the outlets
 * of one or both banners (kiosks never close), one outlet that opens part-way through the history, and one that
 * closes two weeks for a refit. Opening and refit start on a period boundary (a multiple of 7 days from the start
 * date) and last whole weeks, so a weekly scenario can declare them too.
 *
 * <p>Written as {@code closures.csv}: {@code outlet,from,until,reason}, inclusive ISO dates, one row per run of
 * closed days with one reason.
 */
final class ClosureSchedule {
  static final String HEADER = "outlet,from,until,reason";
  /** The outlet (table row) that opens part-way, and the share of the history before it opens. */
  static final int LATE_OUTLET = 3;
  static final int OPENING_PERCENT = 45;
  /** The outlet closed for a refit, when in the history, and the closure's length. */
  static final int REFIT_OUTLET = 1;
  static final int REFIT_PERCENT = 70;
  static final int REFIT_DAYS = 14;
  /** Histories shorter than this get no late opening and no refit: both need room around them. */
  static final int MIN_DAYS_FOR_EVENTS = 112;
  static final String NOT_YET_OPEN = "not yet open";
  static final String REFIT = "refit";
  private static final byte OPEN = 0;
  private static final byte CODE_NOT_YET_OPEN = 1;
  private static final byte CODE_REFIT = 2;
  /** Codes from this one on are a holiday's index plus this offset. */
  private static final byte CODE_FIRST_HOLIDAY = 3;

  private final int calendarDayCount;
  /** Why each outlet is closed on each calendar day; {@link #OPEN} when open. */
  private final byte[][] reasonCode;
  private final int[] openingDayIndex;

  ClosureSchedule(ChainLayout layout, HolidayCalendar calendar, int salesDayCount) {
    calendarDayCount = calendar.dayCount();
    reasonCode = new byte[layout.outletCount()][calendarDayCount];
    openingDayIndex = new int[layout.outletCount()];
    boolean events = salesDayCount >= MIN_DAYS_FOR_EVENTS;
    if (events && layout.outletCount() > LATE_OUTLET) {
      int opening = weekStart(salesDayCount * OPENING_PERCENT / 100);
      openingDayIndex[LATE_OUTLET] = opening;
      fill(LATE_OUTLET, 0, opening, CODE_NOT_YET_OPEN);
    }
    if (events && layout.outletCount() > REFIT_OUTLET) {
      int refit = weekStart(salesDayCount * REFIT_PERCENT / 100);
      fill(REFIT_OUTLET, refit, Math.min(refit + REFIT_DAYS, calendarDayCount), CODE_REFIT);
    }
    for (int day = 0; day < calendarDayCount; day++) {
      int holiday = calendar.holidayIndex(day);
      if (holiday < 0) {
        continue;
      }
      HolidayCalendar.Closing closing = HolidayCalendar.HOLIDAYS[holiday].closing();
      for (int outlet = 0; outlet < reasonCode.length; outlet++) {
        boolean closes = ChainLayout.formatIndex(outlet) != ChainLayout.KIOSK
            && (closing == HolidayCalendar.Closing.BOTH_BANNERS
                || closing == HolidayCalendar.Closing.FIRST_BANNER && ChainLayout.bannerIndex(outlet) == 0);
        if (closes && reasonCode[outlet][day] == OPEN) {
          reasonCode[outlet][day] = (byte) (CODE_FIRST_HOLIDAY + holiday);
        }
      }
    }
  }

  boolean isClosed(int outletIndex, int dayIndex) {
    return reasonCode[outletIndex][dayIndex] != OPEN;
  }

  /** First day the outlet could sell: 0 unless it opens part-way. */
  int openingDayIndex(int outletIndex) {
    return openingDayIndex[outletIndex];
  }

  /**
   * Writes {@code closures.csv}. With {@code wholeWeeksOnly} (weekly output) single holidays are left out: a week
   * with a closed holiday still sells on its other days.
   */
  void write(AsciiWriter out, HolidayCalendar calendar, boolean wholeWeeksOnly) throws IOException {
    out.writeAscii(HEADER);
    out.writeByte('\n');
    for (int outlet = 0; outlet < reasonCode.length; outlet++) {
      byte[] codes = reasonCode[outlet];
      int day = 0;
      while (day < calendarDayCount) {
        byte code = codes[day];
        int end = day + 1;
        while (end < calendarDayCount && codes[end] == code) {
          end++;
        }
        if (code != OPEN && !(wholeWeeksOnly && code >= CODE_FIRST_HOLIDAY)) {
          ChainLayout.writeOutletCode(out, outlet);
          out.writeByte(',');
          out.writeBytes(calendar.isoDate(day));
          out.writeByte(',');
          out.writeBytes(calendar.isoDate(end - 1));
          out.writeByte(',');
          out.writeAscii(reason(code));
          out.writeByte('\n');
        }
        day = end;
      }
    }
  }

  private static String reason(byte code) {
    return code == CODE_NOT_YET_OPEN ? NOT_YET_OPEN : code == CODE_REFIT ? REFIT
        : HolidayCalendar.HOLIDAYS[code - CODE_FIRST_HOLIDAY].name();
  }

  private void fill(int outlet, int fromDay, int endDay, byte code) {
    for (int day = fromDay; day < Math.min(endDay, calendarDayCount); day++) {
      reasonCode[outlet][day] = code;
    }
  }

  /** The last period boundary (a multiple of 7 days from the start) at or before a day index. */
  static int weekStart(int dayIndex) {
    return dayIndex / 7 * 7;
  }
}
