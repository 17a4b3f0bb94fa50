package org.lagmill.store;

import java.util.List;

/**
 * Text attributes of each series (item, store, region, …), dictionary-encoded: attribute {@code a} of series {@code s}
 * is a code {@code 0 .. cardinality(a)-1} whose text is {@link #value(int, int)}.
 */
public interface SeriesAttributes {
  int attributeCount();

  /** The attribute names in attribute index order (an unmodifiable copy). */
  default List<String> attributeNames() {
    String[] names = new String[attributeCount()];
    for (int a = 0; a < names.length; a++) {
      names[a] = attributeName(a);
    }
    return List.of(names);
  }

  String attributeName(int attributeIndex);

  /** Index of the attribute with this name, or -1. */
  default int attributeIndex(String attributeName) {
    for (int a = 0; a < attributeCount(); a++) {
      if (attributeName(a).equals(attributeName)) {
        return a;
      }
    }
    return -1;
  }

  /** Number of distinct values of one attribute. */
  int cardinality(int attributeIndex);

  int code(int seriesIndex, int attributeIndex);

  String value(int attributeIndex, int code);

  /** Code of a value, or -1 when the attribute never takes it. */
  int codeOf(int attributeIndex, String value);

  /** The series' name as {@link SeriesIdentity} gives it: its {@code series_id} value, or its values joined by '/'. */
  String seriesId(int seriesIndex);

  /** Index of the series with this name, or -1. */
  int seriesIndexOf(String seriesId);
}
