package org.lagmill.store;

import java.util.Objects;
import java.util.function.Consumer;

/**
 * Where store code tells the user what it did on its own (recovered a store after a crash, removed a dead writer's
 * leftovers). The engine never prints; the command line sets a sink that writes each notice to stderr. One sink per
 * process, because recovery can happen inside any {@link SalesStore#open}, far from the caller's console.
 */
public final class StoreNotices {
  private static volatile Consumer<String> sink = text -> {};

  private StoreNotices() {}

  /** Sets where notices go; the default drops them. */
  public static void setSink(Consumer<String> newSink) {
    sink = Objects.requireNonNull(newSink, "sink");
  }

  /** The current sink, so a caller can restore it. */
  public static Consumer<String> sink() {
    return sink;
  }

  /** Passes one notice to the sink. */
  public static void tell(String text) {
    sink.accept(text);
  }
}
