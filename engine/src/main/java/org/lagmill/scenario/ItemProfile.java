package org.lagmill.scenario;

import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * The traits one article shares across all its outlets, drawn from (seed, article index) alone: its family (and so
 * its section), level, trend, seasonality, price elasticity, launch and whether it is promoted. A reusable flyweight:
 * {@link #load} re-points it at another article without allocating.
 */
final class ItemProfile {
  /** Share of items that are fast movers, selling tens of units a day per store. */
  static final double FAST_MOVER_SHARE = 0.03;
  /** Share of items launched part-way through the history (all zeros and no price before launch). */
  static final double LAUNCHED_SHARE = 0.20;
  /** Share of items that take part in promotions. */
  static final double PROMOTED_SHARE = 0.50;
  /** Median shelf price in cents per section (Chilled, Grocery, Drinks, Homecare, Garden). */
  static final int[] MEDIAN_PRICE_CENTS = {320, 280, 210, 540, 890};
  private static final int FAMILY_WEIGHT_TOTAL = Arrays.stream(ChainLayout.FAMILY_WEIGHT).sum();
  /** A history shorter than this has no launches: a launch needs room before and after it. */
  static final int MIN_DAYS_FOR_LAUNCH = 56;

  private int itemIndex = -1;
  private int familyIndex;
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

  /**
   * Draws the traits of one article; the same (seed, article, dayCount) always gives the same traits. Launches fall
   * on a period boundary (a multiple of 7 days from the start), so weekly output sees whole weeks.
   */
  void load(long seed, int itemIndex, int dayCount) {
    this.itemIndex = itemIndex;
    SplittableRandom random = Seeds.random(seed, Seeds.ITEM, itemIndex);
    familyIndex = drawFamily(random.nextInt(FAMILY_WEIGHT_TOTAL));
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
    launchDayIndex = launchedInHistory ? Math.max(7, ClosureSchedule.weekStart(launchDraw)) : 0;
    promoted = random.nextDouble() < PROMOTED_SHARE;
    basePriceCents = MEDIAN_PRICE_CENTS[sectionIndex()] * Math.exp(0.5 * random.nextGaussian());
    stockOutChancePerDay = fastMover ? 1.0 / 400 : 1.0 / 160;
  }

  int itemIndex() {
    return itemIndex;
  }

  int familyIndex() {
    return familyIndex;
  }

  int sectionIndex() {
    return ChainLayout.FAMILY_SECTION[familyIndex];
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

  /** Scales the section's yearly swing for this article (1 = the section's own swing). */
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

  private static int drawFamily(int weightDraw) {
    int family = 0;
    int remaining = weightDraw;
    while (remaining >= ChainLayout.FAMILY_WEIGHT[family]) {
      remaining -= ChainLayout.FAMILY_WEIGHT[family];
      family++;
    }
    return family;
  }

  private static double clamp(double value, double low, double high) {
    return Math.max(low, Math.min(high, value));
  }
}
