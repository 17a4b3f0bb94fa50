package org.lagmill.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.run.RunRecord;
import org.lagmill.run.SeriesJob;

/** The console lines of {@code series}: a tab-separated table with a header, or a JSON array. */
final class SeriesPrinter {
  /** Heads the id column: the name --series and --show take, which may repeat an attribute's value. */
  private static final String ID_COLUMN = "series";

  private SeriesPrinter() {}

  /**
   * The table on {@code out}, and on {@code err} how many series matched, so the listing itself stays a clean table
   * to pipe on.
   */
  static void print(PrintWriter out, PrintWriter err, SeriesJob.Listing listing, String match) {
    out.println(ID_COLUMN + "\t" + String.join("\t", listing.attributeNames()));
    StringBuilder line = new StringBuilder();
    for (SeriesJob.Series series : listing.series()) {
      line.setLength(0);
      line.append(series.id());
      for (String value : series.attributeValues()) {
        line.append('\t').append(value);
      }
      out.println(line);
    }
    out.flush();
    err.printf("%,d of %,d series%s%n", listing.series().size(), listing.storeSeriesCount(),
        match == null ? "" : " contain \"" + match + "\"");
    err.flush();
  }

  /** Each series as an object: its id and its attributes by name. */
  static void printJson(PrintWriter out, SeriesJob.Listing listing) throws JsonProcessingException {
    List<Map<String, Object>> rows = new ArrayList<>();
    for (SeriesJob.Series series : listing.series()) {
      Map<String, String> values = new LinkedHashMap<>();
      for (int a = 0; a < listing.attributeNames().size(); a++) {
        values.put(listing.attributeNames().get(a), series.attributeValues().get(a));
      }
      Map<String, Object> row = new LinkedHashMap<>();
      row.put(ID_COLUMN, series.id());
      row.put("attributes", values);
      rows.add(row);
    }
    out.println(RunRecord.JSON.writeValueAsString(rows));
  }
}
