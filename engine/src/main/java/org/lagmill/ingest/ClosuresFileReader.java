package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Map;
import java.util.List;
import java.util.Locale;
import org.lagmill.io.Excerpts;
import org.lagmill.io.Setting;
import org.lagmill.store.ArrayClosureTable;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.Periods;
import org.lagmill.store.SeriesAttributes;

/**
 * Reads the closures file: key columns (any subset of the series attributes; none closes every series), a
 * {@code from} and an {@code until} date (both included) and an optional {@code reason} text, which is kept in the
 * file only. Rows may come in any order and overlap; each series' closed days are merged into sorted ranges. Days
 * before the store's first date are dropped; days after its last sales day are kept (a closure planned in the
 * forecast horizon). Rows whose key no series has are skipped and counted.
 *
 * <p>Dates are days, a store's indexes are periods ({@link Periods}). A period is closed when the closures cover every
 * one of its days: only then is nothing known about its sales. A period the closures cover in part (a week with a
 * two-day holiday) stays open, since its total is still what the series sold that period; such item-periods are
 * counted and reported, because their sales (and a forecast for one) are those of a shorter period.
 */
public final class ClosuresFileReader {
  public static final String DEFAULT_FROM_COLUMN = "from";
  public static final String DEFAULT_UNTIL_COLUMN = "until";
  public static final String REASON_COLUMN = "reason";

  private ClosuresFileReader() {}

  /**
   * The closures read, and what the user should be told about skipped rows and partly closed periods.
   *
   * @param closures closed period index ranges per series
   * @param partlyClosedItemPeriods item-periods the closures cover on some days but not all (0 for a daily store),
   *     anywhere from the store's first period on, the forecast horizon included
   */
  public record ClosuresReadResult(ClosureTable closures, long unknownKeyRowCount, long partlyClosedItemPeriods,
      List<String> warnings) {
    public ClosuresReadResult {
      warnings = List.copyOf(warnings);
    }
  }

  /**
   * Reads a closures file against a store's first date, period and series.
   *
   * @param periodDays the store's step in days ({@link Periods})
   * @throws InputFormatException on any violation of the format, with file, line, column and an exact message
   */
  public static ClosuresReadResult read(Path file, LocalDate storeFirstDate, int periodDays,
      SeriesAttributes attributes, int seriesCount, String fromColumn, String untilColumn) {
    return read(file, storeFirstDate, periodDays, attributes, seriesCount, fromColumn, untilColumn, Map.of());
  }

  /** As the other {@code read}, with key columns named otherwise than the attributes ({@link KeyColumns#closures()}). */
  public static ClosuresReadResult read(Path file, LocalDate storeFirstDate, int periodDays,
      SeriesAttributes attributes, int seriesCount, String fromColumn, String untilColumn,
      Map<String, String> keyColumns) {
    Periods.requireValid(periodDays);
    try (CsvSource source = CsvSource.open(file)) {
      String[] header = source.readHeader();
      Cells.requireDistinct(file, header);
      int fromIndex = Cells.requireColumn(file, header, fromColumn, Setting.CLOSURES_FROM_COLUMN.toString());
      int untilIndex = Cells.requireColumn(file, header, untilColumn, Setting.CLOSURES_UNTIL_COLUMN.toString());
      int reasonIndex = Arrays.asList(header).indexOf(REASON_COLUMN);
      int[] valueColumns = reasonIndex < 0 ? new int[] {fromIndex, untilIndex}
          : new int[] {fromIndex, untilIndex, reasonIndex};
      SeriesKeys keys = SeriesKeys.allColumnsExcept(file, KeyColumns.attributeHeader(file, header, keyColumns,
          Setting.CLOSURES_KEY_COLUMN), valueColumns, attributes, seriesCount, "closure", false);
      long firstEpochDay = storeFirstDate.toEpochDay();
      IntArrayList[] rangesBySeries = new IntArrayList[seriesCount];
      long unknownKeyRowCount = 0;
      String firstUnknownKey = null;
      for (CsvRecord record = source.next(); record != null; record = source.next()) {
        long line = source.lineNumber();
        long from = Cells.requireDate(file, line, fromIndex + 1, fromColumn, record.getField(fromIndex));
        long until = Cells.requireDate(file, line, untilIndex + 1, untilColumn, record.getField(untilIndex));
        if (until < from) {
          throw new InputFormatException(file, line, untilIndex + 1,
              untilColumn + " '" + Excerpts.of(record.getField(untilIndex))
                  + "' is before " + fromColumn + " '" + Excerpts.of(record.getField(fromIndex))
                  + "': expected a date on or after it");
        }
        int keyId = keys.keyIdOf(record);
        if (keyId < 0) {
          if (unknownKeyRowCount++ == 0) {
            firstUnknownKey = keys.describe(record);
          }
          continue;
        }
        if (until < firstEpochDay) {
          continue;
        }
        int first = (int) Math.min(Integer.MAX_VALUE - 1, Math.max(0, from - firstEpochDay));
        int last = (int) Math.min(Integer.MAX_VALUE - 1, until - firstEpochDay);
        for (int s : keys.seriesOf(keyId)) {
          if (rangesBySeries[s] == null) {
            rangesBySeries[s] = new IntArrayList();
          }
          rangesBySeries[s].add(first);
          rangesBySeries[s].add(last);
        }
      }
      List<String> warnings = new ArrayList<>();
      if (unknownKeyRowCount > 0) {
        warnings.add(unknownKeyRowCount + " closure rows for unknown keys skipped (first: " + firstUnknownKey + ")");
      }
      // Days are merged before they become periods, so two rows that together cover a week close it.
      ClosedPeriods periods = ClosedPeriods.of(merged(rangesBySeries), seriesCount, periodDays);
      if (periods.partlyClosedItemPeriods() > 0) {
        String unit = Periods.unit(periodDays);
        warnings.add(String.format(Locale.ROOT, "%,d item-%ss partly closed (the closures cover some of their days, "
            + "not all) are kept open: their sales are those of the open days, and a forecast for one is not "
            + "reduced; a %s counts as closed only when every day of it is closed", periods.partlyClosedItemPeriods(),
            unit, unit));
      }
      return new ClosuresReadResult(periods.closures(), unknownKeyRowCount, periods.partlyClosedItemPeriods(),
          warnings);
    }
  }

  /** Sorts each series' day ranges (days from the store's first date) and merges those that overlap or touch. */
  static ArrayClosureTable merged(IntArrayList[] rangesBySeries) {
    int[][] firstDays = new int[rangesBySeries.length][];
    int[][] lastDays = new int[rangesBySeries.length][];
    for (int s = 0; s < rangesBySeries.length; s++) {
      IntArrayList pairs = rangesBySeries[s];
      int pairCount = pairs == null ? 0 : pairs.size() / 2;
      long[] packed = new long[pairCount];
      for (int k = 0; k < pairCount; k++) {
        // First day in the high half: sorting the longs sorts by first day, then last day.
        packed[k] = ((long) pairs.getInt(2 * k) << 32) | pairs.getInt(2 * k + 1);
      }
      Arrays.sort(packed);
      IntArrayList firsts = new IntArrayList();
      IntArrayList lasts = new IntArrayList();
      for (long p : packed) {
        int first = (int) (p >>> 32);
        int last = (int) p;
        int n = lasts.size();
        if (n > 0 && first <= lasts.getInt(n - 1) + 1) {
          lasts.set(n - 1, Math.max(lasts.getInt(n - 1), last));
        } else {
          firsts.add(first);
          lasts.add(last);
        }
      }
      firstDays[s] = firsts.toIntArray();
      lastDays[s] = lasts.toIntArray();
    }
    return new ArrayClosureTable(firstDays, lastDays);
  }
}
