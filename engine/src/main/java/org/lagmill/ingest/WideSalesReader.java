package org.lagmill.ingest;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.DateTimeException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.lagmill.io.Excerpts;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesIdentity;

/**
 * Streams a wide sales file: one row per series, attribute columns (text) and one contiguous, ascending run of
 * date columns (header {@code yyyy-MM-dd}) one fixed step apart, holding non-negative integer units; an empty cell is
 * an unknown period. The step (the store's period: 1 day, 7 days for weekly sales, any number of days) is the
 * distance between the first two date columns, and every later column must follow at the same step; a file with one
 * date column is taken as daily. Parses bytes directly (no String per units cell); text cells may use RFC 4180 quotes and must be UTF-8. A file
 * named {@code *.gz} is read through gzip. Empty lines are skipped.
 *
 * <p>The column named by the series-id option becomes the attribute {@code series_id}. Not thread-safe; one row buffer
 * is filled per {@link #next} call, nothing is allocated per units cell.
 */
public final class WideSalesReader implements AutoCloseable {
  /** Units cells longer than this are rejected anyway (at most 10 digits); the parser keeps this much lookahead. */
  private static final int UNITS_LOOKAHEAD_BYTES = 40;
  private static final int MAX_UNITS_DIGITS = 10;
  private static final long MAX_UNITS = Integer.MAX_VALUE - 1;
  private static final int END_OF_LINE = 1;
  private static final int COMMA = 0;

  private final CsvByteSource source;
  private final Path file;
  private byte[] scratch = new byte[256];
  private int scratchLength;
  private LocalDate firstDate;
  private int periodDays = 1;
  private int dayCount;
  private int columnCount;
  private int dateStart;
  private final List<String> attributeNames = new ArrayList<>();
  /** The header cell of every column, for messages. */
  private String[] columnNames = new String[0];
  private long lineNumber;
  private long rowCount;

  private WideSalesReader(Path file) throws IOException {
    this.file = file;
    this.source = new CsvByteSource(file);
  }

  /**
   * Opens a wide sales file and reads its header.
   *
   * @param seriesIdColumn the column naming each series (stored as attribute {@code series_id}); when absent a series
   *     is named by its attribute values joined with '/'
   * @throws InputFormatException for an empty file or a header without a valid run of date columns
   */
  public static WideSalesReader open(Path file, String seriesIdColumn) throws IOException {
    WideSalesReader reader = new WideSalesReader(file);
    try {
      reader.readHeader(seriesIdColumn);
      return reader;
    } catch (IOException | RuntimeException e) {
      reader.close();
      throw e;
    }
  }

  public Path file() {
    return file;
  }

  /** Date of the first date column. */
  public LocalDate firstDate() {
    return firstDate;
  }

  /** Days between consecutive date columns (1 for one date column): the store's period. */
  public int periodDays() {
    return periodDays;
  }

  /** Number of date columns. */
  public int dayCount() {
    return dayCount;
  }

  /** Attribute (non-date) column names in file order, the series-id column renamed {@code series_id}. */
  public List<String> attributeNames() {
    return Collections.unmodifiableList(attributeNames);
  }

  /** 1-based column of the {@code attributeIndex}-th attribute ({@link #attributeNames()} order), for messages. */
  public int attributeColumnNumber(int attributeIndex) {
    return attributeIndex < dateStart ? attributeIndex + 1 : attributeIndex + dayCount + 1;
  }

  /** 1-based line of the row last returned by {@link #next}. */
  public long lineNumber() {
    return lineNumber;
  }

  /** Rows returned so far. */
  public long rowCount() {
    return rowCount;
  }

  private void readHeader(String seriesIdColumn) throws IOException {
    source.ensure(3);
    if (source.limit == 0) {
      throw new InputFormatException(file, 0, 0,
          "the file is empty: expected a header line of attribute and date columns");
    }
    byte[] b = source.buffer;
    if (source.limit >= 3 && (b[0] & 0xFF) == 0xEF && (b[1] & 0xFF) == 0xBB && (b[2] & 0xFF) == 0xBF) {
      source.position = 3;
    }
    lineNumber = 1;
    source.lineNumber = 1;
    List<String> names = new ArrayList<>();
    int ending;
    do {
      if (ColumnLimit.exceeds(names.size() + 1L)) {
        throw ColumnLimit.refusal(file, 1);
      }
      names.add(readTextCell(names.size()));
      ending = endCell(names.size() - 1);
    } while (ending == COMMA);
    columnCount = names.size();
    columnNames = names.toArray(new String[0]);
    Cells.requireCommaSeparated(file, columnNames);
    // a map, not a scan of the earlier names: a file of 100,000 day columns would take billions of comparisons
    Object2IntOpenHashMap<String> firstColumnByName = new Object2IntOpenHashMap<>(columnCount);
    firstColumnByName.defaultReturnValue(-1);
    int firstDateColumn = -1;
    int lastDateColumn = -1;
    LocalDate previous = null;
    for (int c = 0; c < columnCount; c++) {
      String name = names.get(c);
      LocalDate date = dateOf(name, c);
      if (date == null) {
        if (name.isEmpty()) {
          throw error(c, "expected a column name, found an empty header cell");
        }
        String storedName = name.equals(seriesIdColumn) ? SeriesIdentity.SERIES_ID : name;
        if (name.equals(SeriesIdentity.SERIES_ID) && !seriesIdColumn.equals(SeriesIdentity.SERIES_ID)) {
          throw error(c, "column \"series_id\" clashes with the series id column \"" + seriesIdColumn
              + "\": expected one of them, found both; rename one");
        }
        int earlier = firstColumnByName.putIfAbsent(name, c);
        if (earlier >= 0) {
          throw error(c, "duplicate column name \"" + Excerpts.of(name) + "\" (first at column " + (earlier + 1) + ")");
        }
        attributeNames.add(storedName);
        continue;
      }
      if (firstDateColumn < 0) {
        firstDateColumn = c;
        firstDate = date;
        firstColumnByName.put(name, c);
      } else {
        if (lastDateColumn != c - 1) {
          throw error(c, "expected the date columns in one contiguous run, found date \"" + name
              + "\" after the non-date column \"" + names.get(c - 1) + "\"");
        }
        int earlier = firstColumnByName.putIfAbsent(name, c);
        if (earlier >= 0) {
          throw error(c, "duplicate date column \"" + name + "\" (first at column " + (earlier + 1) + ")");
        }
        if (c == firstDateColumn + 1) {
          long stepDays = date.toEpochDay() - previous.toEpochDay();
          if (stepDays < 1 || stepDays > Periods.MAX_PERIOD_DAYS) {
            throw error(c, "expected the second date column 1 to " + Periods.MAX_PERIOD_DAYS + " days after the first ("
                + previous + "), found \"" + Excerpts.of(name) + "\"");
          }
          periodDays = (int) stepDays;
        } else if (!date.equals(previous.plusDays(periodDays))) {
          throw error(c, "expected date " + previous.plusDays(periodDays) + " (" + stepText()
              + " after the previous date column), found \"" + Excerpts.of(name) + "\"");
        }
      }
      previous = date;
      lastDateColumn = c;
    }
    if (firstDateColumn < 0) {
      throw new InputFormatException(file, 1, 0,
          "expected at least one column whose header is a date (yyyy-MM-dd), found none");
    }
    dateStart = firstDateColumn;
    dayCount = lastDateColumn - firstDateColumn + 1;
  }

  private String stepText() {
    return periodDays == 1 ? "one day" : periodDays + " days, the step of the first two date columns,";
  }

  /** The date of a header cell shaped yyyy-MM-dd, null for any other name; a shaped but impossible date fails. */
  private LocalDate dateOf(String name, int column) {
    if (name.length() != 10 || name.charAt(4) != '-' || name.charAt(7) != '-') {
      return null;
    }
    for (int i = 0; i < 10; i++) {
      if (i != 4 && i != 7 && (name.charAt(i) < '0' || name.charAt(i) > '9')) {
        return null;
      }
    }
    LocalDate date;
    try {
      date = LocalDate.parse(name);
    } catch (DateTimeException e) {
      throw error(column, "expected a valid date (yyyy-MM-dd), found \"" + Excerpts.of(name) + "\"");
    }
    DateWindow.check(file, lineNumber, column + 1, "date column", date.toEpochDay());
    return date;
  }

  /**
   * Reads the next series row.
   *
   * @param attributeValues filled with one value per {@link #attributeNames()} entry
   * @param units filled at {@code [0, dayCount())} with units or {@link SalesHistory#UNKNOWN_UNITS}
   * @return false at the end of the file
   * @throws InputFormatException naming line and column for a malformed row
   */
  public boolean next(String[] attributeValues, int[] units) throws IOException {
    if (!skipEmptyLines()) {
      return false;
    }
    lineNumber++;
    source.lineNumber = lineNumber;
    int attribute = 0;
    for (int c = 0; c < dateStart; c++) {
      attributeValues[attribute++] = readTextCell(c);
      if (endCell(c) == END_OF_LINE) {
        throw raggedRow(c + 1);
      }
    }
    readUnitsRun(units);
    for (int c = dateStart + dayCount; c < columnCount; c++) {
      attributeValues[attribute++] = readTextCell(c);
      int ending = endCell(c);
      if (c < columnCount - 1 && ending == END_OF_LINE) {
        throw raggedRow(c + 1);
      }
      if (c == columnCount - 1 && ending == COMMA) {
        throw raggedRow(c + 2 + countRemainingCells());
      }
    }
    checkSeriesId(attributeValues);
    rowCount++;
    return true;
  }

  /** The hot loop: one pass over the date cells, digits accumulated straight from the byte buffer. */
  private void readUnitsRun(int[] units) throws IOException {
    final CsvByteSource in = source;
    final byte[] b = in.buffer;
    final int lastColumn = columnCount - 1;
    int p = in.position;
    int limit = in.limit;
    for (int d = 0; d < dayCount; d++) {
      if (limit - p < UNITS_LOOKAHEAD_BYTES) {
        in.position = p;
        in.ensure(UNITS_LOOKAHEAD_BYTES);
        p = in.position;
        limit = in.limit;
      }
      int start = p;
      long value = 0;
      while (p < limit) {
        int digit = b[p] - '0';
        if (digit < 0 || digit > 9) {
          break;
        }
        value = value * 10 + digit;
        p++;
      }
      int digitCount = p - start;
      int column = dateStart + d;
      if (digitCount > MAX_UNITS_DIGITS || value > MAX_UNITS) {
        throw error(column, "expected a number of units of at most " + MAX_UNITS + ", found \"" + cellText(start)
            + "\"");
      }
      units[d] = digitCount == 0 ? SalesHistory.UNKNOWN_UNITS : (int) value;
      byte next = p < limit ? b[p] : (byte) '\n';
      if (next == ',') {
        if (column == lastColumn) {
          in.position = p + 1;
          throw raggedRow(column + 2 + countRemainingCells());
        }
        p++;
      } else if (next == '\n' || next == '\r') {
        if (column != lastColumn) {
          throw raggedRow(column + 1);
        }
        if (p < limit) {
          p += next == '\r' && p + 1 < limit && b[p + 1] == '\n' ? 2 : 1;
        }
      } else {
        throw error(column, "expected a non-negative integer number of units, found \"" + cellText(start) + "\"");
      }
    }
    in.position = p;
  }

  /** Text of a cell from {@code start} up to its delimiter, for messages; cut at 40 bytes, then as an excerpt. */
  private String cellText(int start) {
    int end = start;
    byte[] b = source.buffer;
    while (end < source.limit && end - start < 40 && b[end] != ',' && b[end] != '\n' && b[end] != '\r') {
      end++;
    }
    return Excerpts.of(new String(b, start, end - start, StandardCharsets.UTF_8));
  }

  /** The series id of the row just read is not empty (see {@link Cells#requireSeriesId}). */
  private void checkSeriesId(String[] attributeValues) {
    int idIndex = attributeNames.indexOf(SeriesIdentity.SERIES_ID);
    if (idIndex >= 0) {
      Cells.requireSeriesId(file, lineNumber, attributeColumnNumber(idIndex), columnNames[attributeColumnNumber(
          idIndex) - 1], attributeValues[idIndex]);
      return;
    }
    for (int a = 0; a < attributeNames.size(); a++) {
      if (!attributeValues[a].isEmpty()) {
        return;
      }
    }
    Cells.requireSeriesId(file, lineNumber, 0, null, "");
  }

  private boolean skipEmptyLines() throws IOException {
    while (source.hasByte()) {
      byte b = source.buffer[source.position];
      if (b != '\n' && b != '\r') {
        return true;
      }
      source.position++;
      if (b == '\n') {
        lineNumber++;
      }
    }
    return false;
  }

  /** Reads one text cell (quoted or not) up to, not including, its delimiter, and checks it is UTF-8. */
  private String readTextCell(int column) throws IOException {
    scratchLength = 0;
    CsvByteSource in = source;
    if (in.hasByte() && in.buffer[in.position] == '"') {
      in.position++;
      while (true) {
        in.ensure(2);
        if (in.position >= in.limit) {
          throw error(column, "unterminated quoted cell: expected a closing quote, found the end of the file");
        }
        byte b = in.buffer[in.position];
        if (b == '"') {
          if (in.position + 1 < in.limit && in.buffer[in.position + 1] == '"') {
            append(b);
            in.position += 2;
            continue;
          }
          in.position++;
          break;
        }
        append(b);
        in.position++;
      }
      if (in.hasByte()) {
        byte b = in.buffer[in.position];
        if (b != ',' && b != '\n' && b != '\r') {
          throw error(column, "expected a comma or the end of the line after a closing quote, found \""
              + (char) (b & 0xFF) + "\"");
        }
      }
    } else {
      while (in.hasByte()) {
        byte b = in.buffer[in.position];
        if (b == ',' || b == '\n' || b == '\r') {
          break;
        }
        append(b);
        in.position++;
      }
    }
    int invalid = Utf8.firstInvalidByte(scratch, scratchLength);
    if (invalid >= 0) {
      throw error(column, String.format("expected UTF-8 text, found the invalid byte 0x%02X at byte %d of the cell",
          scratch[invalid] & 0xFF, invalid + 1));
    }
    String text = new String(scratch, 0, scratchLength, StandardCharsets.UTF_8);
    Cells.requireNoNul(file, lineNumber, column + 1, lineNumber == 1 ? Cells.HEADER_CELL : columnNames[column], text);
    return text;
  }

  private void append(byte b) {
    if (scratchLength == scratch.length) {
      scratch = java.util.Arrays.copyOf(scratch, scratch.length * 2);
    }
    scratch[scratchLength++] = b;
  }

  /** Consumes the delimiter after a cell: a comma, or a line end (or the end of the file). */
  private int endCell(int column) throws IOException {
    CsvByteSource in = source;
    if (!in.hasByte()) {
      return END_OF_LINE;
    }
    byte b = in.buffer[in.position];
    if (b == ',') {
      in.position++;
      return COMMA;
    }
    in.position++;
    if (b == '\r' && in.hasByte() && in.buffer[in.position] == '\n') {
      in.position++;
    }
    assert b == '\n' || b == '\r' : "text cells stop only at a delimiter, column " + column;
    return END_OF_LINE;
  }

  /** Counts the cells left on the current line (after a comma already consumed) and skips them. */
  private int countRemainingCells() throws IOException {
    int cells = 0;
    CsvByteSource in = source;
    while (in.hasByte()) {
      byte b = in.buffer[in.position];
      if (b == '\n' || b == '\r') {
        break;
      }
      if (b == ',') {
        cells++;
      }
      in.position++;
    }
    return cells;
  }

  private InputFormatException raggedRow(int cellCount) {
    return new InputFormatException(file, lineNumber, 0, "expected " + columnCount + " cells as in the header, found "
        + cellCount);
  }

  private InputFormatException error(int column, String problem) {
    return new InputFormatException(file, lineNumber, column + 1, problem);
  }

  @Override
  public void close() throws IOException {
    source.close();
  }
}
