package org.lagmill.forecast;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.zip.GZIPOutputStream;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;

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
        header.append(ModelDirectory.csvCell(attributes.attributeName(a))).append(',');
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
        header.append(ModelDirectory.csvCell(attributes.attributeName(a))).append(',');
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
    Path absolute = file.toAbsolutePath();
    Files.createDirectories(absolute.getParent());
    // Not Files.createTempFile: its owner-only permissions would carry over to the published file.
    Path temp = absolute.resolveSibling("." + absolute.getFileName() + ".tmp-" + System.nanoTime());
    try {
      try (OutputStream raw = Files.newOutputStream(temp);
          OutputStream maybeZipped = file.toString().endsWith(".gz") ? new GZIPOutputStream(raw, 1 << 16) : raw;
          BufferedWriter out = new BufferedWriter(new OutputStreamWriter(maybeZipped, StandardCharsets.UTF_8),
              1 << 16)) {
        body.write(out);
      }
      Files.move(temp, absolute, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    } finally {
      Files.deleteIfExists(temp);
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
      prefix.append(ModelDirectory.csvCell(attributes.value(a, attributes.code(seriesIndex, a)))).append(',');
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
