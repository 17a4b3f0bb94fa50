package org.lagmill.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class HolidayCalendarTest {
  private static final LocalDate START = LocalDate.of(2023, 1, 2);

  @Test
  void shouldPlaceFixedAndMovableHolidays() {
    // Worked by hand: Thaw Monday is the third Monday of February (2024-02-19), Lantern Friday the second Friday of
    // April (2024-04-12), Harvest Monday the last Monday of August (2024-08-26).
    assertEquals(List.of("2024-01-01 Firstday", "2024-02-19 Thaw Monday", "2024-04-12 Lantern Friday",
        "2024-05-01 Meadow Day", "2024-06-17 Charter Day", "2024-08-26 Harvest Monday", "2024-10-12 Guild Day",
        "2024-12-25 Midwinter", "2024-12-26 Gifting Day"), holidaysIn(2024));
    assertEquals("2023-04-14 Lantern Friday", holidaysIn(2023).get(1));
  }

  @Test
  void shouldStaggerSchoolBreaksByDistrict() {
    HolidayCalendar calendar = new HolidayCalendar(START, 800);
    // ISO week 7 of 2024 runs 12-18 February; Ferncombe's winter week, Lowbridge's is the next.
    assertTrue(calendar.isSchoolBreak(0, dayOf("2024-02-12")));
    assertTrue(calendar.isSchoolBreak(0, dayOf("2024-02-18")));
    assertFalse(calendar.isSchoolBreak(0, dayOf("2024-02-19")));
    assertFalse(calendar.isSchoolBreak(1, dayOf("2024-02-18")));
    assertTrue(calendar.isSchoolBreak(1, dayOf("2024-02-19")));
    // Summer: six weeks from ISO week 28 (8 July 2024) in Ferncombe, from week 30 (22 July) in Quarrytown.
    assertEquals(42, countBreakDays(calendar, 0, "2024-06-01", "2024-09-30"));
    assertTrue(calendar.isSchoolBreak(2, dayOf("2024-09-01")));
    assertFalse(calendar.isSchoolBreak(0, dayOf("2024-08-19")));
    // Year end: 22 December through 3 January everywhere.
    for (int district = 0; district < 3; district++) {
      assertFalse(calendar.isSchoolBreak(district, dayOf("2023-12-21")));
      assertTrue(calendar.isSchoolBreak(district, dayOf("2023-12-22")));
      assertTrue(calendar.isSchoolBreak(district, dayOf("2024-01-03")));
      assertFalse(calendar.isSchoolBreak(district, dayOf("2024-01-04")));
    }
  }

  @Test
  void shouldMarkTheEveOfClosingHolidaysOnly() {
    HolidayCalendar calendar = new HolidayCalendar(START, 400);
    assertTrue(calendar.isEveOfClosingHoliday(dayOf("2023-12-24")));
    assertTrue(calendar.isEveOfClosingHoliday(dayOf("2023-04-13")));
    assertFalse(calendar.isEveOfClosingHoliday(dayOf("2023-04-30")), "Meadow Day closes nothing");
    // The calendar's last day still looks one day ahead.
    assertTrue(new HolidayCalendar(START, dayOf("2023-12-24") + 1).isEveOfClosingHoliday(dayOf("2023-12-24")));
  }

  @Test
  void shouldSumHolidaysAndBreakDaysPerWeekInTheWeeklyCalendar() throws IOException {
    HolidayCalendar calendar = new HolidayCalendar(START, 371);
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (AsciiWriter out = new AsciiWriter(bytes)) {
      calendar.writeWeekly(out, new ChainLayout(3000));
    }
    String[] lines = bytes.toString(StandardCharsets.US_ASCII).split("\n");
    assertEquals("date,holiday_days,school_break[district=Ferncombe],school_break[district=Lowbridge],"
        + "school_break[district=Quarrytown]", lines[0]);
    assertEquals(1 + 53, lines.length);
    // Week of 2023-12-25: Midwinter and Gifting Day, every day a school break; week of 2023-01-02: 2 break days.
    assertEquals("2023-12-25,2,7,7,7", lines[1 + 51]);
    assertEquals("2023-01-02,0,2,2,2", lines[1]);
  }

  private static List<String> holidaysIn(int year) {
    HolidayCalendar calendar = new HolidayCalendar(START, 1200);
    List<String> found = new ArrayList<>();
    for (int day = 0; day < calendar.dayCount(); day++) {
      LocalDate date = START.plusDays(day);
      if (date.getYear() == year && calendar.holidayIndex(day) >= 0) {
        found.add(date + " " + HolidayCalendar.HOLIDAYS[calendar.holidayIndex(day)].name());
      }
    }
    return found;
  }

  private static int countBreakDays(HolidayCalendar calendar, int district, String from, String until) {
    int count = 0;
    for (int day = dayOf(from); day <= dayOf(until); day++) {
      count += calendar.isSchoolBreak(district, day) ? 1 : 0;
    }
    return count;
  }

  private static int dayOf(String date) {
    return (int) (LocalDate.parse(date).toEpochDay() - START.toEpochDay());
  }
}
