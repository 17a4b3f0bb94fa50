package org.lagmill.store;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** {@link SeriesAttributes} built from a plain table of strings; codes are given in order of first appearance. */
public final class ArraySeriesAttributes implements SeriesAttributes {
  private final String[] names;
  private final int[][] codesBySeries;
  private final List<List<String>> valuesByAttribute;
  private final List<Map<String, Integer>> codeByValue;
  private final String[] seriesIds;
  private final Map<String, Integer> seriesIndexById = new HashMap<>();

  private ArraySeriesAttributes(String[] names, String[][] valuesBySeries) {
    this.names = names.clone();
    this.codesBySeries = new int[valuesBySeries.length][names.length];
    this.valuesByAttribute = new ArrayList<>();
    this.codeByValue = new ArrayList<>();
    for (int a = 0; a < names.length; a++) {
      valuesByAttribute.add(new ArrayList<>());
      codeByValue.add(new HashMap<>());
    }
    int idColumn = SeriesIdentity.idIndex(List.of(names));
    seriesIds = new String[valuesBySeries.length];
    for (int s = 0; s < valuesBySeries.length; s++) {
      for (int a = 0; a < names.length; a++) {
        String v = valuesBySeries[s][a];
        Map<String, Integer> codes = codeByValue.get(a);
        Integer code = codes.get(v);
        if (code == null) {
          code = codes.size();
          codes.put(v, code);
          valuesByAttribute.get(a).add(v);
        }
        codesBySeries[s][a] = code;
      }
      seriesIds[s] = SeriesIdentity.seriesId(valuesBySeries[s], idColumn);
      seriesIndexById.put(seriesIds[s], s);
    }
  }

  /** @param valuesBySeries one row per series, one value per attribute name */
  public static ArraySeriesAttributes of(String[] names, String[][] valuesBySeries) {
    return new ArraySeriesAttributes(names, valuesBySeries);
  }

  @Override
  public int attributeCount() { return names.length; }
  @Override
  public String attributeName(int attributeIndex) { return names[attributeIndex]; }
  @Override
  public List<String> attributeNames() { return List.of(names); }

  @Override
  public int cardinality(int attributeIndex) { return valuesByAttribute.get(attributeIndex).size(); }
  @Override
  public int code(int seriesIndex, int attributeIndex) { return codesBySeries[seriesIndex][attributeIndex]; }
  @Override
  public String value(int attributeIndex, int code) { return valuesByAttribute.get(attributeIndex).get(code); }

  @Override
  public int codeOf(int attributeIndex, String value) {
    return codeByValue.get(attributeIndex).getOrDefault(value, -1);
  }

  @Override
  public String seriesId(int seriesIndex) { return seriesIds[seriesIndex]; }
  @Override
  public int seriesIndexOf(String seriesId) { return seriesIndexById.getOrDefault(seriesId, -1); }
}
