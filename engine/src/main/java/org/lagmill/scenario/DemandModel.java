package org.lagmill.scenario;

import java.util.SplittableRandom;

/**
 * Daily unit sales of one item-store series: an item level (log-normal across items, a few fast movers) scaled by
 * store size, a per-item trend, the category's weekly and yearly pattern, event effects, the region's paydays, the
 * price (promotions lift demand through the item's elasticity), a slowly wandering level, and Poisson counts. Items
 * launched in the history sell nothing before launch and ramp up over four weeks; random stock-outs zero 2–14 days.
 *
 * <p>Day factors shared by all series are computed once at construction (a few floats per category and day); a series
 * is then generated into a caller-owned {@code int[]} with no allocation beyond its random stream.
 */
final class DemandModel {
  /** Day-of-week multipliers Monday..Sunday per category (Pantry, Household, Leisure): weekends sell more. */
  static final double[][] WEEKLY = {
      {0.90, 0.86, 0.88, 0.95, 1.10, 1.30, 1.15},
      {0.92, 0.90, 0.92, 0.95, 1.05, 1.25, 1.10},
      {0.80, 0.78, 0.82, 0.90, 1.05, 1.45, 1.35}};
  /** Yearly swing per category: amplitude and the day of year of the peak (late December, spring, midsummer). */
  static final double[] YEARLY_AMPLITUDE = {0.10, 0.06, 0.35};
  static final int[] YEARLY_PEAK_DAY = {355, 100, 190};
  /** Sales lift on a region's payday per category; the day after keeps a third of it. */
  static final double[] PAYDAY_LIFT = {0.15, 0.10, 0.08};
  /** Store size multipliers spread log-normally with this sigma. */
  static final double STORE_SIZE_SIGMA = 0.30;
  static final double SERIES_LEVEL_SIGMA = 0.35;
  static final double DAILY_NOISE_SIGMA = 0.20;
  /** AR(1) log-level wander: persistence per day and innovation sigma (stationary sigma about 0.25). */
  static final double WANDER_PERSISTENCE = 0.97;
  static final double WANDER_SIGMA = 0.06;
  static final int LAUNCH_RAMP_DAYS = 28;
  static final int MIN_STOCK_OUT_DAYS = 2;
  static final int MAX_STOCK_OUT_DAYS = 14;

  private final long seed;
  private final int dayCount;
  private final ChainLayout layout;
  private final double[] storeSize;
  /** Weekly times event multiplier per category and day. */
  private final float[][] dayFactor;
  /** Yearly deviation from 1 per category and day, before the item's amplitude. */
  private final float[][] yearlyDeviation;
  /** Payday multiplier per region, category and day. */
  private final float[][][] paydayFactor;

  /** @param dayCount sales days to generate (the calendar may cover more) */
  DemandModel(long seed, int dayCount, ChainLayout layout, EventCalendar calendar) {
    this.seed = seed;
    this.dayCount = dayCount;
    this.layout = layout;
    int categoryCount = ChainLayout.CATEGORY_NAMES.length;
    storeSize = new double[layout.storeCount()];
    for (int store = 0; store < storeSize.length; store++) {
      storeSize[store] = Math.exp(STORE_SIZE_SIGMA * Seeds.random(seed, Seeds.STORE, store).nextGaussian());
    }
    dayFactor = new float[categoryCount][dayCount];
    yearlyDeviation = new float[categoryCount][dayCount];
    paydayFactor = new float[layout.regionCount()][categoryCount][dayCount];
    for (int category = 0; category < categoryCount; category++) {
      for (int day = 0; day < dayCount; day++) {
        int event = calendar.eventIndex(day);
        double eventFactor = event < 0 ? 1.0 : EventCalendar.EVENTS[event].categoryFactor()[category];
        dayFactor[category][day] = (float) (WEEKLY[category][calendar.dayOfWeek(day)] * eventFactor);
        double phase = 2 * Math.PI * (calendar.dayOfYear(day) - YEARLY_PEAK_DAY[category]) / 365.25;
        yearlyDeviation[category][day] = (float) (YEARLY_AMPLITUDE[category] * Math.cos(phase));
        for (int region = 0; region < layout.regionCount(); region++) {
          boolean payday = calendar.isPayday(region, day);
          boolean dayAfter = day > 0 && calendar.isPayday(region, day - 1);
          double lift = payday ? PAYDAY_LIFT[category] : dayAfter ? PAYDAY_LIFT[category] / 3 : 0;
          paydayFactor[region][category][day] = (float) (1 + lift);
        }
      }
    }
  }

  /**
   * Fills {@code units[0 .. dayCount)} with the daily sales of one series.
   *
   * @param item the series' item, already loaded
   * @param prices the series' prices, already loaded
   */
  void generate(int seriesIndex, ItemProfile item, PriceSchedule prices, int[] units) {
    int storeIndex = layout.storeIndex(seriesIndex);
    int regionIndex = layout.regionIndex(storeIndex);
    int categoryIndex = layout.categoryIndex(item.itemIndex());
    SplittableRandom random = Seeds.random(seed, Seeds.SERIES, seriesIndex);
    double level = item.meanUnitsPerDay() * storeSize[storeIndex]
        * Math.exp(SERIES_LEVEL_SIGMA * random.nextGaussian());
    double yearlyAmplitude = item.yearlyAmplitude();
    double trendStep = Math.exp(item.trendPerYear() / 365.25);
    // Centre the trend on the middle of the history so the level stays near the item's mean overall.
    double trend = Math.exp(-item.trendPerYear() * (dayCount / 2.0) / 365.25);
    double stockOutChance = item.stockOutChancePerDay();
    int launchDay = Math.min(item.launchDayIndex(), dayCount);
    boolean ramp = item.launchedInHistory();
    float[] weekAndEvent = dayFactor[categoryIndex];
    float[] yearly = yearlyDeviation[categoryIndex];
    float[] payday = paydayFactor[regionIndex][categoryIndex];
    double noiseBias = -0.5 * DAILY_NOISE_SIGMA * DAILY_NOISE_SIGMA;
    double wander = 0;
    int stockOutDaysLeft = 0;
    for (int day = 0; day < launchDay; day++) {
      units[day] = 0;
    }
    for (int day = 0; day < dayCount; day++) {
      trend *= trendStep;
      if (day < launchDay) {
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
      double rampFactor = ramp ? Math.min(1.0, 0.3 + 0.7 * (day - launchDay) / LAUNCH_RAMP_DAYS) : 1.0;
      double mean = level * trend * (1 + yearlyAmplitude * yearly[day]) * weekAndEvent[day] * payday[day]
          * prices.demandFactor(day) * rampFactor
          * Math.exp(wander + DAILY_NOISE_SIGMA * random.nextGaussian() + noiseBias);
      units[day] = PoissonSampler.draw(random, mean);
    }
  }
}
