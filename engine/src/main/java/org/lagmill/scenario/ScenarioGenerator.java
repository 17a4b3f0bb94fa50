package org.lagmill.scenario;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.Deflater;
import java.util.zip.GZIPOutputStream;

/**
 * Writes the invented scenario as three CSV files: {@code sales.csv} (wide: six attribute cells, then one unit count
 * per day), {@code calendar.csv} (events and per-region paydays through the future days) and {@code prices.csv} (price
 * change points). Series are generated and written one at a time, so memory stays flat whatever the series count.
 *
 * <p>Each file is written under a temporary name in the output folder and renamed when complete, so a failed run
 * leaves no half-written file. Equal specs give byte-identical files: every series draws from its own stream seeded by
 * (seed, series index). Not thread-safe across calls writing the same folder.
 */
public final class ScenarioGenerator {
  public static final String SALES_FILE = "sales.csv";
  public static final String CALENDAR_FILE = "calendar.csv";
  public static final String PRICES_FILE = "prices.csv";
  public static final String GZIP_SUFFIX = ".gz";
  static final String SALES_HEADER_PREFIX = "series_id,item,department,category,store,region";
  static final String PRICES_HEADER = "item,store,from,price";
  private static final int GZIP_BUFFER_BYTES = 1 << 16;

  private ScenarioGenerator() {}

  /**
   * Generates the scenario into {@code outDir} (created when missing), replacing files of the same names.
   *
   * @return the files written, their total size in bytes and the number of sales cells
   * @throws IOException when the folder or a file cannot be written; no partial file is left behind
   */
  public static ScenarioSummary write(ScenarioSpec spec, Path outDir) throws IOException {
    Files.createDirectories(outDir);
    String suffix = spec.gzip() ? GZIP_SUFFIX : "";
    Path sales = outDir.resolve(SALES_FILE + suffix);
    Path calendarFile = outDir.resolve(CALENDAR_FILE + suffix);
    Path prices = outDir.resolve(PRICES_FILE + suffix);
    ChainLayout layout = new ChainLayout(spec.seriesCount());
    EventCalendar calendar = new EventCalendar(spec.startDate(), spec.calendarDayCount());

    List<Path> temporaries = new ArrayList<>();
    try {
      Path calendarTemp = temporary(outDir, CALENDAR_FILE, temporaries);
      try (AsciiWriter out = open(calendarTemp, spec.gzip())) {
        calendar.write(out);
      }
      Path salesTemp = temporary(outDir, SALES_FILE, temporaries);
      Path pricesTemp = temporary(outDir, PRICES_FILE, temporaries);
      try (AsciiWriter salesOut = open(salesTemp, spec.gzip()); AsciiWriter pricesOut = open(pricesTemp, spec.gzip())) {
        writeSeries(spec, layout, calendar, salesOut, pricesOut);
      }
      moveIntoPlace(salesTemp, sales);
      moveIntoPlace(calendarTemp, calendarFile);
      moveIntoPlace(pricesTemp, prices);
      temporaries.clear();
    } finally {
      for (Path temp : temporaries) {
        Files.deleteIfExists(temp);
      }
    }
    long fileBytes = Files.size(sales) + Files.size(calendarFile) + Files.size(prices);
    return new ScenarioSummary(List.of(sales, calendarFile, prices), spec.seriesCount(), spec.dayCount(),
        spec.itemDayCount(), fileBytes);
  }

  private static void writeSeries(ScenarioSpec spec, ChainLayout layout, EventCalendar calendar, AsciiWriter salesOut,
      AsciiWriter pricesOut) throws IOException {
    int dayCount = spec.dayCount();
    salesOut.writeAscii(SALES_HEADER_PREFIX);
    for (int day = 0; day < dayCount; day++) {
      salesOut.writeByte(',');
      salesOut.writeBytes(calendar.isoDate(day));
    }
    salesOut.writeByte('\n');
    pricesOut.writeAscii(PRICES_HEADER);
    pricesOut.writeByte('\n');

    DemandModel demand = new DemandModel(spec.seed(), dayCount, layout, calendar);
    ItemProfile item = new ItemProfile();
    PriceSchedule priceSchedule = new PriceSchedule(calendar.dayCount());
    int[] units = new int[dayCount];
    int loadedItem = -1;
    int loadedRegion = -1;
    for (int series = 0; series < spec.seriesCount(); series++) {
      int itemIndex = layout.itemIndex(series);
      int storeIndex = layout.storeIndex(series);
      int regionIndex = layout.regionIndex(storeIndex);
      if (itemIndex != loadedItem) {
        item.load(spec.seed(), itemIndex, layout.categoryIndex(itemIndex), dayCount);
        loadedItem = itemIndex;
        loadedRegion = -1;
      }
      if (regionIndex != loadedRegion) {
        priceSchedule.load(spec.seed(), item, regionIndex, layout.regionCount());
        loadedRegion = regionIndex;
      }
      demand.generate(series, item, priceSchedule, units);
      layout.writeSeriesCells(salesOut, series);
      for (int day = 0; day < dayCount; day++) {
        if (day > 0) {
          salesOut.writeByte(',');
        }
        salesOut.writeInt(units[day]);
      }
      salesOut.writeByte('\n');
      priceSchedule.writeChangePoints(pricesOut, layout, calendar, itemIndex, storeIndex);
    }
  }

  private static Path temporary(Path outDir, String name, List<Path> temporaries) throws IOException {
    Path temp = Files.createTempFile(outDir, "." + name + ".", ".partial");
    temporaries.add(temp);
    return temp;
  }

  private static AsciiWriter open(Path file, boolean gzip) throws IOException {
    OutputStream stream = Files.newOutputStream(file);
    if (gzip) {
      // GZIPOutputStream writes a zero modification time, so compressed output is as reproducible as plain. The
      // fastest level: the digits compress well anyway, and the default level tripled the run time.
      stream = new GZIPOutputStream(stream, GZIP_BUFFER_BYTES) {
        {
          def.setLevel(Deflater.BEST_SPEED);
        }
      };
    }
    return new AsciiWriter(stream);
  }

  private static void moveIntoPlace(Path temp, Path target) throws IOException {
    // Temporary files are created owner-only; the finished files get the usual permissions.
    if (Files.getFileStore(temp).supportsFileAttributeView(PosixFileAttributeView.class)) {
      Files.setPosixFilePermissions(temp, PosixFilePermissions.fromString("rw-r--r--"));
    }
    try {
      Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
    }
  }
}
