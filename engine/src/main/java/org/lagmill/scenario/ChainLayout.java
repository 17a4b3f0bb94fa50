package org.lagmill.scenario;

import java.io.IOException;

/**
 * The invented chain "Larkspur Provisions": three regions, a store count that grows with the series count, three
 * categories with seven departments, and items laid out item-major so series {@code s} is item
 * {@code s / storeCount()} in store {@code s % storeCount()}. Ids are written straight to a writer, so no per-item
 * string is ever held.
 */
final class ChainLayout {
  static final String CHAIN_NAME = "Larkspur Provisions";
  static final String[] REGION_NAMES = {"Northvale", "Saltmarsh", "Highmoor"};
  static final String[] REGION_CODES = {"NV", "SM", "HM"};
  static final String[] CATEGORY_NAMES = {"Pantry", "Household", "Leisure"};
  static final String[] CATEGORY_CODES = {"PNT", "HSH", "LSR"};
  /** Category of each department; a department's id is its category code and {@code -D} plus its number there. */
  static final int[] DEPARTMENT_CATEGORY = {0, 0, 0, 1, 1, 2, 2};
  static final int[] DEPARTMENT_NUMBER = {1, 2, 3, 1, 2, 1, 2};
  static final int MIN_STORE_COUNT = 3;
  static final int MAX_STORE_COUNT = 10;
  /** Series per store before another store opens; 3000 series and more get every store. */
  static final int SERIES_PER_STORE_STEP = 300;
  private static final int MIN_ITEM_DIGITS = 4;

  private final int seriesCount;
  private final int storeCount;
  private final int itemCount;
  private final int itemDigitCount;

  ChainLayout(int seriesCount) {
    this.seriesCount = seriesCount;
    int wanted = (int) ((seriesCount + (long) SERIES_PER_STORE_STEP - 1) / SERIES_PER_STORE_STEP);
    this.storeCount = Math.max(MIN_STORE_COUNT, Math.min(MAX_STORE_COUNT, wanted));
    this.itemCount = (int) ((seriesCount + (long) storeCount - 1) / storeCount);
    int largestItemNumber = (itemCount - 1) / DEPARTMENT_CATEGORY.length + 1;
    this.itemDigitCount = Math.max(MIN_ITEM_DIGITS, AsciiWriter.digitCount(largestItemNumber));
  }

  int seriesCount() {
    return seriesCount;
  }

  int storeCount() {
    return storeCount;
  }

  int itemCount() {
    return itemCount;
  }

  int regionCount() {
    return REGION_NAMES.length;
  }

  int itemIndex(int seriesIndex) {
    return seriesIndex / storeCount;
  }

  int storeIndex(int seriesIndex) {
    return seriesIndex % storeCount;
  }

  int regionIndex(int storeIndex) {
    return storeIndex % REGION_NAMES.length;
  }

  int departmentIndex(int itemIndex) {
    return itemIndex % DEPARTMENT_CATEGORY.length;
  }

  int categoryIndex(int itemIndex) {
    return DEPARTMENT_CATEGORY[departmentIndex(itemIndex)];
  }

  /** Writes an item id such as {@code PNT-D2-0041}. */
  void writeItemId(AsciiWriter out, int itemIndex) throws IOException {
    writeDepartmentId(out, departmentIndex(itemIndex));
    out.writeByte('-');
    out.writeZeroPadded(itemIndex / DEPARTMENT_CATEGORY.length + 1, itemDigitCount);
  }

  /** Writes a department id such as {@code PNT-D2}. */
  void writeDepartmentId(AsciiWriter out, int departmentIndex) throws IOException {
    out.writeAscii(CATEGORY_CODES[DEPARTMENT_CATEGORY[departmentIndex]]);
    out.writeByte('-');
    out.writeByte('D');
    out.writeInt(DEPARTMENT_NUMBER[departmentIndex]);
  }

  /** Writes a store id such as {@code NV-03}: region code and the store's number within its region. */
  void writeStoreId(AsciiWriter out, int storeIndex) throws IOException {
    out.writeAscii(REGION_CODES[regionIndex(storeIndex)]);
    out.writeByte('-');
    out.writeZeroPadded(storeIndex / REGION_NAMES.length + 1, 2);
  }

  /** Writes the six leading cells of a sales row (series_id .. region), each followed by a comma. */
  void writeSeriesCells(AsciiWriter out, int seriesIndex) throws IOException {
    int itemIndex = itemIndex(seriesIndex);
    int storeIndex = storeIndex(seriesIndex);
    writeItemId(out, itemIndex);
    out.writeByte('@');
    writeStoreId(out, storeIndex);
    out.writeByte(',');
    writeItemId(out, itemIndex);
    out.writeByte(',');
    writeDepartmentId(out, departmentIndex(itemIndex));
    out.writeByte(',');
    out.writeAscii(CATEGORY_NAMES[categoryIndex(itemIndex)]);
    out.writeByte(',');
    writeStoreId(out, storeIndex);
    out.writeByte(',');
    out.writeAscii(REGION_NAMES[regionIndex(storeIndex)]);
    out.writeByte(',');
  }
}
