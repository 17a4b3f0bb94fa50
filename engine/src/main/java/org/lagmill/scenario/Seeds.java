package org.lagmill.scenario;

import java.util.SplittableRandom;

/**
 * Derives independent random streams from (master seed, purpose, key) so every series, item and store draws the same
 * numbers whatever order or buffering the writer uses.
 */
final class Seeds {
  static final long ITEM = 0x1A2B3C4D5E6F7081L;
  static final long STORE = 0x2233445566778899L;
  static final long PROMO = 0x3141592653589793L;
  static final long SERIES = 0x2718281828459045L;

  private Seeds() {}

  /** The SplitMix64 finalizer (Steele, Lea and Flood, 2014): a bijection with good avalanche on 64-bit keys. */
  static long mix(long z) {
    z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
    z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
    return z ^ (z >>> 31);
  }

  static long mix(long seed, long purpose, long key) {
    return mix(mix(seed ^ purpose) + 0x9E3779B97F4A7C15L * (key + 1));
  }

  static SplittableRandom random(long seed, long purpose, long key) {
    return new SplittableRandom(mix(seed, purpose, key));
  }
}
