package org.lagmill.training;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.util.Collection;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.learner.Objective;
import org.lagmill.learner.TrainedModel;

/**
 * Whether a plan may continue from its starting models: the same feature spec (plan columns included, so every
 * row has the columns the starting trees split on, in the same places), the same objective (the raw scores the rows
 * start from mean the same thing) and the same partitioning (each partition continues its own model). Refused
 * otherwise, naming what differs.
 */
final class ContinuationCheck {
  private static final ObjectMapper YAML = new ObjectMapper(new YAMLFactory());

  private ContinuationCheck() {}

  /**
   * @param plan with its plan columns resolved against the history
   * @param partitionValues the partitions this training trains
   */
  static void check(TrainingPlan plan, Collection<String> partitionValues) {
    StartingModels starting = plan.startingModels();
    String from = "the model to continue from (" + starting.source() + ")";
    if (plan.refit()) {
      throw new InvalidRequestException(Setting.REFIT + " cannot be combined with continuing from " + from + " yet:"
          + " leave out one of them");
    }
    ModelSet models = starting.models();
    if (!models.spec().equals(plan.spec())) {
      throw new InvalidRequestException(from + " was trained on another feature spec: " + firstDifference(
          FeatureSpecYaml.format(models.spec()), FeatureSpecYaml.format(plan.spec()))
          + "; continue only with the feature spec (and plan columns) it was trained with");
    }
    if (!Objects.equals(models.partitionAttribute(), plan.partitionAttribute())) {
      throw new InvalidRequestException(from + " is partitioned by " + shown(models.partitionAttribute())
          + ", this training by " + shown(plan.partitionAttribute()) + "; give the same " + Setting.PARTITION_BY);
    }
    Objective objective = plan.trainParameters().objective();
    for (ModelSet.Partition partition : models.partitions()) {
      Objective startingObjective = partition.model().objective();
      if (startingObjective != objective) {
        throw new InvalidRequestException(from + " was trained for the " + name(startingObjective)
            + " objective, this training for " + name(objective) + "; continue with the objective it was"
            + " trained for");
      }
    }
    for (String value : partitionValues) {
      startingModel(starting, value);
    }
  }

  /** The starting model of partition {@code value}. */
  static TrainedModel startingModel(StartingModels starting, String value) {
    for (ModelSet.Partition partition : starting.models().partitions()) {
      if (partition.value().equals(value)) {
        return partition.model();
      }
    }
    List<String> held = starting.models().partitions().stream().map(ModelSet.Partition::value).toList();
    throw new InvalidRequestException("the model to continue from (" + starting.source() + ") has no model for "
        + "partition " + value + " (it holds " + held + "); train from scratch instead");
  }

  private static String name(Objective objective) {
    return objective.name().toLowerCase(Locale.ROOT);
  }

  private static String shown(String partitionAttribute) {
    return partitionAttribute == null ? "nothing (one model)" : "'" + partitionAttribute + "'";
  }

  /**
   * The first setting (top-level key of the specs' YAML form) whose value differs, as "its KEY is A where this
   * training's is B"; a key one of them lacks reads "(not set)".
   */
  static String firstDifference(String starting, String wanted) {
    try {
      JsonNode a = YAML.readTree(starting);
      JsonNode b = YAML.readTree(wanted);
      Set<String> keys = new LinkedHashSet<>();
      a.fieldNames().forEachRemaining(keys::add);
      b.fieldNames().forEachRemaining(keys::add);
      for (String key : keys) {
        if (!Objects.equals(a.get(key), b.get(key))) {
          return "its " + key + " is " + shownValue(a.get(key)) + " where this training's is " + shownValue(b.get(
              key));
        }
      }
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("a feature spec's own YAML form does not parse: " + e.getOriginalMessage(), e);
    }
    return "they differ in a way their YAML forms do not show";
  }

  private static String shownValue(JsonNode value) {
    return value == null ? "(not set)" : value.toString();
  }
}
