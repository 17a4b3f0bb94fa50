package org.lagmill.learner;

/** What a feature's importance counts. */
public enum FeatureImportance {
  /** Number of splits on the feature. */
  SPLIT,
  /** Total loss reduction of the splits on the feature. */
  GAIN
}
