package org.lagmill.report;

/**
 * The report's stylesheet, inlined into every page. It uses no '<' or '&amp;' so the page stays parseable as XML.
 */
final class ReportStyle {
  private ReportStyle() {}

  static final String CSS = """

      :root { color-scheme: light; }
      html { background: #ffffff; }
      body { margin: 0; background: #ffffff; color: #1a1a1a;
        font: 15px/1.5 'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif; }
      main { max-width: 960px; margin: 0 auto; padding: 28px 32px 56px; }
      .kicker { margin: 0; font-size: 12px; letter-spacing: 0.08em; text-transform: uppercase; color: #555555; }
      h1 { margin: 2px 0 10px; font-size: 27px; line-height: 1.25; }
      h2 { margin: 40px 0 12px; padding-bottom: 4px; border-bottom: 2px solid #1a1a1a; font-size: 20px; }
      h3 { margin: 22px 0 6px; font-size: 15px; }
      dl.facts { display: grid; grid-template-columns: max-content 1fr; gap: 2px 18px; margin: 8px 0 12px; }
      dl.facts dt { color: #555555; }
      dl.facts dd { margin: 0; overflow-wrap: anywhere; }
      .caution-banner { margin: 18px 0; padding: 10px 14px; border: 1px solid #1a1a1a; border-left: 8px solid #1a1a1a;
        background: #fff7e0; }
      .caution-text { font-size: 16px; }
      nav.contents ol { display: flex; flex-wrap: wrap; gap: 4px 18px; margin: 0; padding: 0; list-style: none;
        counter-reset: part; font-size: 14px; }
      nav.contents li { counter-increment: part; }
      nav.contents li::before { content: counter(part) ". "; color: #555555; }
      a { color: #1a4f80; }
      table { border-collapse: collapse; margin: 8px 0 18px; font-size: 14px; }
      caption { caption-side: top; text-align: left; font-weight: bold; padding-bottom: 4px; white-space: nowrap; }
      th, td { padding: 4px 12px 4px 0; border-bottom: 1px solid #dddddd; text-align: left; vertical-align: top; }
      thead th { border-bottom: 2px solid #1a1a1a; }
      table.levels, table.origins { font-size: 12.5px; }
      table.levels th, table.levels td, table.origins th, table.origins td { padding-right: 8px; }
      table.levels thead th.num, table.origins thead th.num { max-width: 6.5em; white-space: normal; }
      table.levels tbody th { min-width: 11em; }
      tbody th { font-weight: normal; }
      tfoot th, tfoot td { border-top: 1px solid #1a1a1a; }
      tfoot tr:first-child th, tfoot tr:first-child td { border-top: 2px solid #1a1a1a; }
      .num { text-align: right; padding-left: 16px; font-variant-numeric: tabular-nums; white-space: nowrap; }
      figure { margin: 12px 0 22px; }
      figcaption { font-weight: bold; font-size: 14px; margin-bottom: 2px; }
      svg.chart { display: block; width: 100%; height: auto; }
      .headline { font-size: 16px; }
      .note { margin: 4px 0 12px; font-size: 13px; color: #444444; }
      .absent { font-style: italic; color: #555555; }
      @page { size: A4; margin: 14mm; }
      @media print {
        body { font-size: 10.5pt; }
        main { max-width: none; padding: 0; }
        nav.contents { display: none; }
        .section { break-before: page; }
        .caution-banner { background: #ffffff; }
        figure, table, dl.facts { break-inside: avoid; }
        h2, h3, figcaption { break-after: avoid; }
        a { color: #1a1a1a; text-decoration: none; }
      }
      """;
}
