package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.io.Setting;

/**
 * Key columns of the dated per-key files (prices, plan, closures) that a retailer's export names otherwise than the
 * sales' attributes: per file, which column holds which attribute ({@code sku=article_code}: the file's column
 * {@code article_code} holds the attribute {@code sku}). A file's columns not listed keep matching attributes by their
 * own names. Immutable.
 *
 * @param prices column by attribute for the prices file
 * @param plan column by attribute for the plan file
 * @param closures column by attribute for the closures file
 */
public record KeyColumns(Map<String, String> prices, Map<String, String> plan, Map<String, String> closures) {
  public static final KeyColumns NONE = new KeyColumns(Map.of(), Map.of(), Map.of());

  public KeyColumns {
    prices = new LinkedHashMap<>(prices);
    plan = new LinkedHashMap<>(plan);
    closures = new LinkedHashMap<>(closures);
  }

  /**
   * A file's header with each listed column replaced by the attribute it holds, so the key matcher reads attributes;
   * the header array itself is not changed.
   *
   * @param columnByAttribute the file's listing ({@link #prices()}, {@link #plan()} or {@link #closures()})
   * @param option the setting the listing came from, for the message
   * @throws InputFormatException naming the file when a listed column is not in its header, or two attributes name
   *     one column
   */
  static String[] attributeHeader(Path file, String[] header, Map<String, String> columnByAttribute,
      Setting option) {
    if (columnByAttribute.isEmpty()) {
      return header;
    }
    String[] renamed = header.clone();
    List<String> columns = Arrays.asList(header);
    Map<String, String> attributeByColumn = new LinkedHashMap<>();
    for (Map.Entry<String, String> entry : columnByAttribute.entrySet()) {
      String attribute = entry.getKey();
      String column = entry.getValue();
      int index = columns.indexOf(column);
      if (index < 0) {
        throw new InputFormatException(file, 1, 0, option + " " + attribute + "=" + column + " names no column of "
            + "the file: expected '" + column + "' among " + columns);
      }
      String earlier = attributeByColumn.put(column, attribute);
      if (earlier != null) {
        throw new InputFormatException(file, 1, index + 1, option + " gives column '" + column + "' to both "
            + earlier + " and " + attribute + ": expected one attribute per column");
      }
      renamed[index] = attribute;
    }
    return renamed;
  }
}
