package org.lagmill.scenario;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.MonthDay;
import java.time.temporal.IsoFields;
import java.time.temporal.TemporalAdjusters;

/**
 * The invented country's calendar over the sales days and the future days: nine yearly public holidays (some close
 * outlets, see {@link ClosureSchedule}) and school breaks that differ by district. Day index 0 is the first sales day.
 *
 * <p>School breaks, by ISO week of the year: a winter week (week 7, 8 or 9 by district), two spring weeks (weeks
 * 14–15, 15–16 or 16–17), six summer weeks (from week 28, 29 or 30), autumn week 43 everywhere, and 22 December to
 * 3 January everywhere.
 */
final class HolidayCalendar {
  /** Which outlets a holiday closes: none, the full-range banner's, or both banners' (kiosks never close). */
  enum Closing {
    NONE,
    FIRST_BANNER,
    BOTH_BANNERS
  }

  /** A yearly public holiday: fixed day of a month, or the n-th (n = -1: last) given weekday of a month. */
  record Holiday(String name, int month, int dayOfMonth, DayOfWeek weekday, int nth, Closing closing,
      float[] sectionFactor) {
    LocalDate dateIn(int year) {
      if (weekday == null) {
        return LocalDate.of(year, month, dayOfMonth);
      }
      LocalDate first = LocalDate.of(year, month, 1);
      return nth < 0 ? first.with(TemporalAdjusters.lastInMonth(weekday))
          : first.with(TemporalAdjusters.dayOfWeekInMonth(nth, weekday));
    }
  }

  /** Sales multipliers per section (Chilled, Grocery, Drinks, Homecare, Garden) in the outlets that stay open. */
  static final Holiday[] HOLIDAYS = {
      fixed("Firstday", 1, 1, Closing.BOTH_BANNERS, 0.70f, 0.60f, 0.90f, 0.50f, 0.40f),
      weekday("Thaw Monday", 2, DayOfWeek.MONDAY, 3, Closing.NONE, 1.10f, 1.05f, 1.15f, 1.00f, 1.20f),
      weekday("Lantern Friday", 4, DayOfWeek.FRIDAY, 2, Closing.FIRST_BANNER, 0.85f, 0.80f, 1.05f, 0.70f, 1.10f),
      fixed("Meadow Day", 5, 1, Closing.NONE, 0.90f, 0.85f, 1.10f, 0.80f, 1.45f),
      fixed("Charter Day", 6, 17, Closing.NONE, 1.05f, 0.95f, 1.25f, 0.90f, 1.10f),
      weekday("Harvest Monday", 8, DayOfWeek.MONDAY, -1, Closing.NONE, 1.20f, 1.00f, 1.40f, 0.90f, 1.05f),
      fixed("Guild Day", 10, 12, Closing.FIRST_BANNER, 0.90f, 0.85f, 0.95f, 0.80f, 0.70f),
      fixed("Midwinter", 12, 25, Closing.BOTH_BANNERS, 0.60f, 0.50f, 0.80f, 0.40f, 0.30f),
      fixed("Gifting Day", 12, 26, Closing.FIRST_BANNER, 0.90f, 0.80f, 1.00f, 0.70f, 0.60f)};
  /** The day before a closing holiday lifts food and drink: shoppers stock up. */
  static final float[] EVE_SECTION_FACTOR = {1.35f, 1.25f, 1.30f, 1.05f, 1.00f};
  static final MonthDay YEAR_END_BREAK_FROM = MonthDay.of(12, 22);
  static final MonthDay YEAR_END_BREAK_UNTIL = MonthDay.of(1, 3);
  static final String HOLIDAY_COLUMN = "holiday";
  static final String HOLIDAY_DAYS_COLUMN = "holiday_days";
  static final String SCHOOL_BREAK_COLUMN = "school_break";
  static final String DISTRICT_ATTRIBUTE = "district";

  private final LocalDate startDate;
  private final int dayCount;
  private final byte[][] isoDateBytes;
  private final byte[] dayOfWeekIndex;
  private final short[] dayOfYear;
  private final byte[] holidayIndex;
  private final boolean[][] schoolBreak;

  HolidayCalendar(LocalDate startDate, int dayCount) {
    this.startDate = startDate;
    this.dayCount = dayCount;
    isoDateBytes = new byte[dayCount][];
    dayOfWeekIndex = new byte[dayCount];
    dayOfYear = new short[dayCount];
    holidayIndex = new byte[dayCount];
    schoolBreak = new boolean[ChainLayout.DISTRICT_NAMES.length][dayCount];
    for (int day = 0; day < dayCount; day++) {
      LocalDate date = startDate.plusDays(day);
      isoDateBytes[day] = date.toString().getBytes(StandardCharsets.US_ASCII);
      dayOfWeekIndex[day] = (byte) (date.getDayOfWeek().getValue() - 1);
      dayOfYear[day] = (short) date.getDayOfYear();
      holidayIndex[day] = (byte) holidayOn(date);
      for (int district = 0; district < schoolBreak.length; district++) {
        schoolBreak[district][day] = isSchoolBreak(district, date);
      }
    }
  }

  int dayCount() {
    return dayCount;
  }

  LocalDate startDate() {
    return startDate;
  }

  /** The ISO date (YYYY-MM-DD) of a day as ASCII bytes; shared, do not modify. */
  byte[] isoDate(int dayIndex) {
    return isoDateBytes[dayIndex];
  }

  /** 0 = Monday .. 6 = Sunday. */
  int dayOfWeek(int dayIndex) {
    return dayOfWeekIndex[dayIndex];
  }

  int dayOfYear(int dayIndex) {
    return dayOfYear[dayIndex];
  }

  /** Index into {@link #HOLIDAYS}, or -1 on an ordinary day. */
  int holidayIndex(int dayIndex) {
    return holidayIndex[dayIndex];
  }

  /** Whether the next day is a holiday that closes some outlets. */
  boolean isEveOfClosingHoliday(int dayIndex) {
    if (dayIndex + 1 < dayCount) {
      int next = holidayIndex[dayIndex + 1];
      return next >= 0 && HOLIDAYS[next].closing() != Closing.NONE;
    }
    int next = holidayOn(startDate.plusDays(dayIndex + 1L));
    return next >= 0 && HOLIDAYS[next].closing() != Closing.NONE;
  }

  boolean isSchoolBreak(int districtIndex, int dayIndex) {
    return schoolBreak[districtIndex][dayIndex];
  }

  /**
   * Writes the daily calendar: {@code date}, {@code holiday} (the holiday's name or empty) and one
   * {@code school_break[district=NAME]} 0/1 column per district that has an outlet.
   */
  void writeDaily(AsciiWriter out, ChainLayout layout) throws IOException {
    out.writeAscii("date," + HOLIDAY_COLUMN);
    writeDistrictColumns(out, layout);
    for (int day = 0; day < dayCount; day++) {
      out.writeBytes(isoDateBytes[day]);
      out.writeByte(',');
      int holiday = holidayIndex[day];
      if (holiday >= 0) {
        out.writeAscii(HOLIDAYS[holiday].name());
      }
      for (int district = 0; district < schoolBreak.length; district++) {
        if (layout.hasDistrict(district)) {
          out.writeByte(',');
          out.writeByte(schoolBreak[district][day] ? '1' : '0');
        }
      }
      out.writeByte('\n');
    }
  }

  /**
   * Writes the weekly calendar, one row per 7-day period from the start date: {@code date} (the period's first day),
   * {@code holiday_days} (public holidays in the period) and {@code school_break[district=NAME]} (school-break days
   * in the period, 0–7). The day count must be a multiple of 7.
   */
  void writeWeekly(AsciiWriter out, ChainLayout layout) throws IOException {
    assert dayCount % 7 == 0 : dayCount;
    out.writeAscii("date," + HOLIDAY_DAYS_COLUMN);
    writeDistrictColumns(out, layout);
    for (int first = 0; first < dayCount; first += 7) {
      out.writeBytes(isoDateBytes[first]);
      out.writeByte(',');
      int holidayDays = 0;
      for (int day = first; day < first + 7; day++) {
        holidayDays += holidayIndex[day] >= 0 ? 1 : 0;
      }
      out.writeInt(holidayDays);
      for (int district = 0; district < schoolBreak.length; district++) {
        if (layout.hasDistrict(district)) {
          int breakDays = 0;
          for (int day = first; day < first + 7; day++) {
            breakDays += schoolBreak[district][day] ? 1 : 0;
          }
          out.writeByte(',');
          out.writeInt(breakDays);
        }
      }
      out.writeByte('\n');
    }
  }

  private static void writeDistrictColumns(AsciiWriter out, ChainLayout layout) throws IOException {
    for (int district = 0; district < ChainLayout.DISTRICT_NAMES.length; district++) {
      if (layout.hasDistrict(district)) {
        out.writeAscii("," + SCHOOL_BREAK_COLUMN + "[" + DISTRICT_ATTRIBUTE + "=" + ChainLayout.DISTRICT_NAMES[district]
            + "]");
      }
    }
    out.writeByte('\n');
  }

  static int holidayOn(LocalDate date) {
    for (int i = 0; i < HOLIDAYS.length; i++) {
      if (HOLIDAYS[i].month() == date.getMonthValue() && HOLIDAYS[i].dateIn(date.getYear()).equals(date)) {
        return i;
      }
    }
    return -1;
  }

  static boolean isSchoolBreak(int districtIndex, LocalDate date) {
    MonthDay monthDay = MonthDay.from(date);
    if (!monthDay.isBefore(YEAR_END_BREAK_FROM) || !monthDay.isAfter(YEAR_END_BREAK_UNTIL)) {
      return true;
    }
    int week = date.get(IsoFields.WEEK_OF_WEEK_BASED_YEAR);
    int d = districtIndex;
    return week == 7 + d || (week >= 14 + d && week <= 15 + d) || (week >= 28 + d && week <= 33 + d) || week == 43;
  }

  private static Holiday fixed(String name, int month, int dayOfMonth, Closing closing, float... factor) {
    return new Holiday(name, month, dayOfMonth, null, 0, closing, factor);
  }

  private static Holiday weekday(String name, int month, DayOfWeek weekday, int nth, Closing closing,
      float... factor) {
    return new Holiday(name, month, 0, weekday, nth, closing, factor);
  }
}
