package org.lagmill.ingest;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreUpdate;
import org.lagmill.store.StoreWriter;

/**
 * Builds a store from input files into a new generation under the store's writer lock, then commits it. Wide sales
 * stream row by row ({@link WideSalesReader}: the heap holds one row plus the attribute dictionaries); long sales take
 * two passes ({@link LongSalesReader}, with a series × day matrix of 4 bytes per item-day charged to the budget). Once
 * every series is written, the calendar ({@link CalendarFileReader}) and prices ({@link PriceFileReader}) are read
 * against the store's first date and series. A failure leaves any existing store untouched and no temporary directory.
 */
public final class StoreIngest {
  private StoreIngest() {}

  /**
   * @param budget charged for the writer's direct I/O buffers and, for long sales, the units matrix; a child budget
   *     is taken and closed
   * @return the manifest of the published store and the readers' warnings
   * @throws InputFormatException for a malformed input file (file, line, column, found, expected)
   */
  public static IngestResult ingest(IngestOptions options, MemoryBudget budget) throws IOException {
    return ingest(options, StoreUpdate.Policy.REPLACE_WAITING, budget);
  }

  /**
   * As {@link #ingest(IngestOptions, MemoryBudget)}, treating an existing path and another writer as {@code policy}
   * says: a path holding anything but a lagmill store is always refused, before anything is read or changed.
   *
   * @throws org.lagmill.io.OutputRefusedException when the store path may not be written
   * @throws org.lagmill.store.StoreBusyException when another writer holds the store and the policy does not wait
   */
  public static IngestResult ingest(IngestOptions options, StoreUpdate.Policy policy, MemoryBudget budget)
      throws IOException {
    SalesInputs inputs = options.inputs();
    ColumnNames columns = inputs.columns();
    SalesFormat format = inputs.salesFormat().resolve(inputs.salesFile(), columns.dateColumn(),
        columns.unitsColumn());
    try (StoreUpdate update = StoreUpdate.begin(options.storeDir(), policy);
        MemoryBudget stage = budget.child("ingest")) {
      Path temp = update.buildingDir();
      List<String> warnings = new ArrayList<>();
      StoreManifest manifest;
      LongSalesRead[] longRead = new LongSalesRead[1];
      String[] periodNote = new String[1];
      try (StoreWriter writer = format == SalesFormat.LONG ? writeLong(options, temp, stage, longRead)
          : writeWide(options, temp, stage, periodNote)) {
        if (longRead[0] != null) {
          periodNote[0] = longRead[0].periodNote();
          if (longRead[0].unusualPeriod()) {
            int days = longRead[0].header().periodDays();
            warnings.add("the sales dates lie " + days + " days apart most often, so the store holds one value per "
                + days + " days; if these are daily (or weekly) sales with some days missing, give " + Setting.PERIOD
                + " day (or " + Setting.PERIOD + " week)");
          }
        }
        if (options.pricesSource() != null) {
          writer.writePrices(options.pricesSource().apply(writer.attributes()));
        } else if (inputs.pricesFile() != null) {
          CalendarAndPrices.writePrices(writer, inputs.pricesFile(), columns, warnings);
        }
        if (options.calendarSource() != null) {
          writer.writeCalendar(options.calendarSource().apply(writer.attributes()));
        } else if (inputs.calendarFile() != null) {
          CalendarAndPrices.writeCalendar(writer, inputs.calendarFile(), columns, warnings);
        }
        ClosureTable closures = inputs.closuresFile() == null ? ClosureTable.EMPTY
            : CalendarAndPrices.writeClosures(writer, inputs.closuresFile(), columns, warnings);
        if (longRead[0] != null) {
          warnings.addAll(longRead[0].warnings());
          writer.addZeroFilledItemDays(longRead[0].zeroFilledItemDays()
              - longRead[0].zeroFills().closedCount(closures, 0));
        }
        if (inputs.plan() != null) {
          CalendarAndPrices.writePlan(writer, inputs.plan(), columns, warnings);
        }
        manifest = writer.finish(sources(inputs));
      }
      // A new store's zero fills are all this run's.
      FillWarnings.add(manifest, manifest.fill().zeroFilledItemDays(), warnings);
      if (inputs.closuresFile() != null) {
        try (SalesStore built = SalesStore.openUnpublished(temp, stage.child("closed-day check"))) {
          ClosedDaySales.warn(built, warnings);
        }
      }
      update.commit();
      return new IngestResult(manifest, warnings, periodNote[0]);
    }
  }

  /** Streams a wide file into a new writer; the writer is closed when this fails. */
  private static StoreWriter writeWide(IngestOptions options, Path dir, MemoryBudget budget, String[] periodNote)
      throws IOException {
    SalesInputs inputs = options.inputs();
    try (WideSalesReader reader = WideSalesReader.open(inputs.salesFile(), inputs.columns().seriesIdColumn())) {
      int periodDays = widePeriodDays(options, reader, periodNote);
      StoreWriter writer = new StoreWriter(dir, reader.firstDate(), periodDays, reader.dayCount(),
          reader.attributeNames(), budget);
      try {
        copyRows(reader, writer);
        if (writer.seriesCount() == 0) {
          throw new InputFormatException(inputs.salesFile(), reader.lineNumber() + 1, 0,
              "expected at least one series row after the header, found none");
        }
        return writer;
      } catch (IOException | RuntimeException | Error e) {
        closeAfterFailure(writer, e);
        throw e;
      }
    }
  }

  /**
   * The period of a wide file: given (and checked against its date columns) or detected; notes which in
   * {@code periodNote[0]}.
   */
  static int widePeriodDays(IngestOptions options, WideSalesReader reader, String[] periodNote) {
    SalesInputs inputs = options.inputs();
    Integer given = options.periodDays();
    if (given != null && reader.dayCount() > 1 && reader.periodDays() != given) {
      throw new InputFormatException(inputs.salesFile(), 1, 0, "date columns " + reader.periodDays() + " days "
          + "apart: expected the step given with " + Setting.PERIOD + ", " + given + (given == 1 ? " day" : " days"));
    }
    int periodDays = given != null ? given : reader.periodDays();
    periodNote[0] = "period " + Periods.describe(periodDays) + ": " + (given != null ? "given with " + Setting.PERIOD
        : reader.dayCount() > 1 ? "detected from the step between the date columns" : "daily, the default for a "
            + "single date column");
    return periodDays;
  }

  /**
   * Reads a long file in its two passes into a new writer; the writer is closed when this fails. The read (with its
   * zero fills, counted once the closures are known) is left in {@code readOut[0]}.
   */
  private static StoreWriter writeLong(IngestOptions options, Path dir, MemoryBudget budget, LongSalesRead[] readOut)
      throws IOException {
    SalesInputs inputs = options.inputs();
    ColumnNames columns = inputs.columns();
    StoreWriterSink sink = new StoreWriterSink(inputs.salesFile(), dir, columns.seriesIdColumn(), budget);
    try {
      LongSalesRead read = LongSalesReader.read(inputs.salesFile(), columns.dateColumn(), columns.unitsColumn(),
          columns.seriesIdColumn(), inputs.missingRows(), options.periodDays() == null ? null
              : LongSalesReader.Frame.ofPeriod(options.periodDays()),
          budget, sink);
      readOut[0] = read;
      return sink.writer();
    } catch (UncheckedIOException e) {
      IOException cause = e.getCause();
      closeAfterFailure(sink.writer(), cause);
      throw cause;
    } catch (RuntimeException | Error e) {
      closeAfterFailure(sink.writer(), e);
      throw e;
    }
  }

  static void closeAfterFailure(StoreWriter writer, Throwable failure) {
    if (writer == null) {
      return;
    }
    try {
      writer.close();
    } catch (IOException | RuntimeException suppressed) {
      failure.addSuppressed(suppressed);
    }
  }

  /** Streams every row of a wide file into a writer, turning a duplicate series into an input error. */
  static void copyRows(WideSalesReader reader, StoreWriter writer) throws IOException {
    String[] attributeValues = new String[reader.attributeNames().size()];
    int[] units = new int[reader.dayCount()];
    while (reader.next(attributeValues, units)) {
      try {
        writer.addSeries(attributeValues, units);
      } catch (IllegalArgumentException e) {
        throw new InputFormatException(reader.file(), reader.lineNumber(), 0, e.getMessage(), e);
      }
    }
  }

  /** The input files given (sales, calendar, prices, closures, plan) with their sizes, as the manifest records them. */
  static List<StoreManifest.SourceFile> sources(SalesInputs inputs) throws IOException {
    List<StoreManifest.SourceFile> sources = new ArrayList<>();
    for (Path file : new Path[] {inputs.salesFile(), inputs.calendarFile(), inputs.pricesFile(),
        inputs.closuresFile(), inputs.plan() == null ? null : inputs.plan().file()}) {
      if (file != null) {
        sources.add(new StoreManifest.SourceFile(file.getFileName().toString(), Files.size(file)));
      }
    }
    return sources;
  }
}
