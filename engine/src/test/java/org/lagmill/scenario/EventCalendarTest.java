package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class EventCalendarTest {
  private static final LocalDate START = LocalDate.of(2023, 1, 2);

  @Test
  void shouldPayNorthvaleOnTheFirstAndFifteenthOrTheFridayBefore() {
    // April 2023: the 1st is a Saturday (paid Fri 31 March), the 15th a Saturday (paid Fri 14 April).
    assertEquals(List.of("2023-03-01", "2023-03-15", "2023-03-31", "2023-04-14", "2023-05-01", "2023-05-15"),
        paydays(0, LocalDate.of(2023, 3, 1), LocalDate.of(2023, 5, 20)));
  }

  @Test
  void shouldPaySaltmarshOnTheLastWeekday() {
    // 30 September 2023 is a Saturday; 31 October a Tuesday; 30 November a Thursday; 31 December a Sunday.
    assertEquals(List.of("2023-09-29", "2023-10-31", "2023-11-30", "2023-12-29"),
        paydays(1, LocalDate.of(2023, 9, 1), LocalDate.of(2023, 12, 31)));
  }

  @Test
  void shouldPayHighmoorEveryOtherFridayLikeASlowCount() {
    List<String> slow = new ArrayList<>();
    for (LocalDate d = EventCalendar.FORTNIGHT_ANCHOR; !d.isAfter(LocalDate.of(2025, 12, 31)); d = d.plusDays(14)) {
      if (!d.isBefore(START)) {
        slow.add(d.toString());
      }
    }
    assertEquals(slow, paydays(2, START, LocalDate.of(2025, 12, 31)));
    assertEquals(DayOfWeek.FRIDAY, LocalDate.parse(slow.get(0)).getDayOfWeek());
  }

  @Test
  void shouldPlaceMovableAndFixedEvents() {
    EventCalendar calendar = new EventCalendar(START, 400);
    assertEquals("Kite Day", eventOn(calendar, "2023-02-12"));
    assertEquals("Harbour Regatta", eventOn(calendar, "2023-05-29"));
    assertEquals("Cup Final", eventOn(calendar, "2023-08-12"));
    assertEquals("Hearth Day", eventOn(calendar, "2023-12-25"));
    assertEquals("Year Turn", eventOn(calendar, "2024-01-01"));
    assertEquals("", eventOn(calendar, "2023-12-26"));
    int eventDays = 0;
    for (int day = 0; day < 365; day++) {
      eventDays += calendar.eventIndex(day) >= 0 ? 1 : 0;
    }
    assertEquals(EventCalendar.EVENTS.length, eventDays);
  }

  private static String eventOn(EventCalendar calendar, String date) {
    int index = calendar.eventIndex((int) (LocalDate.parse(date).toEpochDay() - START.toEpochDay()));
    return index < 0 ? "" : EventCalendar.EVENTS[index].name();
  }

  private static List<String> paydays(int region, LocalDate from, LocalDate to) {
    EventCalendar calendar = new EventCalendar(START, 1200);
    List<String> days = new ArrayList<>();
    for (int day = 0; day < calendar.dayCount(); day++) {
      LocalDate date = START.plusDays(day);
      if (!date.isBefore(from) && !date.isAfter(to) && calendar.isPayday(region, day)) {
        days.add(date.toString());
      }
    }
    return days;
  }
}
