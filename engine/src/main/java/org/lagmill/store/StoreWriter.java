package org.lagmill.store;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.LongArrayList;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.lagmill.memory.MemoryBudget;

/**
 * Writes a store directory series by series. Units are streamed to {@code units.bin} as each series is added, so the
 * heap holds only the attribute dictionaries, one code per series and attribute, and a 20-byte table entry per series.
 *
 * <p>Order: {@link #addSeries} for every series, then optionally {@link #writePrices} and {@link #writeCalendar}
 * (both need the full list of series), then {@link #finish} once. Not thread-safe. {@link #close()} without
 * {@link #finish} leaves an unfinished directory that the caller deletes (ingest builds in a temporary directory).
 */
public final class StoreWriter implements AutoCloseable {
  /** Largest number of days a store holds: keeps one INT column under 1 GiB, so it fits one mapping window. */
  public static final int MAX_DAY_COUNT = 1 << 28;

  private final Path dir;
  private final LocalDate firstDate;
  private final int periodDays;
  private final int dayCount;
  private final MemoryBudget budget;
  private final AttributeDictionaryBuilder attributes;
  private final ChecksummedFileWriter units;
  private final LongArrayList unitsOffsets = new LongArrayList();
  private final IntArrayList bytesPerValue = new IntArrayList();
  private final IntArrayList firstSaleDays = new IntArrayList();
  private final IntArrayList maxUnits = new IntArrayList();
  private final List<StoreManifest.StoreFile> files = new ArrayList<>();
  private long unknownItemDays;
  /**
   * Each series' runs of unknown days (first, last pairs), so that closed days that were unknown anyway are counted
   * once, as closed; runs are few per series (before a first row, after a last one), so this stays small.
   */
  private final IntArrayList unknownRuns = new IntArrayList();
  /** End (exclusive) in {@link #unknownRuns} of each series' runs. */
  private final IntArrayList unknownRunsEnd = new IntArrayList();
  private int unknownRunStart = -1;
  private long zeroFilledItemDays;
  private boolean seriesSealed;
  private boolean pricesWritten;
  private boolean calendarWritten;
  private boolean closuresWritten;
  private boolean planWritten;
  private long closedItemDays;
  private long partlyClosedItemPeriods;
  private boolean finished;
  private boolean closed;
  private Map<String, String> recordedNesting;
  private StoreManifest.Shard shard;

  /**
   * @param dir directory to write into; created when missing, must hold no store files
   * @param dayCount days per series, in {@code [1, MAX_DAY_COUNT]}
   * @param attributeNames distinct attribute names; a {@code series_id} attribute names each series
   * @param budget charged for the writer's small direct I/O buffers
   */
  public StoreWriter(Path dir, LocalDate firstDate, int dayCount, List<String> attributeNames, MemoryBudget budget)
      throws IOException {
    this(dir, firstDate, Periods.DAILY, dayCount, attributeNames, budget);
  }

  /**
   * A store of {@code periodDays} days per index (7 weekly); see {@link Periods}. A daily store records no period in
   * its manifest.
   *
   * @param dayCount periods per series, in {@code [1, MAX_DAY_COUNT]}
   */
  public StoreWriter(Path dir, LocalDate firstDate, int periodDays, int dayCount, List<String> attributeNames,
      MemoryBudget budget) throws IOException {
    Periods.requireValid(periodDays);
    if (dayCount < 1 || dayCount > MAX_DAY_COUNT) {
      throw new IllegalArgumentException("dayCount must be in [1, " + MAX_DAY_COUNT + "], got " + dayCount);
    }
    this.dir = dir;
    this.firstDate = firstDate;
    this.periodDays = periodDays;
    this.dayCount = dayCount;
    this.budget = budget;
    this.attributes = new AttributeDictionaryBuilder(attributeNames);
    Files.createDirectories(dir);
    this.units = new ChecksummedFileWriter(dir.resolve(FileKind.UNITS.fileName()), FileKind.UNITS, budget);
  }

  public int dayCount() {
    return dayCount;
  }

  /** Date of day index 0. */
  public LocalDate firstDate() {
    return firstDate;
  }

  /** Days per period of the store being written. */
  public int periodDays() {
    return periodDays;
  }

  public int seriesCount() {
    return attributes.seriesCount();
  }

  /** The series added so far; a price or calendar reader maps its keys to series through it. */
  public SeriesAttributes attributes() {
    return attributes;
  }

  /**
   * Codes every attribute value as {@code source} does, before the first series (a shard keeps its whole store's
   * dictionaries, so a value's code, and with it a categorical feature or a calendar row, is the same in every
   * shard). Values no series of this store takes stay in the dictionaries.
   */
  public void seedAttributeValues(SeriesAttributes source) {
    checkWritable();
    attributes.seed(source);
  }

  /**
   * Records this store as one shard of a split: the manifest's {@code shard}, and the whole store's nesting as its
   * {@code nesting} instead of the one found in this shard's series alone.
   */
  public void recordShard(StoreManifest.Shard shard, Map<String, String> wholeStoreNesting) {
    checkWritable();
    this.shard = shard;
    this.recordedNesting = wholeStoreNesting;
  }

  /**
   * Appends one series.
   *
   * @param attributeValues one value per attribute name, in the order given to the constructor
   * @param units {@code units[0 .. dayCount)}: non-negative units or {@link SalesHistory#UNKNOWN_UNITS}
   * @throws IllegalArgumentException for a duplicate series id (values joined by '/' when there is no series_id), a
   *     units value below -1, or a wrong array length
   */
  public void addSeries(String[] attributeValues, int[] units) throws IOException {
    checkWritable();
    if (seriesSealed) {
      throw new IllegalStateException("series cannot be added after prices or the calendar were written");
    }
    if (units.length < dayCount) {
      throw new IllegalArgumentException("units needs at least " + dayCount + " days, got " + units.length);
    }
    int max = 0;
    int firstSale = SalesHistory.NO_SALE;
    for (int d = 0; d < dayCount; d++) {
      int u = units[d];
      if (u < SalesHistory.UNKNOWN_UNITS) {
        throw new IllegalArgumentException("units must be >= 0 or UNKNOWN_UNITS (-1), got " + u + " on day " + d);
      }
      if (u > 0 && firstSale < 0) {
        firstSale = d;
      }
      if (u == SalesHistory.UNKNOWN_UNITS) {
        unknownItemDays++;
        if (unknownRunStart < 0) {
          unknownRunStart = d;
        }
      } else if (unknownRunStart >= 0) {
        unknownRuns.add(unknownRunStart);
        unknownRuns.add(d - 1);
        unknownRunStart = -1;
      }
      max = Math.max(max, u);
    }
    if (unknownRunStart >= 0) {
      unknownRuns.add(unknownRunStart);
      unknownRuns.add(dayCount - 1);
      unknownRunStart = -1;
    }
    unknownRunsEnd.add(unknownRuns.size());
    UnitsWidth width = UnitsWidth.forMaxValue(max);
    attributes.add(attributeValues);
    unitsOffsets.add(this.units.position());
    bytesPerValue.add(width.bytesPerValue());
    firstSaleDays.add(firstSale);
    maxUnits.add(max);
    switch (width) {
      case BYTE -> writeBytes(units);
      case SHORT -> writeShorts(units);
      case INT -> writeInts(units);
      default -> throw new AssertionError(width);
    }
  }

  // Unknown (-1) narrows to the all-ones sentinel of each width by plain truncation.
  private void writeBytes(int[] values) throws IOException {
    for (int d = 0; d < dayCount;) {
      ByteBuffer out = units.ensure(1);
      int n = Math.min(out.remaining(), dayCount - d);
      for (int i = 0; i < n; i++) {
        out.put((byte) values[d + i]);
      }
      d += n;
    }
  }

  private void writeShorts(int[] values) throws IOException {
    for (int d = 0; d < dayCount;) {
      ByteBuffer out = units.ensure(2);
      int n = Math.min(out.remaining() / 2, dayCount - d);
      for (int i = 0; i < n; i++) {
        out.putShort((short) values[d + i]);
      }
      d += n;
    }
  }

  private void writeInts(int[] values) throws IOException {
    for (int d = 0; d < dayCount;) {
      ByteBuffer out = units.ensure(4);
      int n = Math.min(out.remaining() / 4, dayCount - d);
      for (int i = 0; i < n; i++) {
        out.putInt(values[d + i]);
      }
      d += n;
    }
  }

  /**
   * Records item-days the reader filled with zero (days with no row in long sales); the manifest's {@code fill}
   * reports the total.
   */
  public void addZeroFilledItemDays(long itemDays) {
    checkWritable();
    if (itemDays < 0) {
      throw new IllegalArgumentException("itemDays must be >= 0, got " + itemDays);
    }
    zeroFilledItemDays += itemDays;
  }

  /** Writes the price change points of every series added (by series index); call after the last series. */
  public void writePrices(PriceTable prices) throws IOException {
    checkWritable();
    if (pricesWritten) {
      throw new IllegalStateException("prices were already written");
    }
    seriesSealed = true;
    addFile(PricesFileWriter.write(dir.resolve(FileKind.PRICES.fileName()), prices, seriesCount(), budget));
    pricesWritten = true;
  }

  /** Writes the day calendar, aligned to day 0 of this store; call after the last series. */
  public void writeCalendar(DayCalendar calendar) throws IOException {
    checkWritable();
    if (calendarWritten) {
      throw new IllegalStateException("the calendar was already written");
    }
    seriesSealed = true;
    addFile(CalendarFileWriter.write(dir.resolve(FileKind.CALENDAR.fileName()), calendar, attributes, budget));
    calendarWritten = true;
  }

  /**
   * Writes the closed day ranges of every series added (by series index); call after the last series. The manifest's
   * {@code fill} counts the closed item-days within the sales days.
   */
  public void writeClosures(ClosureTable closures) throws IOException {
    writeClosures(closures, 0);
  }

  /**
   * As {@link #writeClosures(ClosureTable)}, recording how many item-periods the closures cover only in part (see
   * {@link StoreManifest.Fill#partlyClosedItemDays()}).
   */
  public void writeClosures(ClosureTable closures, long partlyClosedItemPeriods) throws IOException {
    if (partlyClosedItemPeriods < 0) {
      throw new IllegalArgumentException("partlyClosedItemPeriods must be >= 0, got " + partlyClosedItemPeriods);
    }
    checkWritable();
    if (closuresWritten) {
      throw new IllegalStateException("closures were already written");
    }
    seriesSealed = true;
    addFile(ClosuresFileWriter.write(dir.resolve(FileKind.CLOSURES.fileName()), closures, seriesCount(), budget));
    closedItemDays = closures.closedItemDays(seriesCount(), dayCount);
    unknownItemDays -= closedUnknownItemDays(closures);
    this.partlyClosedItemPeriods = partlyClosedItemPeriods;
    closuresWritten = true;
  }

  /** Item-days both unknown in the units and closed: counted as closed only. */
  private long closedUnknownItemDays(ClosureTable closures) {
    if (closures.isEmpty()) {
      return 0;
    }
    long total = 0;
    for (int s = 0; s < seriesCount(); s++) {
      int run = s == 0 ? 0 : unknownRunsEnd.getInt(s - 1);
      int runEnd = unknownRunsEnd.getInt(s);
      int k = 0;
      int rangeCount = closures.rangeCount(s);
      // Both lists are sorted and disjoint within themselves: walk them together.
      while (run < runEnd && k < rangeCount) {
        int first = Math.max(unknownRuns.getInt(run), closures.firstDayIndex(s, k));
        int last = Math.min(unknownRuns.getInt(run + 1), closures.lastDayIndex(s, k));
        total += Math.max(0, last - first + 1);
        if (unknownRuns.getInt(run + 1) < closures.lastDayIndex(s, k)) {
          run += 2;
        } else {
          k++;
        }
      }
    }
    return total;
  }

  /**
   * Writes the plan of every series added (by series index) into {@code plan.bin}; call after the last series. An
   * empty plan writes no file, so a store without a plan keeps exactly the files it had before plans existed.
   */
  public void writePlan(PlanTable plan) throws IOException {
    checkWritable();
    if (planWritten) {
      throw new IllegalStateException("the plan was already written");
    }
    seriesSealed = true;
    if (!plan.isEmpty()) {
      addFile(PlanFileWriter.write(dir.resolve(FileKind.PLAN.fileName()), plan, seriesCount(), budget));
    }
    planWritten = true;
  }

  /**
   * Writes the remaining files, their footers and {@code manifest.json}; empty prices and calendar when none were
   * written.
   *
   * @param sources the input files the store is built from, recorded with their sizes
   * @return the manifest written
   */
  public StoreManifest finish(List<StoreManifest.SourceFile> sources) throws IOException {
    checkWritable();
    seriesSealed = true;
    if (!pricesWritten) {
      writePrices(PriceTable.EMPTY);
    }
    if (!calendarWritten) {
      writeCalendar(DayCalendar.EMPTY);
    }
    if (!closuresWritten) {
      writeClosures(ClosureTable.EMPTY);
    }
    units.finish();
    addFile(units);
    addFile(writeSeriesTable());
    addFile(attributes.write(dir.resolve(FileKind.ATTRIBUTES.fileName()), budget));
    List<StoreManifest.StoreFile> ordered = new ArrayList<>();
    for (FileKind kind : FileKind.values()) {
      for (StoreManifest.StoreFile f : files) {
        if (f.name().equals(kind.fileName())) {
          ordered.add(f);
        }
      }
    }
    StoreManifest manifest = new StoreManifest(StoreManifest.FORMAT_VERSION_CURRENT, firstDate.toString(), dayCount,
        periodDays == Periods.DAILY ? null : periodDays, seriesCount(), attributes.attributeNames(), sources, ordered,
        StoreManifest.fingerprintOf(ordered),
        new StoreManifest.Fill(zeroFilledItemDays, unknownItemDays, closedItemDays, partlyClosedItemPeriods),
        recordedNesting != null ? recordedNesting : AttributeNesting.detect(attributes, seriesCount()).parents(),
        shard);
    manifest.write(dir);
    finished = true;
    close();
    return manifest;
  }

  private ChecksummedFileWriter writeSeriesTable() throws IOException {
    ChecksummedFileWriter out = new ChecksummedFileWriter(dir.resolve(FileKind.SERIES.fileName()), FileKind.SERIES,
        budget);
    try {
      out.putInt(seriesCount());
      out.putInt(dayCount);
      for (int s = 0; s < seriesCount(); s++) {
        out.putLong(unitsOffsets.getLong(s));
        out.putInt(bytesPerValue.getInt(s));
        out.putInt(firstSaleDays.getInt(s));
        out.putInt(maxUnits.getInt(s));
      }
      out.finish();
      return out;
    } finally {
      out.close();
    }
  }

  private void addFile(ChecksummedFileWriter written) {
    files.add(new StoreManifest.StoreFile(written.file().getFileName().toString(), written.fileBytes(),
        String.format("%08x", written.checksum())));
  }

  private void checkWritable() {
    if (finished || closed) {
      throw new IllegalStateException("store writer for " + dir + " is " + (finished ? "finished" : "closed"));
    }
  }

  /** Releases the open file and buffers; idempotent. Does not delete an unfinished directory. */
  @Override
  public void close() throws IOException {
    if (!closed) {
      closed = true;
      units.close();
    }
  }
}
