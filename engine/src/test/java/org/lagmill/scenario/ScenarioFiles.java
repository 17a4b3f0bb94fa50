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
  final String[] salesHeader;
  final List<String[]> salesRows = new ArrayList<>();
  final int[][] units;
  final String[] calendarHeader;
  final List<String[]> calendarRows = new ArrayList<>();
  final List<String[]> priceRows = new ArrayList<>();
  final List<LocalDate> salesDates = new ArrayList<>();

  ScenarioFiles(Path dir) throws IOException {
    List<String> sales = Files.readAllLines(dir.resolve("sales.csv"), StandardCharsets.US_ASCII);
    salesHeader = sales.get(0).split(",", -1);
    for (int i = 6; i < salesHeader.length; i++) {
      salesDates.add(LocalDate.parse(salesHeader[i]));
    }
    units = new int[sales.size() - 1][];
    for (int r = 1; r < sales.size(); r++) {
      String[] cells = sales.get(r).split(",", -1);
      salesRows.add(cells);
      units[r - 1] = new int[cells.length - 6];
      for (int c = 6; c < cells.length; c++) {
        units[r - 1][c - 6] = Integer.parseInt(cells[c]);
      }
    }
    List<String> calendar = Files.readAllLines(dir.resolve("calendar.csv"), StandardCharsets.US_ASCII);
    calendarHeader = calendar.get(0).split(",", -1);
    for (String line : calendar.subList(1, calendar.size())) {
      calendarRows.add(line.split(",", -1));
    }
    List<String> prices = Files.readAllLines(dir.resolve("prices.csv"), StandardCharsets.US_ASCII);
    if (!prices.get(0).equals("item,store,from,price")) {
      throw new AssertionError("prices header: " + prices.get(0));
    }
    for (String line : prices.subList(1, prices.size())) {
      priceRows.add(line.split(",", -1));
    }
  }

  int dayCount() {
    return salesDates.size();
  }

  /** Price change points per "item,store" key in file order: from-date and price. */
  Map<String, List<String[]>> pricesByKey() {
    Map<String, List<String[]>> byKey = new LinkedHashMap<>();
    for (String[] row : priceRows) {
      byKey.computeIfAbsent(row[0] + "," + row[1], k -> new ArrayList<>()).add(new String[] {row[2], row[3]});
    }
    return byKey;
  }

  /**
   * Daily prices of one series over the sales days, NaN before its first price; the slow way, one day at a time.
   */
  double[] dailyPrices(List<String[]> changes) {
    double[] daily = new double[dayCount()];
    for (int day = 0; day < daily.length; day++) {
      daily[day] = Double.NaN;
      for (String[] change : changes) {
        if (!LocalDate.parse(change[0]).isAfter(salesDates.get(day))) {
          daily[day] = Double.parseDouble(change[1]);
        }
      }
    }
    return daily;
  }
}
