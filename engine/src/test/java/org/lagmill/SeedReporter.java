package org.lagmill;

import org.junit.jupiter.api.extension.ExtensionContext;
import org.junit.jupiter.api.extension.TestExecutionExceptionHandler;

/**
 * Registered for every test (META-INF/services, autodetection on in junit-platform.properties): when a test of a
 * class that took a seed from {@link TestSeeds#master} fails, its failure message names the seed and how to replay it.
 */
public final class SeedReporter implements TestExecutionExceptionHandler {
  @Override
  public void handleTestExecutionException(ExtensionContext context, Throwable failure) throws Throwable {
    Long seed = context.getTestClass().map(TestSeeds::seedOf).orElse(null);
    if (seed == null) {
      throw failure;
    }
    String replay = "[" + TestSeeds.PROPERTY + "=" + seed + "; replay with -D" + TestSeeds.PROPERTY + "=" + seed + "]";
    System.err.println(context.getDisplayName() + " failed with " + replay);
    failure.addSuppressed(new SeedNote(replay));
    throw failure;
  }

  /** Carries the seed line into the failure's report without changing the failure's type or message. */
  private static final class SeedNote extends Exception {
    private static final long serialVersionUID = 1L;

    SeedNote(String message) {
      super(message, null, false, false);
    }
  }
}
