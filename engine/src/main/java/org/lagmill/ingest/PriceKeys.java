package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.store.SeriesAttributes;

/**
 * The key columns of a prices file and the series each key value covers. A key is the tuple of the series' codes of
 * the key attributes, packed into one long (mixed radix over the attributes' cardinalities), so matching a row costs one
 * dictionary lookup per key cell and one primitive hash lookup; the key-to-series lists are built once.
 */
final class PriceKeys {
  private final SeriesAttributes attributes;
  private final int seriesCount;
  private final int[] fileColumns;
  private final int[] attributeIndexes;
  private final long[] radix;
  private final Long2IntOpenHashMap keyIdByPackedCodes = new Long2IntOpenHashMap();
  private final List<int[]> seriesByKeyId = new ArrayList<>();

  private PriceKeys(SeriesAttributes attributes, int seriesCount, int[] fileColumns, int[] attributeIndexes,
      long[] radix) {
    this.attributes = attributes;
    this.seriesCount = seriesCount;
    this.fileColumns = fileColumns;
    this.attributeIndexes = attributeIndexes;
    this.radix = radix;
    keyIdByPackedCodes.defaultReturnValue(-1);
    List<IntArrayList> lists = new ArrayList<>();
    for (int s = 0; s < seriesCount; s++) {
      long packed = 0;
      for (int k = 0; k < attributeIndexes.length; k++) {
        packed += attributes.code(s, attributeIndexes[k]) * radix[k];
      }
      int keyId = keyIdByPackedCodes.get(packed);
      if (keyId < 0) {
        keyId = lists.size();
        keyIdByPackedCodes.put(packed, keyId);
        lists.add(new IntArrayList());
      }
      lists.get(keyId).add(s);
    }
    for (IntArrayList list : lists) {
      seriesByKeyId.add(list.toIntArray());
    }
  }

  /** Every header column except the date and the price is a key column and must name a series attribute. */
  static PriceKeys of(Path file, String[] header, int fromIndex, int priceIndex, SeriesAttributes attributes,
      int seriesCount) {
    IntArrayList fileColumns = new IntArrayList();
    IntArrayList attributeIndexes = new IntArrayList();
    for (int c = 0; c < header.length; c++) {
      if (c == fromIndex || c == priceIndex) {
        continue;
      }
      int a = attributes.attributeIndex(header[c]);
      if (a < 0) {
        throw new InputFormatException(file, 1, c + 1, "price key column '" + header[c]
            + "' is not a series attribute: expected one of " + attributeNames(attributes));
      }
      fileColumns.add(c);
      attributeIndexes.add(a);
    }
    if (fileColumns.isEmpty()) {
      throw new InputFormatException(file, 1, 0, "no key columns: expected at least one series attribute column ("
          + attributeNames(attributes) + ") besides '" + header[fromIndex] + "' and '" + header[priceIndex] + "'");
    }
    long[] radix = new long[attributeIndexes.size()];
    long product = 1;
    for (int k = 0; k < radix.length; k++) {
      radix[k] = product;
      product = Math.multiplyExact(product, Math.max(1, attributes.cardinality(attributeIndexes.getInt(k))));
    }
    return new PriceKeys(attributes, seriesCount, fileColumns.toIntArray(), attributeIndexes.toIntArray(), radix);
  }

  static String attributeNames(SeriesAttributes attributes) {
    List<String> names = new ArrayList<>();
    for (int a = 0; a < attributes.attributeCount(); a++) {
      names.add(attributes.attributeName(a));
    }
    return String.join(", ", names);
  }

  int seriesCount() {
    return seriesCount;
  }

  /** Key id of a row, or -1 when no series has its key. */
  int keyIdOf(CsvRecord record) {
    long packed = 0;
    for (int k = 0; k < fileColumns.length; k++) {
      int code = attributes.codeOf(attributeIndexes[k], record.getField(fileColumns[k]));
      if (code < 0) {
        return -1;
      }
      packed += code * radix[k];
    }
    return keyIdByPackedCodes.get(packed);
  }

  /** Series indexes covered by a key id. */
  int[] seriesOf(int keyId) {
    return seriesByKeyId.get(keyId);
  }

  /** "item=X, store=Y" from a row's cells. */
  String describe(CsvRecord record) {
    StringBuilder b = new StringBuilder();
    for (int k = 0; k < fileColumns.length; k++) {
      if (k > 0) {
        b.append(", ");
      }
      b.append(attributes.attributeName(attributeIndexes[k])).append('=').append(record.getField(fileColumns[k]));
    }
    return b.toString();
  }

  /** "item=X, store=Y" of a key id. */
  String describe(int keyId) {
    int s = seriesByKeyId.get(keyId)[0];
    StringBuilder b = new StringBuilder();
    for (int k = 0; k < attributeIndexes.length; k++) {
      if (k > 0) {
        b.append(", ");
      }
      int a = attributeIndexes[k];
      b.append(attributes.attributeName(a)).append('=').append(attributes.value(a, attributes.code(s, a)));
    }
    return b.toString();
  }
}
