package org.lagmill.scenario;

import java.util.SplittableRandom;

/**
 * The traits one item shares across all its stores, drawn from (seed, item index) alone. A reusable flyweight:
 * {@link #load} re-points it at another item without allocating.
 */
final class ItemProfile {
  /** Share of items that are fast movers, selling tens of units a day per store. */
  static final double FAST_MOVER_SHARE = 0.03;
  /** Share of items launched part-way through the history (all zeros and no price before launch). */
  static final double LAUNCHED_SHARE = 0.20;
  /** Share of items that take part in promotions. */
  static final double PROMOTED_SHARE = 0.45;
  /** Median shelf price in cents per category (Pantry, Household, Leisure). */
  static final int[] MEDIAN_PRICE_CENTS = {350, 600, 1200};
  /** A history shorter than this has no launches: a launch needs room before and after it. */
  static final int MIN_DAYS_FOR_LAUNCH = 56;

  private int itemIndex = -1;
  private double meanUnitsPerDay;
  private boolean fastMover;
  private double trendPerYear;
  private double yearlyAmplitude;
  private double elasticity;
  private int launchDayIndex;
  private boolean launchedInHistory;
  private boolean promoted;
  private double basePriceCents;
  private double stockOutChancePerDay;

  /** Draws the traits of one item; the same (seed, item, category, dayCount) always gives the same traits. */
  void load(long seed, int itemIndex, int categoryIndex, int dayCount) {
    this.itemIndex = itemIndex;
    SplittableRandom random = Seeds.random(seed, Seeds.ITEM, itemIndex);
    fastMover = random.nextDouble() < FAST_MOVER_SHARE;
    // Log-normal levels give the long right tail of real assortments: most items sell well under one unit a day.
    meanUnitsPerDay = fastMover ? 40.0 * Math.exp(0.45 * random.nextGaussian())
        : Math.min(20.0, 0.40 * Math.exp(1.05 * random.nextGaussian()));
    trendPerYear = clamp(0.12 * random.nextGaussian(), -0.3, 0.3);
    yearlyAmplitude = 0.3 + 1.4 * random.nextDouble();
    elasticity = 1.2 + 1.8 * random.nextDouble();
    boolean launched = random.nextDouble() < LAUNCHED_SHARE;
    int launchDraw = (int) (dayCount * (0.10 + 0.75 * random.nextDouble()));
    launchedInHistory = launched && dayCount >= MIN_DAYS_FOR_LAUNCH;
    launchDayIndex = launchedInHistory ? launchDraw : 0;
    promoted = random.nextDouble() < PROMOTED_SHARE;
    basePriceCents = MEDIAN_PRICE_CENTS[categoryIndex] * Math.exp(0.5 * random.nextGaussian());
    stockOutChancePerDay = fastMover ? 1.0 / 400 : 1.0 / 160;
  }

  int itemIndex() {
    return itemIndex;
  }

  double meanUnitsPerDay() {
    return meanUnitsPerDay;
  }

  boolean fastMover() {
    return fastMover;
  }

  double trendPerYear() {
    return trendPerYear;
  }

  /** Scales the category's yearly swing for this item (1 = the category's own swing). */
  double yearlyAmplitude() {
    return yearlyAmplitude;
  }

  /** Price elasticity of demand as a positive number: units scale with (price ratio)^-elasticity. */
  double elasticity() {
    return elasticity;
  }

  /** First day with a shelf price and possible sales; 0 for items on sale before the history starts. */
  int launchDayIndex() {
    return launchDayIndex;
  }

  boolean launchedInHistory() {
    return launchedInHistory;
  }

  boolean promoted() {
    return promoted;
  }

  double basePriceCents() {
    return basePriceCents;
  }

  double stockOutChancePerDay() {
    return stockOutChancePerDay;
  }

  private static double clamp(double value, double low, double high) {
    return Math.max(low, Math.min(high, value));
  }
}
