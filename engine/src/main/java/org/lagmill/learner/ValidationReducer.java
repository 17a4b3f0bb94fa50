package org.lagmill.learner;

/**
 * Adds every rank's validation sums after each iteration of a distributed training, so that early stopping sees the
 * loss over all ranks' validation rows (LightGBM evaluates each rank's own rows only and does not add them up).
 * Every rank calls it once per iteration, in the same order; it returns the same sums on every rank.
 */
@FunctionalInterface
public interface ValidationReducer {
  /**
   * @param iteration 1-based iteration just trained (every rank passes the same)
   * @param lossSum this rank's metric × weight sum (0 without validation rows)
   * @param squaredErrorSum this rank's rmse² × weight sum
   * @param weightSum this rank's validation weight sum (the row count when unweighted)
   * @return {@code {Σ lossSum, Σ weightSum, Σ squaredErrorSum}} over every rank
   * @throws RuntimeException when a rank is gone or out of step; training stops with it
   */
  double[] reduce(int iteration, double lossSum, double squaredErrorSum, double weightSum);
}
