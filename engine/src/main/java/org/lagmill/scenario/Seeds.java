package org.lagmill.scenario;

import java.util.SplittableRandom;

/**
 * Derives independent random streams from (master seed, purpose, key) so every series, item and store draws the same
 * numbers whatever order or buffering the writer uses.
 */
final class Seeds {
  static final long ITEM = 0x1A2B_3C4D_5E6F_7081L;
  static final long STORE = 0x2233_4455_6677_8899L;
  static final long PROMO = 0x3141_5926_5358_9793L;
  static final long SERIES = 0x2718_2818_2845_9045L;

  private Seeds() {}

  /** The SplitMix64 finalizer (Steele, Lea and Flood, 2014): a bijection with good avalanche on 64-bit keys. */
  static long mix(long z) {
    z = (z ^ (z >>> 30)) * 0xBF58_476D_1CE4_E5B9L;
    z = (z ^ (z >>> 27)) * 0x94D0_49BB_1331_11EBL;
    return z ^ (z >>> 31);
  }

  static long mix(long seed, long purpose, long key) {
    return mix(mix(seed ^ purpose) + 0x9E37_79B9_7F4A_7C15L * (key + 1));
  }

  static SplittableRandom random(long seed, long purpose, long key) {
    return new SplittableRandom(mix(seed, purpose, key));
  }
}
