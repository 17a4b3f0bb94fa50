/**
 * Evaluation: aggregation levels of attribute hierarchies, bottom-up sums of actuals and forecasts, per-origin scales
 * and weights (days before the origin only), WRMSSE/WSPL and per-level/per-day errors, and simple baselines.
 *
 * <p>Entry points: {@link org.lagmill.eval.Hierarchy} (declare levels), {@link org.lagmill.eval.Evaluator} (score a
 * forecast into an {@link org.lagmill.eval.EvaluationResult}), {@link org.lagmill.eval.BaselineForecaster} (baseline
 * forecasts), {@link org.lagmill.eval.RollingOriginBacktest} (train, forecast and score at several origins, leak-free
 * through {@link org.lagmill.store.TruncatedHistory}). Formulas and sources: docs/metrics.md. Depends on {@code store} (and may use {@code features},
 * {@code learner}, {@code forecast}); never on {@code ingest} or {@code report}.
 */
package org.lagmill.eval;
