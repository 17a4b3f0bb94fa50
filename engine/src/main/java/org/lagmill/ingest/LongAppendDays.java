package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.SeriesIdentity;

/**
 * Reads a long sales file (a till export, sparse or dense) as the days after a store's last period, under the same
 * {@link MissingRows} policy as ingest. A series the store already lists was listed before the file starts, so under
 * {@code zero} its days with no row are zero from the first new period on (a series with no row at all sold nothing
 * in the new periods); under {@code unknown} they are unknown. A series new to the store is unknown before its first
 * row, as at ingest. Dates before the store's next period are refused, as are dates off its step.
 */
final class LongAppendDays {
  private LongAppendDays() {}

  static AppendedDays read(SalesStore store, SalesInputs inputs, MemoryBudget budget) {
    Path file = inputs.salesFile();
    ColumnNames columns = inputs.columns();
    SeriesAttributes attributes = store.attributes();
    int storeSeriesCount = store.seriesCount();
    boolean zero = inputs.missingRows() == MissingRows.ZERO;
    int[][] unitsBySeries = new int[storeSeriesCount][];
    int[][] firstRowDayBySeries = new int[1][];
    List<String[]> newAttributes = new ArrayList<>();
    List<int[]> newUnits = new ArrayList<>();
    IntArrayList newFirstRowDays = new IntArrayList();
    IntArrayList finalIndexOfFileSeries = new IntArrayList();
    int idAttribute = SeriesIdentity.idIndex(attributes.attributeNames());
    SeriesSink sink = new SeriesSink() {
      private int[] storeAttributeOfFileColumn;

      @Override
      public void begin(LongSalesHeader header) {
        List<String> fileNames = new ArrayList<>(header.attributeNames());
        int idColumn = fileNames.indexOf(columns.seriesIdColumn());
        if (idColumn >= 0) {
          fileNames.set(idColumn, SeriesIdentity.SERIES_ID);
        }
        List<String> storeNames = attributes.attributeNames();
        if (!new HashSet<>(storeNames).equals(new HashSet<>(fileNames))) {
          throw new InputFormatException(file, 1, 0, "expected the attribute columns of the store " + storeNames
              + ", found " + header.attributeNames());
        }
        storeAttributeOfFileColumn = new int[fileNames.size()];
        for (int c = 0; c < fileNames.size(); c++) {
          storeAttributeOfFileColumn[c] = storeNames.indexOf(fileNames.get(c));
        }
        firstRowDayBySeries[0] = new int[storeSeriesCount];
      }

      @Override
      public void accept(String[] attributeValues, int[] units) {
        throw new AssertionError("the reader gives each series' first row");
      }

      @Override
      public void accept(String[] fileValues, int[] units, int firstRowDayIndex) {
        String[] values = new String[fileValues.length];
        for (int c = 0; c < fileValues.length; c++) {
          values[storeAttributeOfFileColumn[c]] = fileValues[c];
        }
        String seriesId = SeriesIdentity.seriesId(values, idAttribute);
        int seriesIndex = attributes.seriesIndexOf(seriesId);
        if (seriesIndex >= 0) {
          int changed = StoreAppend.firstChangedAttribute(attributes, seriesIndex, values);
          if (changed >= 0) {
            throw refuseChange(file, columns.seriesIdColumn(), attributes, seriesIndex, changed, values[changed]);
          }
          unitsBySeries[seriesIndex] = units.clone();
          firstRowDayBySeries[0][seriesIndex] = firstRowDayIndex;
          finalIndexOfFileSeries.add(seriesIndex);
        } else {
          finalIndexOfFileSeries.add(storeSeriesCount + newAttributes.size());
          newAttributes.add(values);
          newUnits.add(units.clone());
          newFirstRowDays.add(firstRowDayIndex);
        }
      }
    };
    LongSalesRead read = LongSalesReader.read(file, columns.dateColumn(), columns.unitsColumn(),
        columns.seriesIdColumn(), inputs.missingRows(),
        new LongSalesReader.Frame(store.dateOf(store.dayCount()), store.periodDays(), store.firstDate()), budget,
        sink);
    int dayCount = read.header().dayCount();
    ZeroFills zeroFills = zero ? new ZeroFills(storeSeriesCount + newAttributes.size(), dayCount) : ZeroFills.NONE;
    for (int k = 0; k < finalIndexOfFileSeries.size(); k++) {
      int s = finalIndexOfFileSeries.getInt(k);
      for (int d = 0; zero && d < dayCount; d++) {
        if (read.zeroFills().isSet(k, d)) {
          zeroFills.set(s, d);
        }
      }
    }
    for (int s = 0; zero && s < storeSeriesCount; s++) {
      // Listed before the file starts: the days before its first row (all of them without a row) sold nothing.
      int firstRow = unitsBySeries[s] == null ? dayCount : firstRowDayBySeries[0][s];
      if (unitsBySeries[s] == null) {
        unitsBySeries[s] = new int[dayCount];
        Arrays.fill(unitsBySeries[s], SalesHistory.UNKNOWN_UNITS);
      }
      for (int d = 0; d < firstRow; d++) {
        if (unitsBySeries[s][d] == SalesHistory.UNKNOWN_UNITS) {
          unitsBySeries[s][d] = 0;
          zeroFills.set(s, d);
        }
      }
    }
    return new AppendedDays(dayCount, unitsBySeries, newAttributes, newUnits, zeroFills, read.warnings());
  }

  /**
   * The refusal of a known series whose attribute changed, at the first row of the series in the file: the reader
   * hands over a series once its rows are read, so the row is found again here, on the error path only. Only a file
   * with a series id column can name a known series with other attribute values (without one, other values name
   * another series).
   */
  private static InputFormatException refuseChange(Path file, String seriesIdColumn, SeriesAttributes attributes,
      int seriesIndex, int attribute, String value) {
    String seriesId = attributes.seriesId(seriesIndex);
    String attributeName = attributes.attributeName(attribute);
    try (CsvSource source = CsvSource.open(file)) {
      List<String> header = List.of(source.readHeader());
      int idColumn = header.indexOf(seriesIdColumn);
      int valueColumn = header.indexOf(attributeName);
      for (CsvRecord record = source.next(); record != null && idColumn >= 0; record = source.next()) {
        if (record.getField(idColumn).equals(seriesId)) {
          return StoreAppend.attributeChanged(file, source.lineNumber(), valueColumn + 1, attributes, seriesIndex,
              attribute, value);
        }
      }
    }
    return StoreAppend.attributeChanged(file, 0, 0, attributes, seriesIndex, attribute, value);
  }
}
