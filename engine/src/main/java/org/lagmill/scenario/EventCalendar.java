package org.lagmill.scenario;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.temporal.TemporalAdjusters;

/**
 * The invented country's calendar over the sales days and the future days: one named event per day at most (holidays
 * and events with a kind and a sales effect per category), and per-region paydays. Day index 0 is the first sales day.
 *
 * <p>Paydays differ by region: Northvale pays on the 1st and 15th (the Friday before when that falls on a weekend),
 * Saltmarsh on the last weekday of the month, Highmoor on every other Friday.
 */
final class EventCalendar {
  /** A yearly event: fixed day of a month, or the n-th (n = -1: last) given weekday of a month. */
  record Event(String name, String kind, int month, int dayOfMonth, DayOfWeek weekday, int nth,
      float[] categoryFactor) {
    LocalDate dateIn(int year) {
      if (weekday == null) {
        return LocalDate.of(year, month, dayOfMonth);
      }
      LocalDate first = LocalDate.of(year, month, 1);
      return nth < 0 ? first.with(TemporalAdjusters.lastInMonth(weekday))
          : first.with(TemporalAdjusters.dayOfWeekInMonth(nth, weekday));
    }
  }

  /** Sales multipliers per category (Pantry, Household, Leisure): some events lift sales, closures cut them. */
  static final Event[] EVENTS = {
      fixed("Year Turn", "civic", 1, 1, 0.55f, 0.50f, 0.60f),
      weekday("Kite Day", "cultural", 2, DayOfWeek.SUNDAY, 2, 1.05f, 1.00f, 1.45f),
      fixed("Founders Day", "civic", 3, 14, 1.20f, 1.10f, 1.25f),
      weekday("Spring Vigil", "religious", 4, DayOfWeek.SUNDAY, 1, 0.70f, 0.65f, 0.70f),
      weekday("Harbour Regatta", "sport", 5, DayOfWeek.MONDAY, -1, 1.25f, 1.00f, 1.30f),
      fixed("Midsummer Market", "cultural", 6, 21, 1.30f, 1.05f, 1.40f),
      weekday("Cup Final", "sport", 8, DayOfWeek.SATURDAY, 2, 1.35f, 0.90f, 1.10f),
      fixed("Harvest Fair", "cultural", 9, 23, 1.40f, 1.05f, 1.15f),
      fixed("Ember Night", "cultural", 10, 31, 1.15f, 1.00f, 1.60f),
      fixed("Quiet Day", "religious", 11, 11, 0.60f, 0.55f, 0.50f),
      fixed("Winter Lights", "religious", 12, 24, 1.60f, 1.20f, 1.70f),
      fixed("Hearth Day", "religious", 12, 25, 0.25f, 0.20f, 0.20f),
      fixed("Year End", "civic", 12, 31, 1.30f, 1.05f, 1.20f)};

  /** Highmoor's fortnightly paydays fall on Fridays an even number of weeks from this Friday. */
  static final LocalDate FORTNIGHT_ANCHOR = LocalDate.of(2000, 1, 7);
  static final String PAYDAY_COLUMN = "payday";
  static final String REGION_ATTRIBUTE = "region";

  private final LocalDate startDate;
  private final int dayCount;
  private final byte[][] isoDateBytes;
  private final byte[] dayOfWeekIndex;
  private final short[] dayOfYear;
  private final byte[] eventIndex;
  private final boolean[][] payday;

  EventCalendar(LocalDate startDate, int dayCount) {
    this.startDate = startDate;
    this.dayCount = dayCount;
    isoDateBytes = new byte[dayCount][];
    dayOfWeekIndex = new byte[dayCount];
    dayOfYear = new short[dayCount];
    eventIndex = new byte[dayCount];
    payday = new boolean[ChainLayout.REGION_NAMES.length][dayCount];
    for (int day = 0; day < dayCount; day++) {
      LocalDate date = startDate.plusDays(day);
      isoDateBytes[day] = date.toString().getBytes(StandardCharsets.US_ASCII);
      dayOfWeekIndex[day] = (byte) (date.getDayOfWeek().getValue() - 1);
      dayOfYear[day] = (short) date.getDayOfYear();
      eventIndex[day] = (byte) eventOn(date);
      payday[0][day] = isMidAndFirstPayday(date);
      payday[1][day] = isLastWeekday(date);
      payday[2][day] = isFortnightFriday(date);
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

  /** Index into {@link #EVENTS}, or -1 on a day without event. */
  int eventIndex(int dayIndex) {
    return eventIndex[dayIndex];
  }

  boolean isPayday(int regionIndex, int dayIndex) {
    return payday[regionIndex][dayIndex];
  }

  /** Writes {@code calendar.csv}: date, event, event_kind and one {@code payday[region=NAME]} 0/1 column per region. */
  void write(AsciiWriter out) throws IOException {
    out.writeAscii("date,event,event_kind");
    for (String region : ChainLayout.REGION_NAMES) {
      out.writeAscii("," + PAYDAY_COLUMN + "[" + REGION_ATTRIBUTE + "=" + region + "]");
    }
    out.writeByte('\n');
    for (int day = 0; day < dayCount; day++) {
      out.writeBytes(isoDateBytes[day]);
      out.writeByte(',');
      int event = eventIndex[day];
      if (event >= 0) {
        out.writeAscii(EVENTS[event].name());
        out.writeByte(',');
        out.writeAscii(EVENTS[event].kind());
      } else {
        out.writeByte(',');
      }
      for (boolean[] regionPayday : payday) {
        out.writeByte(',');
        out.writeByte(regionPayday[day] ? '1' : '0');
      }
      out.writeByte('\n');
    }
  }

  static int eventOn(LocalDate date) {
    for (int i = 0; i < EVENTS.length; i++) {
      if (EVENTS[i].month() == date.getMonthValue() && EVENTS[i].dateIn(date.getYear()).equals(date)) {
        return i;
      }
    }
    return -1;
  }

  static boolean isMidAndFirstPayday(LocalDate date) {
    for (int dayOfMonth : new int[] {1, 15}) {
      LocalDate nominal = date.withDayOfMonth(dayOfMonth);
      DayOfWeek weekday = nominal.getDayOfWeek();
      LocalDate paid = weekday == DayOfWeek.SATURDAY ? nominal.minusDays(1)
          : weekday == DayOfWeek.SUNDAY ? nominal.minusDays(2) : nominal;
      if (paid.equals(date)) {
        return true;
      }
    }
    // A 1st on a weekend is paid on the last Friday of the month before.
    LocalDate nextFirst = date.withDayOfMonth(1).plusMonths(1);
    DayOfWeek weekday = nextFirst.getDayOfWeek();
    return (weekday == DayOfWeek.SATURDAY && nextFirst.minusDays(1).equals(date))
        || (weekday == DayOfWeek.SUNDAY && nextFirst.minusDays(2).equals(date));
  }

  static boolean isLastWeekday(LocalDate date) {
    LocalDate last = date.with(TemporalAdjusters.lastDayOfMonth());
    while (last.getDayOfWeek() == DayOfWeek.SATURDAY || last.getDayOfWeek() == DayOfWeek.SUNDAY) {
      last = last.minusDays(1);
    }
    return last.equals(date);
  }

  static boolean isFortnightFriday(LocalDate date) {
    long days = date.toEpochDay() - FORTNIGHT_ANCHOR.toEpochDay();
    return date.getDayOfWeek() == DayOfWeek.FRIDAY && Math.floorMod(Math.floorDiv(days, 7), 2) == 0;
  }

  private static Event fixed(String name, String kind, int month, int dayOfMonth, float... factor) {
    return new Event(name, kind, month, dayOfMonth, null, 0, factor);
  }

  private static Event weekday(String name, String kind, int month, DayOfWeek weekday, int nth, float... factor) {
    return new Event(name, kind, month, 0, weekday, nth, factor);
  }
}
