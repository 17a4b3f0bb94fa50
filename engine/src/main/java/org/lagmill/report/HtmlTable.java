package org.lagmill.report;

import java.util.List;

/**
 * Builds a plain HTML table: a header row, body rows and footer rows; every cell text is escaped, numeric columns
 * are right-aligned with tabular figures. A cell text starting with {@link #STRONG} is printed in bold (the best score
 * of a row). Not thread-safe.
 */
final class HtmlTable {
  /** Prefix marking a cell to print in bold; not shown. */
  static final String STRONG = "\u0000strong:";

  private final StringBuilder out = new StringBuilder(1024);
  private final boolean[] numeric;
  private boolean inBody;
  private boolean inFooter;

  /**
   * @param cssClass class of the table element
   * @param caption a one-line caption above the table, or null
   * @param headers column headings
   * @param numeric which columns hold numbers (right-aligned)
   */
  HtmlTable(String cssClass, String caption, List<String> headers, boolean[] numeric) {
    if (numeric.length != headers.size()) {
      throw new IllegalArgumentException("numeric flags for " + numeric.length + " columns but " + headers.size()
          + " headers");
    }
    this.numeric = numeric.clone();
    out.append("<table class=\"").append(ReportFormat.escape(cssClass)).append("\">");
    if (caption != null) {
      out.append("<caption>").append(ReportFormat.escape(caption)).append("</caption>");
    }
    out.append("<thead><tr>");
    for (int c = 0; c < headers.size(); c++) {
      out.append("<th scope=\"col\"").append(numeric[c] ? " class=\"num\"" : "").append('>')
          .append(ReportFormat.escape(headers.get(c))).append("</th>");
    }
    out.append("</tr></thead>");
  }

  /** Adds a body row; the first cell is the row's heading. */
  HtmlTable row(List<String> cells) {
    if (inFooter) {
      throw new IllegalStateException("body rows must come before footer rows");
    }
    if (!inBody) {
      out.append("<tbody>");
      inBody = true;
    }
    cells(cells);
    return this;
  }

  /** Adds a footer row (totals, mean, spread). */
  HtmlTable footerRow(List<String> cells) {
    if (!inFooter) {
      if (inBody) {
        out.append("</tbody>");
        inBody = false;
      }
      out.append("<tfoot>");
      inFooter = true;
    }
    cells(cells);
    return this;
  }

  String finish() {
    out.append(inBody ? "</tbody>" : "").append(inFooter ? "</tfoot>" : "").append("</table>");
    return out.toString();
  }

  private void cells(List<String> cells) {
    if (cells.size() != numeric.length) {
      throw new IllegalArgumentException("row has " + cells.size() + " cells but the table has " + numeric.length
          + " columns: " + cells);
    }
    out.append("<tr>");
    for (int c = 0; c < cells.size(); c++) {
      String text = cells.get(c);
      boolean strong = text.startsWith(STRONG);
      if (strong) {
        text = text.substring(STRONG.length());
      }
      String tag = c == 0 ? "th" : "td";
      out.append('<').append(tag).append(c == 0 ? " scope=\"row\"" : "").append(numeric[c] ? " class=\"num\"" : "")
          .append('>');
      out.append(strong ? "<strong>" : "").append(ReportFormat.escape(text)).append(strong ? "</strong>" : "");
      out.append("</").append(tag).append('>');
    }
    out.append("</tr>");
  }
}
