package org.lagmill.store;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteOrder;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.agrona.concurrent.UnsafeBuffer;
import org.lagmill.memory.MemoryBudget;

/**
 * A store directory opened read-only: every binary file is verified (size, magic, kind, version, CRC32C) and
 * memory-mapped, each mapped byte reserved from the budget given to {@link #open}.
 *
 * <p>The units file is mapped in windows of at most {@link #DEFAULT_WINDOW_BYTES}, each holding whole series, because
 * one mapping is limited to 2 GiB. Safe for concurrent reads while open; {@link #close()} unmaps everything and
 * releases the budget, after which every method throws {@link IllegalStateException}.
 */
public final class SalesStore implements SalesHistory, AutoCloseable {
  /** Largest span of units.bin one mapping window covers. */
  public static final long DEFAULT_WINDOW_BYTES = 1L << 30;
  /** Pointer re-reads when generations are replaced faster than a reader opens one (each open takes a commit). */
  private static final int MAX_OPEN_ATTEMPTS = 8;

  private final Path dir;
  private final StoreManifest manifest;
  private final int seriesCount;
  private final int dayCount;
  private final LocalDate firstDate;
  private final int periodDays;
  private final MappedRegion seriesTable;
  private final List<MappedRegion> unitsWindows;
  private final UnsafeBuffer[] seriesBuffer;
  private final int[] seriesColumnOffset;
  private final byte[] seriesWidthOrdinal;
  private final long[] seriesCountByWidth = new long[UnitsWidth.values().length];
  private final MappedSeriesAttributes attributes;
  private final MappedPriceTable prices;
  private final MappedDayCalendar calendar;
  private final ClosureTable closures;
  private final boolean anyClosures;
  private final PlanTable plan;
  private final long diskBytes;
  private AttributeNesting nesting;
  private volatile boolean closed;

  private SalesStore(Path dir, StoreManifest manifest, MemoryBudget budget, long maxWindowBytes,
      List<AutoCloseable> opened) throws IOException {
    this.dir = dir;
    this.manifest = manifest;
    this.seriesCount = manifest.seriesCount();
    this.dayCount = manifest.dayCount();
    this.firstDate = manifest.firstLocalDate();
    this.periodDays = manifest.periodDaysOrDaily();
    for (FileKind kind : FileKind.values()) {
      if (kind.optional() && manifest.file(kind.fileName()) == null) {
        continue;
      }
      StoreManifest.StoreFile entry = entry(dir, manifest, kind);
      StoreFileFormat.verify(dir.resolve(kind.fileName()), kind, entry.bytes(), entry.checksum());
    }
    Path seriesFile = dir.resolve(FileKind.SERIES.fileName());
    long seriesFileBytes = entry(dir, manifest, FileKind.SERIES).bytes();
    SeriesTableLayout.checkFileSize(seriesFile, seriesCount, seriesFileBytes);
    seriesTable = MappedRegion.map(seriesFile, 0, seriesFileBytes, budget);
    opened.add(seriesTable);
    UnsafeBuffer table = seriesTable.buffer();
    checkHeaderCount(seriesFile, "series count", seriesCount, table.getInt(SeriesTableLayout.SERIES_COUNT_OFFSET,
        ByteOrder.LITTLE_ENDIAN));
    checkHeaderCount(seriesFile, "day count", dayCount, table.getInt(SeriesTableLayout.DAY_COUNT_OFFSET,
        ByteOrder.LITTLE_ENDIAN));

    seriesBuffer = new UnsafeBuffer[seriesCount];
    seriesColumnOffset = new int[seriesCount];
    seriesWidthOrdinal = new byte[seriesCount];
    unitsWindows = new ArrayList<>();
    mapUnitsWindows(dir.resolve(FileKind.UNITS.fileName()), entry(dir, manifest, FileKind.UNITS).bytes(), table,
        maxWindowBytes, budget, opened);

    attributes = MappedSeriesAttributes.open(dir.resolve(FileKind.ATTRIBUTES.fileName()),
        entry(dir, manifest, FileKind.ATTRIBUTES).bytes(), seriesCount,
        manifest.shard() == null ? seriesCount : manifest.shard().sourceSeriesCount(), budget);
    opened.add(attributes);
    prices = MappedPriceTable.open(dir.resolve(FileKind.PRICES.fileName()),
        entry(dir, manifest, FileKind.PRICES).bytes(), seriesCount, budget);
    opened.add(prices);
    calendar = MappedDayCalendar.open(dir.resolve(FileKind.CALENDAR.fileName()),
        entry(dir, manifest, FileKind.CALENDAR).bytes(), budget);
    opened.add(calendar);
    if (manifest.file(FileKind.CLOSURES.fileName()) == null) {
      closures = ClosureTable.EMPTY;
    } else {
      MappedClosureTable mapped = MappedClosureTable.open(dir.resolve(FileKind.CLOSURES.fileName()),
          entry(dir, manifest, FileKind.CLOSURES).bytes(), seriesCount, budget);
      opened.add(mapped);
      closures = mapped;
    }
    anyClosures = !closures.isEmpty();
    if (manifest.file(FileKind.PLAN.fileName()) == null) {
      plan = PlanTable.EMPTY;
    } else {
      MappedPlanTable mapped = MappedPlanTable.open(dir.resolve(FileKind.PLAN.fileName()),
          entry(dir, manifest, FileKind.PLAN).bytes(), seriesCount, budget);
      opened.add(mapped);
      plan = mapped;
    }
    diskBytes = manifest.binaryBytes() + Files.size(dir.resolve(StoreManifest.FILE_NAME));
  }

  /**
   * Opens and verifies a store directory.
   *
   * @param budget charged with every mapped byte until {@link #close()}
   * @throws CorruptStoreException when a file fails its size, magic, kind, version or checksum check
   * @throws java.nio.file.NoSuchFileException when the directory holds no manifest
   */
  public static SalesStore open(Path dir, MemoryBudget budget) throws IOException {
    return open(dir, budget, DEFAULT_WINDOW_BYTES);
  }

  /** As {@link #open(Path, MemoryBudget)} with a smaller window, so tests can cross window boundaries. */
  static SalesStore open(Path storeDir, MemoryBudget budget, long maxWindowBytes) throws IOException {
    if (Files.isRegularFile(storeDir)) {
      // named as the user gave it, before the lock or pointer inside it is reached ("notes.txt/lock: Not a directory")
      throw new FileSystemException(storeDir.toString(), null, "is a file, not a store: give the folder ingest wrote");
    }
    if (!Files.exists(storeDir)) {
      // A store of the previous protocol, swapped by two renames, may survive only as its backup.
      StoreDirectories.recoverSiblings(storeDir);
    }
    tidyUp(storeDir);
    for (int attempt = 1;; attempt++) {
      Path dir = StoreGenerations.readableDir(storeDir);
      try {
        return openGeneration(dir, budget, maxWindowBytes);
      } catch (NoSuchFileException | UncheckedIOException e) {
        // A writer deleted the generation after committing a newer one; read the pointer again.
        boolean missing = e instanceof NoSuchFileException || e.getCause() instanceof NoSuchFileException;
        if (!missing || attempt >= MAX_OPEN_ATTEMPTS) {
          throw e;
        }
        if (dir.equals(StoreGenerations.readableDir(storeDir))) {
          if (!dir.equals(storeDir) && !Files.isDirectory(dir)) {
            throw new CorruptStoreException(storeDir.resolve(StoreGenerations.POINTER_FILE_NAME), "names generation "
                + dir.getFileName() + ", which does not exist");
          }
          throw e;
        }
      }
    }
  }

  /**
   * Removes what a writer that died left behind when no writer is running now, and says so. A reader never waits
   * for the lock and goes on without it when it is held or cannot be taken (a read-only store).
   */
  private static void tidyUp(Path storeDir) throws IOException {
    // Only writers of the generation layout leave anything to tidy, and each takes the lock file first.
    if (!Files.isRegularFile(storeDir.resolve(StoreLock.FILE_NAME))) {
      return;
    }
    try (StoreLock lock = StoreLock.tryAcquire(storeDir)) {
      if (lock != null) {
        for (String note : StoreGenerations.recover(lock)) {
          StoreNotices.tell("store " + storeDir + ": " + note);
        }
      }
    }
  }

  /**
   * Checks that {@code storeDir} holds a store whose manifest parses and whose every file passes its size, header
   * and checksum checks, without mapping anything.
   *
   * @throws CorruptStoreException naming the first file that fails
   */
  public static StoreManifest verifyFiles(Path storeDir) throws IOException {
    Path dir = StoreGenerations.readableDir(storeDir);
    StoreManifest manifest = StoreManifest.read(dir);
    for (FileKind kind : FileKind.values()) {
      if (kind.optional() && manifest.file(kind.fileName()) == null) {
        continue;
      }
      StoreManifest.StoreFile entry = entry(dir, manifest, kind);
      StoreFileFormat.verify(dir.resolve(kind.fileName()), kind, entry.bytes(), entry.checksum());
    }
    return manifest;
  }

  /**
   * Opens a generation a {@link StoreWriter} has just finished, before it is published: for checks that need the
   * stored units (ingest and append count sales on declared closed days). The caller closes it before publishing.
   */
  public static SalesStore openUnpublished(Path generationDir, MemoryBudget budget) throws IOException {
    return openGeneration(generationDir, budget, DEFAULT_WINDOW_BYTES);
  }

  private static SalesStore openGeneration(Path dir, MemoryBudget budget, long maxWindowBytes) throws IOException {
    StoreManifest manifest = StoreManifest.read(dir);
    List<AutoCloseable> opened = new ArrayList<>();
    try {
      return new SalesStore(dir, manifest, budget, maxWindowBytes, opened);
    } catch (IOException | RuntimeException | Error e) {
      for (int i = opened.size() - 1; i >= 0; i--) {
        try {
          opened.get(i).close();
        } catch (Exception suppressed) {
          e.addSuppressed(suppressed);
        }
      }
      throw e;
    }
  }

  private static StoreManifest.StoreFile entry(Path dir, StoreManifest manifest, FileKind kind) {
    StoreManifest.StoreFile entry = manifest.file(kind.fileName());
    if (entry == null) {
      throw new CorruptStoreException(dir.resolve(StoreManifest.FILE_NAME), "no entry for " + kind.fileName()
          + ": expected every store file listed, actual " + manifest.files().size() + " files listed");
    }
    return entry;
  }

  private static void checkHeaderCount(Path file, String what, int expected, int actual) {
    if (expected != actual) {
      throw new CorruptStoreException(file, "wrong " + what + ": expected " + expected + " (manifest), actual "
          + actual);
    }
  }

  /** Groups consecutive series into windows of at most maxWindowBytes so each series lies in exactly one window. */
  private void mapUnitsWindows(Path unitsFile, long unitsFileBytes, UnsafeBuffer table, long maxWindowBytes,
      MemoryBudget budget, List<AutoCloseable> opened) {
    if (maxWindowBytes < 1 || maxWindowBytes > MappedRegion.MAX_MAPPING_BYTES) {
      throw new IllegalArgumentException("maxWindowBytes must be in [1, " + MappedRegion.MAX_MAPPING_BYTES + "], got "
          + maxWindowBytes);
    }
    Path seriesFile = dir.resolve(FileKind.SERIES.fileName());
    long expectedOffset = UnitsLayout.FIRST_SERIES_OFFSET;
    int windowFirstSeries = 0;
    long windowStart = expectedOffset;
    for (int s = 0; s < seriesCount; s++) {
      int record = SeriesTableLayout.recordOffset(s);
      long offset = table.getLong(record + SeriesTableLayout.UNITS_OFFSET_FIELD, ByteOrder.LITTLE_ENDIAN);
      int bytesPerValue = table.getInt(record + SeriesTableLayout.WIDTH_FIELD, ByteOrder.LITTLE_ENDIAN);
      UnitsWidth width = UnitsWidth.ofBytesPerValue(bytesPerValue);
      if (width == null) {
        throw new CorruptStoreException(seriesFile, "series " + s + " has a bad width: expected 1, 2 or 4 bytes per "
            + "value, actual " + bytesPerValue);
      }
      if (offset != expectedOffset) {
        throw new CorruptStoreException(seriesFile, "series " + s + " does not follow the previous one: expected "
            + "units offset " + expectedOffset + ", actual " + offset);
      }
      checkSeriesRecord(seriesFile, s, table, record, width);
      seriesWidthOrdinal[s] = (byte) width.ordinal();
      seriesCountByWidth[width.ordinal()]++;
      long columnBytes = width.bytesRequired(dayCount);
      if (s > windowFirstSeries && offset + columnBytes - windowStart > maxWindowBytes) {
        mapWindow(unitsFile, windowFirstSeries, s, windowStart, offset, budget, opened);
        windowFirstSeries = s;
        windowStart = offset;
      }
      // Below maxWindowBytes (at most 2 GiB), so the offset inside the window fits an int.
      seriesColumnOffset[s] = (int) (offset - windowStart);
      expectedOffset = offset + columnBytes;
    }
    UnitsLayout.checkFileSize(unitsFile, expectedOffset - UnitsLayout.FIRST_SERIES_OFFSET, unitsFileBytes);
    if (seriesCount > windowFirstSeries) {
      mapWindow(unitsFile, windowFirstSeries, seriesCount, windowStart, expectedOffset, budget, opened);
    }
  }

  /** A record whose checksum passes can still hold values a broken writer or a forger put there. */
  private void checkSeriesRecord(Path seriesFile, int s, UnsafeBuffer table, int record, UnitsWidth width) {
    int firstSale = table.getInt(record + SeriesTableLayout.FIRST_SALE_FIELD, ByteOrder.LITTLE_ENDIAN);
    if (firstSale < NO_SALE || firstSale >= dayCount) {
      throw new CorruptStoreException(seriesFile, "series " + s + " has a first sale day outside the store: "
          + "expected -1 or a day index in [0, " + dayCount + "), actual " + firstSale);
    }
    int max = table.getInt(record + SeriesTableLayout.MAX_UNITS_FIELD, ByteOrder.LITTLE_ENDIAN);
    if (max < 0 || max > UnitsWidth.INT_MAX_UNITS || UnitsWidth.forMaxValue(max) != width) {
      throw new CorruptStoreException(seriesFile, "series " + s + " has a largest value that does not fit its "
          + "width: expected a value that needs " + width.bytesPerValue() + " bytes per value, actual " + max);
    }
  }

  private void mapWindow(Path unitsFile, int fromSeries, int toSeries, long startOffset, long endOffset,
      MemoryBudget budget, List<AutoCloseable> opened) {
    MappedRegion window = MappedRegion.map(unitsFile, startOffset, endOffset - startOffset, budget);
    opened.add(window);
    unitsWindows.add(window);
    for (int s = fromSeries; s < toSeries; s++) {
      seriesBuffer[s] = window.buffer();
    }
  }

  public StoreManifest manifest() {
    return manifest;
  }

  /** The store's fingerprint from its manifest; model files record it to refuse a different store. */
  public String fingerprint() {
    return manifest.fingerprint();
  }

  /** Bytes currently mapped (units windows, series table, attributes, prices, calendar). */
  public long offHeapBytes() {
    checkOpen();
    long total = seriesTable.byteCount() + attributes.offHeapBytes() + prices.offHeapBytes()
        + calendar.offHeapBytes() + (closures instanceof MappedClosureTable mapped ? mapped.offHeapBytes() : 0)
        + (plan instanceof MappedPlanTable mappedPlan ? mappedPlan.offHeapBytes() : 0);
    for (MappedRegion window : unitsWindows) {
      total += window.byteCount();
    }
    return total;
  }

  /** Approximate heap held: per-series lookup arrays and the decoded dictionaries. */
  public long heapBytes() {
    checkOpen();
    return 13L * seriesCount + attributes.heapBytes() + 64L * unitsWindows.size();
  }

  /** Bytes of the store on disk: binary files and manifest. */
  public long diskBytes() {
    return diskBytes;
  }

  /** Number of series stored in each width, indexed by {@link UnitsWidth#ordinal()}. */
  public long[] seriesCountByWidth() {
    checkOpen();
    return seriesCountByWidth.clone();
  }

  /** Width of one series' units column. */
  public UnitsWidth unitsWidth(int seriesIndex) {
    checkOpen();
    return UnitsWidth.values()[seriesWidthOrdinal[seriesIndex]];
  }

  public Path directory() {
    return dir;
  }

  @Override
  public int seriesCount() {
    checkOpen();
    return seriesCount;
  }

  @Override
  public int dayCount() {
    checkOpen();
    return dayCount;
  }

  @Override
  public LocalDate firstDate() {
    checkOpen();
    return firstDate;
  }

  @Override
  public int periodDays() {
    checkOpen();
    return periodDays;
  }

  @Override
  public int units(int seriesIndex, int dayIndex) {
    checkOpen();
    checkDays(seriesIndex, dayIndex, 1);
    if (anyClosures && closures.isClosed(seriesIndex, dayIndex)) {
      return UNKNOWN_UNITS;
    }
    UnsafeBuffer buffer = seriesBuffer[seriesIndex];
    int offset = seriesColumnOffset[seriesIndex];
    switch (seriesWidthOrdinal[seriesIndex]) {
      case 0 :
        return ByteUnitsReader.get(buffer, offset, dayIndex);
      case 1 :
        return ShortUnitsReader.get(buffer, offset, dayIndex);
      default :
        return IntUnitsReader.get(buffer, offset, dayIndex);
    }
  }

  /** One switch per call picks the width's decoder, whose loop has no branch on width. */
  @Override
  public void readUnits(int seriesIndex, int fromDayIndex, int[] dst, int dstOffset, int count) {
    readStoredUnits(seriesIndex, fromDayIndex, dst, dstOffset, count);
    if (anyClosures) {
      // A closed day reads as unknown for every consumer: no training row, no score, a gap in charts.
      closures.maskClosed(seriesIndex, fromDayIndex, dst, dstOffset, count);
    }
  }

  /**
   * As {@link #readUnits} but closed days read as stored, not as unknown: for copying a store's units to another
   * store that carries the same closures (a shard).
   */
  public void readStoredUnits(int seriesIndex, int fromDayIndex, int[] dst, int dstOffset, int count) {
    checkOpen();
    checkDays(seriesIndex, fromDayIndex, count);
    if (dstOffset < 0 || dstOffset + count > dst.length) {
      throw new IndexOutOfBoundsException("dst[" + dstOffset + ", " + (dstOffset + count) + ") outside an array of "
          + dst.length);
    }
    UnsafeBuffer buffer = seriesBuffer[seriesIndex];
    int offset = seriesColumnOffset[seriesIndex];
    switch (seriesWidthOrdinal[seriesIndex]) {
      case 0 -> ByteUnitsReader.read(buffer, offset, fromDayIndex, dst, dstOffset, count);
      case 1 -> ShortUnitsReader.read(buffer, offset, fromDayIndex, dst, dstOffset, count);
      default -> IntUnitsReader.read(buffer, offset, fromDayIndex, dst, dstOffset, count);
    }
  }

  private void checkDays(int seriesIndex, int fromDayIndex, int count) {
    if (seriesIndex < 0 || seriesIndex >= seriesCount) {
      throw new IndexOutOfBoundsException("seriesIndex " + seriesIndex + " outside [0, " + seriesCount + ")");
    }
    if (fromDayIndex < 0 || count < 0 || fromDayIndex + count > dayCount) {
      throw new IndexOutOfBoundsException("days [" + fromDayIndex + ", " + (fromDayIndex + count) + ") outside [0, "
          + dayCount + ")");
    }
  }

  @Override
  public int firstSaleDayIndex(int seriesIndex) {
    return seriesField(seriesIndex, SeriesTableLayout.FIRST_SALE_FIELD);
  }

  @Override
  public int maxUnits(int seriesIndex) {
    return seriesField(seriesIndex, SeriesTableLayout.MAX_UNITS_FIELD);
  }

  private int seriesField(int seriesIndex, int field) {
    checkOpen();
    checkDays(seriesIndex, 0, 0);
    return seriesTable.buffer().getInt(SeriesTableLayout.recordOffset(seriesIndex) + field, ByteOrder.LITTLE_ENDIAN);
  }

  @Override
  public SeriesAttributes attributes() {
    checkOpen();
    return attributes;
  }

  /** Detected from the attributes once, on first use (the manifest's {@code nesting} records the same forest). */
  @Override
  public synchronized AttributeNesting nesting() {
    checkOpen();
    if (nesting == null) {
      nesting = AttributeNesting.detect(attributes, seriesCount);
    }
    return nesting;
  }

  @Override
  public PriceTable prices() {
    checkOpen();
    return prices;
  }

  @Override
  public DayCalendar calendar() {
    checkOpen();
    return calendar;
  }

  @Override
  public ClosureTable closures() {
    checkOpen();
    return closures;
  }

  @Override
  public PlanTable plan() {
    checkOpen();
    return plan;
  }

  private void checkOpen() {
    if (closed) {
      throw new IllegalStateException("store " + dir + " is closed");
    }
  }

  /** Unmaps every file and releases the budget; idempotent. */
  @Override
  public synchronized void close() {
    if (closed) {
      return;
    }
    closed = true;
    if (plan instanceof MappedPlanTable mappedPlan) {
      mappedPlan.close();
    }
    if (closures instanceof MappedClosureTable mapped) {
      mapped.close();
    }
    calendar.close();
    prices.close();
    attributes.close();
    for (MappedRegion window : unitsWindows) {
      window.close();
    }
    seriesTable.close();
  }
}
