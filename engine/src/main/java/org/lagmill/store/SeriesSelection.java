package org.lagmill.store;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * Picks series of a store by name or attribute value, for commands that work on a subset ({@code forecast --series},
 * {@code --where}, {@code series --match}). Series names are {@link SeriesAttributes#seriesId}. Stateless.
 */
public final class SeriesSelection {
  /** Values listed in the message for an attribute value no series has, at most. */
  static final int LISTED_VALUE_COUNT = 8;

  private SeriesSelection() {}

  /**
   * Series named by id and series matching attribute conditions, together (a series is chosen when either picks it).
   * Conditions {@code ATTRIBUTE=VALUE} on the same attribute are alternatives; on different attributes all must hold.
   *
   * @return ascending series indexes, or null when neither ids nor conditions were given (meaning every series)
   * @throws IllegalArgumentException naming the unknown series, attribute or value, or the malformed condition
   */
  public static int[] select(SalesHistory history, List<String> seriesIds, List<String> conditions) {
    SeriesAttributes attributes = history.attributes();
    boolean byId = seriesIds != null && !seriesIds.isEmpty();
    boolean byCondition = conditions != null && !conditions.isEmpty();
    if (!byId && !byCondition) {
      return null;
    }
    BitSet chosen = new BitSet();
    if (byId) {
      for (String id : seriesIds) {
        int series = attributes.seriesIndexOf(id);
        if (series < 0) {
          throw new InvalidRequestException(Setting.CHOSEN_SERIES + " " + id
              + ": no such series in the store; list them with "
              + Setting.Command.SERIES + " " + Setting.STORE + " DIR " + Setting.MATCH + " TEXT");
        }
        chosen.set(series);
      }
    }
    if (byCondition) {
      chosen.or(where(attributes, history.seriesCount(), conditions));
    }
    return chosen.stream().toArray();
  }

  /** The series meeting every attribute's conditions (see {@link #select}). */
  static BitSet where(SeriesAttributes attributes, int seriesCount, List<String> conditions) {
    Map<Integer, BitSet> codesByAttribute = new LinkedHashMap<>();
    for (String condition : conditions) {
      int equals = condition.indexOf('=');
      if (equals <= 0 || equals == condition.length() - 1) {
        throw new InvalidRequestException(Setting.SERIES_CONDITION + " '" + condition
            + "': expected ATTRIBUTE=VALUE, e.g. " + Setting.SERIES_CONDITION + " "
            + exampleCondition(attributes));
      }
      String name = condition.substring(0, equals).strip();
      String value = condition.substring(equals + 1).strip();
      int attribute = attributes.attributeIndex(name);
      if (attribute < 0) {
        throw new InvalidRequestException(Setting.SERIES_CONDITION + " '" + condition
            + "': the store has no attribute '" + name
            + "'; its attributes: " + String.join(", ", attributes.attributeNames()));
      }
      int code = attributes.codeOf(attribute, value);
      if (code < 0) {
        throw new InvalidRequestException(Setting.SERIES_CONDITION + " '" + condition + "': no series has " + name
            + " = " + value
            + "; values of " + name + ": " + someValues(attributes, attribute));
      }
      codesByAttribute.computeIfAbsent(attribute, a -> new BitSet()).set(code);
    }
    BitSet chosen = new BitSet();
    for (int s = 0; s < seriesCount; s++) {
      boolean all = true;
      for (Map.Entry<Integer, BitSet> e : codesByAttribute.entrySet()) {
        all &= e.getValue().get(attributes.code(s, e.getKey()));
      }
      chosen.set(s, all);
    }
    return chosen;
  }

  /**
   * Series whose id or any attribute value contains {@code text}, ignoring case; every series for null or blank text.
   *
   * @return ascending series indexes
   */
  public static int[] matching(SalesHistory history, String text) {
    SeriesAttributes attributes = history.attributes();
    int seriesCount = history.seriesCount();
    List<Integer> out = new ArrayList<>();
    String needle = text == null ? "" : text.strip().toLowerCase(Locale.ROOT);
    for (int s = 0; s < seriesCount; s++) {
      boolean hit = needle.isEmpty() || attributes.seriesId(s).toLowerCase(Locale.ROOT).contains(needle);
      for (int a = 0; a < attributes.attributeCount() && !hit; a++) {
        hit = attributes.value(a, attributes.code(s, a)).toLowerCase(Locale.ROOT).contains(needle);
      }
      if (hit) {
        out.add(s);
      }
    }
    return out.stream().mapToInt(Integer::intValue).toArray();
  }

  private static String someValues(SeriesAttributes attributes, int attribute) {
    List<String> values = new ArrayList<>();
    for (int c = 0; c < Math.min(LISTED_VALUE_COUNT, attributes.cardinality(attribute)); c++) {
      values.add(attributes.value(attribute, c));
    }
    int more = attributes.cardinality(attribute) - values.size();
    return String.join(", ", values) + (more > 0 ? " and " + more + " more" : "");
  }

  private static String exampleCondition(SeriesAttributes attributes) {
    int a = attributes.attributeCount() - 1;
    return attributes.attributeName(a) + "=" + attributes.value(a, 0);
  }
}
