package org.lagmill.features;

import java.util.List;

/**
 * Names and kinds of the feature columns in the order a {@link FeatureBatch} holds them.
 *
 * @param names one unique name per column, e.g. {@code lag_28}, {@code roll_mean_7_shift_28}
 * @param categorical true where the column holds integer codes to be split as categories
 */
public record FeatureSchema(List<String> names, List<Boolean> categorical) {
  public FeatureSchema {
    names = List.copyOf(names);
    categorical = List.copyOf(categorical);
    if (names.size() != categorical.size()) {
      throw new IllegalArgumentException("names and categorical flags differ in length: " + names.size() + " vs "
          + categorical.size());
    }
  }

  public int featureCount() { return names.size(); }

  /** Indexes of the categorical columns, ascending. */
  public int[] categoricalIndexes() {
    return java.util.stream.IntStream.range(0, names.size()).filter(categorical::get).toArray();
  }
}
