/**
 * The streaming feature pass: turns a {@link org.lagmill.store.SalesHistory} into rows of lags, rolling statistics,
 * calendar, price and series features in a reusable {@link org.lagmill.features.FeatureBatch}, one series at a time,
 * with nothing allocated per row.
 *
 * <p>Entry points: {@link org.lagmill.features.FeatureSpec} (what to compute; YAML through
 * {@link org.lagmill.features.FeatureSpecYaml}) and {@link org.lagmill.features.FeaturePass} (training or prediction
 * rows, a {@link org.lagmill.features.RowStream} the learner consumes). Depends on {@code memory} and {@code store}
 * only; each feature family is one package-private kernel class (lag, rolling, calendar, price, series).
 * {@link org.lagmill.features.ZeroRowSampling} is the one rule for which zero-sales training rows a pass keeps and
 * what a kept one weighs.
 */
package org.lagmill.features;
