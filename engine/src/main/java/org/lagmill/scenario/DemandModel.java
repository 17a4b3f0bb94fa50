package org.lagmill.scenario;

import java.util.SplittableRandom;

/**
 * Daily unit sales of one article-outlet series: an article level (log-normal across articles, a few fast movers)
 * scaled by the outlet's size (set mostly by its format), a per-article trend, the format's weekly pattern, the
 * section's yearly swing, public holidays and their eves, the district's school breaks, prices and planned promotions
 * (through the article's elasticity, displays and leaflets), a slowly wandering level, and Poisson counts. Nothing
 * sells on a day the outlet is closed. Articles launched in the history, and outlets opened in it, ramp up over four
 * weeks; random stock-outs zero 2–14 days.
 *
 * <p>Day factors shared by all series are computed once at construction, one array per outlet and section; a series
 * is then generated into a caller-owned {@code int[]} with no allocation beyond its random stream.
 */
final class DemandModel {
  /**
   * Day-of-week multipliers Monday..Sunday per format: superstores take the weekend shop, neighbourhood stores are
   * even, kiosks sell on commuting days.
   */
  static final double[][] WEEKLY = {
      {0.82, 0.80, 0.85, 0.92, 1.12, 1.40, 1.09},
      {0.95, 0.93, 0.95, 1.00, 1.08, 1.12, 0.97},
      {1.06, 1.05, 1.06, 1.07, 1.05, 0.92, 0.79}};
  /** Outlet size per format before the outlet's own spread. */
  static final double[] FORMAT_SIZE = {1.8, 1.0, 0.45};
  /** Yearly swing per section: amplitude and the day of year of its peak. */
  static final double[] YEARLY_AMPLITUDE = {0.06, 0.10, 0.30, 0.05, 0.55};
  static final int[] YEARLY_PEAK_DAY = {200, 355, 195, 95, 135};
  /** Sales multiplier per section on school-break days: families at home drink more and garden. */
  static final double[] SCHOOL_BREAK_FACTOR = {1.05, 1.02, 1.12, 0.97, 1.10};
  /** Outlet sizes spread log-normally around the format's size with this sigma. */
  static final double OUTLET_SIZE_SIGMA = 0.20;
  static final double SERIES_LEVEL_SIGMA = 0.35;
  static final double DAILY_NOISE_SIGMA = 0.20;
  /** AR(1) log-level wander: persistence per day and innovation sigma (stationary sigma about 0.25). */
  static final double WANDER_PERSISTENCE = 0.97;
  static final double WANDER_SIGMA = 0.06;
  static final int RAMP_DAYS = 28;
  static final int MIN_STOCK_OUT_DAYS = 2;
  static final int MAX_STOCK_OUT_DAYS = 14;

  private final long seed;
  private final int dayCount;
  private final ChainLayout layout;
  private final ClosureSchedule closures;
  private final double[] outletSize;
  /** Weekly, holiday and school-break multiplier per outlet, section and day; 0 when the outlet is closed. */
  private final float[][][] dayFactor;
  /** Yearly deviation from 1 per section and day, before the article's amplitude. */
  private final float[][] yearlyDeviation;

  /** @param dayCount sales days to generate (the calendar may cover more) */
  DemandModel(long seed, int dayCount, ChainLayout layout, HolidayCalendar calendar, ClosureSchedule closures) {
    this.seed = seed;
    this.dayCount = dayCount;
    this.layout = layout;
    this.closures = closures;
    int sectionCount = ChainLayout.SECTION_NAMES.length;
    outletSize = new double[layout.outletCount()];
    dayFactor = new float[layout.outletCount()][sectionCount][dayCount];
    yearlyDeviation = new float[sectionCount][dayCount];
    for (int section = 0; section < sectionCount; section++) {
      for (int day = 0; day < dayCount; day++) {
        double phase = 2 * Math.PI * (calendar.dayOfYear(day) - YEARLY_PEAK_DAY[section]) / 365.25;
        yearlyDeviation[section][day] = (float) (YEARLY_AMPLITUDE[section] * Math.cos(phase));
      }
    }
    for (int outlet = 0; outlet < layout.outletCount(); outlet++) {
      int format = ChainLayout.formatIndex(outlet);
      int district = ChainLayout.districtIndex(outlet);
      outletSize[outlet] = FORMAT_SIZE[format]
          * Math.exp(OUTLET_SIZE_SIGMA * Seeds.random(seed, Seeds.STORE, outlet).nextGaussian());
      for (int section = 0; section < sectionCount; section++) {
        float[] factor = dayFactor[outlet][section];
        for (int day = 0; day < dayCount; day++) {
          if (closures.isClosed(outlet, day)) {
            continue;
          }
          int holiday = calendar.holidayIndex(day);
          double value = WEEKLY[format][calendar.dayOfWeek(day)];
          value *= holiday >= 0 ? HolidayCalendar.HOLIDAYS[holiday].sectionFactor()[section] : 1.0;
          value *= calendar.isEveOfClosingHoliday(day) ? HolidayCalendar.EVE_SECTION_FACTOR[section] : 1.0;
          value *= calendar.isSchoolBreak(district, day) ? SCHOOL_BREAK_FACTOR[section] : 1.0;
          factor[day] = (float) value;
        }
      }
    }
  }

  /**
   * Fills {@code units[0 .. dayCount)} with the daily sales of one series.
   *
   * @param item the series' article, already loaded
   * @param promotions the series' banner prices and promotions, already loaded
   */
  void generate(int seriesIndex, ItemProfile item, PromotionSchedule promotions, int[] units) {
    int outletIndex = layout.outletIndex(seriesIndex);
    SplittableRandom random = Seeds.random(seed, Seeds.SERIES, seriesIndex);
    double level = item.meanUnitsPerDay() * outletSize[outletIndex]
        * Math.exp(SERIES_LEVEL_SIGMA * random.nextGaussian());
    double yearlyAmplitude = item.yearlyAmplitude();
    double trendStep = Math.exp(item.trendPerYear() / 365.25);
    // Centre the trend on the middle of the history so the level stays near the article's mean overall.
    double trend = Math.exp(-item.trendPerYear() * (dayCount / 2.0) / 365.25);
    double stockOutChance = item.stockOutChancePerDay();
    int firstDay = Math.min(Math.max(item.launchDayIndex(), closures.openingDayIndex(outletIndex)), dayCount);
    boolean ramp = firstDay > 0;
    float[] days = dayFactor[outletIndex][item.sectionIndex()];
    float[] yearly = yearlyDeviation[item.sectionIndex()];
    double noiseBias = -0.5 * DAILY_NOISE_SIGMA * DAILY_NOISE_SIGMA;
    double wander = 0;
    int stockOutDaysLeft = 0;
    for (int day = 0; day < firstDay; day++) {
      units[day] = 0;
    }
    for (int day = 0; day < dayCount; day++) {
      trend *= trendStep;
      if (day < firstDay) {
        continue;
      }
      if (stockOutDaysLeft > 0) {
        stockOutDaysLeft--;
        units[day] = 0;
        continue;
      }
      if (random.nextDouble() < stockOutChance) {
        int length = MIN_STOCK_OUT_DAYS + random.nextInt(MAX_STOCK_OUT_DAYS - MIN_STOCK_OUT_DAYS + 1);
        stockOutDaysLeft = length - 1;
        units[day] = 0;
        continue;
      }
      wander = WANDER_PERSISTENCE * wander + WANDER_SIGMA * random.nextGaussian();
      double rampFactor = ramp ? Math.min(1.0, 0.3 + 0.7 * (day - firstDay) / RAMP_DAYS) : 1.0;
      double mean = level * trend * (1 + yearlyAmplitude * yearly[day]) * days[day] * promotions.demandFactor(day)
          * rampFactor * Math.exp(wander + DAILY_NOISE_SIGMA * random.nextGaussian() + noiseBias);
      units[day] = PoissonSampler.draw(random, mean);
    }
  }
}
