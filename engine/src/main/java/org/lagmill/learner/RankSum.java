package org.lagmill.learner;

/**
 * Adds numbers over every rank of a distributed training, for what the ranks must agree on before LightGBM's own
 * network takes over (see {@link DistributedBinning}). Every rank calls it at the same point with an array of the
 * same length; it returns the same element-wise sums on every rank.
 */
@FunctionalInterface
public interface RankSum {
  /**
   * @param local this rank's values
   * @return the element-wise sums over every rank
   * @throws RuntimeException when a rank is gone or out of step
   */
  double[] sum(double[] local);
}
