package org.lagmill.features;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.exc.InvalidNullException;
import com.fasterxml.jackson.databind.exc.UnrecognizedPropertyException;
import com.fasterxml.jackson.dataformat.yaml.JacksonYAMLParseException;
import java.util.List;
import java.util.Map;
import org.lagmill.io.Excerpts;
import org.yaml.snakeyaml.error.MarkedYAMLException;

/**
 * Turns the YAML library's failures into messages in our own words: the file, the line, the key, what was expected
 * and what was found ({@code features.yaml line 2: key 'lagDays': expected a list of whole numbers, found '28.5'}).
 * The library's own sentences name Java types and tokens a user cannot act on, so they never reach the console.
 */
final class FeatureSpecYamlErrors {
  private static final String WHOLE = "a whole number";
  private static final String WHOLES = "a list of whole numbers, e.g. [28, 35]";
  private static final String NAMES = "a list of names, e.g. [a, b]";
  private static final String FLAG = "true or false";
  private static final String DATE = "a date written yyyy-mm-dd";

  /** What each key takes, in the words of docs/configuration.md. */
  private static final Map<String, String> EXPECTED = Map.ofEntries(
      Map.entry("horizonDays", WHOLE), Map.entry("strategy", "direct or recursive"), Map.entry("lagDays", WHOLES),
      Map.entry("rollingWindowDays", WHOLES), Map.entry("rollingShiftDays", WHOLE),
      Map.entry("rollingStats", NAMES), Map.entry("calendarFeatures", NAMES), Map.entry("calendarColumns", FLAG),
      Map.entry("priceFeatures", NAMES), Map.entry("priceGroupAttributes", NAMES),
      Map.entry("categoricalAttributes", NAMES), Map.entry("seriesFeatures", NAMES), Map.entry("fromDate", DATE),
      Map.entry("untilDate", DATE), Map.entry("skipPreLaunch", FLAG));

  private FeatureSpecYamlErrors() {}

  /** The message for a failure to read {@code source}; {@code keys} are the allowed keys in file order. */
  static String message(String source, JsonProcessingException e, List<String> keys) {
    String where = e.getCause() instanceof MarkedYAMLException marked && marked.getProblemMark() != null
        ? source + " line " + (marked.getProblemMark().getLine() + 1) + ": " : where(source, e.getLocation());
    if (e instanceof UnrecognizedPropertyException u) {
      return where + "unknown key '" + Excerpts.of(u.getPropertyName()) + "'; allowed: " + String.join(", ", keys);
    }
    if (e instanceof JacksonYAMLParseException) {
      String problem = e.getCause() instanceof MarkedYAMLException marked && marked.getProblem() != null
          ? marked.getProblem() : e.getOriginalMessage().lines().findFirst().orElse("unreadable").trim();
      return where + "not valid YAML (" + Excerpts.of(problem) + "): expected one 'key: value' per line";
    }
    String original = String.valueOf(e.getOriginalMessage());
    if (original.startsWith("Duplicate field '")) {
      String key = original.substring("Duplicate field '".length(),
          original.indexOf('\'', "Duplicate field '".length()));
      return where + "key '" + Excerpts.of(key) + "' appears twice: expected each key once";
    }
    JsonParser parser = e.getProcessor() instanceof JsonParser p ? p : null;
    String key = e instanceof JsonMappingException m ? keyOf(m.getPath()) : null;
    if (key == null && parser != null) {
      key = keyOf(parser.getParsingContext());
    }
    // a value the library refused before reading it (e.g. a number of thousands of digits) has no parser to quote
    String found = e instanceof InvalidNullException ? ", found an empty value"
        : parser == null ? "" : ", found " + found(parser);
    if (key == null) {
      return where + "expected keys with values (key: value, one per line)" + found;
    }
    return where + "key '" + Excerpts.of(key) + "': expected " + EXPECTED.getOrDefault(key, "a value") + found;
  }

  private static String keyOf(List<JsonMappingException.Reference> path) {
    for (int i = path.size() - 1; i >= 0; i--) {
      if (path.get(i).getFieldName() != null) {
        return path.get(i).getFieldName();
      }
    }
    return null;
  }

  /** The innermost enclosing key, e.g. {@code lagDays} for an element of its list. */
  private static String keyOf(JsonStreamContext context) {
    for (JsonStreamContext c = context; c != null; c = c.getParent()) {
      if (c.getCurrentName() != null) {
        return c.getCurrentName();
      }
    }
    return null;
  }

  private static String found(JsonParser parser) {
    JsonToken token = parser == null ? null : parser.currentToken();
    if (token == null) {
      return "nothing";
    }
    switch (token) {
      case START_ARRAY :
        return "a list";
      case START_OBJECT :
        return "a mapping of keys";
      case VALUE_NULL :
        return "an empty value";
      default :
        try {
          String text = parser.getText();
          // an empty scalar reaches a list or number as an empty text
          return text == null || text.isEmpty() ? "an empty value" : "'" + Excerpts.of(text) + "'";
        } catch (java.io.IOException unreadable) {
          return "an unreadable value";
        }
    }
  }

  private static String where(String source, JsonLocation location) {
    if (location == null || location.getLineNr() < 1) {
      return source + ": ";
    }
    // Jackson places the location after the offending token, so only the line is reliable enough to print
    return source + " line " + location.getLineNr() + ": ";
  }
}
