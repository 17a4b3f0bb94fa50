package org.lagmill.report;

import java.io.IOException;
import java.nio.file.Path;
import org.lagmill.io.AtomicFiles;

/**
 * Renders a {@link ReportData} as one self-contained HTML file: inline CSS and inline SVG charts, no scripts, no
 * external resources, black on white and paged sensibly when printed.
 *
 * <p>Sections carry stable ids that links and tests rely on, in page order: {@code #headline}, {@code #failures},
 * {@code #series}, {@code #drivers}, {@code #accuracy}, {@code #horizon}, {@code #training}, {@code #summary},
 * {@code #memory}, {@code #caution}. A section whose data is absent stays, with
 * one line saying so. The caution is shown twice: in a banner at the top and in the closing section. The markup is
 * written XHTML-style (every element closed, only numeric character references) so an XML parser can read it.
 * Stateless and thread-safe.
 */
public final class HtmlReportWriter {
  private HtmlReportWriter() {}

  /** Writes the report to {@code htmlFile} through a temporary file beside it and a rename. */
  public static void write(ReportData report, Path htmlFile) throws IOException {
    AtomicFiles.writeString(htmlFile, render(report));
  }

  /** The whole HTML document as text; the same report always gives the same text. */
  public static String render(ReportData report) {
    StringBuilder b = new StringBuilder(64 * 1024);
    b.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n")
        .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n")
        .append("<meta name=\"generator\" content=\"lagmill\"/>\n")
        .append("<title>").append(ReportFormat.escape(report.title())).append("</title>\n")
        .append("<style>").append(ReportStyle.CSS).append("</style>\n</head>\n<body>\n<main>\n");
    b.append(header(report));
    b.append("<div class=\"caution-banner\" role=\"note\"><strong>Caution. </strong>")
        .append(ReportFormat.escape(report.caution())).append("</div>\n");
    String periodUnit = report.data() == null ? "day" : report.data().periodUnit();
    b.append(contents());
    // a planner reads from the top: how good, where it fails, the charts; engineering details and storage last
    b.append(PlannerSections.headline(report.accuracy(), report.data(), periodUnit));
    b.append(PlannerSections.failures(report.accuracy(), periodUnit));
    b.append(SeriesSection.render(report.series(), periodUnit));
    b.append(DriversSection.render(report.drivers(), periodUnit));
    b.append(ModelSections.accuracy(report.accuracy()));
    b.append(ModelSections.horizon(report.horizon(), periodUnit));
    b.append(ModelSections.training(report.training(), periodUnit));
    b.append(OverviewSections.summary(report.data()));
    b.append(OverviewSections.memory(report.stages()));
    b.append(Html.section("caution", "Caution", "<p class=\"caution-text\">" + ReportFormat.escape(report.caution())
        + "</p>"));
    b.append("</main>\n</body>\n</html>\n");
    return b.toString();
  }

  private static String header(ReportData report) {
    StringBuilder b = new StringBuilder(
        "<header class=\"report-header\"><p class=\"kicker\">lagmill forecast report</p>");
    b.append("<h1>").append(ReportFormat.escape(report.title())).append("</h1>");
    RunInfo run = report.run();
    if (run != null) {
      String machine = run.availableCores() == null && run.maxHeapBytes() == null ? null
          : (run.availableCores() == null ? "" : run.availableCores() + " cores")
              + (run.availableCores() != null && run.maxHeapBytes() != null ? ", " : "")
              + (run.maxHeapBytes() == null ? "" : ReportFormat.bytes(run.maxHeapBytes()) + " max heap");
      b.append(Html.facts(
          "Created", run.created() == null ? null : run.created().toString().replace('T', ' ').replace("Z", " UTC"),
          "lagmill version", run.lagmillVersion(),
          "Command", run.commandLine(),
          "Machine", machine,
          "Store", run.storePath()));
    }
    return b.append("</header>\n").toString();
  }

  private static String contents() {
    String[][] entries = {{"headline", "How good is the forecast"}, {"failures", "Where it fails"},
        {"series", "Actual and forecast"}, {"drivers", "Why this forecast"}, {"accuracy", "Accuracy against every "
            + "baseline"},
        {"horizon", "Error by horizon"}, {"training", "Model details"}, {"summary", "Data and storage"},
        {"memory", "Memory and time"}, {"caution", "Caution"}};
    StringBuilder b = new StringBuilder("<nav class=\"contents\"><ol>");
    for (String[] e : entries) {
      b.append("<li><a href=\"#").append(e[0]).append("\">").append(e[1]).append("</a></li>");
    }
    return b.append("</ol></nav>\n").toString();
  }
}
