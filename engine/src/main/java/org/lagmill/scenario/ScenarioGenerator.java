package org.lagmill.scenario;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.Deflater;
import java.util.zip.GZIPOutputStream;
import org.lagmill.io.AtomicFiles;

/**
 * Writes the invented scenario as five CSV files: {@code sales.csv} (wide: eight attribute cells, then one unit count
 * per period), {@code calendar.csv} (public holidays and per-district school breaks through the future days),
 * {@code prices.csv} (price change points per article and banner; weekly output: one row per article-outlet-week),
 * {@code plan.csv} (planned promotions per article and banner) and {@code closures.csv} (days outlets could not
 * sell). Series are generated and written one at a time, so memory stays flat whatever the series count.
 *
 * <p>Each file is written under a temporary name in the output folder and renamed when complete, so a failed run
 * leaves no half-written file. Equal specs give byte-identical files: every series draws from its own stream seeded by
 * (seed, series index). Not thread-safe across calls writing the same folder.
 */
public final class ScenarioGenerator {
  public static final String SALES_FILE = "sales.csv";
  public static final String CALENDAR_FILE = "calendar.csv";
  public static final String PRICES_FILE = "prices.csv";
  public static final String PLAN_FILE = "plan.csv";
  public static final String CLOSURES_FILE = "closures.csv";
  public static final String GZIP_SUFFIX = ".gz";
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
    List<String> names = List.of(SALES_FILE, CALENDAR_FILE, PRICES_FILE, PLAN_FILE, CLOSURES_FILE);
    ChainLayout layout = new ChainLayout(spec.seriesCount());
    HolidayCalendar calendar = new HolidayCalendar(spec.startDate(), spec.calendarDayCount());
    ClosureSchedule closures = new ClosureSchedule(layout, calendar, spec.dayCount());
    boolean weekly = spec.periodDays() == ScenarioSpec.WEEKLY;

    List<Path> temporaries = new ArrayList<>();
    List<Path> targets = new ArrayList<>();
    try {
      Path salesTemp = temporary(outDir, SALES_FILE, temporaries);
      Path calendarTemp = temporary(outDir, CALENDAR_FILE, temporaries);
      Path pricesTemp = temporary(outDir, PRICES_FILE, temporaries);
      Path planTemp = temporary(outDir, PLAN_FILE, temporaries);
      Path closuresTemp = temporary(outDir, CLOSURES_FILE, temporaries);
      try (AsciiWriter out = open(calendarTemp, spec.gzip())) {
        if (weekly) {
          calendar.writeWeekly(out, layout);
        } else {
          calendar.writeDaily(out, layout);
        }
      }
      try (AsciiWriter out = open(closuresTemp, spec.gzip())) {
        closures.write(out, calendar, weekly);
      }
      try (AsciiWriter salesOut = open(salesTemp, spec.gzip());
          AsciiWriter pricesOut = open(pricesTemp, spec.gzip());
          AsciiWriter planOut = open(planTemp, spec.gzip())) {
        writeSeries(spec, layout, calendar, closures, salesOut, pricesOut, planOut);
      }
      for (int i = 0; i < names.size(); i++) {
        Path target = outDir.resolve(names.get(i) + suffix);
        moveIntoPlace(temporaries.get(i), target);
        targets.add(target);
      }
      temporaries.clear();
    } finally {
      for (Path temp : temporaries) {
        Files.deleteIfExists(temp);
      }
    }
    long fileBytes = 0;
    for (Path target : targets) {
      fileBytes += Files.size(target);
    }
    return new ScenarioSummary(targets, spec.seriesCount(), spec.dayCount(), spec.periodDays(), spec.itemDayCount(),
        fileBytes);
  }

  private static void writeSeries(ScenarioSpec spec, ChainLayout layout, HolidayCalendar calendar,
      ClosureSchedule closures, AsciiWriter salesOut, AsciiWriter pricesOut, AsciiWriter planOut) throws IOException {
    int dayCount = spec.dayCount();
    int periodDays = spec.periodDays();
    boolean weekly = periodDays == ScenarioSpec.WEEKLY;
    salesOut.writeAscii(ChainLayout.SALES_HEADER_PREFIX);
    for (int day = 0; day < dayCount; day += periodDays) {
      salesOut.writeByte(',');
      salesOut.writeBytes(calendar.isoDate(day));
    }
    salesOut.writeByte('\n');
    pricesOut.writeAscii(weekly ? PromotionSchedule.WEEKLY_PRICES_HEADER : PromotionSchedule.PRICES_HEADER);
    pricesOut.writeByte('\n');
    planOut.writeAscii(PromotionSchedule.PLAN_HEADER);
    planOut.writeByte('\n');

    DemandModel demand = new DemandModel(spec.seed(), dayCount, layout, calendar, closures);
    ItemProfile item = new ItemProfile();
    // The plan states how far it reaches with a row on the first day of the last period (weekly: the last week's
    // Monday), so a forecast over the future days finds it covered.
    int lastPlanDay = (calendar.dayCount() - 1) / periodDays * periodDays;
    PromotionSchedule[] promotionsByBanner = new PromotionSchedule[ChainLayout.BANNER_NAMES.length];
    for (int banner = 0; banner < promotionsByBanner.length; banner++) {
      promotionsByBanner[banner] = new PromotionSchedule(calendar.dayCount());
    }
    int[] units = new int[dayCount];
    int loadedArticle = -1;
    for (int series = 0; series < spec.seriesCount(); series++) {
      int articleIndex = layout.articleIndex(series);
      int outletIndex = layout.outletIndex(series);
      if (articleIndex != loadedArticle) {
        item.load(spec.seed(), articleIndex, dayCount);
        loadedArticle = articleIndex;
        for (int banner = 0; banner < promotionsByBanner.length; banner++) {
          if (!layout.sellsInBanner(articleIndex, banner)) {
            continue;
          }
          promotionsByBanner[banner].load(spec.seed(), item, banner);
          promotionsByBanner[banner].writePlan(planOut, calendar, articleIndex, banner, lastPlanDay);
          if (!weekly) {
            promotionsByBanner[banner].writeChangePoints(pricesOut, calendar, articleIndex, banner);
          }
        }
      }
      PromotionSchedule promotions = promotionsByBanner[ChainLayout.bannerIndex(outletIndex)];
      demand.generate(series, item, promotions, units);
      layout.writeSeriesCells(salesOut, series, item.familyIndex());
      if (weekly) {
        writeWeekSums(salesOut, units, dayCount);
        promotions.writeWeeklyRows(pricesOut, calendar, articleIndex, outletIndex);
      } else {
        for (int day = 0; day < dayCount; day++) {
          if (day > 0) {
            salesOut.writeByte(',');
          }
          salesOut.writeInt(units[day]);
        }
      }
      salesOut.writeByte('\n');
    }
  }

  private static void writeWeekSums(AsciiWriter out, int[] units, int dayCount) throws IOException {
    for (int first = 0; first < dayCount; first += ScenarioSpec.WEEKLY) {
      int sum = 0;
      for (int day = first; day < first + ScenarioSpec.WEEKLY; day++) {
        sum += units[day];
      }
      if (first > 0) {
        out.writeByte(',');
      }
      out.writeInt(sum);
    }
  }

  private static Path temporary(Path outDir, String name, List<Path> temporaries) throws IOException {
    Path temp = Files.createFile(AtomicFiles.tempSibling(outDir.resolve(name)));
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
    AtomicFiles.moveIntoPlace(temp, target);
  }

}
