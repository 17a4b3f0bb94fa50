package org.lagmill.report;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.DeserializationContext;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.deser.std.StdDeserializer;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.module.SimpleModule;
import com.fasterxml.jackson.databind.ser.std.StdSerializer;
import com.fasterxml.jackson.databind.ser.std.ToStringSerializer;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.Arrays;
import java.util.function.Function;
import org.lagmill.io.AtomicFiles;
import org.lagmill.io.SealedJson;
import org.lagmill.store.CorruptStoreException;

/**
 * Writes and reads a {@link ReportData} as pretty-printed JSON ({@code report.json} in a run directory), so
 * {@code lagmill report --run DIR} can rebuild the HTML without rerunning anything.
 *
 * <p>The file is {@code {"formatVersion": 1, "report": {...}}}. Dates are ISO-8601 text ("2024-03-01",
 * "2024-03-01T12:00:00Z"); a NaN inside a number array (a day with no value) is written as {@code null}, so the file
 * is strict JSON any tool can read. Thread-safe: the mapper is configured once and shared.
 */
public final class ReportJson {
  /** The format version this code writes and the only one it reads. */
  public static final int FORMAT_VERSION_CURRENT = 1;

  private static final ObjectMapper MAPPER = createMapper();

  private ReportJson() {}

  private record ReportFile(int formatVersion, ReportData report) {}

  /** Writes {@code report} to {@code file} through a temporary file and a rename. */
  public static void write(ReportData report, Path file) throws IOException {
    String json = MAPPER.writeValueAsString(new ReportFile(FORMAT_VERSION_CURRENT, report));
    AtomicFiles.write(file, SealedJson.seal((json + "\n").getBytes(StandardCharsets.UTF_8)));
  }

  /** The JSON text of {@code report}, as {@link #write} stores it. */
  public static String toJson(ReportData report) throws JsonProcessingException {
    return MAPPER.writeValueAsString(new ReportFile(FORMAT_VERSION_CURRENT, report));
  }

  /**
   * Reads a report written by {@link #write}.
   *
   * @throws CorruptStoreException when the file is not a report of the current format version
   * @throws IOException when the file cannot be read
   */
  public static ReportData read(Path file) throws IOException {
    byte[] bytes = SealedJson.unseal(file, Files.readAllBytes(file)).bytes();
    ReportFile parsed;
    try {
      parsed = MAPPER.readValue(bytes, ReportFile.class);
    } catch (JsonProcessingException e) {
      throw new CorruptStoreException(file, "not a readable lagmill report: " + e.getOriginalMessage()
          + (e.getLocation() == null ? "" : " (line " + e.getLocation().getLineNr() + ", column "
              + e.getLocation().getColumnNr() + ")"),
          e);
    }
    if (parsed == null || parsed.formatVersion() != FORMAT_VERSION_CURRENT) {
      throw new CorruptStoreException(file, "report format version: expected " + FORMAT_VERSION_CURRENT
          + ", actual " + (parsed == null ? "none" : parsed.formatVersion()));
    }
    if (parsed.report() == null) {
      throw new CorruptStoreException(file, "report: expected an object, actual none");
    }
    return parsed.report();
  }

  private static ObjectMapper createMapper() {
    SimpleModule module = new SimpleModule("lagmill-report");
    module.addSerializer(double[].class, new NanAsNullArraySerializer());
    module.addDeserializer(double[].class, new NanAsNullArrayDeserializer());
    module.addSerializer(LocalDate.class, ToStringSerializer.instance);
    module.addDeserializer(LocalDate.class, new TextDeserializer<>(LocalDate.class, LocalDate::parse));
    module.addSerializer(Instant.class, ToStringSerializer.instance);
    module.addDeserializer(Instant.class, new TextDeserializer<>(Instant.class, Instant::parse));
    return JsonMapper.builder().addModule(module).enable(SerializationFeature.INDENT_OUTPUT).build();
  }

  private static final class NanAsNullArraySerializer extends StdSerializer<double[]> {
    private static final long serialVersionUID = 1L;

    NanAsNullArraySerializer() {
      super(double[].class);
    }

    @Override
    public void serialize(double[] values, JsonGenerator gen, SerializerProvider provider) throws IOException {
      gen.writeStartArray(values, values.length);
      for (double v : values) {
        if (Double.isNaN(v)) {
          gen.writeNull();
        } else {
          gen.writeNumber(v);
        }
      }
      gen.writeEndArray();
    }
  }

  private static final class NanAsNullArrayDeserializer extends StdDeserializer<double[]> {
    private static final long serialVersionUID = 1L;

    NanAsNullArrayDeserializer() {
      super(double[].class);
    }

    @Override
    public double[] deserialize(JsonParser p, DeserializationContext ctxt) throws IOException {
      if (!p.isExpectedStartArrayToken()) {
        return (double[]) ctxt.handleUnexpectedToken(double[].class, p);
      }
      double[] values = new double[16];
      int count = 0;
      for (JsonToken t = p.nextToken(); t != JsonToken.END_ARRAY; t = p.nextToken()) {
        double v;
        if (t == JsonToken.VALUE_NULL) {
          v = Double.NaN;
        } else if (t == JsonToken.VALUE_NUMBER_INT || t == JsonToken.VALUE_NUMBER_FLOAT) {
          v = p.getDoubleValue();
        } else if (t == JsonToken.VALUE_STRING) {
          // infinities are written as text ("Infinity") by the generator's default
          v = parseSpecial(p, ctxt);
        } else {
          return (double[]) ctxt.handleUnexpectedToken(double[].class, p);
        }
        if (count == values.length) {
          values = Arrays.copyOf(values, count * 2);
        }
        values[count++] = v;
      }
      return Arrays.copyOf(values, count);
    }

    private static double parseSpecial(JsonParser p, DeserializationContext ctxt) throws IOException {
      String text = p.getText();
      switch (text) {
        case "Infinity", "+Infinity" -> {
          return Double.POSITIVE_INFINITY;
        }
        case "-Infinity" -> {
          return Double.NEGATIVE_INFINITY;
        }
        case "NaN" -> {
          return Double.NaN;
        }
        default -> {
          return (double) ctxt.handleWeirdStringValue(double.class, text, "expected a number or null");
        }
      }
    }
  }

  private static final class TextDeserializer<T> extends StdDeserializer<T> {
    private static final long serialVersionUID = 1L;
    private final Class<T> type;
    private final transient Function<String, T> parse;

    TextDeserializer(Class<T> type, Function<String, T> parse) {
      super(type);
      this.type = type;
      this.parse = parse;
    }

    @Override
    public T deserialize(JsonParser p, DeserializationContext ctxt) throws IOException {
      String text = p.getValueAsString();
      if (text == null) {
        return type.cast(ctxt.handleUnexpectedToken(type, p));
      }
      try {
        return parse.apply(text);
      } catch (DateTimeParseException e) {
        return type.cast(ctxt.handleWeirdStringValue(type, text, "expected ISO-8601 text"));
      }
    }
  }
}
