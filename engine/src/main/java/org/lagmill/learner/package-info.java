/**
 * The bridge to LightGBM: builds its Dataset from a {@link org.lagmill.features.RowStream} without a full feature
 * matrix (a sampling pass, then row batches pushed straight from native memory), trains with early stopping, saves,
 * loads and predicts. LightGBM types never leave this package.
 *
 * <p>Entry points: {@link org.lagmill.learner.DatasetBuilder} (owned {@link org.lagmill.learner.TrainingDataset}s),
 * {@link org.lagmill.learner.Trainer} (an owned {@link org.lagmill.learner.TrainedModel}; {@code continueFrom} boosts on
 * from a starting model's trees, LightGBM's init model) and
 * {@link org.lagmill.learner.TrainedModel#load}. Over several machines: {@link org.lagmill.learner.LearnerNetwork},
 * {@link org.lagmill.learner.DatasetBuilder#buildDistributed}, {@link org.lagmill.learner.Trainer#trainDistributed},
 * with the settings every rank shares in {@link org.lagmill.learner.DistributedBinning}. Depends on {@code memory} and {@code features}; see docs/learner.md.
 */
package org.lagmill.learner;
