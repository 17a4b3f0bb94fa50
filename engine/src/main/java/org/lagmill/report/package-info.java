/**
 * The run report: the data model of everything a report shows ({@link org.lagmill.report.ReportData} and its parts),
 * its JSON form ({@link org.lagmill.report.ReportJson}, the run's {@code report.json}) and its rendering as one
 * self-contained HTML page with inline SVG charts ({@link org.lagmill.report.HtmlReportWriter}, drawn by our own
 * {@link org.lagmill.report.SvgCharts}).
 *
 * <p>Entry points: build a {@code ReportData} with {@link org.lagmill.report.ReportData#builder(String)}, then
 * {@code ReportJson.write} and {@code HtmlReportWriter.write}; {@code ReportJson.read} rebuilds it from a run.
 *
 * <p>The records and the renderer depend on no other lagmill stage; {@link org.lagmill.report.ReportAssembler} and
 * {@link org.lagmill.report.SeriesChartBuilder} copy the figures of {@code store}, {@code forecast} and {@code eval}
 * results into them (the report sits last in the data flow, so it may read every stage).
 */
package org.lagmill.report;
