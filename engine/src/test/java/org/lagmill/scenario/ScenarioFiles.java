package org.lagmill.scenario;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** A slow, obvious reader of the generated files for tests: whole lines, String.split, no shared code with the writer. */
final class ScenarioFiles {
  /** Attribute cells before the first unit count of a sales row. */
  static final int KEY_CELLS = 8;
  static final int SERIES_ID = 0;
  static final int ARTICLE = 1;
  static final int FAMILY = 2;
  static final int SECTION = 3;
  static final int OUTLET = 4;
  static final int BANNER = 5;
  static final int FORMAT = 6;
  static final int DISTRICT = 7;

  final String[] salesHeader;
  final List<String[]> salesRows = new ArrayList<>();
  final int[][] units;
  final String[] calendarHeader;
  final List<String[]> calendarRows = new ArrayList<>();
  final String pricesHeader;
  final List<String[]> priceRows = new ArrayList<>();
  final List<String[]> planRows = new ArrayList<>();
  final List<String[]> closureRows = new ArrayList<>();
  final List<LocalDate> salesDates = new ArrayList<>();

  ScenarioFiles(Path dir) throws IOException {
    List<String> sales = lines(dir, "sales.csv");
    salesHeader = sales.get(0).split(",", -1);
    for (int i = KEY_CELLS; i < salesHeader.length; i++) {
      salesDates.add(LocalDate.parse(salesHeader[i]));
    }
    units = new int[sales.size() - 1][];
    for (int r = 1; r < sales.size(); r++) {
      String[] cells = sales.get(r).split(",", -1);
      salesRows.add(cells);
      units[r - 1] = new int[cells.length - KEY_CELLS];
      for (int c = KEY_CELLS; c < cells.length; c++) {
        units[r - 1][c - KEY_CELLS] = Integer.parseInt(cells[c]);
      }
    }
    List<String> calendar = lines(dir, "calendar.csv");
    calendarHeader = calendar.get(0).split(",", -1);
    for (String line : calendar.subList(1, calendar.size())) {
      calendarRows.add(line.split(",", -1));
    }
    List<String> prices = lines(dir, "prices.csv");
    pricesHeader = prices.get(0);
    if (!pricesHeader.equals("article,banner,from,price") && !pricesHeader.equals("article,outlet,from,price")) {
      throw new AssertionError("prices header: " + pricesHeader);
    }
    for (String line : prices.subList(1, prices.size())) {
      priceRows.add(line.split(",", -1));
    }
    List<String> plan = lines(dir, "plan.csv");
    if (!plan.get(0).equals("article,banner,from,promo,discount,display,leaflet")) {
      throw new AssertionError("plan header: " + plan.get(0));
    }
    for (String line : plan.subList(1, plan.size())) {
      planRows.add(line.split(",", -1));
    }
    List<String> closures = lines(dir, "closures.csv");
    if (!closures.get(0).equals("outlet,from,until,reason")) {
      throw new AssertionError("closures header: " + closures.get(0));
    }
    for (String line : closures.subList(1, closures.size())) {
      closureRows.add(line.split(",", -1));
    }
  }

  private static List<String> lines(Path dir, String name) throws IOException {
    return Files.readAllLines(dir.resolve(name), StandardCharsets.US_ASCII);
  }

  int periodCount() {
    return salesDates.size();
  }

  /** Price change points per "key,key" (article and banner, or article and outlet) in file order: from and price. */
  Map<String, List<String[]>> pricesByKey() {
    return byKey(priceRows, 2);
  }

  /** Plan rows per "article,banner" in file order: from, promo, discount, display, leaflet. */
  Map<String, List<String[]>> planByKey() {
    return byKey(planRows, 2);
  }

  private static Map<String, List<String[]>> byKey(List<String[]> rows, int keyCount) {
    Map<String, List<String[]>> byKey = new LinkedHashMap<>();
    for (String[] row : rows) {
      String key = String.join(",", List.of(row).subList(0, keyCount));
      byKey.computeIfAbsent(key, k -> new ArrayList<>()).add(List.of(row).subList(keyCount, row.length)
          .toArray(String[]::new));
    }
    return byKey;
  }

  /** Price key of a sales row in this file's price layout. */
  String priceKey(String[] salesRow) {
    return salesRow[ARTICLE] + "," + (pricesHeader.contains("banner") ? salesRow[BANNER] : salesRow[OUTLET]);
  }

  /**
   * The value of change points ({@code from} first, then values) at each sales date, column {@code valueIndex} of
   * the row after {@code from}; null before the first point. The slow way, one date at a time.
   */
  String[] valueOnDates(List<String[]> changes, int valueIndex) {
    String[] values = new String[periodCount()];
    for (int period = 0; period < values.length; period++) {
      for (String[] change : changes) {
        if (!LocalDate.parse(change[0]).isAfter(salesDates.get(period))) {
          values[period] = change[1 + valueIndex];
        }
      }
    }
    return values;
  }

  /** Prices of one series at each sales date, NaN before its first price. */
  double[] prices(List<String[]> changes) {
    String[] text = valueOnDates(changes, 0);
    double[] prices = new double[text.length];
    for (int i = 0; i < text.length; i++) {
      prices[i] = text[i] == null ? Double.NaN : Double.parseDouble(text[i]);
    }
    return prices;
  }

  /** Whether an outlet is declared closed on a date. */
  boolean isClosed(String outlet, LocalDate date) {
    for (String[] row : closureRows) {
      if (row[0].equals(outlet) && !date.isBefore(LocalDate.parse(row[1])) && !date.isAfter(LocalDate.parse(row[2]))) {
        return true;
      }
    }
    return false;
  }

  /** Calendar column index of a header name. */
  int calendarColumn(String name) {
    for (int c = 0; c < calendarHeader.length; c++) {
      if (calendarHeader[c].equals(name)) {
        return c;
      }
    }
    throw new AssertionError("no calendar column " + name);
  }
}
