package org.lagmill;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The one master seed of the random tests: {@code -Dlagmill.seed=N} replaces every test class's default seed, so any
 * failure can be replayed; {@link SeedReporter} prints the seed a failing test class used.
 */
public final class TestSeeds {
  /** The system property that sets the master seed. */
  public static final String PROPERTY = "lagmill.seed";
  private static final Map<Class<?>, Long> SEED_BY_CLASS = new ConcurrentHashMap<>();
  private static final StackWalker WALKER = StackWalker.getInstance(StackWalker.Option.RETAIN_CLASS_REFERENCE);

  private TestSeeds() {}

  /**
   * The calling test class's seed: {@code -Dlagmill.seed} when set, else {@code defaultSeed}. Call it once per class,
   * from a static field initializer, and derive every other seed of the class from it.
   */
  public static long master(long defaultSeed) {
    long seed = Long.getLong(PROPERTY, defaultSeed);
    SEED_BY_CLASS.put(WALKER.getCallerClass(), seed);
    return seed;
  }

  /** The seed {@code testClass} (or the class enclosing it) took from {@link #master}, or null when it took none. */
  static Long seedOf(Class<?> testClass) {
    for (Class<?> c = testClass; c != null; c = c.getEnclosingClass()) {
      Long seed = SEED_BY_CLASS.get(c);
      if (seed != null) {
        return seed;
      }
    }
    return null;
  }
}
