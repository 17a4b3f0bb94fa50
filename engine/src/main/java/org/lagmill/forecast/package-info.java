/**
 * From trained models to forecasts: {@link org.lagmill.forecast.ModelTraining} trains a
 * {@link org.lagmill.forecast.ModelSet} (one model per partition, early stopping on the last horizon days before the
 * cut, interval dispersions from those held-out days), {@link org.lagmill.forecast.ModelDirectory} saves and opens it,
 * {@link org.lagmill.forecast.Forecaster} forecasts directly or recursively, {@link org.lagmill.forecast.CountQuantiles}
 * turns point forecasts into quantiles, and the forecast file classes write and read the output CSV.
 *
 * <p>May depend on {@code store}, {@code features}, {@code learner}, {@code memory}, {@code progress} and the CSV
 * source of {@code ingest}; never on {@code eval} or {@code report}.
 */
package org.lagmill.forecast;
