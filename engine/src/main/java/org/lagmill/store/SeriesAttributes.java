package org.lagmill.store;

/**
 * Text attributes of each series (item, store, region, …), dictionary-encoded: attribute {@code a} of series {@code s}
 * is a code {@code 0 .. cardinality(a)-1} whose text is {@link #value(int, int)}.
 */
public interface SeriesAttributes {
  int attributeCount();

  String attributeName(int attributeIndex);

  /** Index of the attribute with this name, or -1. */
  int attributeIndex(String attributeName);

  /** Number of distinct values of one attribute. */
  int cardinality(int attributeIndex);

  int code(int seriesIndex, int attributeIndex);

  String value(int attributeIndex, int code);

  /** Code of a value, or -1 when the attribute never takes it. */
  int codeOf(int attributeIndex, String value);

  /** The series' name: its {@code series_id} cell, or its attribute values joined by '/'. */
  String seriesId(int seriesIndex);

  /** Index of the series with this name, or -1. */
  int seriesIndexOf(String seriesId);
}
