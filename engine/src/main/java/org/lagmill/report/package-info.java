/**
 * The run report: the data model of everything a report shows ({@link org.lagmill.report.ReportData} and its parts),
 * its JSON form ({@link org.lagmill.report.ReportJson}, the run's {@code report.json}) and its rendering as one
 * self-contained HTML page with inline SVG charts ({@link org.lagmill.report.HtmlReportWriter}, drawn by our own
 * {@link org.lagmill.report.SvgCharts}).
 *
 * <p>Entry points: build a {@code ReportData} with {@link org.lagmill.report.ReportData#builder(String)}, then
 * {@code ReportJson.write} and {@code HtmlReportWriter.write}; {@code ReportJson.read} rebuilds it from a run.
 *
 * <p>Depends on no other lagmill stage: callers (eval, forecast, cli) copy their figures into these records. It uses
 * jackson for JSON and {@link org.lagmill.store.CorruptStoreException} for an unreadable report file; nothing else.
 */
package org.lagmill.report;
