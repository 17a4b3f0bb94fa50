package org.lagmill.ingest;

import java.time.LocalDate;
import java.util.List;
import org.lagmill.store.SalesHistory;

/** Writes plain arrays as a wide sales CSV, the obvious way, for tests. */
final class WideCsv {
  private WideCsv() {}

  static String of(List<String> attributeNames, String[][] attributeValues, LocalDate firstDate, int[][] units,
      int fromDay, int toDay) {
    StringBuilder csv = new StringBuilder(String.join(",", attributeNames));
    for (int d = fromDay; d < toDay; d++) {
      csv.append(',').append(firstDate.plusDays(d));
    }
    csv.append('\n');
    for (int s = 0; s < units.length; s++) {
      for (int a = 0; a < attributeNames.size(); a++) {
        String v = attributeValues[s][a];
        csv.append(a == 0 ? "" : ",").append(v.contains(",") || v.contains("\"") ? quote(v) : v);
      }
      for (int d = fromDay; d < toDay; d++) {
        csv.append(',');
        if (units[s][d] != SalesHistory.UNKNOWN_UNITS) {
          csv.append(units[s][d]);
        }
      }
      csv.append('\n');
    }
    return csv.toString();
  }

  private static String quote(String v) {
    return '"' + v.replace("\"", "\"\"") + '"';
  }
}
