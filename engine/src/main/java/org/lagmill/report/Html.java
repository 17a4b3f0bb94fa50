package org.lagmill.report;

/** Small HTML fragments shared by the sections; all text arguments are escaped here. */
final class Html {
  private Html() {}

  static String section(String id, String heading, String body) {
    return "<section id=\"" + id + "\" class=\"section\"><h2>" + ReportFormat.escape(heading) + "</h2>" + body
        + "</section>\n";
  }

  static String h3(String text) {
    return "<h3>" + ReportFormat.escape(text) + "</h3>";
  }

  static String p(String text) {
    return "<p>" + ReportFormat.escape(text) + "</p>";
  }

  static String note(String text) {
    return "<p class=\"note\">" + ReportFormat.escape(text) + "</p>";
  }

  /** The one line a section shows when its data is absent. */
  static String absent(String text) {
    return "<p class=\"absent\">" + ReportFormat.escape(text) + "</p>";
  }

  static String figure(String caption, String svg) {
    return "<figure>" + (caption == null ? "" : "<figcaption>" + ReportFormat.escape(caption) + "</figcaption>")
        + svg + "</figure>";
  }

  /** A two-column list of facts; pairs of label and value, values already plain text. */
  static String facts(String... labelValuePairs) {
    StringBuilder b = new StringBuilder("<dl class=\"facts\">");
    for (int i = 0; i + 1 < labelValuePairs.length; i += 2) {
      if (labelValuePairs[i + 1] == null) {
        continue;
      }
      b.append("<dt>").append(ReportFormat.escape(labelValuePairs[i])).append("</dt><dd>")
          .append(ReportFormat.escape(labelValuePairs[i + 1])).append("</dd>");
    }
    return b.append("</dl>").toString();
  }
}
