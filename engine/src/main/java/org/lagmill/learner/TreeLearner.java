package org.lagmill.learner;

import org.lagmill.io.InvalidRequestException;

/**
 * LightGBM's tree learner ({@code tree_learner}): how one tree is grown over one machine or several.
 * Parallel-Learning-Guide of the LightGBM documentation: data-parallel reduce-scatters every rank's histograms
 * (communication grows with features × bins); voting-parallel exchanges only the top features each rank votes for
 * (constant communication, an approximation).
 */
public enum TreeLearner {
  /** One machine. */
  SERIAL("serial"),
  /** Rows split across ranks; histograms reduced over the network. */
  DATA("data"),
  /** Rows split across ranks; two-stage voting on the best features. */
  VOTING("voting");

  private final String lightGbmName;

  TreeLearner(String lightGbmName) {
    this.lightGbmName = lightGbmName;
  }

  /** LightGBM's name of the learner. */
  public String lightGbmName() {
    return lightGbmName;
  }

  /** From {@code serial}, {@code data} or {@code voting}. */
  public static TreeLearner parse(String text) {
    for (TreeLearner learner : values()) {
      if (learner.lightGbmName.equals(text)) {
        return learner;
      }
    }
    throw new InvalidRequestException("tree learner '" + text + "' is not one of data, voting");
  }
}
