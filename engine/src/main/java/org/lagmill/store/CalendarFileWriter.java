package org.lagmill.store;

import java.io.IOException;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/**
 * Writes {@code calendar.bin} ({@link CalendarLayout}) from any {@link DayCalendar}. A column keyed by a series
 * attribute gets one row per code of that attribute in the store, so a series reads its row by its own code.
 */
final class CalendarFileWriter {
  private CalendarFileWriter() {}

  static ChecksummedFileWriter write(Path file, DayCalendar calendar, SeriesAttributes attributes,
      MemoryBudget budget) throws IOException {
    int dayCount = calendar.dayCount();
    int columnCount = calendar.columnCount();
    int[] keyCounts = new int[columnCount];
    for (int c = 0; c < columnCount; c++) {
      String key = calendar.keyAttribute(c);
      if (key == null) {
        keyCounts[c] = 1;
      } else {
        int attributeIndex = attributes.attributeIndex(key);
        if (attributeIndex < 0) {
          throw new IllegalArgumentException("calendar column \"" + calendar.columnName(c) + "\" is keyed by \"" + key
              + "\", which is not a series attribute; the attributes are " + attributeNames(attributes));
        }
        keyCounts[c] = attributes.cardinality(attributeIndex);
      }
    }
    ChecksummedFileWriter out = new ChecksummedFileWriter(file, FileKind.CALENDAR, budget);
    try {
      out.putInt(dayCount);
      out.putInt(columnCount);
      for (int c = 0; c < columnCount; c++) {
        out.putString(calendar.columnName(c));
        boolean categorical = calendar.kind(c) == DayCalendar.ColumnKind.CATEGORICAL;
        out.putInt(categorical ? 1 : 0);
        String key = calendar.keyAttribute(c);
        if (key == null) {
          out.putInt(CalendarLayout.NO_KEY_ATTRIBUTE);
        } else {
          out.putString(key);
        }
        int categoryCount = categorical ? calendar.cardinality(c) : 0;
        out.putInt(categoryCount);
        for (int code = 0; code < categoryCount; code++) {
          out.putString(calendar.categoryValue(c, code));
        }
        out.putInt(keyCounts[c]);
      }
      out.padTo(Float.BYTES);
      for (int c = 0; c < columnCount; c++) {
        for (int keyCode = 0; keyCode < keyCounts[c]; keyCode++) {
          for (int d = 0; d < dayCount; d++) {
            out.putFloat(calendar.value(c, keyCode, d));
          }
        }
      }
      out.finish();
      return out;
    } finally {
      out.close();
    }
  }

  private static String attributeNames(SeriesAttributes attributes) {
    return String.join(", ", attributes.attributeNames());
  }
}
