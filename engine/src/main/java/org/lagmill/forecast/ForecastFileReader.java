package org.lagmill.forecast;

import de.siegmar.fastcsv.reader.CsvRecord;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.lagmill.ingest.CsvSource;
import org.lagmill.ingest.InputFormatException;
import org.lagmill.io.Excerpts;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.SeriesIdentity;

/**
 * Reads a long forecast file (the {@link ForecastFileWriter} form, or any file with {@code series_id} or the store's
 * attribute columns, {@code date}, {@code forecast} and optional {@code q…} columns) against a store, for scoring.
 * Every series of the store must have a forecast for every day of one run of consecutive days.
 */
public final class ForecastFileReader {
  private ForecastFileReader() {}

  public static ForecastTable read(Path file, SalesHistory history) {
    SeriesAttributes attributes = history.attributes();
    try (CsvSource csv = CsvSource.open(file)) {
      String[] header = csv.readHeader();
      int dateColumn = column(header, "date", file);
      int forecastColumn = column(header, "forecast", file);
      List<String> columns = Arrays.asList(header);
      int idColumn = SeriesIdentity.idIndex(columns);
      int[] attributeColumns = new int[attributes.attributeCount()];
      for (int a = 0; a < attributeColumns.length; a++) {
        attributeColumns[a] = columns.indexOf(attributes.attributeName(a));
        if (idColumn < 0 && attributeColumns[a] < 0) {
          throw new InputFormatException(file, 1, 0, "expected a " + SeriesIdentity.SERIES_ID + " column or the"
              + " store's attribute column '" + attributes.attributeName(a) + "', found neither");
        }
      }
      List<Integer> quantileColumns = new ArrayList<>();
      List<Double> levels = new ArrayList<>();
      for (int c = 0; c < header.length; c++) {
        if (header[c].matches("q0\\.\\d+")) {
          double level = Double.parseDouble(header[c].substring(1));
          if (level <= 0) {
            throw new InputFormatException(file, 1, c + 1, "quantile column " + header[c] + ": expected a level"
                + " above 0 and below 1, e.g. q0.5");
          }
          int earlier = levels.indexOf(level);
          if (earlier >= 0) {
            // both columns would be scored as the one level, counting its loss twice
            throw new InputFormatException(file, 1, c + 1, "quantile column " + header[c] + " repeats the level of "
                + header[quantileColumns.get(earlier)] + " (column " + (quantileColumns.get(earlier) + 1)
                + "): expected each level once");
          }
          quantileColumns.add(c);
          levels.add(level);
        }
      }
      // the columns by rising level: a quantile file may list them in any order
      int[] levelOrder = java.util.stream.IntStream.range(0, levels.size()).boxed()
          .sorted((a, b) -> Double.compare(levels.get(a), levels.get(b))).mapToInt(Integer::intValue).toArray();
      List<long[]> cells = new ArrayList<>();
      List<double[]> values = new ArrayList<>();
      int firstDay = Integer.MAX_VALUE;
      int lastDay = Integer.MIN_VALUE;
      String[] key = new String[attributeColumns.length];
      CsvRecord record;
      while ((record = csv.next()) != null) {
        long line = csv.lineNumber();
        if (idColumn < 0) {
          for (int a = 0; a < key.length; a++) {
            key[a] = record.getField(attributeColumns[a]);
          }
        }
        String seriesId = SeriesIdentity.seriesId(idColumn >= 0 ? record.getField(idColumn) : null, key);
        int series = attributes.seriesIndexOf(seriesId);
        if (series < 0) {
          throw new InputFormatException(file, line, idColumn + 1, "expected a series of the store, found '"
              + seriesId + "'");
        }
        int day = dayIndex(file, line, dateColumn, record.getField(dateColumn), history);
        double[] row = new double[1 + quantileColumns.size()];
        row[0] = number(file, line, forecastColumn, record.getField(forecastColumn));
        for (int q = 0; q < quantileColumns.size(); q++) {
          row[1 + q] = number(file, line, quantileColumns.get(q), record.getField(quantileColumns.get(q)));
        }
        requireOrderedQuantiles(file, line, header, quantileColumns, levelOrder, row);
        cells.add(new long[] {series, day, line});
        values.add(row);
        firstDay = Math.min(firstDay, day);
        lastDay = Math.max(lastDay, day);
      }
      if (cells.isEmpty()) {
        throw new InputFormatException(file, 2, 0, "expected forecast rows after the header, found none");
      }
      int horizon = lastDay - firstDay + 1;
      double[][] point = new double[history.seriesCount()][horizon];
      double[][][] quantiles = new double[quantileColumns.size()][history.seriesCount()][horizon];
      for (double[] row : point) {
        Arrays.fill(row, Double.NaN);
      }
      for (int i = 0; i < cells.size(); i++) {
        int s = (int) cells.get(i)[0];
        int d = (int) cells.get(i)[1] - firstDay;
        if (!Double.isNaN(point[s][d])) {
          throw new InputFormatException(file, cells.get(i)[2], dateColumn + 1, "duplicate forecast for series '"
              + attributes.seriesId(s) + "' on " + history.dateOf(firstDay + d));
        }
        point[s][d] = values.get(i)[0];
        for (int q = 0; q < quantiles.length; q++) {
          quantiles[q][s][d] = values.get(i)[1 + q];
        }
      }
      for (int s = 0; s < point.length; s++) {
        for (int d = 0; d < horizon; d++) {
          if (Double.isNaN(point[s][d])) {
            throw new InputFormatException(file, 0, 0, "expected a forecast for every series on every day from "
                + history.dateOf(firstDay) + " to " + history.dateOf(lastDay) + ", missing: series '"
                + attributes.seriesId(s) + "' on " + history.dateOf(firstDay + d));
          }
        }
      }
      return new ForecastTable(firstDay, point, levels.stream().mapToDouble(Double::doubleValue).toArray(),
          quantiles);
    }
  }

  /**
   * Quantiles of one row must not decrease as their level rises: crossing quantiles are no distribution, and the
   * pinball loss of a crossed pair would reward the error.
   */
  private static void requireOrderedQuantiles(Path file, long line, String[] header, List<Integer> quantileColumns,
      int[] levelOrder, double[] row) {
    for (int k = 1; k < levelOrder.length; k++) {
      int lower = levelOrder[k - 1];
      int upper = levelOrder[k];
      if (row[1 + lower] > row[1 + upper]) {
        int column = quantileColumns.get(upper);
        throw new InputFormatException(file, line, column + 1, header[quantileColumns.get(lower)] + " is "
            + row[1 + lower] + " but " + header[column] + " is " + row[1 + upper] + ": expected quantiles that do"
            + " not decrease as the level rises");
      }
    }
  }

  private static int column(String[] header, String name, Path file) {
    int index = Arrays.asList(header).indexOf(name);
    if (index < 0) {
      throw new InputFormatException(file, 1, 0, "expected a '" + name + "' column in the header, found "
          + Excerpts.of(Arrays.toString(header)));
    }
    return index;
  }

  private static int dayIndex(Path file, long line, int column, String text, SalesHistory history) {
    try {
      LocalDate date = LocalDate.parse(text);
      long daysAfterFirst = date.toEpochDay() - history.firstDate().toEpochDay();
      if (Math.floorMod(daysAfterFirst, (long) history.periodDays()) != 0) {
        LocalDate before = history.firstDate().plusDays(Math.floorDiv(daysAfterFirst, (long) history.periodDays())
            * history.periodDays());
        throw new InputFormatException(file, line, column + 1,
            "date " + Excerpts.of(text) + " is off the store's step of "
                + history.periodDays() + " days: expected a period's first date such as " + before + " or "
                + before.plusDays(history.periodDays()));
      }
      return (int) (daysAfterFirst / history.periodDays());
    } catch (DateTimeParseException e) {
      throw new InputFormatException(file, line, column + 1,
          "expected an ISO date (YYYY-MM-DD), found \"" + Excerpts.of(text)
              + "\"");
    }
  }

  private static double number(Path file, long line, int column, String text) {
    try {
      double value = Double.parseDouble(text);
      if (value < 0 || Double.isNaN(value) || Double.isInfinite(value)) {
        throw new NumberFormatException();
      }
      return value;
    } catch (NumberFormatException e) {
      throw new InputFormatException(file, line, column + 1, "expected a non-negative number of units, found \""
          + Excerpts.of(text) + "\"");
    }
  }
}
