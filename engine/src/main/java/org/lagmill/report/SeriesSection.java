package org.lagmill.report;

import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;

/** Actual against forecast, one chart per requested series ({@code #series}). */
final class SeriesSection {
  private static final DateTimeFormatter TICK_DATE = DateTimeFormatter.ofPattern("MMM d", Locale.ROOT);

  private SeriesSection() {}

  static String render(List<SeriesChart> charts, String periodUnit) {
    if (charts.isEmpty()) {
      return Html.section("series", "Actual and forecast",
          Html.absent("No series charts were requested for this report."));
    }
    StringBuilder b = new StringBuilder(Html.note("Black: units sold. Blue: the forecast, with its interval shaded. "
        + "The dashed line marks the forecast origin: the last " + periodUnit + " the model could see is just left of "
        + "it."));
    for (SeriesChart c : charts) {
      b.append(Html.figure(c.title(), chart(c, periodUnit)));
    }
    return Html.section("series", "Actual and forecast", b.toString());
  }

  static String chart(SeriesChart c, String periodUnit) {
    int dayCount = c.dates().size();
    if (dayCount == 0) {
      return Html.absent("No days to plot.");
    }
    List<LocalDate> dates = c.dates();
    LineChart chart = SvgCharts.lineChart(ChartFrame.WIDE_SHORT, dayCount)
        .title("Actual and forecast units per " + periodUnit + ", " + c.title())
        .xLabels(i -> TICK_DATE.format(dates.get(i))).yTitle("units per " + periodUnit).includeZero(true);
    int anchor = c.originIndex() >= 0 ? c.originIndex() : 0;
    chart.xTicks(dayCount > 120 ? 28 : dayCount > 21 ? 7 : 1, anchor);
    if (c.hasBand()) {
      chart.band(bandLabel(c), c.lower(), c.upper(), SvgCharts.MODEL_COLOUR);
    }
    chart.line("actual", c.actual(), SvgCharts.ACTUAL_COLOUR, null, false);
    chart.line("forecast", c.forecast(), SvgCharts.MODEL_COLOUR, null, false);
    if (c.originIndex() >= 0) {
      chart.marker(c.originIndex() - 0.5, "forecast origin");
    }
    return chart.render();
  }

  private static String bandLabel(SeriesChart c) {
    if (c.lowerQuantile() == null || c.upperQuantile() == null) {
      return "interval";
    }
    double coverage = (c.upperQuantile() - c.lowerQuantile()) * 100;
    return String.format(Locale.ROOT, "%s%% interval (quantiles %s to %s)", ReportFormat.compact(coverage),
        ReportFormat.compact(c.lowerQuantile()), ReportFormat.compact(c.upperQuantile()));
  }
}
