/**
 * From a store and a plan to a trained model set: {@link org.lagmill.training.ModelTraining} trains a
 * {@link org.lagmill.training.ModelSet} as a {@link org.lagmill.training.TrainingPlan} says (one model per partition,
 * early stopping on the last horizon days before the cut, optional sales-value row weights, optionally a hashed share
 * of the zero-sales training rows weighted by its inverse, interval dispersions from those held-out days, optionally
 * continuing from {@link org.lagmill.training.StartingModels} instead of boosting from scratch), and
 * {@link org.lagmill.training.ModelDirectory} saves and opens it.
 *
 * <p>Sits between {@code learner} and {@code forecast}: may depend on {@code memory}, {@code store}, {@code features},
 * {@code learner} and {@code progress}; never on {@code ingest}, {@code forecast}, {@code eval} or {@code report}.
 *
 * <p>Over several machines: {@link org.lagmill.training.DistributedTraining} trains one rank's share on LightGBM's
 * distributed learner; {@link org.lagmill.training.ClusterSpec} is the machine list and
 * {@link org.lagmill.training.RankExchange} lagmill's own channel between ranks (rendezvous, identity check, sums and
 * gathers over ranks, a rank that dies reported at once), beside LightGBM's network, which {@code learner} owns.
 */
package org.lagmill.training;
