package org.lagmill.ingest;

import java.util.List;
import org.lagmill.store.ArrayDayCalendar;

/**
 * What {@link CalendarFileReader} read: the calendar aligned to the store's day index and the warnings a user should
 * see (per-attribute columns whose value no series has), one sentence each.
 */
public record CalendarReadResult(ArrayDayCalendar calendar, List<String> warnings) {
  public CalendarReadResult {
    warnings = List.copyOf(warnings);
  }
}
