package org.lagmill.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.w3c.dom.Element;

/** The HTML page's structure: sections, numbers in the tables, chart elements, self-containment, escaping. */
class HtmlReportStructureTest {
  private static final long SEED = TestSeeds.master(20240527L);
  private static final List<String> SECTION_IDS = List.of("headline", "failures", "series", "drivers", "accuracy",
      "horizon", "training", "summary", "memory",
      "caution");

  private static String f3(double v) {
    return String.format(Locale.ROOT, "%.3f", v);
  }

  @Test
  void shouldContainEverySectionOnceAndTheCautionTwice() throws Exception {
    ReportData report = SampleReports.full(SEED);
    String html = HtmlReportWriter.render(report);
    XmlPage page = XmlPage.parse(html);
    int previous = -1;
    for (String id : SECTION_IDS) {
      assertEquals(1, page.count("//section[@id='" + id + "']"), "section #" + id + ", seed " + SEED);
      int at = html.indexOf("<section id=\"" + id + "\"");
      assertTrue(at > previous, "#" + id + " comes after the sections a planner reads before it");
      previous = at;
    }
    assertEquals(2, occurrences(html, ReportData.DEFAULT_CAUTION), "caution in banner and closing section");
    assertEquals(ReportData.DEFAULT_CAUTION, page.text("//section[@id='caution']/p"));
    assertEquals(report.title(), page.text("/html/head/title"));
    assertEquals(0, page.count("//*[@class='absent']"), "a full report has no absent-data lines");
  }

  @Test
  void shouldReferenceNothingOutsideThePage() {
    String html = HtmlReportWriter.render(SampleReports.full(SEED));
    Matcher m = Pattern.compile("https?://[^\"'\\s<>)]*").matcher(html);
    while (m.find()) {
      assertEquals(SvgWriter.NAMESPACE, m.group(), "only the SVG namespace may look like a URL");
    }
    assertFalse(html.toLowerCase(Locale.ROOT).contains("<script"), "no scripts");
    assertFalse(html.contains("src="), "no embedded resources by reference");
    assertFalse(html.contains("url("), "no CSS url()");
    assertFalse(html.contains("@import"), "no CSS import");
    Matcher href = Pattern.compile("href=\"([^\"]*)\"").matcher(html);
    while (href.find()) {
      assertTrue(href.group(1).startsWith("#"), "links stay inside the page: " + href.group(1));
    }
  }

  @Test
  void shouldPrintEveryLevelScoreOfTheReport() throws Exception {
    ReportData report = SampleReports.full(SEED);
    AccuracySummary a = report.accuracy();
    XmlPage page = XmlPage.parse(HtmlReportWriter.render(report));
    List<String> headers = new ArrayList<>();
    page.all("//table[@class='levels']/thead/tr/th").forEach(e -> headers.add(e.getTextContent()));
    assertEquals(List.of("level", "series", "model", "seasonal naive", "naive", "moving average 28",
        "model \u00f7 seasonal naive"), headers);
    List<Element> rows = page.all("//table[@class='levels']/tbody/tr");
    assertEquals(a.levels().size(), rows.size());
    for (int r = 0; r < rows.size(); r++) {
      AccuracySummary.LevelScore l = a.levels().get(r);
      List<String> expected = new ArrayList<>(List.of(l.levelName(), String.format(Locale.ROOT, "%,d",
          l.aggregateCount()), f3(l.modelRmsse())));
      double best = l.modelRmsse();
      int bestIndex = 2;
      for (int k = 0; k < SampleReports.BASELINES.size(); k++) {
        double v = l.baselineRmsse().get(SampleReports.BASELINES.get(k));
        expected.add(f3(v));
        if (v < best) {
          best = v;
          bestIndex = 3 + k;
        }
      }
      expected.add(f3(l.modelRmsse() / l.baselineRmsse().get("seasonal naive")));
      assertEquals(expected, XmlPage.cells(rows.get(r)), "level row " + r + ", seed " + SEED);
      for (int c = 2; c < 6; c++) {
        assertEquals(c == bestIndex, XmlPage.strong(rows.get(r), c), "bold marks the lowest score, row " + r);
      }
    }
    List<Element> footer = page.all("//table[@class='levels']/tfoot/tr");
    assertEquals(List.of("WRMSSE (all levels)", "", f3(a.modelWrmsse()), f3(a.baselineWrmsse().get("seasonal naive")),
        f3(a.baselineWrmsse().get("naive")), f3(a.baselineWrmsse().get("moving average 28")),
        f3(a.modelWrmsse() / a.baselineWrmsse().get("seasonal naive"))), XmlPage.cells(footer.get(0)));
    assertEquals(List.of("WSPL (quantiles)", "", "0.212", "0.268", "0.301", "\u2013", f3(0.212 / 0.268)),
        XmlPage.cells(footer.get(1)));
    String headline = page.text("//section[@id='accuracy']/p[@class='headline']");
    assertTrue(headline.contains("ratio model \u00f7 seasonal naive = " + f3(a.skillRatio())), headline);
    assertTrue(headline.contains("lower is better"), headline);
  }

  @Test
  void shouldPrintEveryOriginAndItsMeanAndSpread() throws Exception {
    ReportData report = SampleReports.full(SEED);
    AccuracySummary a = report.accuracy();
    XmlPage page = XmlPage.parse(HtmlReportWriter.render(report));
    List<Element> rows = page.all("//table[@class='origins']/tbody/tr");
    assertEquals(a.origins().size(), rows.size());
    // commons-math3 DescriptiveStatistics: mean and bias-corrected (n - 1) standard deviation, an outside check
    List<DescriptiveStatistics> columns = new ArrayList<>();
    for (int c = 0; c < 5; c++) {
      columns.add(new DescriptiveStatistics());
    }
    for (int r = 0; r < rows.size(); r++) {
      AccuracySummary.OriginScore o = a.origins().get(r);
      List<String> expected = new ArrayList<>(List.of(o.originDate().toString(), f3(o.modelWrmsse())));
      columns.get(0).addValue(o.modelWrmsse());
      for (int k = 0; k < 3; k++) {
        double v = o.baselineWrmsse().get(SampleReports.BASELINES.get(k));
        expected.add(f3(v));
        columns.get(k + 1).addValue(v);
      }
      double ratio = o.modelWrmsse() / o.baselineWrmsse().get("seasonal naive");
      expected.add(f3(ratio));
      columns.get(4).addValue(ratio);
      assertEquals(expected, XmlPage.cells(rows.get(r)), "origin row " + r + ", seed " + SEED);
    }
    List<Element> footer = page.all("//table[@class='origins']/tfoot/tr");
    List<String> mean = new ArrayList<>(List.of("mean"));
    List<String> sd = new ArrayList<>(List.of("standard deviation"));
    List<String> range = new ArrayList<>(List.of("lowest \u2013 highest"));
    for (DescriptiveStatistics s : columns) {
      mean.add(f3(s.getMean()));
      sd.add(f3(s.getStandardDeviation()));
      range.add(f3(s.getMin()) + " \u2013 " + f3(s.getMax()));
    }
    assertEquals(mean, XmlPage.cells(footer.get(0)));
    assertEquals(sd, XmlPage.cells(footer.get(1)));
    assertEquals(range, XmlPage.cells(footer.get(2)));
  }

  @Test
  void shouldDrawTheExpectedChartElements() throws Exception {
    ReportData report = SampleReports.full(SEED);
    XmlPage page = XmlPage.parse(HtmlReportWriter.render(report));
    assertEquals(1, page.count("//section[@id='summary']//svg"));
    assertEquals(3, page.count("//section[@id='summary']//svg//rect[@class='bar']"), "store, int64, CSV");
    assertEquals(1, page.count("//section[@id='memory']//svg"));
    assertEquals(report.stages().size(), page.count("//section[@id='memory']//svg//rect[@class='bar']"));

    List<Element> training = page.all("//section[@id='training']//svg");
    assertEquals(2, training.size());
    assertEquals(2, training.get(0).getElementsByTagName("polyline").getLength(), "training and validation");
    assertEquals(1, page.count("//section[@id='training']//svg[1]//line[@class='marker']"), "best iteration");
    assertEquals(ModelSections.TOP_FEATURE_COUNT, page.count("//section[@id='training']//svg//rect[@class='bar']"));

    int baselineCount = report.horizon().baselines().size();
    assertEquals(1, page.count("//section[@id='horizon']//svg"));
    assertEquals(1 + baselineCount, page.count("//section[@id='horizon']//svg//polyline"));
    assertEquals((1 + baselineCount) * report.horizon().model().length,
        page.count("//section[@id='horizon']//svg//circle[@class='point']"));

    List<Element> series = page.all("//section[@id='series']//svg");
    assertEquals(report.series().size(), series.size());
    for (int i = 0; i < series.size(); i++) {
      SeriesChart c = report.series().get(i);
      Element svg = series.get(i);
      int expectedLines = runsOfAtLeast(c.actual(), 2) + runsOfAtLeast(c.forecast(), 2);
      assertEquals(expectedLines, count(svg, "polyline", "series"), "chart " + c.title());
      assertEquals(runsOfAtLeast(bandWidth(c), 2), count(svg, "polygon", "band"), "chart " + c.title());
      assertEquals(1, count(svg, "line", "marker"), "origin marker of " + c.title());
    }
    assertEquals(4, count(series.get(2), "polyline", "series"), "two unknown days split the history in three");
  }

  @Test
  void shouldSayWhenDataIsAbsentInsteadOfDroppingTheSection() throws Exception {
    String html = HtmlReportWriter.render(ReportData.builder("Nothing measured").build());
    XmlPage page = XmlPage.parse(html);
    for (String id : SECTION_IDS) {
      assertEquals(1, page.count("//section[@id='" + id + "']"), "section #" + id);
    }
    assertEquals("No data summary was recorded for this report.", page.text("//section[@id='summary']/p"));
    assertEquals("No stage timings were recorded for this report.", page.text("//section[@id='memory']/p"));
    assertEquals("No model was trained for this report.", page.text("//section[@id='training']/p"));
    assertEquals("No error by horizon day was recorded for this report.", page.text("//section[@id='horizon']/p"));
    assertEquals("No series charts were requested for this report.", page.text("//section[@id='series']/p"));
    assertTrue(html.contains("No backtest was run for this report."));
    assertEquals(0, page.count("//svg"));
    assertEquals(2, occurrences(html, ReportData.DEFAULT_CAUTION));

    ReportData noBacktest = SampleReports.full(SEED).toBuilder().accuracy(new AccuracySummary("seasonal naive",
        SampleReports.full(SEED).accuracy().levels(), 0.7, SampleReports.linked("seasonal naive", 0.8), null, null,
        List.of())).build();
    XmlPage single = XmlPage.parse(HtmlReportWriter.render(noBacktest));
    assertEquals("No backtest was run for this report.", single.text("//section[@id='accuracy']/p[@class='absent']"));
    assertEquals(1, single.count("//table[@class='levels']"), "the level table stays");
  }

  @Test
  void shouldEscapeEveryText() throws Exception {
    String title = "Q1 <b>bold</b> & \"quoted\" 'single'";
    String chartTitle = "<script>alert(1)</script>";
    ReportData base = SampleReports.full(SEED);
    SeriesChart c = base.series().get(0);
    ReportData report = base.toBuilder().clearSeries().series(new SeriesChart(chartTitle, c.dates(), c.actual(),
        c.forecast(), c.lower(), c.upper(), c.lowerQuantile(), c.upperQuantile(), c.originIndex()))
        .caution("Check <everything> & then act.").build();
    String html = HtmlReportWriter.render(report);
    assertFalse(html.contains("<script"));
    assertFalse(html.contains("<b>"));
    XmlPage page = XmlPage.parse(html);
    assertEquals("Check <everything> & then act.", page.text("//section[@id='caution']/p"));
    assertEquals(chartTitle, page.text("//section[@id='series']//figcaption"));
    ReportData titled = ReportData.builder(title).build();
    assertEquals(title, XmlPage.parse(HtmlReportWriter.render(titled)).text("//h1"));
  }

  @Test
  void shouldRenderTheSameBytesEveryTime() {
    assertEquals(HtmlReportWriter.render(SampleReports.full(SEED)), HtmlReportWriter.render(SampleReports.full(SEED)));
  }

  @Test
  void shouldWriteTheFileWhole(@TempDir Path dir) throws Exception {
    ReportData report = SampleReports.full(SEED);
    Path file = dir.resolve("run/report.html");
    HtmlReportWriter.write(report, file);
    HtmlReportWriter.write(report, file);
    assertEquals(HtmlReportWriter.render(report), Files.readString(file));
    try (Stream<Path> files = Files.list(file.getParent())) {
      assertEquals(List.of(file), files.toList(), "no temporary file is left behind");
    }
  }

  /**
   * Each why-this-forecast chart draws one segment per non-zero part and period and one dot per period, and its
   * table lists each part's units over the horizon, which add up to the forecast's (the numbers of report.json).
   */
  @Test
  void shouldDrawEveryDriverPartAndListItsUnits() throws Exception {
    ReportData report = SampleReports.full(SEED);
    XmlPage page = XmlPage.parse(HtmlReportWriter.render(report));
    List<Element> charts = page.all("//section[@id='drivers']//svg");
    List<Element> tables = page.all("//section[@id='drivers']//table");
    assertEquals(report.drivers().size(), charts.size());
    assertEquals(report.drivers().size(), tables.size());
    for (int c = 0; c < charts.size(); c++) {
      DriverChart driver = report.drivers().get(c);
      int nonZero = 0;
      for (DriverChart.Part part : driver.parts()) {
        for (double v : part.units()) {
          nonZero += v != 0 ? 1 : 0;
        }
      }
      assertEquals(nonZero, count(charts.get(c), "rect", "segment"), "chart " + driver.title() + ", seed " + SEED);
      assertEquals(driver.dates().size(), count(charts.get(c), "circle", "total-dot"), driver.title());
      List<Element> rows = new ArrayList<>();
      var tr = tables.get(c).getElementsByTagName("tr");
      for (int i = 0; i < tr.getLength(); i++) {
        rows.add((Element) tr.item(i));
      }
      double forecast = 0;
      for (double v : driver.forecast()) {
        forecast += v;
      }
      for (int p = 0; p < driver.parts().size(); p++) {
        List<String> cells = XmlPage.cells(rows.get(p + 1));
        assertEquals(driver.parts().get(p).name(), cells.get(0));
        assertEquals(String.format(Locale.ROOT, "%.1f", driver.parts().get(p).totalUnits()), cells.get(1));
        assertEquals(String.format(Locale.ROOT, "%.1f%%", 100 * driver.parts().get(p).totalUnits() / forecast),
            cells.get(2));
      }
      assertEquals(List.of("forecast", String.format(Locale.ROOT, "%.1f", forecast), "100%"),
          XmlPage.cells(rows.get(rows.size() - 1)));
    }
  }

  /** The headline's table holds each level's MAE and bias as report.json holds them, and names the best baseline. */
  @Test
  void shouldLeadWithErrorsInUnitsMatchingTheJson() throws Exception {
    ReportData report = SampleReports.full(SEED);
    JsonNode json = new ObjectMapper().readTree(ReportJson.toJson(report)).get("report").get("accuracy");
    XmlPage page = XmlPage.parse(HtmlReportWriter.render(report));
    List<Element> rows = page.all("//section[@id='headline']//table//tr");
    JsonNode levels = json.get("levels");
    assertEquals(levels.size() + 1, rows.size());
    String best = null;
    double bestScore = Double.POSITIVE_INFINITY;
    for (var it = json.get("baselineWrmsse").fields(); it.hasNext();) {
      var e = it.next();
      if (e.getValue().asDouble() < bestScore) {
        bestScore = e.getValue().asDouble();
        best = e.getKey();
      }
    }
    assertEquals(List.of("level", "series", "MAE, units", "bias, units", "scaled error (RMSSE)", best),
        XmlPage.cells(rows.get(0)));
    for (int l = 0; l < levels.size(); l++) {
      JsonNode level = levels.get(l);
      List<String> cells = XmlPage.cells(rows.get(l + 1));
      assertEquals(level.get("levelName").asText(), cells.get(0));
      assertEquals(unitsText(level.get("modelMae").asDouble()), cells.get(2), "MAE of " + cells.get(0));
      double bias = level.get("modelBias").asDouble();
      assertEquals((bias > 0 ? "+" : "") + unitsText(bias), cells.get(3), "bias of " + cells.get(0));
      assertEquals(f3(level.get("modelRmsse").asDouble()), cells.get(4));
      assertEquals(f3(level.get("baselineRmsse").get(best).asDouble()), cells.get(5));
    }
    String headline = page.text("//section[@id='headline']/p[@class='headline']");
    double change = (json.get("modelWrmsse").asDouble() / bestScore - 1) * 100;
    assertTrue(headline.contains("the best simple method (" + best + ")"), headline);
    assertTrue(headline.contains(String.format(Locale.ROOT, "%.1f%% %s", Math.abs(change), change < 0 ? "lower"
        : "higher")), headline);
    assertTrue(headline.contains("at the total level the forecast misses by "
        + unitsText(levels.get(0).get("modelMae").asDouble()) + " units per day"), headline);
  }

  /** The worst series are the bottom level's largest shares of the WRMSSE, in order, with report.json's numbers. */
  @Test
  void shouldListWhereItFailsFromTheJson() throws Exception {
    ReportData report = SampleReports.full(SEED);
    JsonNode json = new ObjectMapper().readTree(ReportJson.toJson(report)).get("report").get("accuracy");
    XmlPage page = XmlPage.parse(HtmlReportWriter.render(report));
    List<JsonNode> bottom = new ArrayList<>();
    String bottomLevel = json.get("levels").get(json.get("levels").size() - 1).get("levelName").asText();
    for (JsonNode w : json.get("worstAggregates")) {
      if (w.get("levelName").asText().equals(bottomLevel)) {
        bottom.add(w);
      }
    }
    bottom.sort((a, b) -> Double.compare(b.get("wrmsseContribution").asDouble(),
        a.get("wrmsseContribution").asDouble()));
    List<Element> rows = page.all("//section[@id='failures']//table[contains(@class,'worst-series')]//tr");
    assertEquals(Math.min(10, bottom.size()) + 1, rows.size());
    double wrmsse = json.get("modelWrmsse").asDouble();
    for (int r = 1; r < rows.size(); r++) {
      JsonNode w = bottom.get(r - 1);
      List<String> cells = XmlPage.cells(rows.get(r));
      assertEquals(w.get("aggregateName").asText(), cells.get(0));
      assertEquals(String.format(Locale.ROOT, "%.1f%%", 100 * w.get("wrmsseContribution").asDouble() / wrmsse),
          cells.get(1));
      assertEquals(unitsText(w.get("mae").asDouble()), cells.get(2));
    }
    // region (3 groups), store (8) and department (5) are small enough for a bias table of every group
    assertEquals(3, page.count("//section[@id='failures']//table[contains(@class,'bias-by-group')]"));
  }

  /** Units with 2 decimals below 10, 1 below 100, none above: how the headline and failure tables print them. */
  private static String unitsText(double value) {
    double a = Math.abs(value);
    return String.format(Locale.ROOT, a >= 100 ? "%.0f" : a >= 10 ? "%.1f" : "%.2f", value);
  }

  private static int count(Element svg, String tag, String cssClass) {
    int n = 0;
    var nodes = svg.getElementsByTagName(tag);
    for (int i = 0; i < nodes.getLength(); i++) {
      n += ((Element) nodes.item(i)).getAttribute("class").equals(cssClass) ? 1 : 0;
    }
    return n;
  }

  /** Runs of consecutive finite values at least {@code minLength} long: the slow, obvious count. */
  static int runsOfAtLeast(double[] values, int minLength) {
    int runs = 0;
    int length = 0;
    for (int i = 0; i <= values.length; i++) {
      if (i < values.length && Double.isFinite(values[i])) {
        length++;
      } else {
        runs += length >= minLength ? 1 : 0;
        length = 0;
      }
    }
    return runs;
  }

  private static double[] bandWidth(SeriesChart c) {
    double[] w = new double[c.dates().size()];
    for (int i = 0; i < w.length; i++) {
      w[i] = c.upper()[i] - c.lower()[i];
    }
    return w;
  }

  private static int occurrences(String text, String part) {
    int n = 0;
    for (int i = text.indexOf(part); i >= 0; i = text.indexOf(part, i + 1)) {
      n++;
    }
    return n;
  }
}
