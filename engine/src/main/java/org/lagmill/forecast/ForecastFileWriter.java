package org.lagmill.forecast;

import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;
import org.lagmill.io.AtomicFiles;
import org.lagmill.io.CsvCells;
import org.lagmill.io.OutputTargets;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.training.ModelDirectory;

/**
 * Writes a {@link ForecastTable} as CSV (gzip when the name ends in {@code .gz}), through a temporary file renamed into
 * place. Long form: the series attributes, {@code date}, {@code forecast} and one {@code q…} column per quantile, one
 * row per series-day, and a {@code closed} column (1 on a day the series is declared closed, whose forecast is 0) when
 * the store holds closures. Wide form: the attributes and one column per date holding the point forecast.
 */
public final class ForecastFileWriter {
  private ForecastFileWriter() {}

  public static void writeLong(ForecastTable table, SalesHistory history, Path file) throws IOException {
    write(file, out -> {
      SeriesAttributes attributes = history.attributes();
      StringBuilder header = new StringBuilder();
      for (int a = 0; a < attributes.attributeCount(); a++) {
        header.append(CsvCells.cell(attributes.attributeName(a))).append(',');
      }
      header.append("date,forecast");
      for (double level : table.quantileLevels()) {
        header.append(',').append(ForecastTable.quantileColumn(level));
      }
      boolean markClosed = !history.closures().isEmpty();
      if (markClosed) {
        header.append(",closed");
      }
      out.write(header.append('\n').toString());
      String[] dates = dates(history, table);
      StringBuilder row = new StringBuilder();
      for (int s = 0; s < table.point().length; s++) {
        if (Double.isNaN(table.point()[s][0])) {
          continue;
        }
        String prefix = attributePrefix(attributes, s);
        for (int d = 0; d < table.horizonDays(); d++) {
          row.setLength(0);
          row.append(prefix).append(dates[d]).append(',').append(format(table.point()[s][d]));
          for (int q = 0; q < table.quantileLevels().length; q++) {
            row.append(',').append(format(table.quantiles()[q][s][d]));
          }
          if (markClosed) {
            row.append(history.isClosed(s, table.firstDayIndex() + d) ? ",1" : ",0");
          }
          out.write(row.append('\n').toString());
        }
      }
    });
  }

  public static void writeWide(ForecastTable table, SalesHistory history, Path file) throws IOException {
    write(file, out -> {
      SeriesAttributes attributes = history.attributes();
      StringBuilder header = new StringBuilder();
      for (int a = 0; a < attributes.attributeCount(); a++) {
        header.append(CsvCells.cell(attributes.attributeName(a))).append(',');
      }
      header.append(String.join(",", dates(history, table)));
      out.write(header.append('\n').toString());
      StringBuilder row = new StringBuilder();
      for (int s = 0; s < table.point().length; s++) {
        if (Double.isNaN(table.point()[s][0])) {
          continue;
        }
        row.setLength(0);
        row.append(attributePrefix(attributes, s));
        for (int d = 0; d < table.horizonDays(); d++) {
          row.append(d == 0 ? "" : ",").append(format(table.point()[s][d]));
        }
        out.write(row.append('\n').toString());
      }
    });
  }

  private interface Body {
    void write(BufferedWriter out) throws IOException;
  }

  private static void write(Path file, Body body) throws IOException {
    OutputTargets.checkFile(file.toAbsolutePath().normalize(), "forecast file", ForecastFileWriter::looksLikeForecast);
    boolean gzip = file.toString().endsWith(".gz");
    AtomicFiles.write(file, raw -> {
      OutputStream maybeZipped = gzip ? new GZIPOutputStream(raw, 1 << 16) : raw;
      BufferedWriter out = new BufferedWriter(new OutputStreamWriter(maybeZipped, StandardCharsets.UTF_8), 1 << 16);
      body.write(out);
      out.flush();
      if (maybeZipped instanceof GZIPOutputStream zipped) {
        zipped.finish();
      }
    });
  }

  /**
   * A forecast file lagmill wrote, by its header: a {@code date} and a {@code forecast} column (long form), or a last
   * column named by an ISO date (wide form). Anything else at the output path is never overwritten.
   */
  static boolean looksLikeForecast(Path file) {
    try (InputStream raw = Files.newInputStream(file);
        InputStream in = file.toString().endsWith(".gz") ? new GZIPInputStream(raw) : raw;
        BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      String header = reader.readLine();
      if (header == null) {
        return false;
      }
      List<String> cells = List.of(header.split(",", -1));
      if (cells.contains("date") && cells.contains("forecast")) {
        return true;
      }
      LocalDate.parse(cells.get(cells.size() - 1));
      return true;
    } catch (IOException | RuntimeException e) {
      return false;
    }
  }

  private static String[] dates(SalesHistory history, ForecastTable table) {
    String[] dates = new String[table.horizonDays()];
    for (int d = 0; d < dates.length; d++) {
      dates[d] = history.dateOf(table.firstDayIndex() + d).toString();
    }
    return dates;
  }

  private static String attributePrefix(SeriesAttributes attributes, int seriesIndex) {
    StringBuilder prefix = new StringBuilder();
    for (int a = 0; a < attributes.attributeCount(); a++) {
      prefix.append(CsvCells.cell(attributes.value(a, attributes.code(seriesIndex, a)))).append(',');
    }
    return prefix.toString();
  }

  /** Up to 4 decimals, no trailing zeros: units forecasts need no more, and files stay small. */
  static String format(double value) {
    if (value == Math.rint(value) && Math.abs(value) < 1e15) {
      return Long.toString((long) value);
    }
    String text = String.format(java.util.Locale.ROOT, "%.4f", value);
    text = text.replaceAll("0+$", "");
    return text.endsWith(".") ? text.substring(0, text.length() - 1) : text;
  }
}
