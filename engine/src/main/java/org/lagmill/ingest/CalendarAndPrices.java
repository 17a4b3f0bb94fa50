package org.lagmill.ingest;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.StoreSharding;
import org.lagmill.store.StoreWriter;

/**
 * Reads the calendar and prices files against the finished list of series of a {@link StoreWriter} and writes them
 * into it, collecting the readers' warnings. Shared by ingest and append so both read the files the same way.
 */
final class CalendarAndPrices {
  private CalendarAndPrices() {}

  /**
   * The series a side file's keys are matched against, and the ones the store keeps: a whole ingest matches and keeps
   * its own series; a shard ingest matches every series of the input and keeps its part's
   * ({@link ShardIngest}), so each file reads, and warns, as for the whole input.
   *
   * @param keptSeries the kept series' indexes among {@code attributes}' series, ascending
   */
  record Scope(SeriesAttributes attributes, int seriesCount, int[] keptSeries) {}

  /** Reads the prices file against {@code scope} and writes the kept series' prices. */
  static void writePrices(StoreWriter writer, Scope scope, Path pricesFile, ColumnNames columns,
      List<String> warnings) throws IOException {
    PriceReadResult read = PriceFileReader.read(pricesFile, writer.firstDate(), writer.periodDays(),
        scope.attributes(), scope.seriesCount(), columns.fromColumn(), columns.priceColumn());
    warnings.addAll(read.warnings());
    writer.writePrices(StoreSharding.selectedPrices(read.prices(), scope.keptSeries()));
  }

  /**
   * Reads the closures file against {@code scope} and writes the kept series' closures, as a shard keeps them (the
   * count of partly closed item-periods stays with the whole input). Returns the kept series' closed periods.
   */
  static ClosureTable writeClosures(StoreWriter writer, Scope scope, Path closuresFile, ColumnNames columns,
      List<String> warnings) throws IOException {
    ClosuresFileReader.ClosuresReadResult read = ClosuresFileReader.read(closuresFile, writer.firstDate(),
        writer.periodDays(), scope.attributes(), scope.seriesCount(), columns.closuresFromColumn(),
        columns.closuresUntilColumn());
    warnings.addAll(read.warnings());
    ClosureTable kept = StoreSharding.selectedClosures(read.closures(), scope.keptSeries());
    writer.writeClosures(kept);
    return kept;
  }

  /** Reads the plan file against {@code scope}; each kept series keeps its plan key. */
  static void writePlan(StoreWriter writer, Scope scope, PlanSource plan, List<String> warnings)
      throws IOException {
    PlanFileReader.PlanReadResult read = PlanFileReader.read(plan.file(), writer.firstDate(), writer.periodDays(),
        writer.dayCount(), scope.attributes(), scope.seriesCount(), plan.dateColumn(), plan.fromColumn());
    warnings.addAll(read.warnings());
    writer.writePlan(StoreSharding.selectedPlan(read.plan(), scope.keptSeries()));
  }

  /** Reads the calendar file against {@code scope}'s attribute values (the same codes as the writer's). */
  static void writeCalendar(StoreWriter writer, Scope scope, Path calendarFile, ColumnNames columns,
      List<String> warnings) throws IOException {
    CalendarReadResult read = CalendarFileReader.read(calendarFile, writer.firstDate(), writer.periodDays(),
        scope.attributes(), columns.calendarDateColumn());
    warnings.addAll(read.warnings());
    writer.writeCalendar(read.calendar());
  }

  /** Reads and writes the prices file; call after the last series was added. */
  static void writePrices(StoreWriter writer, Path pricesFile, ColumnNames columns, List<String> warnings)
      throws IOException {
    PriceReadResult read = PriceFileReader.read(pricesFile, writer.firstDate(), writer.periodDays(),
        writer.attributes(),
        writer.seriesCount(), columns.fromColumn(), columns.priceColumn(), columns.keyColumns().prices());
    warnings.addAll(read.warnings());
    writer.writePrices(read.prices());
  }

  /** Reads and writes the closures file; call after the last series was added. Returns the closed periods. */
  static ClosureTable writeClosures(StoreWriter writer, Path closuresFile, ColumnNames columns, List<String> warnings)
      throws IOException {
    ClosuresFileReader.ClosuresReadResult read = ClosuresFileReader.read(closuresFile, writer.firstDate(),
        writer.periodDays(), writer.attributes(), writer.seriesCount(), columns.closuresFromColumn(),
        columns.closuresUntilColumn(), columns.keyColumns().closures());
    warnings.addAll(read.warnings());
    writer.writeClosures(read.closures(), read.partlyClosedItemPeriods());
    return read.closures();
  }

  /** Reads and writes the plan file; call after the last series was added. */
  static void writePlan(StoreWriter writer, PlanSource plan, ColumnNames columns, List<String> warnings)
      throws IOException {
    PlanFileReader.PlanReadResult read = PlanFileReader.read(plan.file(), writer.firstDate(), writer.periodDays(),
        writer.dayCount(), writer.attributes(), writer.seriesCount(), plan.dateColumn(), plan.fromColumn(),
        columns.keyColumns().plan());
    warnings.addAll(read.warnings());
    writer.writePlan(read.plan());
  }

  /** Reads and writes the calendar file; call after the last series was added. */
  static void writeCalendar(StoreWriter writer, Path calendarFile, ColumnNames columns, List<String> warnings)
      throws IOException {
    CalendarReadResult read = CalendarFileReader.read(calendarFile, writer.firstDate(), writer.periodDays(),
        writer.attributes(), columns.calendarDateColumn());
    warnings.addAll(read.warnings());
    writer.writeCalendar(read.calendar());
  }
}
