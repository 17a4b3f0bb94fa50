package org.lagmill.scenario;

import java.io.IOException;
import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * Shelf prices and planned promotions of one article in one banner for every calendar day, and the demand multiplier
 * they cause. Regular prices rise now and then (article-wide, in the same week in both banners, scaled by the
 * banner's price level); promoted articles get planned promotions of one or two weeks every 5–16 weeks, each with a
 * discount of 10–40 %, and sometimes an end-of-aisle display and a leaflet feature. Every change falls on a period
 * boundary (launch dates are on one too), so weekly output sees one price per week. Prices end in 9 cents.
 *
 * <p>Demand on promotion scales with (promotion price / regular price)^(−elasticity), times 1.3 with a display and
 * 1.2 with a leaflet; stockable sections (Grocery, Homecare) sell 15 % less in the week after a promotion, as
 * shoppers use up what they bought. A reusable flyweight sized once for the calendar's day count.
 */
final class PromotionSchedule {
  /** Price level per banner: the second banner is the cheaper one. */
  static final double[] BANNER_PRICE_LEVEL = {1.00, 0.93};
  static final int MIN_PRICE_CENTS = 19;
  static final double DISPLAY_LIFT = 1.30;
  static final double LEAFLET_LIFT = 1.20;
  static final double POST_PROMOTION_DIP = 0.85;
  static final boolean[] STOCKABLE_SECTION = {false, true, false, true, false};
  static final String PRICES_HEADER = "article,banner,from,price";
  static final String WEEKLY_PRICES_HEADER = "article,outlet,from,price";
  static final String PLAN_HEADER = "article,banner,from,promo,discount,display,leaflet";
  private static final long PRICE_RISE = 0x5851F42D4C957F2DL;

  private final int dayCount;
  /** Price on each day in cents; 0 before launch (no price). */
  private final int[] priceCents;
  private final float[] demandFactor;
  /** Planned discount in percent on each day, 0 without promotion. */
  private final byte[] discountPercent;
  private final boolean[] display;
  private final boolean[] leaflet;
  private int launchDayIndex;

  /** @param dayCount calendar days: sales days plus future days */
  PromotionSchedule(int dayCount) {
    this.dayCount = dayCount;
    this.priceCents = new int[dayCount];
    this.demandFactor = new float[dayCount];
    this.discountPercent = new byte[dayCount];
    this.display = new boolean[dayCount];
    this.leaflet = new boolean[dayCount];
  }

  void load(long seed, ItemProfile item, int bannerIndex) {
    launchDayIndex = Math.min(item.launchDayIndex(), dayCount);
    SplittableRandom rises = Seeds.random(seed, PRICE_RISE, item.itemIndex());
    SplittableRandom promos = Seeds.random(seed, Seeds.PROMO,
        (long) item.itemIndex() * ChainLayout.BANNER_NAMES.length + bannerIndex);
    double regularScale = item.basePriceCents() * BANNER_PRICE_LEVEL[bannerIndex];
    int firstRegularCents = endInNine(regularScale);
    int regularCents = firstRegularCents;
    int nextRiseDay = launchDayIndex + 7 * (20 + rises.nextInt(53));
    int promoStartDay = item.promoted() ? launchDayIndex + 7 * (2 + promos.nextInt(15)) : Integer.MAX_VALUE;
    int promoEndDay = Integer.MAX_VALUE;
    int dipEndDay = 0;
    int depthPercent = 0;
    boolean onDisplay = false;
    boolean inLeaflet = false;
    double regularDemand = 1.0;
    double elasticity = item.elasticity();
    boolean stockable = STOCKABLE_SECTION[item.sectionIndex()];
    Arrays.fill(priceCents, 0, launchDayIndex, 0);
    Arrays.fill(demandFactor, 0, launchDayIndex, 0f);
    Arrays.fill(discountPercent, (byte) 0);
    Arrays.fill(display, false);
    Arrays.fill(leaflet, false);
    for (int day = launchDayIndex; day < dayCount; day++) {
      if (day == nextRiseDay) {
        regularScale *= 1.02 + 0.05 * rises.nextDouble();
        regularCents = endInNine(regularScale);
        // A regular rise costs demand at half the promotional elasticity: shoppers adapt to shelf prices.
        regularDemand = Math.pow((double) regularCents / firstRegularCents, -0.5 * elasticity);
        nextRiseDay = day + 7 * (20 + rises.nextInt(53));
      }
      if (day == promoEndDay) {
        depthPercent = 0;
        promoEndDay = Integer.MAX_VALUE;
        dipEndDay = stockable ? day + 7 : day;
        promoStartDay = day + 7 * (5 + promos.nextInt(12));
      }
      if (day == promoStartDay) {
        depthPercent = 10 + 5 * promos.nextInt(7);
        promoEndDay = day + 7 * (1 + promos.nextInt(2));
        onDisplay = promos.nextDouble() < 0.45;
        // Deep discounts are the ones a retailer advertises.
        inLeaflet = promos.nextDouble() < (depthPercent >= 25 ? 0.6 : 0.2);
      }
      if (depthPercent > 0) {
        int promoCents = promoPrice(regularCents, endInNine(regularCents * (1 - depthPercent / 100.0)));
        priceCents[day] = promoCents;
        discountPercent[day] = (byte) depthPercent;
        display[day] = onDisplay;
        leaflet[day] = inLeaflet;
        double lift = Math.pow((double) promoCents / regularCents, -elasticity) * (onDisplay ? DISPLAY_LIFT : 1.0)
            * (inLeaflet ? LEAFLET_LIFT : 1.0);
        demandFactor[day] = (float) (regularDemand * lift);
      } else {
        priceCents[day] = regularCents;
        demandFactor[day] = (float) (regularDemand * (day < dipEndDay ? POST_PROMOTION_DIP : 1.0));
      }
    }
  }

  /** Price in cents on a day, 0 before launch. */
  int priceCents(int dayIndex) {
    return priceCents[dayIndex];
  }

  /** Demand multiplier from price and promotion on a day (1 at the first regular price). */
  float demandFactor(int dayIndex) {
    return demandFactor[dayIndex];
  }

  /** Planned discount in percent on a day, 0 without promotion. */
  int discountPercent(int dayIndex) {
    return discountPercent[dayIndex];
  }

  /** Writes one {@code article,banner,from,price} row per price change, from launch through the last calendar day. */
  void writeChangePoints(AsciiWriter out, HolidayCalendar calendar, int articleIndex, int bannerIndex)
      throws IOException {
    int previous = 0;
    for (int day = launchDayIndex; day < dayCount; day++) {
      int cents = priceCents[day];
      if (cents == previous) {
        continue;
      }
      previous = cents;
      ChainLayout.writeArticleCode(out, articleIndex);
      out.writeByte(',');
      out.writeAscii(ChainLayout.BANNER_NAMES[bannerIndex]);
      out.writeByte(',');
      out.writeBytes(calendar.isoDate(day));
      out.writeByte(',');
      out.writeCents(cents);
      out.writeByte('\n');
    }
  }

  /**
   * Writes one {@code article,outlet,from,price} row per period of 7 days from launch through the last calendar
   * period, as scanner exports deliver weekly prices: a row for every week, changed or not.
   */
  void writeWeeklyRows(AsciiWriter out, HolidayCalendar calendar, int articleIndex, int outletIndex)
      throws IOException {
    for (int day = launchDayIndex; day < dayCount; day += 7) {
      ChainLayout.writeArticleCode(out, articleIndex);
      out.writeByte(',');
      ChainLayout.writeOutletCode(out, outletIndex);
      out.writeByte(',');
      out.writeBytes(calendar.isoDate(day));
      out.writeByte(',');
      out.writeCents(priceCents[day]);
      out.writeByte('\n');
    }
  }

  /**
   * Writes the promotion plan of the article in the banner as change points: a row of zeros on the first calendar day,
   * then a row whenever the promotion flag, discount, display or leaflet changes. Each row holds until the next. A
   * last row on {@code lastPlanDay} repeats the values holding then, so the file says how far the plan reaches (a
   * plan whose last change lies weeks back would otherwise look stale).
   *
   * @param lastPlanDay the day the plan reaches: the first day of the last period
   */
  void writePlan(AsciiWriter out, HolidayCalendar calendar, int articleIndex, int bannerIndex, int lastPlanDay)
      throws IOException {
    for (int day = 0; day < dayCount; day++) {
      boolean changed = day == 0 || discountPercent[day] != discountPercent[day - 1]
          || display[day] != display[day - 1] || leaflet[day] != leaflet[day - 1];
      if (changed || day == lastPlanDay) {
        writePlanRow(out, calendar, articleIndex, bannerIndex, day);
      }
    }
  }

  private void writePlanRow(AsciiWriter out, HolidayCalendar calendar, int articleIndex, int bannerIndex, int day)
      throws IOException {
    ChainLayout.writeArticleCode(out, articleIndex);
    out.writeByte(',');
    out.writeAscii(ChainLayout.BANNER_NAMES[bannerIndex]);
    out.writeByte(',');
    out.writeBytes(calendar.isoDate(day));
    int depth = discountPercent[day];
    out.writeByte(',');
    out.writeByte(depth > 0 ? '1' : '0');
    out.writeByte(',');
    if (depth > 0) {
      out.writeCents(depth);
    } else {
      out.writeByte('0');
    }
    out.writeByte(',');
    out.writeByte(display[day] ? '1' : '0');
    out.writeByte(',');
    out.writeByte(leaflet[day] ? '1' : '0');
    out.writeByte('\n');
  }

  static int endInNine(double cents) {
    int rounded = (int) Math.round(cents);
    return Math.max(MIN_PRICE_CENTS, rounded / 10 * 10 + 9);
  }

  /** A promotion price strictly below the regular price, so every promotion is visible in the price file. */
  private static int promoPrice(int regularCents, int wantedCents) {
    return Math.min(wantedCents, regularCents - 10);
  }
}
