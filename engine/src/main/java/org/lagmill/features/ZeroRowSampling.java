package org.lagmill.features;

import java.util.Locale;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * Which training rows with label 0 a {@link FeaturePass} keeps, and the weight a kept one carries: each zero row is
 * kept with probability {@code keptFraction}, decided by a hash of (series index, day index, seed), and weighs
 * {@code 1 / keptFraction} so the weighted count of zero rows estimates the count before sampling (Horvitz and
 * Thompson's inverse-probability weights). A hash, not a random stream, decides: the pass counts its rows when it is
 * built and again when it streams, and both passes, every run and every rank must agree on the same rows.
 *
 * <p>The hash is the SplitMix64 finaliser (the one {@link java.util.SplittableRandom} uses), applied to the row's
 * packed (series, day) position mixed with the seed's own mix; its top 53 bits as a fraction of 1 are compared with
 * {@code keptFraction}. Immutable and thread-safe.
 */
public final class ZeroRowSampling {
  /** Every row kept, weight 1: today's route. */
  public static final ZeroRowSampling KEEP_ALL = new ZeroRowSampling(1.0, 0L);

  /** The golden-ratio increment SplitMix64 adds before mixing. */
  private static final long GOLDEN_GAMMA = 0x9e3779b97f4a7c15L;
  private static final double UNIT_53_BITS = 0x1.0p-53;

  private final double keptFraction;
  private final long seedMix;
  private final float zeroRowWeight;

  private ZeroRowSampling(double keptFraction, long seed) {
    this.keptFraction = keptFraction;
    this.seedMix = mix64(seed + GOLDEN_GAMMA);
    this.zeroRowWeight = (float) (1.0 / keptFraction);
  }

  /**
   * Keeps each zero row with probability {@code keptFraction}; 1 keeps every row ({@link #KEEP_ALL}).
   *
   * @param keptFraction in (0, 1]
   * @param seed chooses which zero rows: the same seed keeps the same rows
   * @throws InvalidRequestException when the fraction is NaN or outside (0, 1]
   */
  public static ZeroRowSampling of(double keptFraction, long seed) {
    checkFraction(keptFraction);
    return keptFraction == 1.0 ? KEEP_ALL : new ZeroRowSampling(keptFraction, seed);
  }

  /**
   * Checks a share of zero rows to keep, the one rule for every place that takes one.
   *
   * @throws InvalidRequestException when the fraction is NaN or outside (0, 1]
   */
  public static void checkFraction(double keptFraction) {
    if (!(keptFraction > 0 && keptFraction <= 1)) {
      throw new InvalidRequestException(Setting.ZERO_ROWS_KEPT + " must be a share in (0, 1] of the training rows"
          + " with zero sales to keep, got " + String.format(Locale.ROOT, "%s", keptFraction) + " (1 keeps them"
          + " all; 0.25 keeps about one in four and weighs each kept one 4)");
    }
  }

  /** The share of zero rows kept, in (0, 1]. */
  public double keptFraction() {
    return keptFraction;
  }

  /** Whether every row is kept (nothing sampled, every weight unchanged). */
  public boolean keepsAll() {
    return keptFraction == 1.0;
  }

  /** The weight factor of a kept zero row: {@code 1 / keptFraction} as LightGBM's float32 weight; 1 keeping all. */
  public float zeroRowWeight() {
    return zeroRowWeight;
  }

  /**
   * Whether the zero row of series {@code seriesIndex} on day {@code dayIndex} is kept. Allocates nothing: called
   * once per zero row.
   */
  public boolean keepsZeroRow(int seriesIndex, int dayIndex) {
    if (keptFraction == 1.0) {
      return true;
    }
    long position = ((long) seriesIndex << 32) | (dayIndex & 0xffff_ffffL);
    return (mix64((position ^ seedMix) + GOLDEN_GAMMA) >>> 11) * UNIT_53_BITS < keptFraction;
  }

  /** SplitMix64's finaliser (Stafford's variant 13): every input bit moves every output bit. */
  private static long mix64(long z) {
    z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
    z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
    return z ^ (z >>> 31);
  }

  @Override
  public String toString() {
    return keepsAll() ? "all zero rows kept" : String.format(Locale.ROOT, "zero rows kept %s, weight %s",
        keptFraction, zeroRowWeight);
  }
}
