package org.lagmill.report;

import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** Why this forecast ({@code #drivers}): one stacked chart and one table of parts per explained forecast. */
final class DriversSection {
  private static final DateTimeFormatter TICK_DATE = DateTimeFormatter.ofPattern("MMM d", Locale.ROOT);

  /**
   * One colour per part, Okabe–Ito where it has room; the model's own blue is left out so these bars never read as
   * the forecast line of the other charts.
   */
  private static final Map<String, String> COLOURS = Map.ofEntries(
      Map.entry(DriverChartBuilder.BASE_PART, "#c8c8c8"),
      Map.entry("recent level", "#56b4e9"),
      Map.entry("weekly pattern", "#009e73"),
      Map.entry("season", "#f0e442"),
      Map.entry("events and holidays", "#e69f00"),
      Map.entry("price", "#d55e00"),
      Map.entry("plan", "#cc79a7"),
      Map.entry("launch", "#8c564b"),
      Map.entry("item and location", "#7a7a7a"),
      Map.entry("other", "#3d3d3d"),
      Map.entry(DriverChartBuilder.FLOOR_PART, "#b0b0ff"));

  private DriversSection() {}

  static String render(List<DriverChart> charts, String periodUnit) {
    String heading = "Why this forecast";
    if (charts.isEmpty()) {
      return Html.section("drivers", heading, Html.absent("No forecast was explained for this report."));
    }
    StringBuilder b = new StringBuilder(Html.note("Each bar splits one " + periodUnit + "'s forecast into what "
        + "drives it: the base level every series starts from, then each family of inputs the model read (recent "
        + "sales, the weekly pattern, the season, events and holidays, price, the plan, the launch). Parts above zero "
        + "push the forecast up, parts below pull it down; the black line is the forecast, the sum of the parts. The "
        + "split comes from the model's own per-input contributions; it shows what the model leaned on, not cause "
        + "and effect."));
    for (DriverChart c : charts) {
      b.append(Html.figure(c.title() + (c.seriesCount() > 1 ? " (" + ReportFormat.count((long) c.seriesCount())
          + " series)" : ""), chart(c, periodUnit)));
      b.append(table(c, periodUnit));
    }
    return Html.section("drivers", heading, b.toString());
  }

  static String chart(DriverChart c, String periodUnit) {
    StackedBarChart chart = new StackedBarChart(ChartFrame.WIDE, c.dates().size())
        .title("Forecast by driver, units per " + periodUnit + ", " + c.title())
        .yTitle("units per " + periodUnit).xLabels(i -> TICK_DATE.format(c.dates().get(i)));
    for (DriverChart.Part part : c.parts()) {
      chart.part(part.name(), part.units(), COLOURS.getOrDefault(part.name(), "#3d3d3d"));
    }
    chart.total("forecast", c.forecast());
    return chart.render();
  }

  private static String table(DriverChart c, String periodUnit) {
    double forecastTotal = 0;
    for (double v : c.forecast()) {
      forecastTotal += v;
    }
    HtmlTable t = new HtmlTable("drivers", "Parts of the forecast over " + c.dates().size() + " " + periodUnit
        + "s", List.of("part", "units", "share of forecast"), new boolean[] {false, true, true});
    for (DriverChart.Part part : c.parts()) {
      double units = part.totalUnits();
      t.row(List.of(part.name(), ReportFormat.fixed(units, 1), forecastTotal > 0
          ? ReportFormat.percent(units / forecastTotal) : ReportFormat.MISSING));
    }
    t.footerRow(List.of("forecast", ReportFormat.fixed(forecastTotal, 1), forecastTotal > 0 ? "100%" : ""));
    return t.finish();
  }
}
