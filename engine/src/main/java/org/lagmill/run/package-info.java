/**
 * The run model: a {@link org.lagmill.run.Run} owns the root memory budget and the {@link org.lagmill.run.RunRecord}
 * ({@code run.json}); each {@link org.lagmill.run.Stage} owns a named child budget (optionally limited), times itself,
 * records the run's peak off-heap bytes while it ran and the peak resident memory, and on close fails naming itself
 * when it leaked. {@link org.lagmill.run.RunReport} writes the report with the stages' figures, so what run.json and
 * the report say about time and memory is what the stages measured.
 *
 * <p>Entry points, one per command that runs the pipeline or reads or writes a store:
 * {@link org.lagmill.run.IngestJob}, {@link org.lagmill.run.AppendJob}, {@link org.lagmill.run.ShardJob},
 * {@link org.lagmill.run.InspectJob}, {@link org.lagmill.run.SeriesJob}, {@link org.lagmill.run.TrainJob},
 * {@link org.lagmill.run.DistributedTrainJob} (one rank of {@code train} over several machines),
 * {@link org.lagmill.run.ForecastJob}, {@link org.lagmill.run.EvaluateJob}, {@link org.lagmill.run.BacktestJob},
 * {@link org.lagmill.run.ExplainJob}, {@link org.lagmill.run.DemoJob}. Each takes a request of plain values, writes
 * every file itself and returns what a front end prints; warnings go to a sink as engine text with setting mentions.
 *
 * <p>Sits on top of the engine: may depend on every other engine package; only {@code cli} depends on it.
 */
package org.lagmill.run;
