package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.floats.FloatArrayList;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Map;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.io.Excerpts;
import org.lagmill.io.Setting;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.Periods;
import org.lagmill.store.SeriesAttributes;

/**
 * Reads the prices file: key columns (a subset of the series attributes, e.g. {@code item,store}, or just {@code item}
 * for a price that applies to every series of the item), a {@code from} date and a {@code price} (decimal, > 0). A
 * price holds from its date until the next row of the same key; rows may come in any order. Rows before the store's
 * first date collapse to the latest one, clamped to day 0. Rows whose key no series has are skipped and counted.
 *
 * <p>In a store of longer periods (weekly) a date maps to the period containing it, so a price from a Wednesday holds
 * for that whole week; of several rows of one key within one period the latest date holds for the period.
 *
 * <p>Rows are held as primitive columns (key id, day index, price, line), never as one object per row; each row costs
 * one dictionary lookup per key cell and one primitive hash lookup of the packed key codes.
 */
public final class PriceFileReader {
  public static final String DEFAULT_FROM_COLUMN = "from";
  public static final String DEFAULT_PRICE_COLUMN = "price";

  private static final int[] NO_DAYS = new int[0];
  private static final float[] NO_PRICES = new float[0];

  private PriceFileReader() {}

  /**
   * Reads a prices file.
   *
   * @param storeFirstDate date of the store's day 0
   * @param attributes the store's series attributes
   * @param seriesCount number of series in the store; the result holds one (possibly empty) price list per series
   * @param fromColumn name of the date column ({@code --from-column}), normally {@link #DEFAULT_FROM_COLUMN}
   * @param priceColumn name of the price column ({@code --price-column}), normally {@link #DEFAULT_PRICE_COLUMN}
   * @throws InputFormatException on any violation of the format, with file, line, column and an exact message
   */
  public static PriceReadResult read(Path file, LocalDate storeFirstDate, SeriesAttributes attributes,
      int seriesCount, String fromColumn, String priceColumn) {
    return read(file, storeFirstDate, Periods.DAILY, attributes, seriesCount, fromColumn, priceColumn);
  }

  /**
   * Reads a prices file for a store of {@code periodDays} days per period; the change points' indexes count periods.
   *
   * @see #read(Path, LocalDate, SeriesAttributes, int, String, String)
   */
  public static PriceReadResult read(Path file, LocalDate storeFirstDate, int periodDays, SeriesAttributes attributes,
      int seriesCount, String fromColumn, String priceColumn) {
    return read(file, storeFirstDate, periodDays, attributes, seriesCount, fromColumn, priceColumn, Map.of());
  }

  /**
   * As {@link #read(Path, LocalDate, int, SeriesAttributes, int, String, String)}, with key columns named otherwise
   * than the attributes ({@link KeyColumns#prices()}).
   */
  public static PriceReadResult read(Path file, LocalDate storeFirstDate, int periodDays, SeriesAttributes attributes,
      int seriesCount, String fromColumn, String priceColumn, Map<String, String> keyColumns) {
    Periods.requireValid(periodDays);
    if (seriesCount < 0) {
      throw new IllegalArgumentException("seriesCount must be >= 0, got " + seriesCount);
    }
    try (CsvSource source = CsvSource.open(file)) {
      String[] header = source.readHeader();
      Cells.requireDistinct(file, header);
      int fromIndex = Cells.requireColumn(file, header, fromColumn, Setting.PRICES_FROM_COLUMN.toString());
      int priceIndex = Cells.requireColumn(file, header, priceColumn, Setting.PRICES_PRICE_COLUMN.toString());
      SeriesKeys keys = SeriesKeys.allColumnsExcept(file, KeyColumns.attributeHeader(file, header, keyColumns,
          Setting.PRICES_KEY_COLUMN), new int[] {fromIndex, priceIndex}, attributes, seriesCount, "price", true);

      long firstEpochDay = storeFirstDate.toEpochDay();
      IntArrayList rowKeyIds = new IntArrayList();
      IntArrayList rowDays = new IntArrayList();
      FloatArrayList rowPrices = new FloatArrayList();
      IntArrayList rowLines = new IntArrayList();
      long unknownKeyRowCount = 0;
      String firstUnknownKey = null;
      for (CsvRecord record = source.next(); record != null; record = source.next()) {
        long line = source.lineNumber();
        long epochDay = Cells.requireDate(file, line, fromIndex + 1, fromColumn, record.getField(fromIndex));
        String priceText = record.getField(priceIndex);
        double price = Cells.isDecimal(priceText) ? Double.parseDouble(priceText) : Double.NaN;
        if (!(price > 0) || Double.isInfinite(price)) {
          throw new InputFormatException(file, line, priceIndex + 1,
              priceColumn + " '" + Excerpts.of(priceText) + "': expected a decimal number > 0");
        }
        if ((float) price == 0f) {
          // the store keeps prices as float32: a smaller number would read back as 0
          throw new InputFormatException(file, line, priceIndex + 1, priceColumn + " '" + Excerpts.of(priceText)
              + "': expected a decimal number of at least " + Float.MIN_VALUE + " (the smallest price the store"
              + " holds)");
        }
        if (Float.isInfinite((float) price)) {
          // the store keeps prices as float32: a larger number would read back as infinity
          throw new InputFormatException(file, line, priceIndex + 1, priceColumn + " '" + Excerpts.of(priceText)
              + "': expected a decimal number > 0 and at most " + Float.MAX_VALUE);
        }
        int keyId = keys.keyIdOf(record);
        if (keyId < 0) {
          if (unknownKeyRowCount++ == 0) {
            firstUnknownKey = keys.describe(record);
          }
          continue;
        }
        rowKeyIds.add(keyId);
        rowDays.add((int) Math.max(Integer.MIN_VALUE, Math.min(Integer.MAX_VALUE, epochDay - firstEpochDay)));
        rowPrices.add((float) price);
        rowLines.add((int) Math.min(Integer.MAX_VALUE, line));
      }
      ArrayPriceTable table = buildTable(file, keys, storeFirstDate, periodDays, rowKeyIds.elements(),
          rowDays.elements(),
          rowPrices.elements(), rowLines.elements(), rowKeyIds.size());
      List<String> warnings = new ArrayList<>();
      if (unknownKeyRowCount > 0) {
        warnings.add(unknownKeyRowCount + " price rows for unknown keys skipped (first: " + firstUnknownKey + ")");
      }
      return new PriceReadResult(table, unknownKeyRowCount, warnings);
    }
  }

  private static ArrayPriceTable buildTable(Path file, SeriesKeys keys, LocalDate storeFirstDate, int periodDays,
      int[] keyIds,
      int[] days, float[] prices, int[] lines, int rowCount) {
    int[] order = KeyRuns.sortedRows(rowCount, keyIds, (a, b) -> Integer.compare(days[a], days[b]));
    int seriesCount = keys.seriesCount();
    int[][] changeDays = new int[seriesCount][];
    float[][] changePrices = new float[seriesCount][];
    IntArrayList keyDays = new IntArrayList();
    FloatArrayList keyPrices = new FloatArrayList();
    KeyRuns.forEachKey(order, keyIds, (keyId, start, end) -> {
      keyDays.clear();
      keyPrices.clear();
      for (int i = start; i < end; i++) {
        int r = order[i];
        if (i > start && days[order[i - 1]] == days[r]) {
          int other = order[i - 1];
          throw new InputFormatException(file, Math.max(lines[r], lines[other]), 0, "duplicate price for "
              + keys.describe(keyId) + " from " + storeFirstDate.plusDays(days[r]) + ": lines "
              + Math.min(lines[r], lines[other]) + " and " + Math.max(lines[r], lines[other]) + ", expected one");
        }
        // Rows before the first period all land in period 0, and rows within one period share it: the latest holds.
        int period = keptPeriod(days[r], periodDays);
        boolean superseded = i + 1 < end && keptPeriod(days[order[i + 1]], periodDays) == period;
        if (superseded) {
          continue;
        }
        keyDays.add(period);
        keyPrices.add(prices[r]);
      }
      int[] sharedDays = keyDays.toIntArray();
      float[] sharedPrices = keyPrices.toFloatArray();
      // Every series of one key has the same change points, so they share one read-only pair of arrays.
      for (int seriesIndex : keys.seriesOf(keyId)) {
        changeDays[seriesIndex] = sharedDays;
        changePrices[seriesIndex] = sharedPrices;
      }
    });
    for (int s = 0; s < seriesCount; s++) {
      if (changeDays[s] == null) {
        changeDays[s] = NO_DAYS;
        changePrices[s] = NO_PRICES;
      }
    }
    return new ArrayPriceTable(changeDays, changePrices);
  }

  private static int keptPeriod(int daysAfterFirst, int periodDays) {
    return Math.max(0, Math.floorDiv(daysAfterFirst, periodDays));
  }
}
