package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.lagmill.report.DriverChart;

/** The explanation's console lines: each chart's forecast and its parts, or the same as JSON. */
final class ExplainPrinter {
  private ExplainPrinter() {}

  /** The JSON document {@code explain --json} prints: each chart's dates, forecast and parts by period. */
  static List<Map<String, Object>> document(List<DriverChart> charts) {
    List<Map<String, Object>> document = new ArrayList<>();
    for (DriverChart c : charts) {
      Map<String, Object> row = new LinkedHashMap<>();
      row.put("title", c.title());
      row.put("seriesCount", c.seriesCount());
      row.put("dates", c.dates().stream().map(Object::toString).toList());
      row.put("forecast", c.forecast());
      Map<String, double[]> parts = new LinkedHashMap<>();
      c.parts().forEach(p -> parts.put(p.name(), p.units()));
      row.put("parts", parts);
      document.add(row);
    }
    return document;
  }

  static void print(PrintWriter out, List<DriverChart> charts) {
    for (DriverChart c : charts) {
      double total = 0;
      for (double v : c.forecast()) {
        total += v;
      }
      out.printf(Locale.ROOT, "%s (%d series), %s .. %s: forecast %.1f units%n", c.title(), c.seriesCount(),
          c.dates().get(0), c.dates().get(c.dates().size() - 1), total);
      for (DriverChart.Part part : c.parts()) {
        double units = part.totalUnits();
        out.printf(Locale.ROOT, "  %-22s %+12.1f units  %6.1f%%%n", part.name(), units,
            total > 0 ? 100 * units / total : Double.NaN);
      }
    }
    out.println("The parts show what the model leaned on, not cause and effect; forecasts are estimates for a planner"
        + " to review.");
  }
}
