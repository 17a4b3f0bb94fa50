package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.floats.FloatArrayList;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.LongArrayList;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Map;
import java.util.List;
import org.lagmill.io.Excerpts;
import org.lagmill.io.Setting;
import org.lagmill.store.ArrayPlanTable;
import org.lagmill.store.Periods;
import org.lagmill.store.PlanTable;
import org.lagmill.store.SeriesAttributes;

/**
 * Reads a plan file (known-future drivers): key columns (every header column that names a series attribute, any
 * subset of them; none plans the whole chain), one time column, and any number of numeric value columns (promotion
 * flag, discount depth, display, leaflet, …) that become the features {@code plan_<column>}.
 *
 * <p>The time column decides how long a row holds:
 * <ul>
 *   <li>{@code date} ({@code --plan-date-column}): the row holds for the period containing its date only; a period
 *       without a row of the key reads 0 in every column (nothing planned). Two rows of one key in one period are an
 *       error.
 *   <li>{@code from} ({@code --plan-from-column}): the row holds from the period containing its date until the key's
 *       next row; of several rows of one key within one period the latest date holds. Before a key's first row every
 *       column reads 0.
 * </ul>
 * The plan speaks for periods up to the one holding the latest date of any matched row (its reach), which may lie past
 * the last sales day; a forecast checks its horizon against it. In a store of longer periods (weekly) a date that is
 * not a period's first day maps to the period containing it, as dated prices do; such rows are counted in a warning.
 * Rows of a {@code date} plan before the store's first period hold for no stored period and are dropped; rows of a
 * {@code from} plan before it set the value the first period starts with.
 *
 * <p>Rows whose key no series has are skipped and counted; a cell that is not a plain decimal number, a row repeating
 * a key and date, and a header with both or neither time column raise {@link InputFormatException}. Heap: the rows
 * are held until sorted, {@code 16 + 4 × columns} bytes each.
 */
public final class PlanFileReader {
  public static final String DEFAULT_DATE_COLUMN = "date";
  public static final String DEFAULT_FROM_COLUMN = "from";

  private PlanFileReader() {}

  /** How long a plan row holds. */
  public enum Form {
    /** The row's period only. */
    DATE,
    /** Until the key's next row. */
    FROM
  }

  /**
   * The plan read, its form, and what the user should be told.
   *
   * @param unknownKeyRowCount rows skipped because no series has their key
   * @param offBoundaryRowCount rows whose date is not the first day of a period (0 in a daily store)
   * @param seriesWithoutPlanCount series no plan row matched (their plan features read 0)
   */
  public record PlanReadResult(PlanTable plan, Form form, long unknownKeyRowCount, long offBoundaryRowCount,
      int seriesWithoutPlanCount, List<String> warnings) {
    public PlanReadResult {
      warnings = List.copyOf(warnings);
    }
  }

  /**
   * Reads a plan file against a store's first date, period, day count and series.
   *
   * @param storeDayCount the store's number of sales periods, to warn when the plan ends before them
   * @param dateColumn name of the time column of a plan whose rows hold for one period
   * @param fromColumn name of the time column of a plan whose rows hold until the next row
   * @throws InputFormatException on any violation of the format, with file, line, column and an exact message
   */
  public static PlanReadResult read(Path file, LocalDate storeFirstDate, int periodDays, int storeDayCount,
      SeriesAttributes attributes, int seriesCount, String dateColumn, String fromColumn) {
    return read(file, storeFirstDate, periodDays, storeDayCount, attributes, seriesCount, dateColumn, fromColumn,
        Map.of());
  }

  /** As the other {@code read}, with key columns named otherwise than the attributes ({@link KeyColumns#plan()}). */
  public static PlanReadResult read(Path file, LocalDate storeFirstDate, int periodDays, int storeDayCount,
      SeriesAttributes attributes, int seriesCount, String dateColumn, String fromColumn,
      Map<String, String> keyColumns) {
    Periods.requireValid(periodDays);
    try (CsvSource source = CsvSource.open(file)) {
      String[] header = source.readHeader();
      Cells.requireDistinct(file, header);
      int dateIndex = Arrays.asList(header).indexOf(dateColumn);
      int fromIndex = Arrays.asList(header).indexOf(fromColumn);
      if (dateIndex >= 0 && fromIndex >= 0) {
        throw new InputFormatException(file, 1, Math.max(dateIndex, fromIndex) + 1, "both a '" + dateColumn
            + "' column (a row holds for its period) and a '" + fromColumn + "' column (a row holds until the next)"
            + ": expected one of them");
      }
      if (dateIndex < 0 && fromIndex < 0) {
        throw new InputFormatException(file, 1, 0, "no column '" + dateColumn + "' or '" + fromColumn + "' in header "
            + Excerpts.of(String.join(",", header)) + ": expected one (or name it with " + Setting.PLAN_DATE_COLUMN
            + " or " + Setting.PLAN_FROM_COLUMN + ")");
      }
      Form form = dateIndex >= 0 ? Form.DATE : Form.FROM;
      int timeIndex = form == Form.DATE ? dateIndex : fromIndex;
      String timeColumn = header[timeIndex];
      SeriesKeys keys = SeriesKeys.attributeColumns(KeyColumns.attributeHeader(file, header, keyColumns,
          Setting.PLAN_KEY_COLUMN), new int[] {timeIndex}, attributes, seriesCount);
      IntArrayList valueColumnList = new IntArrayList();
      for (int c = 0; c < header.length; c++) {
        if (c != timeIndex && !keys.isKeyColumn(c)) {
          if (header[c].isEmpty()) {
            throw new InputFormatException(file, 1, c + 1, "an empty column name: expected a name for each plan "
                + "column (it becomes the feature plan_<name>)");
          }
          valueColumnList.add(c);
        }
      }
      int[] valueColumns = valueColumnList.toIntArray();
      if (valueColumns.length == 0) {
        throw new InputFormatException(file, 1, 0, "no plan value columns: expected at least one numeric column "
            + "besides the key columns (series attributes: " + SeriesKeys.attributeNames(attributes) + ") and '"
            + timeColumn + "'");
      }
      long firstEpochDay = storeFirstDate.toEpochDay();
      IntArrayList rowKeyIds = new IntArrayList();
      LongArrayList rowEpochDays = new LongArrayList();
      LongArrayList rowLines = new LongArrayList();
      FloatArrayList rowValues = new FloatArrayList();
      long unknownKeyRowCount = 0;
      long offBoundaryRowCount = 0;
      String firstUnknownKey = null;
      for (CsvRecord record = source.next(); record != null; record = source.next()) {
        long line = source.lineNumber();
        long epochDay = Cells.requireDate(file, line, timeIndex + 1, timeColumn, record.getField(timeIndex));
        for (int c : valueColumns) {
          rowValues.add(number(file, line, c, header[c], record.getField(c)));
        }
        int keyId = keys.keyIdOf(record);
        if (keyId < 0) {
          rowValues.size(rowValues.size() - valueColumns.length);
          if (unknownKeyRowCount++ == 0) {
            firstUnknownKey = keys.describe(record);
          }
          continue;
        }
        if (Math.floorMod(epochDay - firstEpochDay, periodDays) != 0) {
          offBoundaryRowCount++;
        }
        rowKeyIds.add(keyId);
        rowEpochDays.add(epochDay);
        rowLines.add(line);
      }
      List<String> columnNames = new ArrayList<>();
      for (int c : valueColumns) {
        columnNames.add(header[c]);
      }
      List<String> keyNames = new ArrayList<>();
      for (int c = 0; c < header.length; c++) {
        if (keys.isKeyColumn(c)) {
          keyNames.add(header[c]);
        }
      }
      Rows rows = new Rows(rowKeyIds.toIntArray(), rowEpochDays.toLongArray(), rowLines.toLongArray(),
          rowValues.toFloatArray(), valueColumns.length);
      ArrayPlanTable plan = new Builder(file, keys, storeFirstDate, periodDays, form, rows).build(keyNames,
          columnNames);
      int seriesWithoutPlan = 0;
      for (int s = 0; s < seriesCount; s++) {
        if (plan.keyOf(s) == PlanTable.NO_KEY) {
          seriesWithoutPlan++;
        }
      }
      List<String> warnings = new ArrayList<>();
      if (unknownKeyRowCount > 0) {
        warnings.add(unknownKeyRowCount + " plan rows for unknown keys skipped (first: " + firstUnknownKey + ")");
      }
      if (offBoundaryRowCount > 0) {
        warnings.add(offBoundaryRowCount + " plan dates are not the first day of a " + Periods.unit(periodDays)
            + ": each holds for the " + Periods.unit(periodDays) + " containing it");
      }
      if (seriesWithoutPlan > 0) {
        warnings.add(seriesWithoutPlan + " of " + seriesCount + " series match no plan row: their plan features "
            + "read 0 (nothing planned)");
      }
      if (plan.keyCount() > 0 && plan.reachDayIndex() < storeDayCount - 1) {
        warnings.add("the plan's latest date falls in the " + Periods.unit(periodDays) + " of "
            + storeFirstDate.plusDays((long) plan.reachDayIndex() * periodDays) + ", before the last sales "
            + Periods.unit(periodDays) + " " + storeFirstDate.plusDays((long) (storeDayCount - 1) * periodDays)
            + ": the plan's last values hold for the " + Periods.count(storeDayCount - 1 - plan.reachDayIndex(),
                periodDays)
            + " after it");
      }
      return new PlanReadResult(plan, form, unknownKeyRowCount, offBoundaryRowCount, seriesWithoutPlan, warnings);
    }
  }

  private static float number(Path file, long line, int column, String columnName, String text) {
    if (!Cells.isDecimal(text)) {
      throw new InputFormatException(file, line, column + 1,
          "plan column '" + columnName + "' holds '" + Excerpts.of(text)
              + "': expected a number such as 1, 0 or 0.25");
    }
    float value = Float.parseFloat(text);
    if (Float.isInfinite(value)) {
      throw new InputFormatException(file, line, column + 1,
          "plan column '" + columnName + "' holds '" + Excerpts.of(text)
              + "': expected a number within float range (magnitude below 3.4e38)");
    }
    return value;
  }

  /** The matched rows, in file order. */
  private record Rows(int[] keyIds, long[] epochDays, long[] lines, float[] values, int columnCount) {
    int count() {
      return keyIds.length;
    }
  }

  /** Sorts the rows by key and date and turns each key's rows into change points. */
  private static final class Builder {
    private final Path file;
    private final SeriesKeys keys;
    private final LocalDate storeFirstDate;
    private final long firstEpochDay;
    private final int periodDays;
    private final Form form;
    private final Rows rows;
    private final int columnCount;
    private final IntArrayList keyDays = new IntArrayList();
    private final FloatArrayList keyValues = new FloatArrayList();

    Builder(Path file, SeriesKeys keys, LocalDate storeFirstDate, int periodDays, Form form, Rows rows) {
      this.file = file;
      this.keys = keys;
      this.storeFirstDate = storeFirstDate;
      this.firstEpochDay = storeFirstDate.toEpochDay();
      this.periodDays = periodDays;
      this.form = form;
      this.rows = rows;
      this.columnCount = rows.columnCount();
    }

    private int periodOf(int row) {
      long period = Math.floorDiv(rows.epochDays()[row] - firstEpochDay, periodDays);
      return (int) Math.max(Integer.MIN_VALUE / 2, Math.min(Integer.MAX_VALUE / 2, period));
    }

    ArrayPlanTable build(List<String> keyNames, List<String> columnNames) {
      int rowCount = rows.count();
      int[] keyIds = rows.keyIds();
      long[] days = rows.epochDays();
      int[] order = KeyRuns.sortedRows(rowCount, keyIds, (a, b) -> Long.compare(days[a], days[b]));
      int lastPeriod = -1;
      for (int r = 0; r < rowCount; r++) {
        lastPeriod = Math.max(lastPeriod, periodOf(r));
      }
      int reach = lastPeriod;
      int[] keyBySeries = new int[keys.seriesCount()];
      Arrays.fill(keyBySeries, PlanTable.NO_KEY);
      List<int[]> changeDays = new ArrayList<>();
      List<float[]> changeValues = new ArrayList<>();
      KeyRuns.forEachKey(order, keyIds, (keyId, start, end) -> {
        keyDays.clear();
        keyValues.clear();
        if (form == Form.DATE) {
          addDateRows(order, start, end, reach);
        } else {
          addFromRows(order, start, end);
        }
        int planKey = changeDays.size();
        changeDays.add(keyDays.toIntArray());
        changeValues.add(keyValues.toFloatArray());
        for (int s : keys.seriesOf(keyId)) {
          keyBySeries[s] = planKey;
        }
      });
      return new ArrayPlanTable(keyNames, columnNames, keyBySeries, changeDays.toArray(new int[0][]),
          changeValues.toArray(new float[0][]), reach);
    }

    private void addFromRows(int[] order, int start, int end) {
      for (int i = start; i < end; i++) {
        int r = order[i];
        checkNotRepeated(order, start, i);
        // Rows before the first period all land in period 0, and rows within one period share it: the latest holds.
        int period = Math.max(0, periodOf(r));
        boolean superseded = i + 1 < end && Math.max(0, periodOf(order[i + 1])) == period;
        if (!superseded) {
          addChange(period, r);
        }
      }
    }

    private void addDateRows(int[] order, int start, int end, int reach) {
      for (int i = start; i < end; i++) {
        int r = order[i];
        checkNotRepeated(order, start, i);
        int period = periodOf(r);
        if (i > start && periodOf(order[i - 1]) == period) {
          int other = order[i - 1];
          long first = Math.min(rows.lines()[r], rows.lines()[other]);
          long second = Math.max(rows.lines()[r], rows.lines()[other]);
          throw new InputFormatException(file, second, 0, "two plan rows for " + keys.describe(keyIds(r)) + " in the "
              + Periods.unit(periodDays) + " of " + storeFirstDate.plusDays((long) period * periodDays) + ": lines "
              + first + " and " + second + ", expected one row per key and " + Periods.unit(periodDays)
              + " (a dated row holds for its whole " + Periods.unit(periodDays) + ")");
        }
        if (period < 0) {
          continue;
        }
        addChange(period, r);
        // The row holds for its own period only: the next period without a row of the key reads 0 again, unless it
        // lies past the plan's reach, where nothing is known and the last values carry on.
        boolean nextPeriodHasRow = i + 1 < end && periodOf(order[i + 1]) == period + 1;
        if (!nextPeriodHasRow && period < reach) {
          addZeros(period + 1);
        }
      }
    }

    private int keyIds(int row) {
      return rows.keyIds()[row];
    }

    private void checkNotRepeated(int[] order, int start, int i) {
      if (i == start) {
        return;
      }
      int r = order[i];
      int other = order[i - 1];
      if (rows.epochDays()[r] == rows.epochDays()[other]) {
        long first = Math.min(rows.lines()[r], rows.lines()[other]);
        long second = Math.max(rows.lines()[r], rows.lines()[other]);
        throw new InputFormatException(file, second, 0, "duplicate plan row for " + keys.describe(keyIds(r)) + " on "
            + LocalDate.ofEpochDay(rows.epochDays()[r]) + ": lines " + first + " and " + second + ", expected one");
      }
    }

    /** Adds a change point unless it repeats the values already holding (0 before the first). */
    private void addChange(int period, int row) {
      float[] values = rows.values();
      int offset = row * columnCount;
      if (holdsAlready(values, offset)) {
        return;
      }
      keyDays.add(period);
      for (int c = 0; c < columnCount; c++) {
        keyValues.add(values[offset + c]);
      }
    }

    private void addZeros(int period) {
      if (holdsAlready(null, 0)) {
        return;
      }
      keyDays.add(period);
      for (int c = 0; c < columnCount; c++) {
        keyValues.add(0f);
      }
    }

    /** Whether the values at {@code offset} (all zeros when {@code values} is null) equal the ones holding now. */
    private boolean holdsAlready(float[] values, int offset) {
      int last = keyValues.size() - columnCount;
      for (int c = 0; c < columnCount; c++) {
        float now = last < 0 ? 0f : keyValues.getFloat(last + c);
        float next = values == null ? 0f : values[offset + c];
        if (Float.floatToIntBits(now) != Float.floatToIntBits(next)) {
          return false;
        }
      }
      return true;
    }
  }
}
