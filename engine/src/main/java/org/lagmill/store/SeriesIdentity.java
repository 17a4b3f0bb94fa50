package org.lagmill.store;

import java.util.List;

/**
 * How a series is named, in one place: by its {@code series_id} attribute when the store has one, otherwise by all its
 * attribute values joined by '/' in attribute order. Ingest, append, the attribute views and the forecast file reader
 * all name series through here, so a name written by one is found by the others.
 *
 * <p>Stateless; thread-safe.
 */
public final class SeriesIdentity {
  /** The attribute, and the default input column, that holds each series' own name. */
  public static final String SERIES_ID = "series_id";
  /** Joins attribute values into a name when there is no {@code series_id}. */
  public static final String VALUE_SEPARATOR = "/";

  private SeriesIdentity() {}

  /** Position of {@code series_id} among attribute (or column) names, or -1 when there is none. */
  public static int idIndex(List<String> attributeNames) {
    return attributeNames.indexOf(SERIES_ID);
  }

  /**
   * The name of a series with these attribute values.
   *
   * @param attributeValues one value per attribute, in attribute order
   * @param idIndex position of {@code series_id} among them ({@link #idIndex}), or -1
   */
  public static String seriesId(String[] attributeValues, int idIndex) {
    return idIndex >= 0 ? attributeValues[idIndex] : String.join(VALUE_SEPARATOR, attributeValues);
  }

  /**
   * The name of a series read from a file row: its {@code series_id} cell when the file has one, else its attribute
   * values joined.
   *
   * @param idCell the row's {@code series_id} cell, or null when the file has no such column
   * @param attributeValues the row's attribute values in attribute order (read only when {@code idCell} is null)
   */
  public static String seriesId(String idCell, String[] attributeValues) {
    return idCell != null ? idCell : String.join(VALUE_SEPARATOR, attributeValues);
  }

  /** The name of series {@code seriesIndex} of a dictionary-encoded attribute view. */
  static String seriesId(SeriesAttributes attributes, int seriesIndex, int idIndex) {
    if (idIndex >= 0) {
      return attributes.value(idIndex, attributes.code(seriesIndex, idIndex));
    }
    String[] values = new String[attributes.attributeCount()];
    for (int a = 0; a < values.length; a++) {
      values[a] = attributes.value(a, attributes.code(seriesIndex, a));
    }
    return String.join(VALUE_SEPARATOR, values);
  }
}
