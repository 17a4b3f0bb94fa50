package org.lagmill.ingest;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import org.lagmill.io.Excerpts;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.Periods;
import org.lagmill.store.PlanTable;
import org.lagmill.store.PriceTable;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.SeriesIdentity;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreUpdate;
import org.lagmill.store.StoreWriter;

/**
 * Adds the days of a wide sales file whose first date is the store's next day. The store is rewritten into a
 * temporary sibling (each old series streamed from the mapped store plus its new days; its width may widen) and
 * published atomically.
 *
 * <p>Series in the store but absent from the file get unknown units for the new days; series new in the file are
 * added after the old ones, in file order, with unknown units for every earlier day. Prices and calendar are carried
 * over unchanged (a series new to the store has no price) unless a newer calendar or prices file is given: its content
 * then replaces the stored one, read against the store's first date and the appended list of series (a weekly refresh
 * usually brings next month's prices and events). The file's units are held on the heap until the rewrite (4 bytes
 * per new item-day), because its rows may come in any order.
 */
public final class StoreAppend {
  private StoreAppend() {}

  /** As {@link #append(AppendOptions, MemoryBudget)} with sales only; returns the manifest. */
  public static StoreManifest append(Path storeDir, Path salesFile, String seriesIdColumn, MemoryBudget budget)
      throws IOException {
    AppendOptions options = new AppendOptions(storeDir, SalesInputs.of(salesFile)
        .withColumns(ColumnNames.DEFAULTS.with(ColumnNames.Column.SERIES_ID, seriesIdColumn)));
    return append(options, budget).manifest();
  }

  /**
   * Appends the sales file's days and, when given, replaces the calendar and prices. Nothing is published unless
   * every file reads without error; the existing store is left byte-identical otherwise.
   *
   * @param budget charged for the mapped store and the writer's buffers; a child budget is taken and closed
   * @return the manifest of the published store and the calendar and price readers' warnings
   * @throws InputFormatException when the sales file does not start the day after the store's last day, its
   *     attribute columns differ from the store's, a row is malformed or repeated, or the calendar or prices file is
   *     malformed
   */
  public static IngestResult append(AppendOptions options, MemoryBudget budget) throws IOException {
    return append(options, StoreUpdate.Policy.CHANGE_WAITING, budget);
  }

  /**
   * As {@link #append(AppendOptions, MemoryBudget)}; the store's lock is held from before it is read until the new
   * generation is committed, so two appends never both read the same days (the second waits, or fails at once when
   * the policy does not wait).
   *
   * @throws org.lagmill.store.StoreBusyException when another writer holds the store and the policy does not wait
   */
  public static IngestResult append(AppendOptions options, StoreUpdate.Policy policy, MemoryBudget budget)
      throws IOException {
    SalesInputs inputs = options.inputs();
    Path storeDir = options.storeDir();
    Path salesFile = inputs.salesFile();
    if (salesFile == null && inputs.calendarFile() == null && inputs.pricesFile() == null
        && inputs.closuresFile() == null && inputs.plan() == null) {
      throw new InvalidRequestException("nothing to append: give " + Setting.SALES + ", " + Setting.CALENDAR + ", "
          + Setting.PRICES + ", " + Setting.CLOSURES + " or "
          + Setting.PLAN.toString());
    }
    try (StoreUpdate update = StoreUpdate.begin(storeDir, policy);
        MemoryBudget stage = budget.child("append")) {
      Path temp = update.buildingDir();
      IngestResult result;
      // No sales file: the calendar, prices or closures alone replace the stored ones; the days stay as they are.
      try (SalesStore store = SalesStore.open(storeDir, stage)) {
        AppendedDays newDays;
        if (salesFile == null) {
          newDays = AppendedDays.none(store.seriesCount());
        } else if (inputs.salesFormat().resolve(salesFile, inputs.columns().dateColumn(),
            inputs.columns().unitsColumn()) == SalesFormat.LONG) {
          newDays = LongAppendDays.read(store, inputs, stage);
        } else {
          newDays = readWide(store, salesFile, inputs);
        }
        result = rewrite(store, temp, newDays, inputs, stage);
      }
      update.commit();
      return result;
    }
  }

  /** A wide file's days, which must start at the store's next period and keep its step. */
  private static AppendedDays readWide(SalesStore store, Path salesFile, SalesInputs inputs) throws IOException {
    try (WideSalesReader reader = WideSalesReader.open(salesFile, inputs.columns().seriesIdColumn())) {
      LocalDate expectedFirst = store.dateOf(store.dayCount());
      int periodDays = store.periodDays();
      if (!reader.firstDate().equals(expectedFirst)) {
        throw new InputFormatException(salesFile, 1, 0, "expected the first date column to be " + expectedFirst
            + " (the " + (periodDays == Periods.DAILY ? "day" : "period") + " after the store's last "
            + (periodDays == Periods.DAILY ? "day " : "period, from ") + store.dateOf(store.dayCount() - 1)
            + "), found " + reader.firstDate());
      }
      if (reader.dayCount() > 1 && reader.periodDays() != periodDays) {
        throw new InputFormatException(salesFile, 1, 0, "date columns " + reader.periodDays() + " days apart: "
            + "expected the store's step of " + periodDays + (periodDays == 1 ? " day" : " days") + " ("
            + Periods.describe(periodDays) + ")");
      }
      int[] fileColumnOfAttribute = matchAttributes(store.attributes(), reader);
      return readNewDays(store, reader, fileColumnOfAttribute);
    }
  }

  private static int[] matchAttributes(SeriesAttributes attributes, WideSalesReader reader) {
    List<String> storeNames = attributes.attributeNames();
    List<String> fileNames = reader.attributeNames();
    if (!new HashSet<>(storeNames).equals(new HashSet<>(fileNames))) {
      throw new InputFormatException(reader.file(), 1, 0, "expected the attribute columns of the store "
          + storeNames + ", found " + fileNames);
    }
    int[] fileColumn = new int[storeNames.size()];
    for (int a = 0; a < fileColumn.length; a++) {
      fileColumn[a] = fileNames.indexOf(storeNames.get(a));
    }
    return fileColumn;
  }

  private static AppendedDays readNewDays(SalesStore store, WideSalesReader reader, int[] fileColumnOfAttribute)
      throws IOException {
    int dayCount = reader.dayCount();
    int[][] unitsBySeries = new int[store.seriesCount()][];
    List<String[]> newAttributes = new ArrayList<>();
    List<int[]> newUnits = new ArrayList<>();
    Object2IntOpenHashMap<String> newIndexById = new Object2IntOpenHashMap<>();
    newIndexById.defaultReturnValue(-1);
    int idAttribute = SeriesIdentity.idIndex(store.attributes().attributeNames());
    String[] fileValues = new String[fileColumnOfAttribute.length];
    int[] row = new int[dayCount];
    while (reader.next(fileValues, row)) {
      String[] values = new String[fileColumnOfAttribute.length];
      for (int a = 0; a < values.length; a++) {
        values[a] = fileValues[fileColumnOfAttribute[a]];
      }
      String seriesId = SeriesIdentity.seriesId(values, idAttribute);
      int seriesIndex = store.attributes().seriesIndexOf(seriesId);
      boolean repeated = seriesIndex >= 0 ? unitsBySeries[seriesIndex] != null : newIndexById.containsKey(seriesId);
      if (repeated) {
        throw new InputFormatException(reader.file(), reader.lineNumber(), 0, "duplicate series \"" + seriesId
            + "\": each series may appear once");
      }
      if (seriesIndex >= 0) {
        requireSameAttributes(store.attributes(), seriesIndex, values, reader, fileColumnOfAttribute);
        unitsBySeries[seriesIndex] = row.clone();
      } else {
        newIndexById.put(seriesId, newAttributes.size());
        newAttributes.add(values);
        newUnits.add(row.clone());
      }
    }
    return new AppendedDays(dayCount, unitsBySeries, newAttributes, newUnits, ZeroFills.NONE, List.of());
  }

  /**
   * A known series must keep its attributes: an append that moved it to another department or store would silently
   * rewrite its history's grouping, so it is refused as ingest refuses a series whose rows disagree. The rule of wide
   * and long appends alike ({@link LongAppendDays}).
   *
   * @param values the file's value of each store attribute, in the store's attribute order
   * @return the first store attribute whose value differs from the store's, or -1 when all agree
   */
  static int firstChangedAttribute(SeriesAttributes attributes, int seriesIndex, String[] values) {
    for (int a = 0; a < values.length; a++) {
      if (!attributes.value(a, attributes.code(seriesIndex, a)).equals(values[a])) {
        return a;
      }
    }
    return -1;
  }

  /** The refusal of a known series whose {@code attribute} has {@code value} in the file at line and column. */
  static InputFormatException attributeChanged(Path file, long line, int column, SeriesAttributes attributes,
      int seriesIndex, int attribute, String value) {
    String name = attributes.attributeName(attribute);
    String stored = attributes.value(attribute, attributes.code(seriesIndex, attribute));
    return new InputFormatException(file, line, column, "series '" + Excerpts.of(attributes.seriesId(seriesIndex))
        + "' has " + name + "=" + Excerpts.of(value) + ": expected " + name + "=" + Excerpts.of(stored)
        + " as in the store (a series keeps its attributes; give a changed one a new series id)");
  }

  private static void requireSameAttributes(SeriesAttributes attributes, int seriesIndex, String[] values,
      WideSalesReader reader, int[] fileColumnOfAttribute) {
    int changed = firstChangedAttribute(attributes, seriesIndex, values);
    if (changed >= 0) {
      throw attributeChanged(reader.file(), reader.lineNumber(), reader.attributeColumnNumber(
          fileColumnOfAttribute[changed]), attributes, seriesIndex, changed, values[changed]);
    }
  }

  private static IngestResult rewrite(SalesStore store, Path temp, AppendedDays newDays, SalesInputs inputs,
      MemoryBudget budget) throws IOException {
    int oldDayCount = store.dayCount();
    int dayCount = oldDayCount + newDays.dayCount();
    SeriesAttributes attributes = store.attributes();
    List<String> names = attributes.attributeNames();
    try (StoreWriter writer = new StoreWriter(temp, store.firstDate(), store.periodDays(), dayCount, names,
        budget)) {
      int[] row = new int[dayCount];
      String[] values = new String[names.size()];
      for (int s = 0; s < store.seriesCount(); s++) {
        // As stored: a closed day keeps its units, so a corrected closures file appended later finds them again.
        store.readStoredUnits(s, 0, row, 0, oldDayCount);
        int[] added = newDays.unitsBySeries()[s];
        if (added == null) {
          Arrays.fill(row, oldDayCount, dayCount, SalesHistory.UNKNOWN_UNITS);
        } else {
          System.arraycopy(added, 0, row, oldDayCount, added.length);
        }
        for (int a = 0; a < values.length; a++) {
          values[a] = attributes.value(a, attributes.code(s, a));
        }
        writer.addSeries(values, row);
      }
      Arrays.fill(row, 0, oldDayCount, SalesHistory.UNKNOWN_UNITS);
      for (int n = 0; n < newDays.newSeriesAttributes().size(); n++) {
        System.arraycopy(newDays.newSeriesUnits().get(n), 0, row, oldDayCount, newDays.dayCount());
        writer.addSeries(newDays.newSeriesAttributes().get(n), row);
      }
      StoreManifest.Fill oldFill = store.manifest().fill();
      List<String> warnings = new ArrayList<>(newDays.warnings());
      if (inputs.pricesFile() != null) {
        CalendarAndPrices.writePrices(writer, inputs.pricesFile(), inputs.columns(), warnings);
      } else {
        writer.writePrices(extended(store.prices(), store.seriesCount()));
      }
      if (inputs.calendarFile() != null) {
        CalendarAndPrices.writeCalendar(writer, inputs.calendarFile(), inputs.columns(), warnings);
      } else {
        writer.writeCalendar(store.calendar());
      }
      ClosureTable closures;
      if (inputs.closuresFile() != null) {
        closures = CalendarAndPrices.writeClosures(writer, inputs.closuresFile(), inputs.columns(), warnings);
      } else {
        closures = extended(store.closures(), store.seriesCount());
        writer.writeClosures(closures, oldFill == null ? 0 : oldFill.partlyClosedItemDays());
      }
      // A day with no row that a closure covers counts as closed, as at ingest.
      long zeroFilledNow = newDays.zeroFills().count() - newDays.zeroFills().closedCount(closures, oldDayCount);
      writer.addZeroFilledItemDays((oldFill == null ? 0 : oldFill.zeroFilledItemDays()) + zeroFilledNow);
      if (inputs.plan() != null) {
        CalendarAndPrices.writePlan(writer, inputs.plan(), inputs.columns(), warnings);
      } else {
        // Kept as stored; series new to the store have no plan row until a plan file is appended.
        PlanTable plan = store.plan();
        int oldSeriesCount = store.seriesCount();
        writer.writePlan(PlanTable.withSeriesKeys(plan, s -> s < oldSeriesCount ? plan.keyOf(s) : PlanTable.NO_KEY));
      }
      String uncovered = uncoveredNewSeries(newDays.newSeriesAttributes().size(),
          inputs.pricesFile() == null && !store.prices().isEmpty(),
          inputs.closuresFile() == null && !store.closures().isEmpty(),
          inputs.plan() == null && !store.plan().isEmpty());
      if (uncovered != null) {
        warnings.add(uncovered);
      }
      List<StoreManifest.SourceFile> sources = new ArrayList<>(store.manifest().sources());
      sources.addAll(StoreIngest.sources(inputs));
      StoreManifest manifest = writer.finish(sources);
      FillWarnings.add(manifest, zeroFilledNow, warnings);
      if (!closures.isEmpty()) {
        try (SalesStore built = SalesStore.openUnpublished(temp, budget.child("closed-day check"))) {
          ClosedDaySales.warn(built, warnings);
        }
      }
      return new IngestResult(manifest, warnings);
    }
  }

  /**
   * The warning for series new to the store when stored prices, closures or a plan are kept: each table was matched
   * to the series when its file was read, so a new series gets no rows from it (no price, never closed, nothing
   * planned) until that file is appended again. Null when nothing is missing.
   */
  static String uncoveredNewSeries(int newSeriesCount, boolean keptPrices, boolean keptClosures, boolean keptPlan) {
    List<String> kinds = new ArrayList<>();
    List<String> files = new ArrayList<>();
    if (keptPrices) {
      kinds.add("prices");
      files.add(Setting.PRICES + " FILE");
    }
    if (keptClosures) {
      kinds.add("closures");
      files.add(Setting.CLOSURES + " FILE");
    }
    if (keptPlan) {
      kinds.add("plan rows");
      files.add(Setting.PLAN + " FILE");
    }
    if (newSeriesCount == 0 || kinds.isEmpty()) {
      return null;
    }
    return newSeriesCount + " series new to the store have no " + String.join(", ", kinds) + " from the stored "
        + "files, which were matched to series when they were read; append them again (" + String.join(", ", files)
        + ") to cover the new series";
  }

  /** The old closures, with none for series added by the append. */
  private static ClosureTable extended(ClosureTable closures, int oldSeriesCount) {
    return new ClosureTable() {
      @Override
      public boolean isEmpty() { return closures.isEmpty(); }
      @Override
      public int rangeCount(int s) { return s < oldSeriesCount ? closures.rangeCount(s) : 0; }
      @Override
      public int firstDayIndex(int s, int k) { return closures.firstDayIndex(s, k); }
      @Override
      public int lastDayIndex(int s, int k) { return closures.lastDayIndex(s, k); }
    };
  }

  /** The old price table, with no prices for series added by the append. */
  private static PriceTable extended(PriceTable prices, int oldSeriesCount) {
    return new PriceTable() {
      @Override
      public boolean isEmpty() { return prices.isEmpty(); }
      @Override
      public int changeCount(int s) { return s < oldSeriesCount ? prices.changeCount(s) : 0; }
      @Override
      public int changeDayIndex(int s, int k) { return prices.changeDayIndex(s, k); }
      @Override
      public float changePrice(int s, int k) { return prices.changePrice(s, k); }
    };
  }
}
