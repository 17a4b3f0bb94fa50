package org.lagmill.features;

import com.fasterxml.jackson.annotation.JsonAutoDetect;
import com.fasterxml.jackson.annotation.JsonSetter;
import com.fasterxml.jackson.annotation.Nulls;
import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.annotation.JsonPropertyOrder;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.fasterxml.jackson.dataformat.yaml.YAMLGenerator;
import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.List;
import org.lagmill.io.InvalidRequestException;

/**
 * Reads and writes a {@link FeatureSpec} as YAML (docs/configuration.md lists every key). Keys left out keep their
 * defaults; an unknown key, a repeated key, a wrong type or an invalid value raises {@link IllegalArgumentException}
 * naming the file and, where known, the line, the key, what was expected and what was found.
 */
public final class FeatureSpecYaml {
  static final List<String> KEYS = List.of("horizonDays", "strategy", "lagDays", "rollingWindowDays",
      "rollingShiftDays", "rollingStats", "calendarFeatures", "calendarColumns", "priceFeatures",
      "priceGroupAttributes", "categoricalAttributes", "seriesFeatures", "planColumns", "fromDate", "untilDate",
      "skipPreLaunch");

  private static final YAMLMapper MAPPER = YAMLMapper.builder(
      YAMLFactory.builder().disable(YAMLGenerator.Feature.WRITE_DOC_START_MARKER).build())
      .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
      // 28.5 as a lag or 14.0 as a horizon is a mistake to report, not a number to truncate
      .disable(DeserializationFeature.ACCEPT_FLOAT_AS_INT)
      .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
      // a key with an empty value would keep the default without a word: refused like a value of the wrong type
      .defaultSetterInfo(JsonSetter.Value.forValueNulls(Nulls.FAIL))
      .serializationInclusion(JsonInclude.Include.NON_NULL)
      .build();

  private FeatureSpecYaml() {}

  /**
   * Reads a user's spec file for a store of this period: a key left out takes the period's default for the file's
   * strategy ({@link FeatureSpec#defaultsFor(int, FeatureSpec.Strategy)}; recursive when the file names none), and
   * an empty file gives {@link FeatureSpec#defaultsFor(int)}.
   */
  public static FeatureSpec read(Path file, int periodDays) throws IOException {
    return parse(Files.readString(file), file.toString(), periodDays);
  }

  /** {@link #read(Path, int)} of spec text; {@code source} names it in error messages. */
  public static FeatureSpec parse(String yaml, String source, int periodDays) {
    Document doc = document(yaml, source);
    if (doc == null) {
      return FeatureSpec.defaultsFor(periodDays);
    }
    FeatureSpec.Strategy strategy;
    try {
      strategy = doc.strategy == null ? FeatureSpec.Strategy.RECURSIVE : FeatureSpec.Strategy.parse(doc.strategy);
    } catch (IllegalArgumentException e) {
      throw new InvalidRequestException(source + ": " + e.getMessage(), e);
    }
    return toSpec(doc, FeatureSpec.defaultsFor(periodDays, strategy), source);
  }

  /**
   * Parses a spec that lagmill wrote itself (a model's manifest, which holds every key): a key left out takes the
   * builder's value ({@link FeatureSpec#defaults()}), as when the file was written, so a stored spec reads back
   * the same whatever today's period defaults are. {@code source} names it in error messages.
   */
  public static FeatureSpec parse(String yaml, String source) {
    Document doc = document(yaml, source);
    return doc == null ? FeatureSpec.defaults() : toSpec(doc, FeatureSpec.defaults(), source);
  }

  private static FeatureSpec toSpec(Document doc, FeatureSpec base, String source) {
    try {
      return doc.toSpec(base);
    } catch (IllegalArgumentException e) {
      throw new InvalidRequestException(source + ": " + e.getMessage(), e);
    }
  }

  /** The parsed document, or null for blank text. */
  private static Document document(String yaml, String source) {
    if (yaml.isBlank()) {
      return null;
    }
    Document doc;
    try {
      doc = MAPPER.readValue(yaml, Document.class);
    } catch (JsonProcessingException e) {
      throw new InvalidRequestException(FeatureSpecYamlErrors.message(source, e, KEYS), e);
    }
    return doc;
  }

  /** Writes every setting of {@code spec}, so the file documents the run. */
  public static void write(FeatureSpec spec, Path file) throws IOException {
    Files.writeString(file, format(spec));
  }

  public static String format(FeatureSpec spec) {
    try {
      return MAPPER.writeValueAsString(Document.of(spec));
    } catch (JsonProcessingException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Every key set in {@code spec} with its value as plain JSON values (lists, numbers, text); unset keys absent. */
  public static java.util.Map<String, Object> values(FeatureSpec spec) {
    return MAPPER.convertValue(Document.of(spec), MAPPER.getTypeFactory().constructMapType(
        java.util.LinkedHashMap.class, String.class, Object.class));
  }

  /** The file's shape; null fields keep the defaults. */
  @JsonAutoDetect(fieldVisibility = JsonAutoDetect.Visibility.ANY)
  @JsonPropertyOrder({"horizonDays", "strategy", "lagDays", "rollingWindowDays", "rollingShiftDays", "rollingStats",
      "calendarFeatures", "calendarColumns", "priceFeatures", "priceGroupAttributes", "categoricalAttributes",
      "seriesFeatures", "planColumns", "fromDate", "untilDate", "skipPreLaunch"})
  static final class Document {
    Integer horizonDays;
    String strategy;
    int[] lagDays;
    int[] rollingWindowDays;
    Integer rollingShiftDays;
    List<String> rollingStats;
    List<String> calendarFeatures;
    Boolean calendarColumns;
    List<String> priceFeatures;
    List<String> priceGroupAttributes;
    List<String> categoricalAttributes;
    List<String> seriesFeatures;
    List<String> planColumns;
    String fromDate;
    String untilDate;
    Boolean skipPreLaunch;

    static Document of(FeatureSpec spec) {
      Document d = new Document();
      d.horizonDays = spec.horizonDays();
      d.strategy = spec.strategy().configName();
      d.lagDays = spec.lagDays();
      d.rollingWindowDays = spec.rollingWindowDays();
      d.rollingShiftDays = spec.hasExplicitRollingShift() ? spec.rollingShiftDays() : null;
      d.rollingStats = spec.rollingStats().stream().map(FeatureSpec.RollingStat::configName).toList();
      d.calendarFeatures = spec.calendarFeatures().stream().map(FeatureSpec.CalendarFeature::configName).toList();
      d.calendarColumns = spec.calendarColumns();
      d.priceFeatures = spec.priceFeatures().stream().map(FeatureSpec.PriceFeature::configName).toList();
      d.priceGroupAttributes = spec.priceGroupAttributes();
      d.categoricalAttributes = spec.categoricalAttributes();
      d.seriesFeatures = spec.seriesFeatures().stream().map(FeatureSpec.SeriesFeature::configName).toList();
      d.planColumns = spec.planColumns();
      d.fromDate = spec.fromDate() == null ? null : spec.fromDate().toString();
      d.untilDate = spec.untilDate() == null ? null : spec.untilDate().toString();
      d.skipPreLaunch = spec.skipPreLaunch();
      return d;
    }

    /** The spec: every key given here, the rest from {@code base}. */
    FeatureSpec toSpec(FeatureSpec base) {
      FeatureSpec.Builder b = base.toBuilder();
      if (horizonDays != null) {
        b.horizonDays(horizonDays);
      }
      if (strategy != null) {
        b.strategy(FeatureSpec.Strategy.parse(strategy));
      }
      if (lagDays != null) {
        b.lagDays(lagDays);
      }
      if (rollingWindowDays != null) {
        b.rollingWindowDays(rollingWindowDays);
      }
      if (rollingShiftDays != null) {
        b.rollingShiftDays(rollingShiftDays);
      }
      if (rollingStats != null) {
        b.rollingStatNames(rollingStats);
      }
      if (calendarFeatures != null) {
        b.calendarFeatureNames(calendarFeatures);
      }
      if (calendarColumns != null) {
        b.calendarColumns(calendarColumns);
      }
      if (priceFeatures != null) {
        b.priceFeatureNames(priceFeatures);
      }
      if (priceGroupAttributes != null) {
        b.priceGroupAttributes(priceGroupAttributes);
      }
      if (categoricalAttributes != null) {
        b.categoricalAttributes(categoricalAttributes);
      }
      if (seriesFeatures != null) {
        b.seriesFeatureNames(seriesFeatures);
      }
      if (planColumns != null) {
        b.planColumns(planColumns);
      }
      if (fromDate != null) {
        b.fromDate(date("fromDate", fromDate));
      }
      if (untilDate != null) {
        b.untilDate(date("untilDate", untilDate));
      }
      if (skipPreLaunch != null) {
        b.skipPreLaunch(skipPreLaunch);
      }
      return b.build();
    }

    private static LocalDate date(String key, String text) {
      if (text == null) {
        return null;
      }
      try {
        return LocalDate.parse(text);
      } catch (DateTimeParseException e) {
        throw new InvalidRequestException(key + " '" + text + "' is not a date; write it as yyyy-mm-dd, e.g. "
            + "2024-01-31", e);
      }
    }
  }
}
