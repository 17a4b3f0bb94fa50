package org.lagmill.ingest;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.AttributeDictionaryBuilder;
import org.lagmill.store.AttributeNesting;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.ShardAssignment;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreSharding;
import org.lagmill.store.StoreUpdate;
import org.lagmill.store.StoreWriter;

/**
 * Builds only shard {@code part} of {@code partCount} straight from the input files: the store {@code lagmill shard}
 * would write for that part from a store of the same files. Every series of the sales file is read, but only the
 * series whose value of the shard attribute hashes to {@code part} ({@link ShardAssignment}, the one rule) are
 * written, in file order; the attribute dictionaries and the nesting are those of every series (so a value has the
 * same code in every shard), and prices, closures, the plan and the calendar are matched against every series and
 * then kept for this part's series ({@link StoreSharding}'s selections), so each reader's warnings are those of the
 * whole input.
 *
 * <p>Wide sales are read twice (every row's attributes, then this part's units), holding one row at a time; long sales
 * once, as {@link StoreIngest} does, plus this part's units on the heap until the dictionaries are known.
 */
public final class ShardIngest {
  /** Text a shard's {@link StoreManifest.Shard#sourceName} starts with when it was ingested from input files. */
  public static final String INPUT_SOURCE_PREFIX = "input ";

  private ShardIngest() {}

  /**
   * Which shard to build.
   *
   * @param part 0-based, below {@code partCount}
   * @param partCount in {@code [1, ShardAssignment.MAX_PART_COUNT]}
   * @param attribute the attribute whose value picks each series' shard
   */
  public record Request(int part, int partCount, String attribute) {
    /** {@code K/N}; nine digits at most, so both parse as int. */
    private static final Pattern PART_OF_COUNT = Pattern.compile("(\\d{1,9})/(\\d{1,9})");

    public Request {
      new ShardAssignment(partCount);
      if (part < 0 || part >= partCount) {
        throw new InvalidRequestException(Setting.SHARD + " part " + part + " is outside 0.." + (partCount - 1)
            + " for " + partCount + " parts");
      }
      if (attribute == null || attribute.isEmpty()) {
        throw new InvalidRequestException(Setting.SHARD + " needs " + Setting.SHARD_ATTRIBUTE
            + ", the attribute whose value picks each series' shard");
      }
    }

    /**
     * The shard a request names as text {@code K/N} (part K from 0 of N) with the attribute, or null when neither is
     * given (every series).
     *
     * @throws InvalidRequestException when the attribute comes without the shard, or the text is not {@code K/N}
     */
    public static Request parse(String shard, String attribute) {
      if (shard == null) {
        if (attribute != null) {
          throw new InvalidRequestException(Setting.SHARD_ATTRIBUTE + " " + attribute + " picks the shard of each "
              + "series for " + Setting.SHARD + " K/N; give " + Setting.SHARD + " too, or leave both out to ingest "
              + "every series");
        }
        return null;
      }
      Matcher m = PART_OF_COUNT.matcher(shard);
      if (!m.matches()) {
        throw new InvalidRequestException(Setting.SHARD + " '" + shard + "': expected K/N, shard K (from 0) of N, "
            + "e.g. 0/3");
      }
      return new Request(Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)), attribute);
    }
  }

  /**
   * @throws InvalidRequestException for an unknown attribute, or when no series falls in the part (nothing is written)
   * @throws InputFormatException for a malformed input file, as a whole ingest reports it
   */
  public static IngestResult ingest(IngestOptions options, Request request, StoreUpdate.Policy policy,
      MemoryBudget budget) throws IOException {
    SalesInputs inputs = options.inputs();
    ColumnNames columns = inputs.columns();
    SalesFormat format = inputs.salesFormat().resolve(inputs.salesFile(), columns.dateColumn(),
        columns.unitsColumn());
    if (options.pricesSource() != null || options.calendarSource() != null) {
      throw new IllegalArgumentException("a shard ingest reads prices and the calendar from files");
    }
    String sourceName = INPUT_SOURCE_PREFIX + org.lagmill.io.PathNames.nameOf(inputs.salesFile()) + " crc32c "
        + crc32c(inputs.salesFile());
    try (StoreUpdate update = StoreUpdate.begin(options.storeDir(), policy);
        MemoryBudget stage = budget.child("ingest")) {
      List<String> warnings = new ArrayList<>();
      String[] periodNote = new String[1];
      LongSalesRead[] longRead = new LongSalesRead[1];
      Selection selection = new Selection();
      StoreManifest manifest;
      try (StoreWriter writer = format == SalesFormat.LONG
          ? writeLong(options, request, update.buildingDir(), stage, selection, longRead)
          : writeWide(options, request, update.buildingDir(), stage, selection, periodNote)) {
        AttributeDictionaryBuilder whole = selection.whole;
        int[] kept = selection.keptSeries();
        writer.recordShard(new StoreManifest.Shard(request.part(), request.partCount(), request.attribute(),
            ShardAssignment.HASH_NAME, sourceName, whole.seriesCount()),
            AttributeNesting.detect(whole, whole.seriesCount()).parents());
        if (longRead[0] != null) {
          periodNote[0] = longRead[0].periodNote();
        }
        CalendarAndPrices.Scope scope = new CalendarAndPrices.Scope(whole, whole.seriesCount(), kept);
        if (inputs.pricesFile() != null) {
          CalendarAndPrices.writePrices(writer, scope, inputs.pricesFile(), columns, warnings);
        }
        if (inputs.calendarFile() != null) {
          CalendarAndPrices.writeCalendar(writer, scope, inputs.calendarFile(), columns, warnings);
        }
        ClosureTable closures = inputs.closuresFile() == null ? ClosureTable.EMPTY
            : CalendarAndPrices.writeClosures(writer, scope, inputs.closuresFile(), columns, warnings);
        if (longRead[0] != null) {
          warnings.addAll(longRead[0].warnings());
          ZeroFills fills = longRead[0].zeroFills().restrictedTo(kept);
          writer.addZeroFilledItemDays(fills.count() - fills.closedCount(closures, 0));
        }
        if (inputs.plan() != null) {
          CalendarAndPrices.writePlan(writer, scope, inputs.plan(), warnings);
        }
        manifest = writer.finish(StoreIngest.sources(inputs));
      }
      FillWarnings.add(manifest, manifest.fill().zeroFilledItemDays(), warnings);
      update.commit();
      return new IngestResult(manifest, warnings, periodNote[0]);
    }
  }

  /** Every series of the input (attributes only) and which of them this part keeps, in file order. */
  private static final class Selection {
    private AttributeDictionaryBuilder whole;
    private ShardAssignment assignment;
    private int attributeIndex;
    private int part;
    private final it.unimi.dsi.fastutil.ints.IntArrayList kept = new it.unimi.dsi.fastutil.ints.IntArrayList();

    void begin(List<String> attributeNames, Request request, Path salesFile) {
      whole = new AttributeDictionaryBuilder(attributeNames);
      assignment = new ShardAssignment(request.partCount());
      part = request.part();
      attributeIndex = attributeNames.indexOf(request.attribute());
      if (attributeIndex < 0) {
        throw new InvalidRequestException("unknown attribute '" + request.attribute() + "' for "
            + Setting.SHARD_ATTRIBUTE + "; allowed: " + attributeNames + " (the attribute columns of " + salesFile
            + ")");
      }
    }

    /** Registers one series; true when this part keeps it. */
    boolean admit(String[] attributeValues) {
      whole.add(attributeValues);
      if (assignment.partOf(attributeValues[attributeIndex]) != part) {
        return false;
      }
      kept.add(whole.seriesCount() - 1);
      return true;
    }

    int[] keptSeries() {
      return kept.toIntArray();
    }

    void requireSeries(Request request) {
      if (kept.isEmpty()) {
        throw new InvalidRequestException("shard " + request.part() + " of " + request.partCount() + " would hold no"
            + " series: the " + whole.seriesCount() + " series take " + whole.cardinality(attributeIndex)
            + " values of '" + request.attribute() + "' and none of them hashes to shard " + request.part()
            + "; nothing was written (hint: use fewer parts, or shard by an attribute with more values)");
      }
    }
  }

  /** Pass 1 registers every row's attributes; pass 2 writes this part's rows. The writer is closed on failure. */
  private static StoreWriter writeWide(IngestOptions options, Request request, Path dir, MemoryBudget budget,
      Selection selection, String[] periodNote) throws IOException {
    SalesInputs inputs = options.inputs();
    int periodDays;
    List<String> names;
    java.time.LocalDate firstDate;
    int dayCount;
    try (WideSalesReader reader = WideSalesReader.open(inputs.salesFile(), inputs.columns().seriesIdColumn())) {
      periodDays = StoreIngest.widePeriodDays(options, reader, periodNote);
      names = reader.attributeNames();
      firstDate = reader.firstDate();
      dayCount = reader.dayCount();
      selection.begin(names, request, inputs.salesFile());
      String[] attributeValues = new String[names.size()];
      int[] units = new int[dayCount];
      while (reader.next(attributeValues, units)) {
        try {
          selection.admit(attributeValues);
        } catch (IllegalArgumentException e) {
          throw new InputFormatException(reader.file(), reader.lineNumber(), 0, e.getMessage(), e);
        }
      }
      if (selection.whole.seriesCount() == 0) {
        throw new InputFormatException(inputs.salesFile(), reader.lineNumber() + 1, 0,
            "expected at least one series row after the header, found none");
      }
    }
    selection.requireSeries(request);
    StoreWriter writer = new StoreWriter(dir, firstDate, periodDays, dayCount, names, budget);
    try (WideSalesReader reader = WideSalesReader.open(inputs.salesFile(), inputs.columns().seriesIdColumn())) {
      writer.seedAttributeValues(selection.whole);
      int[] kept = selection.keptSeries();
      String[] attributeValues = new String[names.size()];
      int[] units = new int[dayCount];
      int row = 0;
      int next = 0;
      while (next < kept.length && reader.next(attributeValues, units)) {
        if (row++ == kept[next]) {
          writer.addSeries(attributeValues, units);
          next++;
        }
      }
      if (next != kept.length) {
        throw new IOException(inputs.salesFile() + " changed while it was read: " + next + " of " + kept.length
            + " series of the shard found in the second pass");
      }
      return writer;
    } catch (IOException | RuntimeException | Error e) {
      StoreIngest.closeAfterFailure(writer, e);
      throw e;
    }
  }

  /** Reads long sales once, keeping this part's series until the dictionaries are known. */
  private static StoreWriter writeLong(IngestOptions options, Request request, Path dir, MemoryBudget budget,
      Selection selection, LongSalesRead[] readOut) throws IOException {
    SalesInputs inputs = options.inputs();
    ColumnNames columns = inputs.columns();
    StoreWriterSink writerSink = new StoreWriterSink(inputs.salesFile(), dir, columns.seriesIdColumn(), budget);
    List<String[]> keptValues = new ArrayList<>();
    List<int[]> keptUnits = new ArrayList<>();
    SeriesSink sink = new SeriesSink() {
      @Override
      public void begin(LongSalesHeader header) {
        writerSink.begin(header);
        selection.begin(writerSink.writer().attributes().attributeNames(), request, inputs.salesFile());
      }

      @Override
      public void accept(String[] attributeValues, int[] units) {
        boolean keep;
        try {
          keep = selection.admit(attributeValues);
        } catch (IllegalArgumentException e) {
          throw new InputFormatException(inputs.salesFile(), 0, 0, e.getMessage(), e);
        }
        if (keep) {
          keptValues.add(attributeValues.clone());
          keptUnits.add(units.clone());
        }
      }
    };
    try {
      readOut[0] = LongSalesReader.read(inputs.salesFile(), columns.dateColumn(), columns.unitsColumn(),
          columns.seriesIdColumn(), inputs.missingRows(), options.periodDays() == null ? null
              : LongSalesReader.Frame.ofPeriod(options.periodDays()),
          budget, sink);
      selection.requireSeries(request);
      StoreWriter writer = writerSink.writer();
      writer.seedAttributeValues(selection.whole);
      for (int i = 0; i < keptValues.size(); i++) {
        writer.addSeries(keptValues.get(i), keptUnits.get(i));
      }
      return writer;
    } catch (UncheckedIOException e) {
      IOException cause = e.getCause();
      StoreIngest.closeAfterFailure(writerSink.writer(), cause);
      throw cause;
    } catch (IOException | RuntimeException | Error e) {
      StoreIngest.closeAfterFailure(writerSink.writer(), e);
      throw e;
    }
  }

  /** CRC-32C of the file's bytes, in hex: names the input every shard of one split was ingested from. */
  static String crc32c(Path file) throws IOException {
    java.util.zip.CRC32C crc = new java.util.zip.CRC32C();
    byte[] buffer = new byte[1 << 16];
    try (InputStream in = Files.newInputStream(file)) {
      for (int n = in.read(buffer); n > 0; n = in.read(buffer)) {
        crc.update(buffer, 0, n);
      }
    }
    return String.format(java.util.Locale.ROOT, "%08x", crc.getValue());
  }
}
