package org.lagmill.ingest;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.StoreDirectories;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreWriter;

/**
 * Builds a store from input files: streams the wide sales file row by row into a {@link StoreWriter} in a temporary
 * sibling of the target, then publishes it atomically. The heap holds one row buffer plus the attribute
 * dictionaries, whatever the file size. A failure leaves any existing store untouched and no temporary directory.
 */
public final class StoreIngest {
  private StoreIngest() {}

  /**
   * @param budget charged for the writer's direct I/O buffers; a child budget is taken and closed
   * @return the manifest of the published store
   * @throws InputFormatException for a malformed input file (file, line, column, found, expected)
   */
  public static StoreManifest ingest(IngestOptions options, MemoryBudget budget) throws IOException {
    Path temp = StoreDirectories.createTempSibling(options.storeDir());
    try (MemoryBudget stage = budget.child("ingest")) {
      StoreManifest manifest;
      try (WideSalesReader reader = WideSalesReader.open(options.salesFile(), options.seriesIdColumn());
          StoreWriter writer = new StoreWriter(temp, reader.firstDate(), reader.dayCount(), reader.attributeNames(),
              stage)) {
        copyRows(reader, writer);
        if (writer.seriesCount() == 0) {
          throw new InputFormatException(options.salesFile(), reader.lineNumber() + 1, 0,
              "expected at least one series row after the header, found none");
        }
        // Hook for the prices file: the lead wires PriceFileReader here as pricesSource = attrs -> read(file, attrs).
        if (options.pricesSource() != null) {
          writer.writePrices(options.pricesSource().apply(writer.attributes()));
        } else if (options.pricesFile() != null) {
          throw new IllegalArgumentException("--prices " + options.pricesFile() + " given but no price reader is "
              + "wired in this build; pass a PriceTable through IngestOptions.withPrices");
        }
        // Hook for the calendar file: CalendarFileReader plugs in here as calendarSource.
        if (options.calendarSource() != null) {
          writer.writeCalendar(options.calendarSource().apply(writer.attributes()));
        } else if (options.calendarFile() != null) {
          throw new IllegalArgumentException("--calendar " + options.calendarFile() + " given but no calendar reader "
              + "is wired in this build; pass a DayCalendar through IngestOptions.withCalendar");
        }
        manifest = writer.finish(sources(options));
      }
      StoreDirectories.publish(temp, options.storeDir());
      return manifest;
    } catch (IOException | RuntimeException | Error e) {
      try {
        StoreDirectories.deleteRecursively(temp);
      } catch (IOException suppressed) {
        e.addSuppressed(suppressed);
      }
      throw e;
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

  static List<StoreManifest.SourceFile> sources(IngestOptions options) throws IOException {
    List<StoreManifest.SourceFile> sources = new ArrayList<>();
    for (Path file : new Path[] {options.salesFile(), options.calendarFile(), options.pricesFile()}) {
      if (file != null) {
        sources.add(new StoreManifest.SourceFile(file.getFileName().toString(), Files.size(file)));
      }
    }
    return sources;
  }
}
