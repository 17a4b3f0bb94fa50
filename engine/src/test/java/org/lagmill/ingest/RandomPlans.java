package org.lagmill.ingest;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;
import org.lagmill.store.ArraySeriesAttributes;

/**
 * Seeded random plan files shaped differently on purpose, with a slow obvious reference for what each series reads:
 * attributes named sku, shop and dept (sku under dept), keys at every level (none, sku, shop, dept×shop, sku×shop),
 * both forms (a {@code day} column holding for one period, a {@code valid_from} column holding until the next row),
 * daily and weekly stores with dates off the week's first day, rows before the first period and past the last, keys
 * no series has, series with no plan row, value columns of any name. The reference reads the raw rows for every
 * series and period with no sorting and no change points.
 */
public final class RandomPlans {
  public static final LocalDate FIRST = LocalDate.of(2024, 1, 1);

  /** One raw plan row as written to the file. */
  public record Row(String[] keyValues, long epochDay, float[] values, boolean known) {}

  public Path file;
  public int periodDays;
  /** Sales periods of the store the plan is read against. */
  public int dayCount;
  /** Periods the rows may fall in, from 0 (rows start 3 periods before). */
  public int periodsSpan;
  public ArraySeriesAttributes attributes;
  public List<String[]> series;
  public int[] keyAttributes;
  public List<String> keyNames;
  public boolean dateForm;
  public String[] columns;
  public String dateColumn;
  public String fromColumn;
  public List<Row> rows;

  private RandomPlans() {}

  /**
   * A random plan file in {@code dir} against random series; {@code round} varies the column names.
   *
   * @param periodDays 1 or 7, or 0 to draw one
   */
  public static RandomPlans generate(SplittableRandom random, int round, int periodDays, Path dir) throws IOException {
    periodDays = periodDays == 0 ? (random.nextBoolean() ? 1 : 7) : periodDays;
    int dayCount = 10 + random.nextInt(30);
    int deptCount = 1 + random.nextInt(3);
    int skuCount = 2 + random.nextInt(6);
    int shopCount = 1 + random.nextInt(4);
    String[] names = {"sku", "dept", "shop"};
    List<String[]> series = new ArrayList<>();
    for (int sku = 0; sku < skuCount; sku++) {
      for (int shop = 0; shop < shopCount; shop++) {
        // Not every sku sells in every shop: a long export leaves such pairs out.
        if (random.nextInt(5) > 0 || series.isEmpty()) {
          series.add(new String[] {"k" + sku, "d" + (sku % deptCount), "shop-" + shop});
        }
      }
    }
    ArraySeriesAttributes attributes = ArraySeriesAttributes.of(names, series.toArray(new String[0][]));
    int[][] keyChoices = {{}, {0}, {2}, {1, 2}, {0, 2}};
    int[] keyAttributes = keyChoices[random.nextInt(keyChoices.length)];
    boolean dateForm = random.nextBoolean();
    int columnCount = 1 + random.nextInt(3);
    String[] columns = new String[columnCount];
    for (int c = 0; c < columnCount; c++) {
      columns[c] = List.of("promo", "depth", "end_cap", "flyer", "tv.spot").get((round + c) % 5);
    }
    String timeColumn = dateForm ? "day" : "valid_from";

    // Distinct key values from the series, plus one no series has.
    List<String[]> keyValues = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    for (String[] values : series) {
      String[] key = new String[keyAttributes.length];
      for (int k = 0; k < key.length; k++) {
        key[k] = values[keyAttributes[k]];
      }
      // Leave some keys without any row: their series read 0.
      if (seen.add(String.join("/", key)) && random.nextInt(6) > 0) {
        keyValues.add(key);
      }
    }
    if (keyAttributes.length > 0) {
      String[] unknown = new String[keyAttributes.length];
      Arrays.fill(unknown, "nowhere");
      keyValues.add(unknown);
    }
    List<Row> rows = new ArrayList<>();
    int periodsSpan = dayCount + 8;
    for (String[] key : keyValues) {
      boolean known = key.length == 0 || !key[0].equals("nowhere");
      Set<Integer> usedPeriods = new HashSet<>();
      int rowCount = random.nextInt(7);
      for (int i = 0; i < rowCount; i++) {
        // From three periods before the store's first to past its last.
        int period = random.nextInt(periodsSpan) - 3;
        if (!usedPeriods.add(period)) {
          continue;
        }
        int offset = periodDays == 1 ? 0 : (random.nextInt(3) == 0 ? 1 + random.nextInt(6) : 0);
        long epochDay = FIRST.toEpochDay() + (long) period * periodDays + offset;
        float[] values = new float[columnCount];
        for (int c = 0; c < columnCount; c++) {
          values[c] = random.nextInt(3) == 0 ? 0f : random.nextInt(4) * 0.25f;
        }
        rows.add(new Row(key, epochDay, values, known));
      }
    }
    java.util.Collections.shuffle(rows, new java.util.Random(random.nextLong()));

    StringBuilder csv = new StringBuilder();
    List<String> header = new ArrayList<>();
    for (int c = 0; c < columnCount; c++) {
      header.add(columns[c]);
    }
    header.add(random.nextInt(header.size() + 1), timeColumn);
    List<String> keyNames = new ArrayList<>();
    for (int a : keyAttributes) {
      keyNames.add(names[a]);
    }
    List<String> fullHeader = new ArrayList<>(keyNames);
    fullHeader.addAll(header);
    csv.append(String.join(",", fullHeader)).append('\n');
    for (Row row : rows) {
      List<String> cells = new ArrayList<>(Arrays.asList(row.keyValues()));
      for (String column : header) {
        if (column.equals(timeColumn)) {
          cells.add(LocalDate.ofEpochDay(row.epochDay()).toString());
        } else {
          cells.add(Float.toString(row.values()[Arrays.asList(columns).indexOf(column)]));
        }
      }
      csv.append(String.join(",", cells)).append('\n');
    }
    Path file = Files.writeString(dir.resolve("plan-" + round + ".csv"), csv);
    RandomPlans plans = new RandomPlans();
    plans.file = file;
    plans.periodDays = periodDays;
    plans.dayCount = dayCount;
    plans.periodsSpan = periodsSpan;
    plans.attributes = attributes;
    plans.series = series;
    plans.keyAttributes = keyAttributes;
    plans.keyNames = keyNames;
    plans.dateForm = dateForm;
    plans.columns = columns;
    plans.dateColumn = dateForm ? "day" : "date";
    plans.fromColumn = dateForm ? "from" : "valid_from";
    plans.rows = rows;
    return plans;
  }

  /** Reads the file as ingest would. */
  public PlanFileReader.PlanReadResult read() {
    return PlanFileReader.read(file, FIRST, periodDays, dayCount, attributes, series.size(), dateColumn, fromColumn);
  }

  /** The period holding the latest date of a matched row, -1 when there is none. */
  public int reach() {
    int reach = -1;
    for (Row r : rows) {
      if (r.known()) {
        reach = Math.max(reach, periodOf(r.epochDay(), periodDays));
      }
    }
    return reach;
  }

  /** The raw rows whose key matches series {@code s}. */
  public List<Row> rowsOf(int s) {
    return rowsOf(rows, series.get(s), keyAttributes);
  }

  /** What series {@code s} reads in column {@code column} on a period, from the raw rows. */
  public float slowValue(int s, int period, int column) {
    List<Row> own = rowsOf(s);
    return dateForm ? slowDateValue(own, period, column, periodDays, reach()) : slowFromValue(own, period, column,
        periodDays);
  }

  static int periodOf(long epochDay, int periodDays) {
    return (int) Math.floorDiv(epochDay - FIRST.toEpochDay(), periodDays);
  }

  static List<Row> rowsOf(List<Row> rows, String[] seriesValues, int[] keyAttributes) {
    List<Row> own = new ArrayList<>();
    for (Row row : rows) {
      boolean match = true;
      for (int k = 0; k < keyAttributes.length; k++) {
        match &= row.keyValues()[k].equals(seriesValues[keyAttributes[k]]);
      }
      if (match) {
        own.add(row);
      }
    }
    return own;
  }

  /** From-form: the row with the latest date on or before the period's last day; 0 when there is none. */
  static float slowFromValue(List<Row> own, int period, int column, int periodDays) {
    long lastDay = FIRST.toEpochDay() + (long) (period + 1) * periodDays - 1;
    Row best = null;
    for (Row row : own) {
      if (row.epochDay() <= lastDay && (best == null || row.epochDay() > best.epochDay())) {
        best = row;
      }
    }
    return best == null ? 0f : best.values()[column];
  }

  /** Date-form: the row dated within the period, else 0; past the reach the values of the reach's period carry on. */
  static float slowDateValue(List<Row> own, int period, int column, int periodDays, int reach) {
    int at = period > reach ? reach : period;
    for (Row row : own) {
      if (periodOf(row.epochDay(), periodDays) == at) {
        return row.values()[column];
      }
    }
    return 0f;
  }
}
