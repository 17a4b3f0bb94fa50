package org.lagmill.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.lagmill.store.Periods;

/** The data summary ({@code #summary}) and the time and memory per stage ({@code #memory}). */
final class OverviewSections {
  private OverviewSections() {}

  static String summary(DataSummary data) {
    if (data == null) {
      return Html.section("summary", "Data and storage", Html.absent("No data summary was recorded for this report."));
    }
    StringBuilder b = new StringBuilder();
    String period = data.firstDate() == null || data.lastDate() == null ? null
        : data.firstDate() + " to " + data.lastDate();
    int periodDays = data.periodDays() == null ? Periods.DAILY : data.periodDays();
    String unit = Periods.unit(periodDays);
    String units = Character.toUpperCase(unit.charAt(0)) + unit.substring(1) + "s";
    if (periodDays != Periods.DAILY) {
      period = period == null ? null : period + " (" + Periods.describe(periodDays) + ", dates are each period's first"
          + " day)";
    }
    b.append(Html.facts(
        "Series (item-store)", data.seriesCount() == null ? null : ReportFormat.count(data.seriesCount()),
        units + " per series", data.dayCount() == null ? null : ReportFormat.count((long) data.dayCount()),
        "Item-" + unit + "s", data.itemDayCount() == null ? null : ReportFormat.count(data.itemDayCount()),
        "Period", period,
        units + " with zero sales", data.zeroDayShare() == null ? null : ReportFormat.percent(data.zeroDayShare())));
    if (!data.attributeCardinalities().isEmpty()) {
      HtmlTable t = new HtmlTable("cardinalities", "Distinct values per attribute", List.of("attribute", "values"),
          new boolean[] {false, true});
      for (Map.Entry<String, Long> e : data.attributeCardinalities().entrySet()) {
        t.row(List.of(e.getKey(), ReportFormat.count(e.getValue())));
      }
      b.append(t.finish());
    }
    b.append(storage(data));
    return Html.section("summary", "Data and storage", b.toString());
  }

  private static String storage(DataSummary data) {
    Double store = data.storeBytesPerItemDay();
    if (store == null || !Double.isFinite(store)) {
      return Html.note("The store's size per item-day was not recorded.");
    }
    BarChart chart = SvgCharts.barChart(920).title("Bytes per item-day: store against plain encodings")
        .axisTitle("bytes per item-day");
    chart.bar("lagmill store", store, bytesPerItemDay(store));
    List<String> comparisons = new ArrayList<>();
    addComparison(chart, comparisons, "64-bit integers", data.int64BytesPerItemDay(), store);
    addComparison(chart, comparisons, "CSV text", data.csvBytesPerItemDay(), store);
    StringBuilder b = new StringBuilder(Html.h3("Storage per item-day"));
    b.append(Html.figure(null, chart.render()));
    if (!comparisons.isEmpty()) {
      b.append(Html.note("The store takes " + String.join(" and ", comparisons) + "."));
    }
    return b.toString();
  }

  private static void addComparison(BarChart chart, List<String> comparisons, String label, Double bytes,
      double store) {
    if (bytes != null && Double.isFinite(bytes) && bytes >= 0) {
      chart.bar(label, bytes, bytesPerItemDay(bytes));
      if (store > 0) {
        comparisons.add(String.format(Locale.ROOT, "%.1f times less than %s", bytes / store, label));
      }
    }
  }

  private static String bytesPerItemDay(double bytes) {
    return ReportFormat.fixed(bytes, bytes < 10 ? 2 : 1) + " B";
  }

  static String memory(List<StageStats> stages) {
    if (stages.isEmpty()) {
      return Html.section("memory", "Memory and time", Html.absent("No stage timings were recorded for this report."));
    }
    HtmlTable t = new HtmlTable("stages", null,
        List.of("stage", "time", "peak RSS", "off-heap", "rows", "rows per second", "Dataset bytes per row"),
        new boolean[] {false, true, true, true, true, true, true});
    double totalSeconds = 0;
    long maxRss = -1;
    BarChart rss = SvgCharts.barChart(920).title("Peak resident memory after each stage").axisTitle("MiB");
    for (StageStats s : stages) {
      totalSeconds += s.seconds();
      t.row(List.of(s.stageName(), ReportFormat.seconds(s.seconds()), ReportFormat.bytes(s.peakRssBytes()),
          ReportFormat.bytes(s.offHeapBytes()), ReportFormat.count(s.rowCount()),
          s.rowsPerSecond() == null ? ReportFormat.MISSING : ReportFormat.compact(s.rowsPerSecond()),
          s.datasetBytesPerRow() == null ? ReportFormat.MISSING : ReportFormat.fixed(s.datasetBytesPerRow(), 1)));
      if (s.peakRssBytes() != null) {
        maxRss = Math.max(maxRss, s.peakRssBytes());
        rss.bar(s.stageName(), s.peakRssBytes() / (1024.0 * 1024.0), ReportFormat.bytes(s.peakRssBytes()));
      }
    }
    t.footerRow(List.of("all stages", ReportFormat.seconds(totalSeconds),
        maxRss < 0 ? ReportFormat.MISSING : ReportFormat.bytes(maxRss), "", "", "", ""));
    StringBuilder b = new StringBuilder(t.finish());
    b.append(Html.note("Peak RSS is the process's resident high-water mark (VmHWM) at the end of the stage; "
        + "off-heap is the peak the stage's memory budget held. The footer shows total time and the highest peak."));
    if (maxRss >= 0) {
      b.append(Html.figure("Peak resident memory by stage", rss.render()));
    }
    return Html.section("memory", "Memory and time", b.toString());
  }
}
