package org.lagmill.scenario;

import java.io.IOException;
import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * Shelf prices of one item-store series for every calendar day, and the demand multiplier they cause. Regular prices
 * rise now and then (item-wide, on the same day in every store, scaled by a regional price level); promoted items get
 * temporary cuts of 10–35 % for one to three weeks, the same in every store of a region. Prices end in 9 cents.
 *
 * <p>A reusable flyweight sized once for the calendar's day count: {@link #load} fills its day arrays for a series.
 */
final class PriceSchedule {
  /** Regional price level (Northvale, Saltmarsh, Highmoor). */
  static final double[] REGION_PRICE_LEVEL = {1.00, 1.03, 0.97};
  static final int MIN_PRICE_CENTS = 19;
  private static final long PRICE_RISE = 0x5851F42D4C957F2DL;

  private final int dayCount;
  /** Price on each day in cents; 0 before launch (no price). */
  private final int[] priceCents;
  private final float[] demandFactor;
  private int launchDayIndex;

  /** @param dayCount calendar days: sales days plus future days */
  PriceSchedule(int dayCount) {
    this.dayCount = dayCount;
    this.priceCents = new int[dayCount];
    this.demandFactor = new float[dayCount];
  }

  void load(long seed, ItemProfile item, int regionIndex, int regionCount) {
    launchDayIndex = item.launchDayIndex();
    SplittableRandom rises = Seeds.random(seed, PRICE_RISE, item.itemIndex());
    SplittableRandom promos = Seeds.random(seed, Seeds.PROMO, (long) item.itemIndex() * regionCount + regionIndex);
    double regularScale = item.basePriceCents() * REGION_PRICE_LEVEL[regionIndex];
    int firstRegularCents = endInNine(regularScale);
    int regularCents = firstRegularCents;
    int nextRiseDay = launchDayIndex + 150 + rises.nextInt(350);
    int promoStartDay = item.promoted() ? launchDayIndex + 14 + promos.nextInt(106) : Integer.MAX_VALUE;
    int promoEndDay = promoStartDay;
    int promoCents = 0;
    double regularDemand = 1.0;
    double promoDemand = 1.0;
    double elasticity = item.elasticity();
    Arrays.fill(priceCents, 0, Math.min(launchDayIndex, dayCount), 0);
    Arrays.fill(demandFactor, 0, Math.min(launchDayIndex, dayCount), 0f);
    for (int day = launchDayIndex; day < dayCount; day++) {
      if (day == nextRiseDay) {
        regularScale *= 1.02 + 0.05 * rises.nextDouble();
        regularCents = endInNine(regularScale);
        // A regular rise costs demand at half the promotional elasticity: shoppers adapt to shelf prices.
        regularDemand = Math.pow((double) regularCents / firstRegularCents, -0.5 * elasticity);
        nextRiseDay = day + 150 + rises.nextInt(350);
        if (promoCents > 0) {
          promoCents = promoPrice(regularCents, promoCents);
        }
      }
      if (day == promoEndDay && promoCents > 0) {
        promoCents = 0;
        promoStartDay = day + 42 + promos.nextInt(99);
      }
      if (day == promoStartDay) {
        double cut = 0.10 + 0.05 * promos.nextInt(6);
        promoEndDay = day + 7 * (1 + promos.nextInt(3));
        promoCents = promoPrice(regularCents, endInNine(regularCents * (1 - cut)));
        promoDemand = Math.pow((double) promoCents / regularCents, -elasticity);
      }
      boolean onPromo = promoCents > 0;
      priceCents[day] = onPromo ? promoCents : regularCents;
      demandFactor[day] = (float) (regularDemand * (onPromo ? promoDemand : 1.0));
    }
  }

  /** Price in cents on a day, 0 before launch. */
  int priceCents(int dayIndex) {
    return priceCents[dayIndex];
  }

  /** Demand multiplier from the price on a day (1 at the first regular price, above 1 on promotion). */
  float demandFactor(int dayIndex) {
    return demandFactor[dayIndex];
  }

  /** Writes one {@code item,store,from,price} row per price change, from launch through the last calendar day. */
  void writeChangePoints(AsciiWriter out, ChainLayout layout, EventCalendar calendar, int itemIndex, int storeIndex)
      throws IOException {
    int previous = 0;
    for (int day = launchDayIndex; day < dayCount; day++) {
      int cents = priceCents[day];
      if (cents == previous) {
        continue;
      }
      previous = cents;
      layout.writeItemId(out, itemIndex);
      out.writeByte(',');
      layout.writeStoreId(out, storeIndex);
      out.writeByte(',');
      out.writeBytes(calendar.isoDate(day));
      out.writeByte(',');
      out.writeCents(cents);
      out.writeByte('\n');
    }
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
