package org.lagmill.training;

/**
 * The models a training continues from, and where they come from in words (a model directory's path, or the
 * backtest origin that trained them), for the run record, the console and the report.
 *
 * @param models one model per partition; not owned: whoever opened them closes them after the training
 * @param source where the models come from, e.g. a folder
 */
public record StartingModels(ModelSet models, String source) {
  public StartingModels {
    if (models == null || source == null) {
      throw new IllegalArgumentException("starting models and their source are required, got " + models + " from "
          + source);
    }
  }

  /** The source and each partition's iteration count: what a plan's text shows instead of object identities. */
  @Override
  public String toString() {
    StringBuilder text = new StringBuilder(source).append(" (");
    for (ModelSet.Partition partition : models.partitions()) {
      if (text.charAt(text.length() - 1) != '(') {
        text.append(", ");
      }
      text.append(partition.value()).append(": ").append(partition.report().iterationCount()).append(" rounds");
    }
    return text.append(')').toString();
  }
}
