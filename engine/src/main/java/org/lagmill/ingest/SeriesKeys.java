package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CsvRecord;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.store.SeriesAttributes;

/**
 * The key columns of a dated per-key file (prices, plan, closures) and the series each key value covers: one matcher
 * for every such file, so a key means the same everywhere. Key columns name series attributes, any subset of them:
 * {@code item,store} addresses one series, {@code item} every series of the item, no key column at all every series
 * (one key for the whole chain).
 *
 * <p>A key is the tuple of the series' codes of the key attributes, packed into one long (mixed radix over the
 * attributes' cardinalities), so matching a row costs one dictionary lookup per key cell and one primitive hash
 * lookup; the key-to-series lists are built once.
 */
final class SeriesKeys {
  private final SeriesAttributes attributes;
  private final int seriesCount;
  private final int[] fileColumns;
  private final int[] attributeIndexes;
  private final long[] radix;
  private final Long2IntOpenHashMap keyIdByPackedCodes = new Long2IntOpenHashMap();
  private final List<int[]> seriesByKeyId = new ArrayList<>();

  private SeriesKeys(SeriesAttributes attributes, int seriesCount, int[] fileColumns, int[] attributeIndexes) {
    this.attributes = attributes;
    this.seriesCount = seriesCount;
    this.fileColumns = fileColumns;
    this.attributeIndexes = attributeIndexes;
    this.radix = new long[attributeIndexes.length];
    long product = 1;
    for (int k = 0; k < radix.length; k++) {
      radix[k] = product;
      product = Math.multiplyExact(product, Math.max(1, attributes.cardinality(attributeIndexes[k])));
    }
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

  /**
   * Every header column except {@code valueColumns} is a key column and must name a series attribute (the prices
   * file: key columns, a date and a price).
   *
   * @param fileNoun what the file holds, for messages ("price" gives "price key column 'x' is not a series
   *     attribute")
   * @param requireKey whether at least one key column is required; if so its absence is an error naming the value
   *     columns
   * @throws InputFormatException when a key column names no attribute, or no key column is given but one is required
   */
  static SeriesKeys allColumnsExcept(Path file, String[] header, int[] valueColumns, SeriesAttributes attributes,
      int seriesCount, String fileNoun, boolean requireKey) {
    if (seriesCount < 0) {
      throw new IllegalArgumentException("seriesCount must be >= 0, got " + seriesCount);
    }
    IntArrayList fileColumns = new IntArrayList();
    IntArrayList attributeIndexes = new IntArrayList();
    for (int c = 0; c < header.length; c++) {
      if (contains(valueColumns, c)) {
        continue;
      }
      int a = attributes.attributeIndex(header[c]);
      if (a < 0) {
        throw new InputFormatException(file, 1, c + 1, fileNoun + " key column '" + header[c]
            + "' is not a series attribute: expected one of " + attributeNames(attributes));
      }
      fileColumns.add(c);
      attributeIndexes.add(a);
    }
    if (requireKey && fileColumns.isEmpty()) {
      StringBuilder besides = new StringBuilder();
      for (int i = 0; i < valueColumns.length; i++) {
        besides.append(i == 0 ? "" : i == valueColumns.length - 1 ? " and " : ", ")
            .append('\'').append(header[valueColumns[i]]).append('\'');
      }
      throw new InputFormatException(file, 1, 0, "no key columns: expected at least one series attribute column ("
          + attributeNames(attributes) + ") besides " + besides);
    }
    return new SeriesKeys(attributes, seriesCount, fileColumns.toIntArray(), attributeIndexes.toIntArray());
  }

  /**
   * The header columns that name a series attribute are the key columns, in header order (the plan file: key
   * columns, a date, and any number of value columns). None is allowed: the whole chain is one key.
   *
   * @param skippedColumns columns never taken as keys (the date column), even when they name an attribute
   */
  static SeriesKeys attributeColumns(String[] header, int[] skippedColumns, SeriesAttributes attributes,
      int seriesCount) {
    if (seriesCount < 0) {
      throw new IllegalArgumentException("seriesCount must be >= 0, got " + seriesCount);
    }
    IntArrayList fileColumns = new IntArrayList();
    IntArrayList attributeIndexes = new IntArrayList();
    for (int c = 0; c < header.length; c++) {
      int a = contains(skippedColumns, c) ? -1 : attributes.attributeIndex(header[c]);
      if (a >= 0) {
        fileColumns.add(c);
        attributeIndexes.add(a);
      }
    }
    return new SeriesKeys(attributes, seriesCount, fileColumns.toIntArray(), attributeIndexes.toIntArray());
  }

  private static boolean contains(int[] columns, int c) {
    for (int x : columns) {
      if (x == c) {
        return true;
      }
    }
    return false;
  }

  /** Whether a header column is one of the key columns. */
  boolean isKeyColumn(int column) {
    return contains(fileColumns, column);
  }

  /** Number of key columns; 0 when one key covers the whole chain. */
  int keyColumnCount() {
    return fileColumns.length;
  }

  /** Number of distinct keys the store's series have; key ids run {@code 0 .. keyCount()-1}. */
  int keyCount() {
    return seriesByKeyId.size();
  }

  static String attributeNames(SeriesAttributes attributes) {
    return String.join(", ", attributes.attributeNames());
  }

  int seriesCount() {
    return seriesCount;
  }

  /** Key id of a row, or -1 when no series has its key (always 0 with no key column, when there are series). */
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

  /** "item=X, store=Y" from a row's cells; "all series" with no key column. */
  String describe(CsvRecord record) {
    if (fileColumns.length == 0) {
      return "all series";
    }
    StringBuilder b = new StringBuilder();
    for (int k = 0; k < fileColumns.length; k++) {
      if (k > 0) {
        b.append(", ");
      }
      b.append(attributes.attributeName(attributeIndexes[k])).append('=').append(record.getField(fileColumns[k]));
    }
    return b.toString();
  }

  /** "item=X, store=Y" of a key id; "all series" with no key column. */
  String describe(int keyId) {
    if (fileColumns.length == 0) {
      return "all series";
    }
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
