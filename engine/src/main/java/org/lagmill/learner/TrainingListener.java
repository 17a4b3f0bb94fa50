package org.lagmill.learner;

/** Hears about each boosting iteration, e.g. so the command line can print progress. Called on the training thread. */
@FunctionalInterface
public interface TrainingListener {
  TrainingListener NONE = (iteration, trainSeconds, validationLoss) -> {};

  /**
   * @param iteration 1-based number of the iteration just finished
   * @param trainSeconds wall-clock seconds spent training so far
   * @param validationLoss the objective's own metric on the validation rows, NaN when there are none
   */
  void onIteration(int iteration, double trainSeconds, double validationLoss);
}
