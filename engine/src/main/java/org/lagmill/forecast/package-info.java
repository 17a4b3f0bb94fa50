/**
 * From trained models to forecasts: {@link org.lagmill.forecast.Forecaster} forecasts a
 * {@link org.lagmill.training.ModelSet} directly or recursively, {@link org.lagmill.forecast.CountQuantiles} turns
 * point forecasts into quantiles, and the forecast file classes write and read the output CSV. Training lives in
 * {@code training}.
 *
 * <p>May depend on {@code memory}, {@code store}, {@code features}, {@code learner}, {@code training}, {@code progress}
 * and the CSV source of {@code ingest}; never on {@code eval} or {@code report}.
 */
package org.lagmill.forecast;
import org.lagmill.training.ModelSet;
