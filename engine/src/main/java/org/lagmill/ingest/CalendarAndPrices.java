package org.lagmill.ingest;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.StoreWriter;

/**
 * Reads the calendar and prices files against the finished list of series of a {@link StoreWriter} and writes them
 * into it, collecting the readers' warnings. Shared by ingest and append so both read the files the same way.
 */
final class CalendarAndPrices {
  private CalendarAndPrices() {}

  /** Reads and writes the prices file; call after the last series was added. */
  static void writePrices(StoreWriter writer, Path pricesFile, ColumnNames columns, List<String> warnings)
      throws IOException {
    PriceReadResult read = PriceFileReader.read(pricesFile, writer.firstDate(), writer.periodDays(),
        writer.attributes(),
        writer.seriesCount(), columns.fromColumn(), columns.priceColumn());
    warnings.addAll(read.warnings());
    writer.writePrices(read.prices());
  }

  /** Reads and writes the closures file; call after the last series was added. Returns the closed periods. */
  static ClosureTable writeClosures(StoreWriter writer, Path closuresFile, ColumnNames columns, List<String> warnings)
      throws IOException {
    ClosuresFileReader.ClosuresReadResult read = ClosuresFileReader.read(closuresFile, writer.firstDate(),
        writer.periodDays(), writer.attributes(), writer.seriesCount(), columns.closuresFromColumn(),
        columns.closuresUntilColumn());
    warnings.addAll(read.warnings());
    writer.writeClosures(read.closures(), read.partlyClosedItemPeriods());
    return read.closures();
  }

  /** Reads and writes the plan file; call after the last series was added. */
  static void writePlan(StoreWriter writer, PlanSource plan, List<String> warnings) throws IOException {
    PlanFileReader.PlanReadResult read = PlanFileReader.read(plan.file(), writer.firstDate(), writer.periodDays(),
        writer.dayCount(), writer.attributes(), writer.seriesCount(), plan.dateColumn(), plan.fromColumn());
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
